/**
 * The ODE method (and the other two) against Bresse's closed-form solution (Bresse 1860; as given in
 * Chow 1959, ch. 10, §10-5; form from memory, checked here against Bakhmeteff's varied-flow function table):
 * a wide rectangular channel with Chézy friction, where
 *   x = (yn/S0)·{u − [1 − (yc/yn)³]·φ(u)} + const,  u = y/yn,  (yc/yn)³ = C²·S0/g,
 *   φ(u) = (1/6)·ln((u² + u + 1)/(u − 1)²) − (1/√3)·arctan(√3/(2u + 1)).
 */
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../src/core/roots.js';
import { accuracyFor } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { computeProfile } from '../../src/profile/engine.js';
import { odeProfile } from '../../src/profile/ode.js';
import { assertInDelta } from '../helpers/assert.js';
import { wideChannel } from './channels.js';

const C = 50; // Chézy C, m^½/s (invented channel)
const S0 = 0.0004;
const q = 2; // m²/s over a 1 m strip
const g = SI.g;
const hs = wideChannel(1, C);
const yn = Math.cbrt((q / (C * Math.sqrt(S0))) ** 2);
const yc = Math.cbrt((q * q) / g);
const beta = (C * C * S0) / g;

function phi(u: number): number {
  return (1 / 6) * Math.log((u * u + u + 1) / ((u - 1) * (u - 1))) - (1 / Math.sqrt(3)) * Math.atan(Math.sqrt(3) / (2 * u + 1));
}
function bresseX(y: number): number {
  const u = y / yn;
  return (yn / S0) * (u - (1 - beta) * phi(u));
}

describe("Bresse's function (from memory) against Bakhmeteff's table", () => {
  it('φ(u) differences equal F(u, 3) differences: F(1.5) − F(2.0) = 0.2548 − 0.1318 and F(1.01) − F(1.05) = 1.4192 − 0.8958 (Chow 1959 App. D)', () => {
    // for u > 1, dF(u,3)/du = 1/(1 − u³) = dφ/du, so the two differ by a constant
    assertInDelta(phi(1.5) - phi(2.0), 0.2548 - 0.1318, 2e-4, 'u = 1.5 to 2');
    assertInDelta(phi(1.01) - phi(1.05), 1.4192 - 0.8958, 2e-4, 'u = 1.01 to 1.05');
  });
  it('yc/yn from the Chézy wide-channel relation equals (C²S0/g)^(1/3)', () => {
    assertInDelta((yc / yn) ** 3, beta, 1e-12);
  });
});

describe('odeProfile and computeProfile against Bresse (closed form)', () => {
  const damDepth = 3; // u = 1.89: an M1 profile
  const length = 8000;

  function bresseDepthAt(distanceUpstream: number): number {
    const xDam = bresseX(damDepth);
    return brentRoot((y) => xDam - bresseX(y) - distanceUpstream, yn * (1 + 1e-9), damDepth, { xTolerance: 1e-12 });
  }

  it('odeProfile: M1 depths upstream of the control match Bresse to 1e-5 m', () => {
    const stations = Array.from({ length: 81 }, (_, i) => length - i * 100);
    const profile = odeProfile({
      hs,
      slope: S0,
      discharge: q,
      stations,
      startDepth: damDepth,
      regime: 'subcritical',
      criticalDepth: yc,
      normalDepth: yn,
      averaging: 'conveyance',
      tolerance: accuracyFor('SI', yc),
    });
    expect(profile.depths).toHaveLength(stations.length);
    stations.forEach((s, i) => assertInDelta(profile.depths[i]!, bresseDepthAt(length - s), 1e-5, `station ${s}`));
  });

  it('computeProfile: every method within the accuracy goal of Bresse at every output station', () => {
    for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
      const result = computeProfile({
        units: SI,
        reaches: [{ id: 'wide', section: hs, length, slope: S0 }],
        discharge: q,
        flowId: 'bresse',
        boundaries: { downstream: { type: 'depth', depth: damDepth } },
        method,
      });
      for (const s of result.stations) {
        const exact = bresseDepthAt(length - s.station);
        assertInDelta(s.depth, exact, accuracyFor('SI', exact), `${method} at ${s.station}`);
      }
    }
  });

  it('odeProfile: an M2 drawdown to a free overfall starts at critical depth and matches Bresse', () => {
    // from the brink (critical depth) upstream: Bresse with the constant fixed at yc
    const stations = Array.from({ length: 41 }, (_, i) => 2000 - i * 50);
    const profile = odeProfile({
      hs,
      slope: S0,
      discharge: q,
      stations,
      startDepth: yc,
      regime: 'subcritical',
      criticalDepth: yc,
      normalDepth: yn,
      averaging: 'conveyance',
      tolerance: accuracyFor('SI', yc),
    });
    const xBrink = bresseX(yc);
    stations.forEach((s, i) => {
      if (i === 0) return;
      const exact = brentRoot((y) => bresseX(y) - xBrink + (2000 - s), yc, yn * (1 - 1e-12), { xTolerance: 1e-12 });
      assertInDelta(profile.depths[i]!, exact, 1e-5, `station ${s}`);
    });
  });
});
