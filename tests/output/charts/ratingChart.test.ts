/** Spec tests of the rating chart; stages are read off the invented run of ../fixtures.ts by straight-line interpolation. */
import { describe, expect, it } from 'vitest';
import { ratingChart, ratingSeriesFromRun } from '../../../src/output/charts/ratingChart.js';
import { compileChart } from '../../../src/output/render.js';
import { assertInDelta } from '../../helpers/assert.js';
import { twoReachRun } from '../fixtures.js';

describe('ratingChart(input)', () => {
  const run = twoReachRun();

  it('ratingSeriesFromRun(run, stations) gives one stage per flow at each station, sorted by discharge', () => {
    const [s0, s205, outside] = ratingSeriesFromRun(run, [0, 205, 900]);
    expect(s0!.label).toBe('Station 0 m');
    expect(s0!.points.map((p) => p.discharge)).toEqual([6, 9]);
    assertInDelta(s0!.points[0]!.stage, run.flows[0]!.stations[0]!.wsel, 1e-12, 'stage at a station');
    // 205 m lies halfway between the stations at 200 and 210
    const st = run.flows[1]!.stations;
    const a = st.find((s) => s.station === 200)!.wsel;
    const b = st.find((s) => s.station === 210)!.wsel;
    assertInDelta(s205!.points[1]!.stage, (a + b) / 2, 1e-12, 'interpolated stage');
    expect(outside!.points).toEqual([]);
  });

  it('ratingChart(input) puts stage against discharge with units on the axes, and compiles cleanly', async () => {
    const spec = ratingChart({ units: 'US', series: ratingSeriesFromRun(run, [0, 400]) }) as any;
    const enc = spec.layer[0].encoding;
    expect(enc.x.title).toBe('Discharge (ft³/s)');
    expect(enc.y.title).toBe('Stage (ft)');
    expect(spec.datasets.rating.length).toBe(4);
    expect((await compileChart(spec)).warnings).toEqual([]);
  });
});
