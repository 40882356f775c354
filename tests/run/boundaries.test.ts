import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core/errors.js';
import { SI } from '../../src/core/units.js';
import { parseModelText } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';
import { computeChannelProfile } from '../../src/profile/channelFlow.js';
import { computeProfile } from '../../src/profile/engine.js';
import { computeReservoirProfile } from '../../src/profile/reservoir.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { rect } from '../structures/controls/support.js';

const base = (slope: number, discharge = 4) => ({
  units: SI,
  reaches: [{ id: 'a', section: rect(3), length: 400, slope }],
  discharge,
  flowId: 'f',
  boundaries: { downstream: { type: 'normal' as const } },
  method: 'standard-step' as const,
  outputSpacing: 10,
  downstreamBedElevation: 100,
});

function model(extra: Record<string, unknown>, flows: unknown[] = [{ id: 'f', discharge: 20 }]): string {
  return JSON.stringify({
    units: 'SI',
    description: 'an invented test channel',
    sections: { c: { shape: 'rectangular', bottomWidth: 5, n: 0.02 } },
    reaches: [{ id: 'c', section: 'c', length: 500, slope: 0.001 }],
    downstreamBedElevation: 10,
    flows,
    ...extra,
  });
}

describe('rating-curve downstream boundary', () => {
  it('runModel with a rating table starts the profile at the interpolated stage', () => {
    // linear interpolation between (11.0, 10) and (12.0, 30): Q = 20 → stage 11.5 (closed form)
    const m = parseModelText(model({ boundaries: { downstream: { type: 'rating', table: [[10.5, 2], [11.0, 10], [12.0, 30], [13.0, 60]] } } }), 'm.json');
    const flow = runModel(m).result.flows[0]!;
    const last = flow.stations[flow.stations.length - 1]!;
    assertInDelta(last.wsel, 11.5, 1e-12, 'stage at the downstream end');
    expect(flow.controls!.some((c) => c.kind === 'rating curve' && /interpolated/.test(c.reason))).toBe(true);
  });

  it('runModel with a rating table refuses a discharge outside it, naming the range', () => {
    const m = parseModelText(model({ boundaries: { downstream: { type: 'rating', table: [[10.5, 2], [11.0, 10], [12.0, 15]] } } }), 'm.json');
    expect(() => runModel(m)).toThrow(InputError);
    expect(() => runModel(m)).toThrow(/discharges 2 to 15/);
  });

  it('runModel reads a rating curve CSV beside the model and refuses one outside its folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gvf-rating-'));
    writeFileSync(join(dir, 'rating.csv'), 'stage (m),discharge (m3/s)\n10.5,2\n11.0,10\n12.0,30\n13.0,60\n');
    const file = join(dir, 'model.json');
    const m = parseModelText(model({ boundaries: { downstream: { type: 'rating', file: 'rating.csv' } } }), file);
    const flow = runModel(m, { modelFile: file }).result.flows[0]!;
    assertInDelta(flow.stations[flow.stations.length - 1]!.wsel, 11.5, 1e-12, 'stage from the CSV');
    const outside = parseModelText(model({ boundaries: { downstream: { type: 'rating', file: '../rating.csv' } } }), file);
    expect(() => runModel(outside, { modelFile: file })).toThrow(/outside/);
  });

  it('validateModel wants exactly one of table and file in a rating boundary', () => {
    expect(() => parseModelText(model({ boundaries: { downstream: { type: 'rating' } } }), 'm.json')).toThrow(/either "table"/);
  });
});

