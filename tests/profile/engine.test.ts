/**
 * computeProfile on prismatic channels: each profile type where the theory of gradually varied flow puts it
 * (Chow 1959, ch. 9, fig. 9-1 and §9-3; Henderson 1966, §4.3: published classification), and the three
 * methods agreeing with a tight-tolerance ODE solution within the accuracy goal (core/tolerances.ts).
 */
import { describe, expect, it } from 'vitest';
import { criticalSlope } from '../../src/hydraulics/slopeClass.js';
import { compareMethods } from '../../src/profile/compare.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { ProfileType } from '../../src/results/types.js';
import type { ProfileInput } from '../../src/profile/types.js';
import { accuracyFor } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { points } from '../../src/geometry/shapes/points.js';
import { conveyanceAndAlpha, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { channel, rect5, rect5Discharge } from './channels.js';

const mild = 0.0005; // yn = 2.358 m > yc = 1.177 m for rect5 at 20 m³/s
const steep = 0.02; // yn = 0.656 m < yc
const sc = criticalSlope(rect5, rect5Discharge);

function types(input: ProfileInput): ProfileType[] {
  return computeProfile(input).reaches.flatMap((r) => r.profiles.map((p) => p.type));
}

interface Case {
  readonly name: ProfileType;
  readonly input: ProfileInput;
  /** the sequence of types expected from upstream to downstream ('uniform' stretches dropped) */
  readonly sequence: ProfileType[];
}

const cases: Case[] = [
  { name: 'M1', input: channel([{ id: 'm', section: rect5, length: 3000, slope: mild }], { downstream: { type: 'depth', depth: 4 } }), sequence: ['M1'] },
  { name: 'M2', input: channel([{ id: 'm', section: rect5, length: 3000, slope: mild }], { downstream: { type: 'critical' } }), sequence: ['M2'] },
  {
    name: 'M3',
    input: channel([{ id: 'm', section: rect5, length: 3000, slope: mild }], { upstream: { type: 'depth', depth: 0.4 }, downstream: { type: 'critical' } }),
    sequence: ['M3', 'M2'],
  },
  {
    name: 'S1',
    input: channel([{ id: 's', section: rect5, length: 300, slope: steep }], { upstream: { type: 'critical' }, downstream: { type: 'depth', depth: 3 } }),
    sequence: ['S2', 'S1'],
  },
  { name: 'S2', input: channel([{ id: 's', section: rect5, length: 300, slope: steep }], { upstream: { type: 'critical' } }), sequence: ['S2'] },
  { name: 'S3', input: channel([{ id: 's', section: rect5, length: 300, slope: steep }], { upstream: { type: 'depth', depth: 0.3 } }), sequence: ['S3'] },
  { name: 'C1', input: channel([{ id: 'c', section: rect5, length: 200, slope: sc }], { upstream: { type: 'critical' }, downstream: { type: 'depth', depth: 2 } }), sequence: ['C1'] },
  { name: 'C3', input: channel([{ id: 'c', section: rect5, length: 200, slope: sc }], { upstream: { type: 'depth', depth: 0.5 } }), sequence: ['C3'] },
  { name: 'H2', input: channel([{ id: 'h', section: rect5, length: 500, slope: 0 }], { downstream: { type: 'critical' } }), sequence: ['H2'] },
  {
    name: 'H3',
    input: channel([{ id: 'h', section: rect5, length: 300, slope: 0 }], { upstream: { type: 'depth', depth: 0.4 }, downstream: { type: 'critical' } }),
    sequence: ['H3', 'H2'],
  },
  { name: 'A2', input: channel([{ id: 'a', section: rect5, length: 300, slope: -0.002 }], { downstream: { type: 'critical' } }), sequence: ['A2'] },
  {
    name: 'A3',
    input: channel([{ id: 'a', section: rect5, length: 300, slope: -0.002 }], { upstream: { type: 'depth', depth: 0.4 }, downstream: { type: 'critical' } }),
    sequence: ['A3', 'A2'],
  },
];

describe('computeProfile: profile types by zone (Chow 1959 fig. 9-1, published)', () => {
  for (const c of cases) {
    it(`computeProfile gives ${c.name} where the theory puts it (${c.sequence.join(' → ')})`, () => {
      for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
        const seen = types({ ...c.input, method }).filter((t) => t !== 'uniform');
        expect(seen, method).toEqual(c.sequence);
      }
    });
    it(`compareMethods on the ${c.name} case: every method within the accuracy goal of the reference ODE`, () => {
      const comparison = compareMethods(c.input);
      for (const m of comparison.methods) {
        expect(m.comparedStations, m.method).toBeGreaterThan(10);
        expect(m.worstRatio, `${m.method} off by ${m.maxDifference} at station ${m.station} (goal ${m.allowed})`).toBeLessThanOrEqual(1);
      }
      expect(comparison.withinGoal).toBe(true);
    });
  }
});

