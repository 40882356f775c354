import { describe, expect, it } from 'vitest';
import { sensitivityAnalysis } from '../../src/analysis/sensitivity.js';
import { sensitivityCases } from '../../src/analysis/variation.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';
import { assertInDelta } from '../helpers/assert.js';
import { manningRectangleDepth, steepToMildModel, twoReachModel, uniformModel } from './models.js';

describe('sensitivityCases', () => {
  it('sensitivityCases(n ±20 %, Q ±10 %) gives the 9 combinations, base first', () => {
    const cases = sensitivityCases([
      { parameter: 'n', percent: 20 },
      { parameter: 'Q', percent: 10 },
    ]);
    expect(cases).toHaveLength(9);
    expect(cases[0]).toEqual({ label: 'base', n: 1, Q: 1, base: true });
    expect(cases.map((c) => c.label)).toContain('n +20 %, Q −10 %');
    const corner = cases.find((c) => c.label === 'n +20 %, Q +10 %')!;
    expect(corner.n).toBeCloseTo(1.2, 14);
    expect(corner.Q).toBeCloseTo(1.1, 14);
  });
});

describe('sensitivityAnalysis', () => {
  it('sensitivityAnalysis bands contain the base profile at every station', () => {
    const model = twoReachModel();
    const { sensitivity, base } = sensitivityAnalysis(model, [
      { parameter: 'n', percent: 20 },
      { parameter: 'Q', percent: 10 },
    ]);
    expect(sensitivity.cases.every((c) => c.computed)).toBe(true);
    sensitivity.flows.forEach((flow, i) => {
      const baseFlow = base.result.flows[i]!;
      expect(flow.stations).toHaveLength(baseFlow.stations.length);
      for (const [j, e] of flow.stations.entries()) {
        expect(e.base).toBe(baseFlow.stations[j]!.wsel);
        expect(e.low).toBeLessThanOrEqual(e.base);
        expect(e.high).toBeGreaterThanOrEqual(e.base);
      }
      // the fixed stage downstream holds the band shut there; upstream it opens
      expect(flow.stations.at(-1)!.range).toBeLessThan(1e-9);
      expect(flow.largestRange!.range).toBeGreaterThan(0.1);
    });
  });

  it('sensitivityAnalysis bands widen with the variation (±10 % inside ±20 %)', () => {
    const model = twoReachModel();
    const narrow = sensitivityAnalysis(model, [{ parameter: 'n', percent: 10 }]).sensitivity;
    const wide = sensitivityAnalysis(model, [{ parameter: 'n', percent: 20 }]).sensitivity;
    narrow.flows.forEach((flow, i) => {
      let wider = 0;
      flow.stations.forEach((e, j) => {
        const w = wide.flows[i]!.stations[j]!;
        expect(w.station).toBe(e.station);
        expect(w.low).toBeLessThanOrEqual(e.low + 1e-9);
        expect(w.high).toBeGreaterThanOrEqual(e.high - 1e-9);
        if (w.range > e.range * 1.5) wider++;
      });
      expect(wider).toBeGreaterThan(flow.stations.length / 2);
    });
  });

  it('sensitivityAnalysis(uniform flow) band edges are the normal depths of the corner cases (Manning 1891)', () => {
    // normal depth at both ends of a long canal: every case is uniform flow, so the band is bounded by Manning's
    // normal depth for (n·0.8, Q·0.9) and (n·1.2, Q·1.1), solved independently here
    const model = uniformModel();
    const { sensitivity } = sensitivityAnalysis(model, [
      { parameter: 'n', percent: 20 },
      { parameter: 'Q', percent: 10 },
    ]);
    const mid = sensitivity.flows[0]!.stations.find((s) => s.station === 1000)!;
    assertInDelta(mid.high - mid.bedElevation, manningRectangleDepth(12 * 1.1, 6, 0.02 * 1.2, 0.001), 1e-3, 'high');
    assertInDelta(mid.low - mid.bedElevation, manningRectangleDepth(12 * 0.9, 6, 0.02 * 0.8, 0.001), 1e-3, 'low');
    expect(mid.highCase).toBe('n +20 %, Q +10 %');
    expect(mid.lowCase).toBe('n −20 %, Q −10 %');
  });

  it('sensitivityAnalysis reports where the profile type changes (M1 behind a stage becomes M2 when normal depth rises above it)', () => {
    // major flow: normal depth 2.16 m just under the fixed stage 2.2 m (M1); 20 % rougher lifts normal depth
    // above the stage, so the lower reach draws down to it (M2): the zone rule of Chow 1959 ch. 9
    const { sensitivity } = sensitivityAnalysis(twoReachModel(), [{ parameter: 'n', percent: 20 }]);
    const major = sensitivity.flows.find((f) => f.id === 'major')!;
    const change = major.profileTypeChanges.find((c) => c.reach === 'lower' && c.case === 'n +20 %')!;
    expect(change.base).toEqual(['M1']);
    expect(change.varied[0]).toBe('M2');
    expect(major.notes).toContain(`n +20 %: the profile types of reach lower change from M1 to ${change.varied.join(' then ')}`);
  });

  it('sensitivityAnalysis reports how far the jump toe moves', () => {
    const model = steepToMildModel();
    const baseToe = runModel(model).result.flows[0]!.jumps[0]!.station;
    const { sensitivity } = sensitivityAnalysis(model, [{ parameter: 'n', percent: 20 }]);
    const flow = sensitivity.flows[0]!;
    expect(flow.jumpChanges.length).toBeGreaterThan(0);
    for (const j of flow.jumpChanges) {
      expect(j.base).toBe(baseToe);
      expect(j.shift).not.toBeNull();
    }
    expect(flow.jumpToeRange!.lowest).toBeLessThan(baseToe);
    expect(flow.jumpToeRange!.highest).toBeGreaterThan(baseToe);
    expect(flow.notes.some((n) => n.startsWith('n +20 %: the jump toe moves from station'))).toBe(true);
  });
});

