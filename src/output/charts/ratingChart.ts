/**
 * A rating curve chart (stage against discharge) as a Vega-Lite spec: one line with points per station.
 * `ratingSeriesFromRun` reads the stages of a run's flows at chosen stations (straight-line interpolation
 * along each flow's station table), so a run of several flows gives its own rating curves.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { UnitSystem } from '../../core/units.js';
import type { RunResult } from '../../results/types.js';
import { chartConfig, dash, palette, pick, size, stroke, words, lengthUnit } from './style.js';
import { SeriesKey, extent, interpolate, isFiniteNumber, padded, r } from './series.js';

export interface RatingPoint {
  discharge: number;
  stage: number;
  flow?: string;
}

export interface RatingSeries {
  /** words for the legend, e.g. "Station 250 m" */
  label: string;
  points: readonly RatingPoint[];
}

export interface RatingChartInput {
  units: UnitSystem;
  series: readonly RatingSeries[];
  title?: string;
  width?: number;
  height?: number;
}

/** Stage (water-surface elevation) against discharge at each of `stations`, one point per flow of the run. */
export function ratingSeriesFromRun(run: RunResult, stations: readonly number[]): RatingSeries[] {
  const u = lengthUnit(run.units);
  return stations.filter(isFiniteNumber).map((x) => {
    const points: RatingPoint[] = [];
    for (const flow of run.flows) {
      const st = flow.stations;
      if (st.length === 0) continue;
      const lo = Math.min(...st.map((s) => s.station));
      const hi = Math.max(...st.map((s) => s.station));
      if (x < lo || x > hi) continue;
      const stage = interpolate(st.map((s) => ({ x: s.station, y: s.wsel })), x);
      if (stage !== null && isFiniteNumber(flow.discharge)) points.push({ discharge: flow.discharge, stage, flow: flow.id });
    }
    points.sort((a, b) => a.discharge - b.discharge);
    return { label: `Station ${x} ${u}`, points };
  });
}

/** Key names longer than this (characters) get two columns instead of three. */
const legendLongName = 24;

export function ratingChart(input: RatingChartInput): TopLevelSpec {
  const width = input.width ?? size.rating.width;
  const height = input.height ?? size.rating.height;
  const key = new SeriesKey();
  const rows = input.series.flatMap((s, i) => {
    const series = key.add(s.label, pick(palette.water, i), dash.solid);
    return s.points
      .filter((p) => isFiniteNumber(p.discharge) && isFiniteNumber(p.stage))
      .map((p, order) => ({ discharge: r(p.discharge), stage: r(p.stage), series, order, flow: p.flow ?? '' }));
  });
  const xr = extent(rows.map((p) => p.discharge)) ?? [0, 1];
  const yr = extent(rows.map((p) => p.stage)) ?? [0, 1];
  const [yLow, yHigh] = padded(yr, 0.08, 0.08);
  // one key entry per station: two columns when the names are long, so none is cut off at the right
  const longest = Math.max(0, ...key.series.map((e) => [...e.name].length));
  const columns = longest > legendLongName ? 2 : 3;
  const colour = key.colour(words.legendTitle, { orient: 'bottom', direction: 'horizontal', columns, labelLimit: Math.floor(width / columns) - 10, symbolSize: 100 });
  const x = { field: 'discharge', type: 'quantitative', title: words.dischargeAxis(input.units), scale: { domain: [0, r(xr[1] * 1.05)], nice: false } } as const;
  const y = { field: 'stage', type: 'quantitative', title: words.stageAxis(input.units), scale: { domain: [r(yLow), r(yHigh)], nice: false, zero: false } } as const;
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: 'gvf rating curve',
    title: { text: input.title ?? words.ratingTitle, limit: width - 10, subtitle: 'Stage against discharge' },
    width,
    height,
    autosize: { type: 'fit', contains: 'padding' },
    config: chartConfig(),
    datasets: { rating: rows },
    layer: [
      {
        name: 'rating-lines',
        data: { name: 'rating' },
        mark: { type: 'line', strokeWidth: stroke.water, point: { filled: true, size: 50 } },
        encoding: { x, y, color: colour, order: { field: 'order' } },
      },
    ],
  };
  return spec as unknown as TopLevelSpec;
}
