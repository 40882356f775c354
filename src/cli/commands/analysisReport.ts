/**
 * Printing the analysis commands' results: readable tables, CSV (unit-labelled headers, fixed decimals) and the
 * JSON structures of `gvf calibrate` and `gvf rating`, plus their chart specs, and the envelope table
 * `gvf run --sensitivity` prints (its files are written with the run's, src/output/sensitivityFiles.ts). Chart
 * specs only: rendering (vega, resvg) is imported by the commands when `--out` asks for files.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Calibration } from '../../analysis/calibrate.js';
import type { RatingTable } from '../../analysis/rating.js';
import type { Sensitivity } from '../../analysis/sensitivity.js';
import { unitsOf } from '../../core/units.js';
import type { RunResult } from '../../results/types.js';
import { screeningCaution } from '../../runSection.js';
import { type CsvColumn, toCsv } from '../../output/csv.js';
import { type Column, formatNumber, formatPairs, formatTable, formatSignificant } from '../../output/table.js';
import type { OutputFile } from '../../output/files.js';

/* ---- calibration ---- */

export function calibrationJson(c: Calibration): Record<string, unknown> {
  return {
    units: c.run.result.units,
    method: c.method,
    scope: c.scope,
    multipliers: c.multipliers,
    marks: c.marks,
    rmseBefore: c.rmseBefore,
    rmse: c.rmse,
    weightedRmse: c.weightedRmse,
    iterations: c.iterations,
    evaluations: c.evaluations,
    stop: c.stop,
    warnings: c.warnings,
    cautions: [screeningCaution],
    calibratedRun: c.run.result,
  };
}

export function calibrationText(c: Calibration): string {
  const u = unitsOf(c.run.result.units);
  const roughnessText = (m: Calibration['multipliers'][number]) =>
    m.roughness
      .map((r) => `${r.section} ${r.key} ${r.model === null ? 'varies' : formatSignificant(r.model)} → ${r.calibrated === null ? `×${formatNumber(m.multiplier, 3)}` : formatSignificant(r.calibrated)}`)
      .join('; ');
  const multiplierColumns: Column<Calibration['multipliers'][number]>[] = [
    { header: 'multiplier of', value: (m) => m.id, align: 'left' },
    { header: 'value', value: (m) => m.multiplier, decimals: 4 },
    { header: '± std error', value: (m) => m.standardError, decimals: 4 },
    { header: 'bounds', value: (m) => `${m.lower}–${m.upper}`, align: 'right' },
    { header: 'fitted', value: (m) => (m.fitted ? (m.atBound === null ? 'yes' : `on ${m.atBound} bound`) : 'no (left at 1)'), align: 'left' },
    { header: 'roughness (model → calibrated)', value: (m) => roughnessText(m) || '—', align: 'left' },
  ];
  const markColumns: Column<Calibration['marks'][number]>[] = [
    { header: 'station', unit: u.length, value: (m) => m.station, decimals: 2 },
    { header: 'flow', value: (m) => m.flow, align: 'left' },
    { header: 'observed', unit: u.length, value: (m) => m.observed, decimals: 3 },
    { header: 'before', unit: u.length, value: (m) => m.before, decimals: 3 },
    { header: 'calibrated', unit: u.length, value: (m) => m.computed, decimals: 3 },
    { header: 'residual', unit: u.length, value: (m) => m.residual, decimals: 3 },
    { header: 'weight', value: (m) => m.weight, decimals: 2 },
    { header: '∂WSEL/∂m', unit: u.length, value: (m) => m.sensitivity, decimals: 3 },
    { header: 'informs n', value: (m) => (m.insensitive ? 'no' : 'yes'), align: 'left' },
  ];
  const parts = [
    `Roughness calibration to high-water marks (${c.scope})${c.run.result.title ? `: ${c.run.result.title}` : ''}`,
    formatPairs([
      ['method', c.method],
      ['units', c.run.result.units],
      ['RMSE before', `${formatNumber(c.rmseBefore, 4)} ${u.length}`],
      ['RMSE calibrated', `${formatNumber(c.rmse, 4)} ${u.length} (weighted ${formatNumber(c.weightedRmse, 4)} ${u.length})`],
      ['iterations', `${c.iterations} (${c.evaluations} profile runs; ${c.stop})`],
    ]),
    '',
    formatTable(multiplierColumns, c.multipliers),
    '',
    'Marks (residual = calibrated − observed; ∂WSEL/∂m = change of water surface per unit change of the multipliers)',
    formatTable(markColumns, c.marks),
  ];
  if (c.warnings.length) parts.push('', 'Warnings:', ...c.warnings.map((w) => `  - ${w}`));
  parts.push('', `Caution: ${screeningCaution}`);
  return parts.join('\n');
}

export function calibrationCsv(c: Calibration): string {
  const u = unitsOf(c.run.result.units);
  const columns: CsvColumn<Calibration['marks'][number]>[] = [
    { name: 'station', unit: u.length, value: (m) => m.station, decimals: 3 },
    { name: 'flow', value: (m) => m.flow },
    { name: 'observed', unit: u.length, value: (m) => m.observed },
    { name: 'before', unit: u.length, value: (m) => m.before },
    { name: 'calibrated', unit: u.length, value: (m) => m.computed },
    { name: 'residual', unit: u.length, value: (m) => m.residual },
    { name: 'weight', value: (m) => m.weight },
    { name: 'sensitivity', unit: u.length, value: (m) => m.sensitivity },
    { name: 'informs_roughness', value: (m) => !m.insensitive },
  ];
  return toCsv(columns, c.marks);
}

