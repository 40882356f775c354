/**
 * The chart specs of the analysis results: the sensitivity band and the high-water marks on the profile
 * chart (profileChart's `bands` and `observations` options), checked against the data they were built from.
 */
import { describe, expect, it } from 'vitest';
import { sensitivityAnalysis } from '../../src/analysis/sensitivity.js';
import { calibrationChart, ratingTableChart } from '../../src/cli/commands/analysisReport.js';
import { sensitivityChart } from '../../src/output/sensitivityFiles.js';
import { calibrateRoughness } from '../../src/analysis/calibrate.js';
import { ratingTable } from '../../src/analysis/rating.js';
import { profileChart } from '../../src/output/charts/profileChart.js';
import { twoReachModel } from './models.js';

type Spec = { datasets: Record<string, Record<string, unknown>[]>; layer: { name: string }[] };

describe('profileChart(bands, observations)', () => {
  it('profileChart without the new options has neither layer (unchanged for other callers)', () => {
    const { base } = sensitivityAnalysis(twoReachModel(), [{ parameter: 'n', percent: 10 }]);
    const spec = profileChart(base.result) as unknown as Spec;
    expect(spec.layer.map((l) => l.name)).not.toContain('bands');
    expect(spec.layer.map((l) => l.name)).not.toContain('observations');
    expect(spec.datasets.bands).toBeUndefined();
  });

  it('sensitivityChart draws each flow\'s envelope as a band under the lines, one row per base station', async () => {
    const { sensitivity, base } = sensitivityAnalysis(twoReachModel(), [{ parameter: 'n', percent: 20 }]);
    const spec = sensitivityChart(sensitivity, base.result) as unknown as Spec;
    const names = spec.layer.map((l) => l.name);
    expect(names.indexOf('bands')).toBeGreaterThan(names.indexOf('water'));
    expect(names.indexOf('bands')).toBeLessThan(names.indexOf('lines'));
    const rows = spec.datasets.bands!;
    expect(rows).toHaveLength(sensitivity.flows.reduce((n, f) => n + f.stations.length, 0));
    const major = rows.filter((r) => r.flow === 'major');
    const widest = sensitivity.flows.find((f) => f.id === 'major')!.largestRange!;
    const at = major.find((r) => Math.abs((r.station as number) - widest.station) < 1e-6)!;
    expect((at.high as number) - (at.low as number)).toBeCloseTo(widest.range, 6);
    expect(new Set(rows.map((r) => r.series))).toEqual(new Set(['Range of water surface, minor', 'Range of water surface, major']));
  });

  it('calibrationChart puts every mark at its observed elevation on the calibrated profile', async () => {
    const model = twoReachModel();
    const marks = [
      { station: 200, elevation: 2.9, flow: 'minor' },
      { station: 800, elevation: 2.45, flow: 'minor' },
    ];
    const c = calibrateRoughness(model, marks);
    const spec = (await calibrationChart(c)) as unknown as Spec;
    expect(spec.datasets.observations!.map((o) => [o.station, o.elevation])).toEqual([
      [200, 2.9],
      [800, 2.45],
    ]);
    // only the flow that left marks is drawn
    expect(new Set(spec.datasets.lines!.filter((l) => l.flow !== undefined).map((l) => l.flow))).toEqual(new Set(['minor']));
  });

  it('ratingTableChart gives one series per station with one point per discharge', async () => {
    const t = ratingTable(twoReachModel(), [100, 900], [3, 6, 9]);
    const spec = (await ratingTableChart(t)) as unknown as Spec;
    const rows = spec.datasets.rating!;
    expect(rows).toHaveLength(6);
    expect(rows.filter((r) => r.series === 'Station 100 m').map((r) => r.discharge)).toEqual([3, 6, 9]);
  });
});
