/**
 * Chow 1959, Open-Channel Hydraulics, Example 10-1 (direct step; inputs from memory): trapezoidal channel
 * b = 20 ft, side slopes 2:1, S0 = 0.0016, n = 0.025, Q = 400 ft³/s, α = 1.10, 5 ft of water behind a dam,
 * the M1 profile computed upstream to 1 % above normal depth. Published yn ≈ 3.36 ft and yc ≈ 2.22 ft
 * (from memory). The book's total length is not relied on: the profile is checked against an exact
 * (independent, tight) integration of the gradually varied flow equation done here by Gauss–Legendre quadrature.
 */
import { describe, expect, it } from 'vitest';
import { accuracyFor } from '../../src/core/tolerances.js';
import { flowState } from '../../src/hydraulics/state.js';
import { classifyReach } from '../../src/profile/classify.js';
import { directStep } from '../../src/profile/directStep.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { ProfileInput } from '../../src/profile/types.js';
import { US } from '../../src/core/units.js';
import { assertInDelta } from '../helpers/assert.js';
import { chowTrapezoid } from './channels.js';

const Q = 400;
const S0 = 0.0016;
const damDepth = 5;
const reach = classifyReach(chowTrapezoid, Q, S0);
const yn = reach.normalDepth!;
const target = 1.01 * yn;

/** dx/dy = (dE/dy)/(S0 − Sf), with α constant (Chow 1959 eq. 9-8), by composite 5-point Gauss–Legendre. */
function exactLength(from: number, to: number): number {
  const nodes = [0, -0.5384693101056831, 0.5384693101056831, -0.906179845938664, 0.906179845938664];
  const weights = [0.5688888888888889, 0.47862867049936647, 0.47862867049936647, 0.23692688505618908, 0.23692688505618908];
  const integrand = (y: number) => {
    const s = flowState(chowTrapezoid, y, Q);
    const dEdy = 1 - s.froude * s.froude;
    return dEdy / (S0 - s.frictionSlope);
  };
  // panels spaced geometrically in (y − yn): the integrand grows like 1/(y − yn) near normal depth
  const panels = 4000;
  let total = 0;
  const a = from - yn;
  const b = to - yn;
  for (let i = 0; i < panels; i++) {
    const lo = yn + a * Math.pow(b / a, i / panels);
    const hi = yn + a * Math.pow(b / a, (i + 1) / panels);
    const mid = 0.5 * (lo + hi);
    const half = 0.5 * (hi - lo);
    for (let k = 0; k < 5; k++) total += weights[k]! * half * integrand(mid + half * nodes[k]!);
  }
  return total;
}

describe('Chow 1959 Example 10-1 (inputs from memory)', () => {
  it('classifyReach(trapezoid b = 20 ft, z = 2, n = 0.025, S0 = 0.0016, Q = 400 cfs, α = 1.10): yn ≈ 3.36 ft, yc ≈ 2.22 ft, mild', () => {
    // published (from memory): yn = 3.36 ft, yc = 2.22 ft; the book rounds g and the Manning factor
    assertInDelta(yn, 3.36, 0.01, 'normal depth');
    assertInDelta(reach.criticalDepth, 2.22, 0.01, 'critical depth');
    expect(reach.slopeClass).toBe('mild');
  });

  const length = exactLength(target, damDepth);

  it('computeProfile: the M1 from 5 ft behind the dam reaches 1 % above normal depth where exact integration puts it, every method', () => {
    expect(length).toBeGreaterThan(1000);
    const reachLength = Math.ceil(length) + 600;
    const probe = reachLength - length;
    for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
      const input: ProfileInput = {
        units: US,
        reaches: [{ id: 'approach', section: chowTrapezoid, length: reachLength, slope: S0 }],
        discharge: Q,
        flowId: 'example',
        boundaries: { downstream: { type: 'depth', depth: damDepth } },
        method,
        extraStations: [probe],
      };
      const result = computeProfile(input);
      const at = result.stations.find((s) => Math.abs(s.station - probe) < 1e-6)!;
      assertInDelta(at.depth, target, accuracyFor('US', target), `${method} depth at ${probe.toFixed(1)} ft`);
      expect(result.reaches[0]!.profiles.map((p) => p.type).filter((t) => t !== 'uniform')).toEqual(['M1']);
    }
  });

  it('directStep: started at the dam, its depth at the exact distance of the 1 % point is 1.01·yn within the accuracy goal', () => {
    const reachLength = Math.ceil(length) + 600;
    for (const averaging of ['conveyance', 'arithmetic', 'geometric', 'harmonic'] as const) {
      const profile = directStep({
        hs: chowTrapezoid,
        slope: S0,
        discharge: Q,
        stations: [reachLength, reachLength - length / 2, reachLength - length],
        startDepth: damDepth,
        regime: 'subcritical',
        criticalDepth: reach.criticalDepth,
        normalDepth: yn,
        averaging,
        tolerance: accuracyFor('US', target),
      });
      assertInDelta(profile.depths[2]!, target, accuracyFor('US', target), averaging);
      expect(profile.stop).toBeUndefined();
    }
  });
});
