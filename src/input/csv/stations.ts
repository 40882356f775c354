/**
 * A stations file: one row per surveyed station, with its bed (invert) elevation and the section found there,
 * optionally Manning's n, bank (or lining) top elevations, the flow-path length to the next station downstream,
 * and contraction and expansion loss coefficients.
 *
 * Rows must be sorted by station, all rising or all falling; the model says which way stations increase
 * (`direction`), and the rows come back in flow order, upstream first, with the user's station numbers
 * unchanged. Every problem in the file is collected and thrown as one InputError.
 */
import type { Units } from '../../core/units.js';
import { parseCsvTable, type CsvRow } from './table.js';
import { cellOf, matchColumns, stationColumns } from './columns.js';
import { largestLength, largestPureNumber, readNumber } from './numbers.js';
import { at, ProblemList } from './problems.js';
import * as say from './messages.js';

/** The way station numbers increase along the channel. */
export type StationDirection = 'downstream' | 'upstream';

export interface StationRow {
  /** the station as the user wrote it */
  readonly station: number;
  readonly bedElevation: number;
  /** a section name from the model, or a cross-section id */
  readonly section: string;
  readonly n?: number;
  /** top of left bank (or lining), looking downstream */
  readonly leftBank?: number;
  /** top of right bank (or lining), looking downstream */
  readonly rightBank?: number;
  /** flow-path length from this station to the next station downstream (unused on the most downstream row) */
  readonly reachLength?: number;
  readonly contraction?: number;
  readonly expansion?: number;
  /** 1-based line of the row in the file */
  readonly line: number;
}

export interface StationOptions {
  /** which way station numbers increase: toward downstream or toward upstream */
  readonly direction: StationDirection;
  /** the section ids that exist (model sections and cross-section ids); when given, others are errors */
  readonly sections?: Iterable<string>;
  /** accept Manning's n outside the usual range (the CLI's --force) */
  readonly force?: boolean;
}

/**
 * The range of Manning's n accepted without --force: from smooth lined channels to densely vegetated
 * floodplains (common practice; a value outside it is more often a typing mistake than a real channel).
 */
export const manningRange = { low: 0.005, high: 0.2 } as const;
/** Loss coefficients multiply a change in velocity head; a coefficient above one loses more than the change. */
export const lossCoefficientRange = { low: 0, high: 1 } as const;

/** Read a stations file. Throws one InputError listing every problem (up to problemCap). */
export function readStations(text: string, fileLabel: string, units: Units, options: StationOptions): StationRow[] {
  const table = parseCsvTable(text, fileLabel);
  const problems = new ProblemList();
  const columns = matchColumns(table, stationColumns, units, problems);
  const file = table.file;
  if (table.rows.length === 0) problems.add(at(file, table.header.line), say.noDataRows('stations', table.header.line));
  const missingRequired = stationColumns.some((c) => c.required && columns[c.key] === undefined);
  if (missingRequired) problems.throwIfAny(file);

  const known = options.sections === undefined ? undefined : [...options.sections];
  const knownSet = known === undefined ? undefined : new Set(known);
  const read: StationRow[] = [];
  const stationCells = new Map<StationRow, CsvRow>();

  for (const row of table.rows) {
    const num = (key: keyof typeof columns, label: string, required: boolean, limit = largestLength) =>
      readNumber(cellOf(row, columns[key]), { label, limit }, file, problems, required);
    const station = num('station', 'station', true);
    const bedElevation = num('bedElevation', 'bed elevation', true);
    const sectionCell = cellOf(row, columns.section);
    const section = sectionCell?.text ?? '';
    if (sectionCell !== undefined && section === '') {
      problems.add(at(file, sectionCell.line, sectionCell.column), say.missingText('section'));
    } else if (sectionCell !== undefined && knownSet !== undefined && !knownSet.has(section)) {
      problems.add(at(file, sectionCell.line, sectionCell.column), say.unknownSection(section, known ?? []), section);
    }
    const n = num('n', "Manning's n", false, largestPureNumber);
    const leftBank = num('leftBank', 'left bank', false);
    const rightBank = num('rightBank', 'right bank', false);
    const reachLength = num('reachLength', 'reach length', false);
    const contraction = num('contraction', 'contraction coefficient', false, largestPureNumber);
    const expansion = num('expansion', 'expansion coefficient', false, largestPureNumber);

    const here = (key: keyof typeof columns) => {
      const cell = cellOf(row, columns[key]);
      return at(file, cell?.line ?? row.line, cell?.column);
    };
    if (n !== undefined && !options.force && (n < manningRange.low || n > manningRange.high)) {
      problems.add(here('n'), say.outOfRange("Manning's n", n, manningRange.low, manningRange.high, say.roughnessForce), n);
    }
    if (reachLength !== undefined && reachLength < 0) problems.add(here('reachLength'), say.negative('reach length', reachLength), reachLength);
    for (const [key, label, value] of [
      ['contraction', 'contraction coefficient', contraction],
      ['expansion', 'expansion coefficient', expansion],
    ] as const) {
      if (value !== undefined && (value < lossCoefficientRange.low || value > lossCoefficientRange.high)) {
        problems.add(here(key), say.outOfRange(label, value, lossCoefficientRange.low, lossCoefficientRange.high), value);
      }
    }
    if (bedElevation !== undefined) {
      if (leftBank !== undefined && leftBank < bedElevation) problems.add(here('leftBank'), say.bankBelowBed('left', leftBank, bedElevation), leftBank);
      if (rightBank !== undefined && rightBank < bedElevation) problems.add(here('rightBank'), say.bankBelowBed('right', rightBank, bedElevation), rightBank);
    }
    if (station === undefined || bedElevation === undefined) continue;
    const entry: StationRow = {
      station,
      bedElevation,
      section,
      line: row.line,
      ...(n !== undefined && { n }),
      ...(leftBank !== undefined && { leftBank }),
      ...(rightBank !== undefined && { rightBank }),
      ...(reachLength !== undefined && { reachLength }),
      ...(contraction !== undefined && { contraction }),
      ...(expansion !== undefined && { expansion }),
    };
    read.push(entry);
    stationCells.set(entry, row);
  }

  const rising = checkOrder(read, (r) => cellOf(stationCells.get(r) as CsvRow, columns.station), file, problems);
  if (problems.size === 0 && read.length < 2) problems.add(at(file, table.header.line), say.tooFewStations(read.length));
  problems.throwIfAny(file);

  // Flow order: upstream first. Rising stations run downstream when they increase downstream.
  const runsDownstream = rising === (options.direction === 'downstream');
  return runsDownstream ? read : read.reverse();
}

/** Duplicates and order; returns whether the stations rise down the file. */
function checkOrder(
  rows: readonly StationRow[],
  cell: (row: StationRow) => { line: number; column: number } | undefined,
  file: string,
  problems: ProblemList,
): boolean {
  const seen = new Map<number, number>();
  let rising: boolean | undefined;
  let previous: StationRow | undefined;
  for (const row of rows) {
    const c = cell(row);
    const where = at(file, c?.line ?? row.line, c?.column);
    const first = seen.get(row.station);
    if (first !== undefined) {
      problems.add(where, say.duplicateStation(row.station, first), row.station);
      continue;
    }
    seen.set(row.station, row.line);
    if (previous !== undefined) {
      const up = row.station > previous.station;
      if (rising === undefined) rising = up;
      else if (up !== rising) {
        problems.add(where, say.unsortedStation(row.station, previous.station, previous.line, rising), row.station);
        continue;
      }
    }
    previous = row;
  }
  return rising ?? true;
}
