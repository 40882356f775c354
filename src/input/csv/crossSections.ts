/**
 * A cross-section points file: rows of (section id, offset across the section, elevation[, n]), so a whole
 * survey of many sections fits in one file. Each section's rows are kept together, left to right.
 *
 * Manning's n, where the file has an n column, is given at a section's first point and wherever it changes;
 * a blank n continues the value above. The value on a row applies from that point's offset to the next
 * change, which makes the roughness zones [fromOffset, n] the irregular section shape takes.
 */
import type { Units } from '../../core/units.js';
import { parseCsvTable, type CsvCell } from './table.js';
import { cellOf, crossSectionColumns, matchColumns } from './columns.js';
import { largestLength, largestPureNumber, readNumber } from './numbers.js';
import { at, ProblemList } from './problems.js';
import { manningRange } from './stations.js';
import * as say from './messages.js';

export interface CrossSectionRows {
  /** [offset, elevation], left to right (looking downstream), offsets non-decreasing */
  readonly points: [number, number][];
  /** [fromOffset, n] where n changes across the section; absent when the file gives no n for it */
  readonly roughness?: [number, number][];
  /** 1-based line of the section's first row */
  readonly line: number;
}

export interface CrossSectionOptions {
  /** every section must carry its own n (no n elsewhere in the model to fall back on) */
  readonly requireN?: boolean;
  /** accept Manning's n outside the usual range (the CLI's --force) */
  readonly force?: boolean;
}

/** The smallest number of points that encloses a flow area. */
export const minimumPoints = 3;

interface PointRow {
  offset: number;
  elevation: number;
  n: number | undefined;
  line: number;
  offsetCell: CsvCell;
  nCell: CsvCell | undefined;
}

interface Gathering {
  readonly line: number;
  readonly idCell: CsvCell;
  readonly rows: PointRow[];
  /** a row of this section failed to read: skip the whole-section checks, they would mislead */
  broken: boolean;
}

/** Read a cross-section points file into sections by id (in file order). Throws one InputError listing every problem. */
export function readCrossSections(
  text: string,
  fileLabel: string,
  units: Units,
  options: CrossSectionOptions = {},
): Map<string, CrossSectionRows> {
  const table = parseCsvTable(text, fileLabel);
  const file = table.file;
  const problems = new ProblemList();
  const columns = matchColumns(table, crossSectionColumns, units, problems);
  if (table.rows.length === 0) problems.add(at(file, table.header.line), say.noDataRows('cross-section points', table.header.line));
  if (options.requireN && columns.n === undefined) {
    problems.add(at(file, table.header.line), say.nColumnRequired());
  }
  if (crossSectionColumns.some((c) => c.required && columns[c.key] === undefined)) problems.throwIfAny(file);

  const groups = new Map<string, Gathering>();
  let current: string | undefined;
  for (const row of table.rows) {
    const idCell = cellOf(row, columns.section);
    if (idCell === undefined) continue;
    const id = idCell.text;
    if (id === '') {
      problems.add(at(file, idCell.line, idCell.column), say.missingText('section id'));
      continue;
    }
    let group = groups.get(id);
    if (group === undefined) {
      group = { line: row.line, idCell, rows: [], broken: false };
      groups.set(id, group);
    } else if (current !== id) {
      problems.add(at(file, idCell.line, idCell.column), say.sectionSplit(id, group.line), id);
      group.broken = true;
    }
    current = id;
    const before = problems.size;
    const offsetCell = cellOf(row, columns.offset);
    const nCell = cellOf(row, columns.n);
    const offset = readNumber(offsetCell, { label: 'offset', limit: largestLength }, file, problems, true);
    const elevation = readNumber(cellOf(row, columns.elevation), { label: 'elevation', limit: largestLength }, file, problems, true);
    const n = readNumber(nCell, { label: "Manning's n", limit: largestPureNumber }, file, problems, false);
    if (n !== undefined && nCell !== undefined && !options.force && (n < manningRange.low || n > manningRange.high)) {
      problems.add(at(file, nCell.line, nCell.column), say.outOfRange("Manning's n", n, manningRange.low, manningRange.high, say.roughnessForce), n);
    }
    if (offset === undefined || elevation === undefined || offsetCell === undefined || problems.size > before) {
      group.broken = true;
      continue;
    }
    group.rows.push({ offset, elevation, n, line: row.line, offsetCell, nCell });
  }

  const sections = new Map<string, CrossSectionRows>();
  for (const [id, group] of groups) {
    const section = checkSection(id, group, file, problems, options.requireN === true && columns.n !== undefined);
    if (section !== undefined) sections.set(id, section);
  }
  problems.throwIfAny(file);
  return sections;
}

