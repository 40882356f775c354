/**
 * The standard step (Chow 1959 §10-3; Henderson 1966 §4.4; published method): each step balances the energy
 * equation z2 + E2 = z1 + E1 − S̄f·(x2 − x1) to the root finder's tolerance; where no depth on the branch
 * balances it, the step ends exactly where critical depth does.
 */
import { describe, expect, it } from 'vitest';
import { accuracyFor, energyStepDepthFraction } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { criticalDepth } from '../../src/hydraulics/criticalDepth.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../src/hydraulics/normalDepth.js';
import { computeProfile } from '../../src/profile/engine.js';
import { pointState } from '../../src/profile/energy.js';
import { meanFrictionSlope } from '../../src/profile/frictionMean.js';
import { energyStep, standardStep } from '../../src/profile/standardStep.js';
import type { StretchSpec } from '../../src/profile/stretch.js';
import type { FrictionAveraging } from '../../src/profile/types.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { rect5, rect5Discharge, wideChannel } from './channels.js';
import { brentRoot } from '../../src/core/roots.js';

const q = rect5Discharge;
const yc = criticalDepth(rect5, q);

function spec(slope: number, regime: 'subcritical' | 'supercritical', startDepth: number, averaging: FrictionAveraging = 'conveyance'): StretchSpec {
  return {
    hs: rect5,
    slope,
    discharge: q,
    stations: regime === 'subcritical' ? [1000, 0] : [0, 1000],
    startDepth,
    regime,
    criticalDepth: yc,
    normalDepth: normalDepth(rect5, q, slope),
    averaging,
    tolerance: accuracyFor('SI', yc),
  };
}

const residual = (s: StretchSpec, x1: number, y1: number, x2: number, y2: number) => {
  const a = pointState(rect5, y1, q);
  const b = pointState(rect5, y2, q);
  return b.energy - a.energy - s.slope * (x2 - x1) + meanFrictionSlope(s.averaging, a, b, q) * (x2 - x1);
};

describe('energyStep', () => {
  for (const averaging of ['conveyance', 'arithmetic', 'geometric', 'harmonic'] as const) {
    it(`energyStep (${averaging} mean): the depth found balances the energy equation to the solver tolerance`, () => {
      // depth solved to energyStepDepthFraction of the goal; the residual changes with depth at about |dE/dy| (+ friction)
      const bound = (y: number) => 2 * energyStepDepthFraction * accuracyFor('SI', yc) * Math.max(1, Math.abs(pointState(rect5, y, q).dEdy));
      const sub = spec(0.0005, 'subcritical', 3, averaging);
      const up = energyStep(sub, 1000, pointState(rect5, 3, q), 950);
      expect(up.state!.depth).toBeGreaterThan(yc);
      expect(Math.abs(residual(sub, 1000, 3, 950, up.state!.depth))).toBeLessThan(bound(up.state!.depth));
      const sup = spec(0.0005, 'supercritical', 0.5, averaging);
      const down = energyStep(sup, 0, pointState(rect5, 0.5, q), 5);
      expect(down.state!.depth).toBeLessThan(yc);
      expect(Math.abs(residual(sup, 0, 0.5, 5, down.state!.depth))).toBeLessThan(bound(down.state!.depth));
    });
  }

  it('energyStep: where no subcritical depth balances the step (S1 near critical), it stops where critical depth does, exactly', () => {
    const s = spec(0.02, 'subcritical', 1.2);
    const outcome = energyStep(s, 1000, pointState(rect5, 1.2, q), 900);
    expect(outcome.stop).toBeDefined();
    const at = outcome.stop!.station;
    expect(at).toBeLessThan(1000);
    expect(at).toBeGreaterThan(900);
    assertInDelta(outcome.stop!.depth, yc, 0);
    expect(Math.abs(residual(s, 1000, 1.2, at, yc))).toBeLessThan(1e-12);
  });
});

