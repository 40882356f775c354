/**
 * A stage–discharge rating curve from CSV (stage, discharge), for a downstream boundary. Rows may come in
 * any order; they are returned sorted by stage. Discharge must rise with stage, or the curve could not be
 * read backwards (stage from discharge) without ambiguity.
 */
import type { Units } from '../../core/units.js';
import { parseCsvTable } from './table.js';
import { cellOf, matchColumns, ratingCurveColumns } from './columns.js';
import { largestDischarge, largestLength, readNumber } from './numbers.js';
import { at, ProblemList } from './problems.js';
import * as say from './messages.js';

/** [stage, discharge] */
export type RatingPair = [number, number];

/** Read a rating curve: pairs sorted by rising stage, discharge strictly rising. Throws one InputError listing every problem. */
export function readRatingCurve(text: string, fileLabel: string, units: Units): RatingPair[] {
  const table = parseCsvTable(text, fileLabel);
  const file = table.file;
  const problems = new ProblemList();
  const columns = matchColumns(table, ratingCurveColumns, units, problems);
  if (ratingCurveColumns.some((c) => c.required && columns[c.key] === undefined)) problems.throwIfAny(file);

  const read: { stage: number; discharge: number; line: number; where: string }[] = [];
  for (const row of table.rows) {
    const stage = readNumber(cellOf(row, columns.stage), { label: 'stage', limit: largestLength }, file, problems, true);
    const dischargeCell = cellOf(row, columns.discharge);
    const discharge = readNumber(dischargeCell, { label: 'discharge', limit: largestDischarge }, file, problems, true);
    if (stage === undefined || discharge === undefined || dischargeCell === undefined) continue;
    const where = at(file, dischargeCell.line, dischargeCell.column);
    if (discharge < 0) {
      problems.add(where, say.negative('discharge', discharge), discharge);
      continue;
    }
    read.push({ stage, discharge, line: row.line, where });
  }
  if (problems.size === 0 && read.length < 2) problems.add(at(file, table.header.line), say.ratingTooShort(read.length));

  read.sort((a, b) => a.stage - b.stage || a.line - b.line);
  for (let i = 1; i < read.length; i++) {
    const p = read[i]!;
    const q = read[i - 1]!;
    if (p.stage === q.stage) {
      // At the later of the two lines: the repeat is the row to look at.
      const [later, other] = p.line > q.line ? [p, q] : [q, p];
      problems.add(at(file, later.line, stageColumn(columns)), say.ratingDuplicateStage(p.stage, other.line), p.stage);
    } else if (p.discharge <= q.discharge) {
      problems.add(p.where, say.ratingNotMonotone(p.stage, p.discharge, q.stage, q.discharge, q.line), p.discharge);
    }
  }
  problems.throwIfAny(file);
  return read.map((r): RatingPair => [r.stage, r.discharge]);
}

function stageColumn(columns: ReturnType<typeof matchColumns<'stage' | 'discharge'>>): number | undefined {
  return columns.stage === undefined ? undefined : columns.stage.index + 1;
}
