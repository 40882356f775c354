/**
 * The files a sensitivity run (`gvf run --sensitivity … --out DIR`) adds to the run's outputs: the envelope of
 * every flow as sensitivity.csv and the base profile with each flow's range drawn as a band. They are built here,
 * beside the rest of the run's files (runFiles.ts), so they are written in the same staged step and recorded in
 * the folder's list of outputs like every other file gvf writes.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Sensitivity } from '../analysis/sensitivity.js';
import { unitsOf } from '../core/units.js';
import type { RunResult } from '../results/types.js';
import { profileChart } from './charts/profileChart.js';
import { type CsvColumn, toCsv } from './csv.js';

/** The envelope table file: per flow and station the base, lowest and highest water surface and their cases. */
export const sensitivityCsvName = 'sensitivity.csv';
/** The band chart's file name without extension (written as .vl.json, .svg and .png under charts/). */
export const sensitivityChartName = 'sensitivity-profile';

export function sensitivityCsv(s: Sensitivity, units: RunResult['units']): string {
  const u = unitsOf(units);
  const rows = s.flows.flatMap((f) => f.stations.map((e) => ({ flow: f.id, ...e })));
  const columns: CsvColumn<(typeof rows)[number]>[] = [
    { name: 'flow', value: (r) => r.flow },
    { name: 'station', unit: u.length, value: (r) => r.station, decimals: 3 },
    { name: 'bed_elevation', unit: u.length, value: (r) => r.bedElevation },
    { name: 'base_wsel', unit: u.length, value: (r) => r.base },
    { name: 'lowest_wsel', unit: u.length, value: (r) => r.low },
    { name: 'highest_wsel', unit: u.length, value: (r) => r.high },
    { name: 'range', unit: u.length, value: (r) => r.range },
    { name: 'lowest_case', value: (r) => r.lowCase },
    { name: 'highest_case', value: (r) => r.highCase },
  ];
  return toCsv(columns, rows);
}

/** The base profile with each flow's envelope drawn as a band. */
export function sensitivityChart(s: Sensitivity, result: RunResult): TopLevelSpec {
  const variations = s.variations.map((v) => `${v.parameter} ±${v.percent} %`).join(', ');
  return profileChart(result, {
    title: `${result.title ? `${result.title}: ` : ''}profile with the range for ${variations}`,
    bands: s.flows.map((f) => ({ flow: f.id, label: `Range of water surface, ${f.id}`, rows: f.stations.map((e) => ({ station: e.station, low: e.low, high: e.high })) })),
  });
}
