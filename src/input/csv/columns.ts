/**
 * Matching a CSV header to the columns a reader needs.
 *
 * A header names a column loosely: case is ignored, and so are spaces, hyphens, underscores, dots and
 * apostrophes (`Bed Elevation`, `bed-elevation`, `bed_elevation` are one name). A unit may follow, either
 * bracketed (`Station (ft)`, `bed elevation [m]`) or as a last word (`bed_elev_m`). A length or discharge
 * unit that is not the model's is an error at the header cell, never a silent conversion.
 */
import type { Units } from '../../core/units.js';
import { cellAt, type CsvCell, type CsvTable } from './table.js';
import { at, type ProblemList } from './problems.js';
import * as say from './messages.js';

/** What a column holds, which decides the units it may carry. */
export type Quantity = 'length' | 'discharge' | 'dimensionless' | 'text';

export interface ColumnSpec<K extends string = string> {
  readonly key: K;
  /** words for messages, e.g. "bed elevation" */
  readonly label: string;
  /** accepted names, already normalized (lower-case letters and digits only) */
  readonly aliases: readonly string[];
  readonly quantity: Quantity;
  readonly required: boolean;
}

/** A header cell matched to a column, with its 0-based field index. */
export interface MatchedColumn {
  readonly index: number;
  readonly header: CsvCell;
  /** the unit written in the header, normalized, if any */
  readonly unit?: string;
}

export type ColumnMap<K extends string> = Partial<Record<K, MatchedColumn>>;

// Unit words. Keys are normalized spellings; values their canonical symbol.
const lengthUnits: Readonly<Record<string, string>> = {
  m: 'm', metre: 'm', metres: 'm', meter: 'm', meters: 'm',
  ft: 'ft', feet: 'ft', foot: 'ft', usft: 'ft',
  km: 'km', cm: 'cm', mm: 'mm', in: 'in', inch: 'in', inches: 'in', yd: 'yd', yard: 'yd', yards: 'yd', mi: 'mi',
};
const dischargeUnits: Readonly<Record<string, string>> = {
  'm3/s': 'm³/s', 'm³/s': 'm³/s', 'm^3/s': 'm³/s', cms: 'm³/s', cumecs: 'm³/s', cumec: 'm³/s',
  'ft3/s': 'ft³/s', 'ft³/s': 'ft³/s', 'ft^3/s': 'ft³/s', cfs: 'ft³/s',
  'l/s': 'l/s', lps: 'l/s', 'm3/h': 'm³/h', gpm: 'gpm', mgd: 'mgd',
};
const noUnit = new Set(['', '-', '–', '—', '1', 'none', 'dimensionless', 'nondimensional']);

/** Lower-case letters and digits only: the form aliases are written in. */
export function normalizeName(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]/g, '');
}

/** Split a header into a name and an optional unit (bracketed, or a known unit word at the end). */
export function splitHeader(text: string): { name: string; unit?: string; bare: boolean }[] {
  const trimmed = text.trim();
  const options: { name: string; unit?: string; bare: boolean }[] = [{ name: normalizeName(trimmed), bare: false }];
  // One level of nesting inside round brackets, for units such as `(s/m^(1/3))`.
  const bracket = /^(.*?)[\s_-]*(?:\(((?:[^()]|\([^()]*\))*)\)|\[([^\]]*)\]|\{([^}]*)\})\s*$/.exec(trimmed);
  if (bracket) {
    const unit = bracket[2] ?? bracket[3] ?? bracket[4] ?? '';
    options.unshift({ name: normalizeName(bracket[1] ?? ''), unit: unitKey(unit), bare: false });
  }
  const word = /^(.*?)[\s_.-]+([A-Za-z0-9³^/]+)\s*$/.exec(trimmed);
  if (word) {
    const unit = unitKey(word[2] ?? '');
    if (unit in lengthUnits || unit in dischargeUnits) {
      options.push({ name: normalizeName(word[1] ?? ''), unit, bare: true });
    }
  }
  // a discharge unit with its slash written as an underscore, as gvf's own CSV headers do (`discharge_m3_s`)
  const compound = /^(.*?)[\s_.-]+([A-Za-z0-9³^]+)_([A-Za-z]+)\s*$/.exec(trimmed);
  if (compound) {
    const unit = unitKey(`${compound[2] ?? ''}/${compound[3] ?? ''}`);
    if (unit in dischargeUnits) options.push({ name: normalizeName(compound[1] ?? ''), unit, bare: true });
  }
  return options;
}

function unitKey(unit: string): string {
  return unit.trim().toLowerCase().replace(/\s+/g, '').replace(/·/g, '');
}

/**
 * Find each spec's column in the header. Problems (missing, duplicated, unit conflicts, extra fields)
 * go to `problems`; the map holds whatever matched.
 */