function checkSection(
  id: string,
  group: Gathering,
  file: string,
  problems: ProblemList,
  requireN: boolean,
): CrossSectionRows | undefined {
  if (group.broken) return undefined;
  const rows = group.rows;
  const idWhere = at(file, group.idCell.line, group.idCell.column);
  if (rows.length < minimumPoints) {
    problems.add(idWhere, say.tooFewPoints(id, rows.length), rows.length);
    return undefined;
  }
  let ok = true;
  // Direction of the vertical wall being walked at the current offset: +1 up, −1 down, 0 none yet.
  let wall = 0;
  for (let i = 1; i < rows.length; i++) {
    const p = rows[i] as PointRow;
    const q = rows[i - 1] as PointRow;
    const where = at(file, p.offsetCell.line, p.offsetCell.column);
    if (p.offset < q.offset) {
      problems.add(where, say.offsetBackwards(id, p.offset, q.offset, q.line), p.offset);
      ok = false;
      wall = 0;
    } else if (p.offset > q.offset) {
      wall = 0;
    } else if (p.elevation === q.elevation) {
      // A repeated point is a loop of zero length: the outline would touch itself there.
      problems.add(where, say.repeatedPoint(id, p.offset, p.elevation, q.line), [p.offset, p.elevation]);
      ok = false;
    } else {
      const step = p.elevation > q.elevation ? 1 : -1;
      if (wall !== 0 && step !== wall) {
        problems.add(where, say.foldedWall(id, p.offset), p.offset);
        ok = false;
      }
      wall = step;
    }
  }
  const first = rows[0] as PointRow;
  const last = rows[rows.length - 1] as PointRow;
  if (ok && first.offset === last.offset) {
    problems.add(idWhere, say.noWidth(id, first.offset), first.offset);
    ok = false;
  }

  const roughness = zones(rows);
  if (roughness === 'first-missing') {
    const cell = first.nCell;
    problems.add(cell ? at(file, cell.line, cell.column) : idWhere, say.firstPointNeedsN(id));
    return undefined;
  }
  if (roughness === undefined && requireN) {
    const cell = first.nCell;
    problems.add(cell ? at(file, cell.line, cell.column) : idWhere, say.sectionNeedsN(id));
    return undefined;
  }
  if (!ok) return undefined;
  const points = rows.map((r): [number, number] => [r.offset, r.elevation]);
  return roughness === undefined ? { points, line: group.line } : { points, roughness, line: group.line };
}

/** Roughness zones from the n column: a zone starts where n changes. */
function zones(rows: readonly PointRow[]): [number, number][] | undefined | 'first-missing' {
  if (rows.every((r) => r.n === undefined)) return undefined;
  if (rows[0]?.n === undefined) return 'first-missing';
  const result: [number, number][] = [];
  for (const r of rows) {
    if (r.n === undefined) continue;
    const last = result[result.length - 1];
    if (last !== undefined && last[1] === r.n) continue;
    // A change at the foot of a vertical wall starts at the same offset as the zone before: that zone has no width.
    if (last !== undefined && last[0] === r.offset) {
      last[1] = r.n;
      if (result.length > 1 && result[result.length - 2]?.[1] === r.n) result.pop();
    } else {
      result.push([r.offset, r.n]);
    }
  }
  // n written on the last point starts a zone of no width: it changes nothing.
  const end = rows[rows.length - 1]?.offset ?? 0;
  while (result.length > 1 && (result[result.length - 1]?.[0] ?? 0) >= end) result.pop();
  return result;
}
