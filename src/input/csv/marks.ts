/**
 * Observed high-water marks (station, elevation, flow id[, weight]) for calibrating roughness to a flood.
 * Weights are relative (a weight of 2 counts a mark twice); blank means 1.
 */
import type { Units } from '../../core/units.js';
import { parseCsvTable } from './table.js';
import { cellOf, highWaterMarkColumns, matchColumns } from './columns.js';
import { largestLength, largestPureNumber, readNumber } from './numbers.js';
import { at, ProblemList } from './problems.js';
import * as say from './messages.js';

export interface HighWaterMark {
  readonly station: number;
  readonly elevation: number;
  /** the id of the model flow this mark was left by */
  readonly flow: string;
  readonly weight: number;
  readonly line: number;
}

export interface MarkOptions {
  /** the model's flow ids; when given, a mark naming another flow is an error */
  readonly flows?: Iterable<string>;
}

/** Read high-water marks in file order. Throws one InputError listing every problem. */
export function readHighWaterMarks(text: string, fileLabel: string, units: Units, options: MarkOptions = {}): HighWaterMark[] {
  const table = parseCsvTable(text, fileLabel);
  const file = table.file;
  const problems = new ProblemList();
  const columns = matchColumns(table, highWaterMarkColumns, units, problems);
  if (table.rows.length === 0) problems.add(at(file, table.header.line), say.noDataRows('high-water marks', table.header.line));
  if (highWaterMarkColumns.some((c) => c.required && columns[c.key] === undefined)) problems.throwIfAny(file);
  const known = options.flows === undefined ? undefined : [...options.flows];

  const marks: HighWaterMark[] = [];
  for (const row of table.rows) {
    const station = readNumber(cellOf(row, columns.station), { label: 'station', limit: largestLength }, file, problems, true);
    const elevation = readNumber(cellOf(row, columns.elevation), { label: 'mark elevation', limit: largestLength }, file, problems, true);
    const weightCell = cellOf(row, columns.weight);
    const weight = readNumber(weightCell, { label: 'weight', limit: largestPureNumber }, file, problems, false);
    if (weight !== undefined && weight <= 0 && weightCell) {
      problems.add(at(file, weightCell.line, weightCell.column), say.notPositive('weight', weight), weight);
    }
    const flowCell = cellOf(row, columns.flow);
    const flow = flowCell?.text ?? '';
    if (flowCell && flow === '') problems.add(at(file, flowCell.line, flowCell.column), say.missingText('flow id'));
    else if (flowCell && known && !known.includes(flow)) {
      problems.add(at(file, flowCell.line, flowCell.column), say.unknownFlow(flow, known), flow);
    }
    if (station === undefined || elevation === undefined || flow === '') continue;
    marks.push({ station, elevation, flow, weight: weight ?? 1, line: row.line });
  }
  problems.throwIfAny(file);
  return marks;
}