/** The calibrated profile of the flows that left marks, with the marks as diamonds. */
export async function calibrationChart(c: Calibration): Promise<TopLevelSpec> {
  const { profileChart } = await import('../../output/charts/profileChart.js');
  const flows = [...new Set(c.marks.map((m) => m.flow))];
  const title = `${c.run.result.title ? `${c.run.result.title}: ` : ''}calibrated profile and high-water marks`;
  return profileChart(c.run.result, {
    flows,
    title,
    observations: { label: 'High-water mark', points: c.marks.map((m) => ({ station: m.station, elevation: m.observed, flow: m.flow })) },
  });
}

/* ---- rating tables ---- */

export function ratingJson(t: RatingTable): Record<string, unknown> {
  return { units: t.units, stations: t.stations, downstreamControl: t.downstreamControl, rows: t.rows, warnings: t.warnings, cautions: [screeningCaution] };
}

export function ratingText(t: RatingTable): string {
  const u = unitsOf(t.units);
  const columns: Column<RatingTable['rows'][number]>[] = [{ header: 'discharge', unit: u.discharge, value: (r) => r.discharge, decimals: 3 }];
  t.stations.forEach((x, j) => {
    columns.push(
      { header: `stage @ ${x}`, unit: u.length, value: (r) => r.values[j]?.stage, decimals: 3 },
      { header: `velocity @ ${x}`, unit: u.velocity, value: (r) => r.values[j]?.velocity, decimals: 3 },
    );
  });
  const parts = [`Rating table${t.run.result.title ? `: ${t.run.result.title}` : ''} (downstream control: ${t.downstreamControl}; units ${t.units})`, formatTable(columns, t.rows)];
  if (t.warnings.length) parts.push('', 'Warnings:', ...t.warnings.map((w) => `  - ${w}`));
  parts.push('', `Caution: ${screeningCaution}`);
  return parts.join('\n');
}

export function ratingCsv(t: RatingTable): string {
  const u = unitsOf(t.units);
  const rows = t.rows.flatMap((r) => r.values.map((v) => ({ discharge: r.discharge, ...v })));
  const columns: CsvColumn<(typeof rows)[number]>[] = [
    { name: 'discharge', unit: u.discharge, value: (r) => r.discharge },
    { name: 'station', unit: u.length, value: (r) => r.station, decimals: 3 },
    { name: 'stage', unit: u.length, value: (r) => r.stage },
    { name: 'depth', unit: u.length, value: (r) => r.depth },
    { name: 'velocity', unit: u.velocity, value: (r) => r.velocity },
    { name: 'regime', value: (r) => r.regime },
  ];
  return toCsv(columns, rows);
}

export async function ratingTableChart(t: RatingTable): Promise<TopLevelSpec> {
  const { ratingChart } = await import('../../output/charts/ratingChart.js');
  const u = unitsOf(t.units);
  return ratingChart({
    units: t.units,
    ...(t.run.result.title ? { title: `${t.run.result.title}: rating curve` } : {}),
    series: t.stations.map((x, j) => ({
      label: `Station ${x} ${u.length}`,
      points: t.rows.flatMap((r) => (r.values[j] === undefined ? [] : [{ discharge: r.discharge, stage: r.values[j]!.stage }])),
    })),
  });
}

/* ---- sensitivity ---- */

export function sensitivityText(s: Sensitivity, units: RunResult['units']): string {
  const u = unitsOf(units);
  const variations = s.variations.map((v) => `${v.parameter} ±${v.percent} %`).join(', ');
  const parts = [`Sensitivity (${variations}; ${s.cases.filter((c) => c.computed).length} of ${s.cases.length} cases computed, every combination)`];
  for (const flow of s.flows) {
    const columns: Column<(typeof flow.stations)[number]>[] = [
      { header: 'station', unit: u.length, value: (e) => e.station, decimals: 2 },
      { header: 'base WSEL', unit: u.length, value: (e) => e.base, decimals: 3 },
      { header: 'lowest', unit: u.length, value: (e) => e.low, decimals: 3 },
      { header: 'highest', unit: u.length, value: (e) => e.high, decimals: 3 },
      { header: 'range', unit: u.length, value: (e) => e.range, decimals: 3 },
      { header: 'highest in case', value: (e) => e.highCase, align: 'left' },
    ];
    parts.push('', `Flow ${flow.id} (${formatNumber(flow.discharge, 3)} ${u.discharge})`);
    if (flow.largestRange) parts.push(`widest range ${formatNumber(flow.largestRange.range, 3)} ${u.length} at station ${formatNumber(flow.largestRange.station, 2)}`);
    if (flow.jumpToeRange) parts.push(`jump toe between stations ${formatNumber(flow.jumpToeRange.lowest, 2)} and ${formatNumber(flow.jumpToeRange.highest, 2)} over all cases`);
    parts.push(formatTable(columns, flow.stations));
    if (flow.notes.length) parts.push('Changes:', ...flow.notes.map((n) => `  - ${n}`));
  }
  if (s.warnings.length) parts.push('', 'Warnings:', ...s.warnings.map((w) => `  - ${w}`));
  return parts.join('\n');
}

/* ---- files ---- */

/** A chart as the three files gvf writes for every chart: the spec, SVG and PNG. */
export async function chartFiles(name: string, spec: TopLevelSpec): Promise<OutputFile[]> {
  const { renderChart } = await import('../../output/render.js');
  const out = await renderChart(spec);
  return [
    { name: `charts/${name}.vl.json`, content: `${JSON.stringify(spec, null, 2)}\n` },
    { name: `charts/${name}.svg`, content: out.svg },
    { name: `charts/${name}.png`, content: out.png },
  ];
}

/** JSON with non-finite numbers as null, ending in a newline. */
export function jsonText(value: unknown): string {
  return `${JSON.stringify(value, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`;
}