describe('energyStep with an eddy loss (the surveyed step: Chow 1959 §10-4, published method; coefficients 0.1 and 0.3 common practice)', () => {
  // he = 0.1·rise or 0.3·fall of the velocity head downstream (eddyLoss of src/profile/surveyed.ts, pinned in
  // tests/profile/surveyed.test.ts); the energy equation with it, solved here independently of the engine
  const loss = (known: ReturnType<typeof pointState>, trial: ReturnType<typeof pointState>) => {
    const dh = trial.velocityHead - known.velocityHead;
    return dh > 0 ? 0.1 * dh : 0.3 * -dh;
  };
  const balance = (s: StretchSpec, y1: number, dx: number, y2: number) => {
    const a = pointState(rect5, y1, q);
    const b = pointState(rect5, y2, q);
    return b.energy - a.energy - s.slope * dx + meanFrictionSlope(s.averaging, a, b, q) * dx + loss(a, b);
  };

  it('energyStep: a supercritical step near critical depth whose residual is positive at critical depth still finds the depth that balances it (regression)', () => {
    // an S2 drawdown on an invented steep slope (S0 = 0.005: yn = 1.04 m, yc = 1.18 m), one metre from a depth 5 % below
    // critical: the expansion loss a trial
    // depth nearer critical would carry (0.3 of the fall in velocity head) turns the residual up towards critical depth,
    // which was read as "no depth balances the step" and ended the profile at critical depth
    const s = spec(0.005, 'supercritical', 0.95 * yc);
    const y1 = 0.95 * yc;
    expect(s.normalDepth!).toBeLessThan(y1);
    expect(balance(s, y1, 1, yc), 'the residual at critical depth (the case of the regression)').toBeGreaterThan(0);
    const outcome = energyStep(s, 0, pointState(rect5, y1, q), 1, undefined, loss);
    expect(outcome.stop).toBeUndefined();
    const y2 = outcome.state!.depth;
    // an S2 profile falls downstream (Chow 1959 §9-2, fig. 9-1): the depth found lies below the known one
    expect(y2).toBeLessThan(y1);
    expect(Math.abs(balance(s, y1, 1, y2))).toBeLessThan(1e-9);
    // the same depth with a guess (the bracket around it) and without (the whole-branch search)
    const guessed = energyStep(s, 0, pointState(rect5, y1, q), 1, y1 - 0.01, loss);
    assertInDelta(guessed.state!.depth, y2, 2 * energyStepDepthFraction * accuracyFor('SI', yc), 'with a guess');
  });

  it('energyStep: with the eddy loss and no balancing depth on the branch, the step still stops at critical depth', () => {
    // the same slope from a depth just below critical with a long step uphill in energy: a mild slope (S0 < Sf) and a
    // supercritical flow that reaches critical depth within 50 m (an M3, Chow 1959 §9-2)
    const s = spec(0.0005, 'supercritical', 0.9 * yc);
    const outcome = energyStep(s, 0, pointState(rect5, 0.9 * yc, q), 50, undefined, loss);
    expect(outcome.stop?.reason).toBe('critical');
  });
});

describe('meanFrictionSlope (the four means of Chow 1959 §10-3; common practice)', () => {
  it('meanFrictionSlope: average conveyance, arithmetic, geometric and harmonic means of Sf', () => {
    const a = pointState(rect5, 2, q);
    const b = pointState(rect5, 2.5, q);
    assertRelative(meanFrictionSlope('conveyance', a, b, q), (q / ((a.conveyance + b.conveyance) / 2)) ** 2, 1e-14);
    assertRelative(meanFrictionSlope('arithmetic', a, b, q), (a.frictionSlope + b.frictionSlope) / 2, 1e-14);
    assertRelative(meanFrictionSlope('geometric', a, b, q), Math.sqrt(a.frictionSlope * b.frictionSlope), 1e-14);
    assertRelative(meanFrictionSlope('harmonic', a, b, q), 2 / (1 / a.frictionSlope + 1 / b.frictionSlope), 1e-14);
  });
});