export function matchColumns<K extends string>(
  table: CsvTable,
  specs: readonly ColumnSpec<K>[],
  units: Units,
  problems: ProblemList,
): ColumnMap<K> {
  const map: ColumnMap<K> = {};
  const file = table.file;
  for (const [index, cell] of table.header.cells.entries()) {
    if (cell.text === '') continue;
    const match = identify(cell.text, specs);
    if (match === undefined) continue;
    const { spec, unit } = match;
    const previous = map[spec.key];
    if (previous !== undefined) {
      problems.add(at(file, cell.line, cell.column), say.duplicateColumn(spec.label, cell.text, previous.header.column), cell.text);
      continue;
    }
    checkUnit(spec, cell, unit, units, problems, file);
    map[spec.key] = unit === undefined ? { index, header: cell } : { index, header: cell, unit };
  }
  const missing = specs.filter((s) => s.required && map[s.key] === undefined).map((s) => s.label);
  if (missing.length > 0) {
    const found = table.header.cells.map((c) => c.text).filter((t) => t !== '');
    const first = table.header.cells[0];
    problems.add(at(file, table.header.line, first?.column ?? 1), say.missingColumns(missing, found));
  }
  const named = lastNamedColumn(table);
  for (const row of table.rows) {
    const extra = row.cells.slice(named).filter((c) => c.text !== '');
    const firstExtra = extra[0];
    if (firstExtra !== undefined) {
      const found = row.cells.length - row.cells.slice().reverse().findIndex((c) => c.text !== '');
      problems.add(at(file, firstExtra.line, firstExtra.column), say.tooManyFields(found, named), firstExtra.text);
    }
  }
  return map;
}

/** The cell of a matched column in a row (empty text at the right position when the row is short). */
export function cellOf(row: CsvTable['rows'][number], column: MatchedColumn | undefined): CsvCell | undefined {
  return column === undefined ? undefined : cellAt(row, column.index);
}

function lastNamedColumn(table: CsvTable): number {
  let n = 0;
  for (const [i, c] of table.header.cells.entries()) if (c.text !== '') n = i + 1;
  return n;
}

function identify<K extends string>(
  header: string,
  specs: readonly ColumnSpec<K>[],
): { spec: ColumnSpec<K>; unit?: string } | undefined {
  for (const option of splitHeader(header)) {
    const spec = specs.find((s) => s.aliases.includes(option.name));
    if (spec === undefined) continue;
    // A bare last word counts as a unit only where the column carries one (so `section_m` is not a unit).
    if (option.bare && (spec.quantity === 'text' || spec.quantity === 'dimensionless')) continue;
    return option.unit === undefined ? { spec } : { spec, unit: option.unit };
  }
  return undefined;
}

function checkUnit(
  spec: ColumnSpec,
  cell: CsvCell,
  unit: string | undefined,
  units: Units,
  problems: ProblemList,
  file: string,
): void {
  if (unit === undefined) return;
  const where = at(file, cell.line, cell.column);
  switch (spec.quantity) {
    case 'text':
      return;
    case 'dimensionless':
      if (unit === '%') problems.add(where, say.percentCoefficient(cell.text), cell.text);
      else if (unit in lengthUnits || unit in dischargeUnits) problems.add(where, say.unitOnDimensionless(cell.text, unit), cell.text);
      // Anything else (n written with its formal unit s/m^(1/3), say) is accepted: the number is the same.
      else if (!noUnit.has(unit) && !unit.startsWith('s/')) problems.add(where, say.unitOnDimensionless(cell.text, unit), cell.text);
      return;
    case 'length':
    case 'discharge': {
      const table = spec.quantity === 'length' ? lengthUnits : dischargeUnits;
      const expected = spec.quantity === 'length' ? units.length : units.discharge;
      const symbol = table[unit];
      if (symbol === undefined) {
        problems.add(where, say.unknownUnit(cell.text, unit, expected), cell.text);
      } else if (symbol !== expected) {
        problems.add(where, say.unitConflict(cell.text, symbol, expected, units.system), cell.text);
      }
      return;
    }
  }
}

// --- the column vocabularies (gvf's own) ---------------------------------------------------------------

const stationNames = ['station', 'sta', 'chainage', 'stationing', 'distance', 'dist'];
const sectionNames = ['section', 'sectionid', 'sectionname', 'sec', 'xs', 'xsid', 'xsection', 'crosssection', 'crosssectionid'];
const roughnessNames = ['n', 'manningn', 'manningsn', 'manning', 'nvalue', 'roughness', 'manningroughness'];
const elevationNames = ['elevation', 'elev', 'z', 'level', 'ground', 'groundelevation', 'groundlevel', 'height'];