describe('reservoir upstream boundary', () => {
  it('computeReservoirProfile on a steep rectangular channel equals the critical-entrance closed form Q = b·√g·(2/3·E)^1.5', () => {
    // critical depth at the entrance: E = 1.5·yc, q = √(g·yc³) (Chow 1959 ch. 3; common closed form)
    const input = base(0.02);
    const E = 1.5;
    const { solution, result } = computeReservoirProfile(input, { poolElevation: 100 + 400 * 0.02 + E });
    expect(solution.fixedBy).toBe('entrance');
    assertRelative(solution.discharge, 3 * Math.sqrt(SI.g) * Math.pow((2 / 3) * E, 1.5), 1e-6, 'Q');
    expect(result.discharge).toBe(solution.discharge);
    expect(result.controls![0]!.kind).toBe('reservoir');
  });

  it('computeReservoirProfile on a mild channel: the downstream control sets the discharge and the entrance energy meets the pool', () => {
    const input = base(0.0005);
    const pool = 100 + 400 * 0.0005 + 1.5;
    const { solution } = computeReservoirProfile(input, { poolElevation: pool, entranceLoss: 0.2 });
    expect(solution.fixedBy).toBe('downstream');
    expect(solution.discharge).toBeLessThan(solution.criticalEntranceDischarge);
    // energy from the still pool to the entrance: pool = z0 + y0 + (1 + ke)·V0²/2g (α = 1)
    const v = solution.entranceVelocity;
    assertInDelta(solution.entranceBedElevation + solution.entranceDepth + (1.2 * v * v) / (2 * SI.g), pool, 1e-6, 'energy balance at the entrance');
  });

  it('runModel with a reservoir finds each flow’s discharge from its pool elevation and refuses a discharge given', () => {
    const text = model({ boundaries: { upstream: { type: 'reservoir', poolElevation: 12.3 } } }, [{ id: 'low' , poolElevation: 11.9 }, { id: 'high' }]);
    const flows = runModel(parseModelText(text, 'm.json')).result.flows;
    expect(flows[0]!.discharge).toBeLessThan(flows[1]!.discharge);
    const bad = model({ boundaries: { upstream: { type: 'reservoir', poolElevation: 12.3 } } }, [{ id: 'x', discharge: 3 }]);
    expect(() => parseModelText(bad, 'm.json')).toThrow(/fixes the discharge/);
  });
});

describe('flow changes and lateral inflow', () => {
  it('computeChannelProfile: a tributary keeps the water surface continuous and the discharge below is the sum', () => {
    const r = computeChannelProfile({ ...base(0.001, 2), dischargeChanges: [{ station: 200, added: 3, id: 'trib' }] });
    const at = r.stations.filter((s) => s.station === 200);
    expect(at.length).toBeGreaterThanOrEqual(1);
    const below = r.stations.filter((s) => s.station > 200);
    for (const s of below) {
      expect(s.discharge).toBe(5);
      assertRelative(s.velocity, 5 / (3 * s.depth), 1e-12, 'V = Q/A below');
    }
    const above = r.stations.filter((s) => s.station < 200);
    for (const s of above) expect(s.discharge).toBe(2);
    // below the change the channel matches a run of its own with the larger discharge (continuity of depth at the junction)
    const alone = computeProfile({ ...base(0.001, 5), reaches: [{ id: 'a', section: rect(3), length: 200, slope: 0.001 }] });
    assertInDelta(at[at.length - 1]!.depth, alone.stations[0]!.depth, 1e-9, 'depth at the junction');
  });

  it('computeChannelProfile: spatially varied flow with zero lateral inflow reduces to the ordinary profile (whole-channel run)', () => {
    // with q* = 0 the momentum equation of spatially varied flow is the gradually varied flow equation (Chow 1959 ch. 12)
    const input = { ...base(0.001, 4), method: 'ode' as const, boundaries: { downstream: { type: 'depth' as const, depth: 1.6 } } };
    const plain = computeProfile(input);
    const svf = computeChannelProfile({ ...input, lateralInflow: [{ from: 100, to: 300, inflowPerLength: 0 }] });
    for (const s of plain.stations) {
      const match = svf.stations.find((t) => Math.abs(t.station - s.station) < 1e-9);
      expect(match, `station ${s.station}`).toBeDefined();
      assertInDelta(match!.depth, s.depth, 1e-3, `depth at ${s.station}`); // the accuracy goal: 1 mm in SI
    }
  });

  it('computeChannelProfile: lateral inflow raises the discharge along its stretch by q*·length', () => {
    const r = computeChannelProfile({ ...base(0.001, 2), lateralInflow: [{ from: 100, to: 300, inflowPerLength: 0.01 }] });
    const mid = r.stations.find((s) => s.station === 200)!;
    assertRelative(mid.discharge!, 3, 1e-12, 'Q at the middle');
    expect(r.stations[r.stations.length - 1]!.discharge).toBeCloseTo(4, 12);
  });
});