describe('sensitivityAnalysis(surveyed reaches)', () => {
  it('sensitivityAnalysis(samples/survey-drain, n ±20 %) opens a band between a fixed stage and a critical control, rougher higher on the mild reach', () => {
    // every surveyed section's n (and every interpolated one's) times 0.8 and 1.2. The band must be shut where
    // roughness cannot move the water: at the pool's fixed stage (station 0) and at the upstream critical-depth
    // control (station 400: critical depth, Q²·T/(g·A³) = 1 with α, involves no roughness, and α is unchanged
    // when every zone's n is scaled alike; Chow 1959 §2-8 and §3-2, from memory). On the mild lower reach the
    // flow is subcritical and held from downstream, so a rougher channel stands higher (Sf grows with n², and
    // the standard step carries the difference upstream: common practice)
    const file = 'samples/survey-drain/model.json';
    const model = readModelFile(file);
    const { sensitivity, base } = sensitivityAnalysis(model, [{ parameter: 'n', percent: 20 }], { run: { modelFile: file } });
    expect(sensitivity.cases.map((c) => [c.label, c.computed])).toEqual([['base', true], ['n −20 %', true], ['n +20 %', true]]);
    expect(sensitivity.warnings).toEqual([]);
    sensitivity.flows.forEach((flow, i) => {
      const baseFlow = base.result.flows[i]!;
      expect(flow.stations).toHaveLength(baseFlow.stations.length);
      for (const e of flow.stations) {
        expect(e.low).toBeLessThanOrEqual(e.base);
        expect(e.high).toBeGreaterThanOrEqual(e.base);
      }
      const at = (station: number) => flow.stations.find((e) => e.station === station)!;
      expect(at(0).range, `${flow.id} at the pool`).toBeLessThan(1e-9);
      expect(at(400).range, `${flow.id} at the critical control`).toBeLessThan(1e-6);
      const lower = flow.stations.filter((e) => e.station > 0 && e.station <= 320).sort((a, b) => a.station - b.station);
      expect(lower.length).toBeGreaterThan(10);
      for (const e of lower) expect([e.lowCase, e.highCase], `${flow.id} at ${e.station}`).toEqual(['n −20 %', 'n +20 %']);
      // a band of centimetres at the reach junction: the multiplier reached the surveyed and interpolated sections
      expect(at(320).range, `${flow.id} at 320`).toBeGreaterThan(0.05);
    });
  });
});