export const stationColumns = [
  { key: 'station', label: 'station', aliases: stationNames, quantity: 'length', required: true },
  {
    key: 'bedElevation',
    label: 'bed elevation',
    aliases: ['bed', 'bedelevation', 'bedelev', 'bedlevel', 'invert', 'invertelevation', 'invertelev', 'invertlevel',
      'thalweg', 'thalwegelevation', 'bottom', 'bottomelevation'],
    quantity: 'length',
    required: true,
  },
  { key: 'section', label: 'section', aliases: sectionNames, quantity: 'text', required: true },
  { key: 'n', label: "Manning's n", aliases: roughnessNames, quantity: 'dimensionless', required: false },
  {
    key: 'leftBank',
    label: 'left bank',
    aliases: ['leftbank', 'leftbankelevation', 'leftbankelev', 'leftbanktop', 'lefttop', 'lefttopofbank', 'topofbankleft',
      'leftlining', 'leftliningtop', 'liningleft'],
    quantity: 'length',
    required: false,
  },
  {
    key: 'rightBank',
    label: 'right bank',
    aliases: ['rightbank', 'rightbankelevation', 'rightbankelev', 'rightbanktop', 'righttop', 'righttopofbank',
      'topofbankright', 'rightlining', 'rightliningtop', 'liningright'],
    quantity: 'length',
    required: false,
  },
  {
    key: 'reachLength',
    label: 'reach length',
    aliases: ['reachlength', 'flowlength', 'length', 'flowpathlength', 'pathlength', 'lengthtonext', 'steplength'],
    quantity: 'length',
    required: false,
  },
  {
    key: 'contraction',
    label: 'contraction coefficient',
    aliases: ['contraction', 'contractioncoefficient', 'contractioncoeff', 'contractionloss', 'cc', 'kc'],
    quantity: 'dimensionless',
    required: false,
  },
  {
    key: 'expansion',
    label: 'expansion coefficient',
    aliases: ['expansion', 'expansioncoefficient', 'expansioncoeff', 'expansionloss', 'ce', 'ke'],
    quantity: 'dimensionless',
    required: false,
  },
] as const satisfies readonly ColumnSpec[];

export const crossSectionColumns = [
  { key: 'section', label: 'section', aliases: sectionNames, quantity: 'text', required: true },
  {
    key: 'offset',
    label: 'offset',
    aliases: ['offset', 'station', 'sta', 'x', 'across', 'lateral', 'lateraldistance', 'distanceacross', 'crossstation'],
    quantity: 'length',
    required: true,
  },
  { key: 'elevation', label: 'elevation', aliases: elevationNames, quantity: 'length', required: true },
  { key: 'n', label: "Manning's n", aliases: roughnessNames, quantity: 'dimensionless', required: false },
] as const satisfies readonly ColumnSpec[];

export const ratingCurveColumns = [
  {
    key: 'stage',
    label: 'stage',
    aliases: ['stage', 'wsel', 'wse', 'watersurface', 'watersurfaceelevation', 'waterlevel', 'level', 'elevation', 'h'],
    quantity: 'length',
    required: true,
  },
  { key: 'discharge', label: 'discharge', aliases: ['discharge', 'q', 'flow', 'flowrate', 'rate'], quantity: 'discharge', required: true },
] as const satisfies readonly ColumnSpec[];

export const highWaterMarkColumns = [
  { key: 'station', label: 'station', aliases: stationNames, quantity: 'length', required: true },
  {
    key: 'elevation',
    label: 'mark elevation',
    aliases: ['elevation', 'elev', 'mark', 'markelevation', 'hwm', 'highwater', 'highwatermark', 'wsel', 'stage', 'waterlevel', 'level'],
    quantity: 'length',
    required: true,
  },
  { key: 'flow', label: 'flow id', aliases: ['flow', 'flowid', 'event', 'eventid', 'scenario'], quantity: 'text', required: true },
  { key: 'weight', label: 'weight', aliases: ['weight', 'w', 'wt'], quantity: 'dimensionless', required: false },
] as const satisfies readonly ColumnSpec[];

export const flowTableColumns = [
  { key: 'id', label: 'flow id', aliases: ['id', 'flowid', 'name', 'event', 'eventid', 'scenario'], quantity: 'text', required: true },
  { key: 'discharge', label: 'discharge', aliases: ['discharge', 'q', 'flow', 'flowrate', 'rate'], quantity: 'discharge', required: true },
  {
    key: 'downstreamStage',
    label: 'downstream stage',
    aliases: ['downstreamstage', 'dsstage', 'tailwater', 'tailwaterstage', 'tailwaterelevation', 'downstreamwsel', 'stage'],
    quantity: 'length',
    required: false,
  },
] as const satisfies readonly ColumnSpec[];