describe('computeProfile: depths lie in the zone their type names (Chow 1959 §9-2, published)', () => {
  it('computeProfile: every station of an M1 stretch lies above normal depth, of M2 between yc and yn, of M3 below yc', () => {
    const result = computeProfile(cases[2]!.input);
    const reach = result.reaches[0]!;
    const yn = reach.normalDepth!;
    const yc = reach.criticalDepth;
    for (const p of reach.profiles) {
      const inside = result.stations.filter((s) => s.station > p.from && s.station < p.to);
      for (const s of inside) {
        if (p.type === 'M3') expect(s.depth).toBeLessThan(yc);
        if (p.type === 'M2') {
          expect(s.depth).toBeGreaterThan(yc);
          expect(s.depth).toBeLessThan(yn);
        }
      }
    }
  });
});

describe('computeProfile: compound section with α from subsection conveyances (dE/dx form)', () => {
  // an invented compound channel: 10 m main channel 2 m deep (n = 0.03) with 40 m floodplains each side (n = 0.06)
  const compound = hydraulicSection(
    points({
      points: [
        [0, 5], [2, 2.5], [40, 2.2], [45, 2], [47, 0], [53, 0], [55, 2], [60, 2.2], [98, 2.5], [100, 5],
      ],
      roughness: [[0, 0.06], [45, 0.03], [55, 0.06]],
    }),
    'manning',
    SI,
  );
  const input: ProfileInput = {
    units: SI,
    reaches: [{ id: 'flood', section: compound, length: 4000, slope: 0.0004 }],
    discharge: 60,
    flowId: 'flood',
    // backwater from 3.5 m: the water spreads over the floodplains, where α changes fast with depth
    boundaries: { downstream: { type: 'depth', depth: 3.5 } },
    method: 'ode',
  };
  it('compareMethods: standard step and direct step (which balance E with α(y)) agree with the ODE using dα/dy in dE/dy', () => {
    const c = compareMethods(input);
    for (const m of c.methods) expect(m.worstRatio, `${m.method}: ${m.maxDifference} at ${m.station}`).toBeLessThanOrEqual(1);
    // tighter: the standard step at 4× resolution sits within 1/40 of the goal of the reference ODE (measured 0.02 mm;
    // leaving dα/dy out of dE/dy moves the ODE by about 0.45 mm here, over five times the bound)
    const fine = computeProfile({ ...input, method: 'standard-step', refinement: 4 });
    fine.stations.forEach((s, i) => {
      const ref = c.reference.stations[i]!;
      expect(ref.station).toBe(s.station);
      expect(Math.abs(s.depth - ref.depth), `station ${s.station}`).toBeLessThanOrEqual(accuracyFor('SI', s.depth) / 40);
    });
    const alphas = c.reference.stations.map((s) => conveyanceAndAlpha(compound, s.depth, 60).alpha);
    expect(Math.max(...alphas) - Math.min(...alphas)).toBeGreaterThan(0.05); // α really varies along the profile
  });
});

describe('computeProfile: resolution and friction averaging', () => {
  const base = channel([{ id: 'm', section: rect5, length: 3000, slope: mild }], { upstream: { type: 'depth', depth: 0.4 }, downstream: { type: 'critical' } });
  it('computeProfile: doubling the internal resolution (refinement 2) changes no depth by more than the accuracy goal', () => {
    for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
      const a = computeProfile({ ...base, method });
      const b = computeProfile({ ...base, method, refinement: 2 });
      const toe = [a.jumps[0]!.station, b.jumps[0]!.station];
      a.stations.forEach((s) => {
        if (s.station >= Math.min(...toe) && s.station <= Math.max(...toe)) return;
        const other = b.stations.find((t) => t.station === s.station)!;
        expect(Math.abs(other.depth - s.depth), `${method} at ${s.station}`).toBeLessThanOrEqual(accuracyFor('SI', s.depth));
      });
    }
  });
  it('computeProfile: each friction-slope mean (conveyance, arithmetic, geometric, harmonic) meets the accuracy goal', () => {
    for (const frictionAveraging of ['conveyance', 'arithmetic', 'geometric', 'harmonic'] as const) {
      const c = compareMethods({ ...cases[0]!.input, frictionAveraging });
      expect(c.withinGoal, frictionAveraging).toBe(true);
    }
  });
});