describe('standardStep', () => {
  it('standardStep: an S1 from a tailwater runs into critical depth and stops there, all depths on the branch', () => {
    const s = spec(0.02, 'subcritical', 2.5);
    const profile = standardStep({ ...s, stations: Array.from({ length: 101 }, (_, i) => 1000 - 10 * i) });
    expect(profile.stop?.reason).toBe('critical');
    expect(profile.depths.length).toBeLessThan(101);
    expect(profile.depths.every((d) => d > yc && d <= 2.5)).toBe(true);
  });

  it('computeProfile: a part-full pipe whose backwater reaches the crown stops there and says the conduit flows full', () => {
    const pipe = hydraulicSection(circular({ diameter: 1.2, roughness: 0.013 }), 'manning', SI);
    const r = computeProfile({
      units: SI,
      reaches: [{ id: 'barrel', section: pipe, length: 300, slope: 0.001 }],
      discharge: 1.5,
      flowId: 'pipe',
      boundaries: { downstream: { type: 'depth', depth: 1.15 } },
      method: 'standard-step',
    });
    const full = r.stops!.find((s) => s.reason === 'full')!;
    expect(full.station).toBeGreaterThan(0);
    expect(full.resolved).toBe(false);
    expect(r.warnings.join(' ')).toMatch(/flows full/);
    expect(r.stations.every((s) => Number.isFinite(s.depth) && s.depth > 0 && s.depth <= 1.2)).toBe(true);
  });
});

describe('standardStep towards critical depth (found by the long property run)', () => {
  // Bresse's closed form for a wide channel with Chézy friction (Bresse 1860, as given in Chow 1959 §10-5; form from
  // memory, checked against Bakhmeteff's varied-flow table in ode.test.ts): x = (yn/S0)·{u − (1 − β)·φ(u)} + const,
  // u = y/yn, β = (yc/yn)³ = C²S0/g; it holds below critical depth too (an M3 profile, u < yc/yn).
  const C = 50;
  const S0 = 0.0004;
  const unitQ = 2;
  const wide = wideChannel(1, C);
  const yn = Math.cbrt((unitQ / (C * Math.sqrt(S0))) ** 2);
  const ycWide = Math.cbrt((unitQ * unitQ) / SI.g);
  const beta = (C * C * S0) / SI.g;
  const phi = (u: number) => (1 / 6) * Math.log((u * u + u + 1) / ((u - 1) * (u - 1))) - (1 / Math.sqrt(3)) * Math.atan(Math.sqrt(3) / (2 * u + 1));
  const bresseX = (y: number) => (yn / S0) * (y / yn - (1 - beta) * phi(y / yn));

  // F² from 2 to 1.1, and from 4 to 1.2: the energy errors made where |dE/dy| = F² − 1 is large are read where it is
  // small; before the fix the step control missed the accuracy goal by 2.4 and 1.4 times here
  for (const [f0, f1] of [[2, 1.1], [4, 1.2]] as const) {
    it(`standardStep: an M3 profile from F² = ${f0} to F² = ${f1} meets the accuracy goal against Bresse`, () => {
      const y0 = ycWide / Math.cbrt(f0);
      const y1 = ycWide / Math.cbrt(f1);
      const length = bresseX(y1) - bresseX(y0);
      const stations = Array.from({ length: 51 }, (_, i) => (length * i) / 50);
      const profile = standardStep({
        hs: wide,
        slope: S0,
        discharge: unitQ,
        stations,
        startDepth: y0,
        regime: 'supercritical',
        criticalDepth: ycWide,
        normalDepth: yn,
        averaging: 'conveyance',
        tolerance: accuracyFor('SI', ycWide),
      });
      expect(profile.stop).toBeUndefined();
      stations.forEach((s, i) => {
        const exact = brentRoot((y) => bresseX(y) - bresseX(y0) - s, y0, ycWide * (1 - 1e-12), { xTolerance: 1e-13 });
        assertInDelta(profile.depths[i]!, exact, accuracyFor('SI', exact), `station ${s}`);
      });
    });
  }
});
