/**
 * A batch of flows from CSV (id, discharge[, downstream stage]), one profile run per row.
 */
import type { Units } from '../../core/units.js';
import { parseCsvTable } from './table.js';
import { cellOf, flowTableColumns, matchColumns } from './columns.js';
import { largestDischarge, largestLength, readNumber } from './numbers.js';
import { at, ProblemList } from './problems.js';
import * as say from './messages.js';

export interface FlowRow {
  readonly id: string;
  readonly discharge: number;
  /** a water-surface elevation at the downstream end for this flow, when the file gives one */
  readonly downstreamStage?: number;
  readonly line: number;
}

/** Read a flow table in file order. Throws one InputError listing every problem. */
export function readFlowTable(text: string, fileLabel: string, units: Units): FlowRow[] {
  const table = parseCsvTable(text, fileLabel);
  const file = table.file;
  const problems = new ProblemList();
  const columns = matchColumns(table, flowTableColumns, units, problems);
  if (table.rows.length === 0) problems.add(at(file, table.header.line), say.noDataRows('flows', table.header.line));
  if (flowTableColumns.some((c) => c.required && columns[c.key] === undefined)) problems.throwIfAny(file);

  const seen = new Map<string, number>();
  const flows: FlowRow[] = [];
  for (const row of table.rows) {
    const idCell = cellOf(row, columns.id);
    const id = idCell?.text ?? '';
    if (idCell && id === '') problems.add(at(file, idCell.line, idCell.column), say.missingText('flow id'));
    const first = seen.get(id);
    if (idCell && id !== '' && first !== undefined) {
      problems.add(at(file, idCell.line, idCell.column), say.duplicateFlowId(id, first), id);
    }
    if (id !== '' && first === undefined) seen.set(id, row.line);
    const dischargeCell = cellOf(row, columns.discharge);
    const discharge = readNumber(dischargeCell, { label: 'discharge', limit: largestDischarge }, file, problems, true);
    if (discharge !== undefined && discharge <= 0 && dischargeCell) {
      problems.add(at(file, dischargeCell.line, dischargeCell.column), say.notPositive('discharge', discharge), discharge);
    }
    const stage = readNumber(cellOf(row, columns.downstreamStage), { label: 'downstream stage', limit: largestLength }, file, problems, false);
    if (id === '' || discharge === undefined || discharge <= 0) continue;
    flows.push(stage === undefined ? { id, discharge, line: row.line } : { id, discharge, downstreamStage: stage, line: row.line });
  }
  problems.throwIfAny(file);
  return flows;
}
