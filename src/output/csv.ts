/**
 * CSV output: deterministic (same input, same bytes), unit-labelled headers (`station_m`, `discharge_m3_s`),
 * fixed decimals per column, "\n" line ends, no timestamps. A value that does not exist is an empty cell.
 * Fields are quoted only when they hold a comma, a double quote or a line break (RFC 4180).
 */
import { unitsOf } from '../core/units.js';
import type { FlowResult, RunResult } from '../results/types.js';

export interface CsvColumn<Row> {
  /** snake_case name without unit, e.g. "station" */
  readonly name: string;
  /** unit as printed elsewhere (m, ft³/s, m/s); becomes a header suffix */
  readonly unit?: string;
  readonly value: (row: Row) => number | string | boolean | null | undefined;
  /** decimals for numbers (default 4) */
  readonly decimals?: number;
}

/** "m³/s" → "m3_s", "ft²" → "ft2": a header suffix of letters, digits and underscores only. */
export function unitSuffix(unit: string): string {
  const digits: Record<string, string> = { '²': '2', '³': '3', '½': 'half' };
  return unit
    .replace(/[²³½]/g, (c) => digits[c]!)
    .replace(/[^A-Za-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

export function csvHeader(name: string, unit?: string): string {
  return unit === undefined || unit === '' ? name : `${name}_${unitSuffix(unit)}`;
}

function field(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function cell(value: number | string | boolean | null | undefined, decimals: number): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) return '';
    const text = value.toFixed(decimals);
    return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
  }
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return field(value);
}

export function toCsv<Row>(columns: readonly CsvColumn<Row>[], rows: readonly Row[]): string {
  const lines = [columns.map((c) => field(csvHeader(c.name, c.unit))).join(',')];
  for (const row of rows) lines.push(columns.map((c) => cell(c.value(row), c.decimals ?? 4)).join(','));
  return `${lines.join('\n')}\n`;
}

interface StationRow {
  flow: FlowResult;
  station: FlowResult['stations'][number];
  freeboard?: NonNullable<FlowResult['freeboard']>[number];
}

/** The station table of every flow of a run, one row per flow and station. */
export function stationsCsv(run: RunResult): string {
  const u = unitsOf(run.units);
  const columns: CsvColumn<StationRow>[] = [
    { name: 'flow', value: (r) => r.flow.id },
    { name: 'discharge', unit: u.discharge, value: (r) => r.flow.discharge, decimals: 4 },
    { name: 'station', unit: u.length, value: (r) => r.station.station, decimals: 3 },
    { name: 'reach', value: (r) => r.station.reach },
    { name: 'bed_elevation', unit: u.length, value: (r) => r.station.bedElevation, decimals: 4 },
    { name: 'depth', unit: u.length, value: (r) => r.station.depth, decimals: 4 },
    { name: 'wsel', unit: u.length, value: (r) => r.station.wsel, decimals: 4 },
    { name: 'energy_elevation', unit: u.length, value: (r) => r.station.energyElevation, decimals: 4 },
    { name: 'velocity', unit: u.velocity, value: (r) => r.station.velocity, decimals: 4 },
    { name: 'froude', value: (r) => r.station.froude, decimals: 4 },
    { name: 'regime', value: (r) => r.station.regime },
    { name: 'critical_depth', unit: u.length, value: (r) => r.station.criticalDepth, decimals: 4 },
    { name: 'normal_depth', unit: u.length, value: (r) => r.station.normalDepth, decimals: 4 },
  ];
  const rows: StationRow[] = [];
  for (const flow of run.flows) {
    // freeboard rows follow the station table (a station listed twice, at a jump toe, has two rows)
    const fb = new Map<number, NonNullable<FlowResult['freeboard']>>();
    for (const f of flow.freeboard ?? []) fb.set(f.station, [...(fb.get(f.station) ?? []), f]);
    const seen = new Map<number, number>();
    for (const station of flow.stations) {
      const k = seen.get(station.station) ?? 0;
      seen.set(station.station, k + 1);
      const freeboard = fb.get(station.station)?.[k];
      rows.push(freeboard === undefined ? { flow, station } : { flow, station, freeboard });
    }
  }
  // bank, freeboard and interpolation columns only where some station has them (prismatic runs keep their table)
  if (rows.some((r) => r.station.leftBank !== undefined || r.station.rightBank !== undefined || r.freeboard !== undefined)) {
    columns.push(
      { name: 'left_bank', unit: u.length, value: (r) => r.station.leftBank, decimals: 4 },
      { name: 'right_bank', unit: u.length, value: (r) => r.station.rightBank, decimals: 4 },
      { name: 'freeboard_left', unit: u.length, value: (r) => r.freeboard?.freeboardLeft, decimals: 4 },
      { name: 'freeboard_right', unit: u.length, value: (r) => r.freeboard?.freeboardRight, decimals: 4 },
      { name: 'freeboard_required', unit: u.length, value: (r) => r.freeboard?.required, decimals: 4 },
      { name: 'freeboard_pass', value: (r) => r.freeboard?.pass },
      { name: 'overtopped', value: (r) => r.freeboard?.overtopped },
      { name: 'energy_overtopped', value: (r) => r.freeboard?.energyOvertopped },
    );
  }
  if (rows.some((r) => r.station.interpolated === true)) columns.push({ name: 'interpolated', value: (r) => r.station.interpolated === true });
  return toCsv(columns, rows);
}
