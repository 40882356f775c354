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
import { standardStep } from '../../src/profile/standardStep.js';
import { points } from '../../src/geometry/shapes/points.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
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

describe('odeProfile: every output station is filled (regressions found by the property tests)', () => {
  // An invented compound points section (SI) drawn by the property tests: a V-shaped main channel with two
  // roughness zones. odex ends an integration when it is within about ten rounding units of its end, which here
  // falls a hair short of the last station; the station was then never filled and, with no stop reported, the
  // engine read the missing depth as "no subcritical flow" and put critical depth at a mild-to-mild break.
  const pts: Array<[number, number]> = [
    [0, 5.171370223059764], [0, 1.1442768238511243], [1.546013853656798, 1.1212879756865919], [3.092027707313596, 1.0982991275220593],
    [4.638041560970394, 1.0753102793575269], [6.184055414627192, 1.0523214311929945], [7.73006926828399, 1.0293325830284619],
    [9.276083121940788, 1.0063437348639295], [10.822096975597585, 0.9833548866993971], [12.368110829254384, 0.9603660385348646],
    [13.914124682911183, 0.9373771903703321], [15.46013853656798, 0.9143883422057996], [17.006152390224777, 0.8913994940412672],
    [18.552166243881576, 0.8684106458767347], [20.098180097538375, 0.8454217977122023], [21.64419395119517, 0.8224329495476698],
    [23.19020780485197, 0.7435304560334723], [24.736221658508768, 2.9753621601295906e-290], [26.282235512165567, 0.7435304560334778],
    [27.828249365822366, 0.8224329495476698], [29.37426321947916, 0.8454217977122022], [30.92027707313596, 0.8684106458767347],
    [32.46629092679276, 0.8913994940412671], [34.012304780449554, 0.9143883422057995], [35.55831863410636, 0.9373771903703321],
    [37.10433248776315, 0.9603660385348645], [38.65034634141995, 0.9833548866993969], [40.19636019507675, 1.0063437348639295],
    [41.742374048733545, 1.0293325830284619], [43.28838790239034, 1.0523214311929943], [44.83440175604714, 1.0753102793575269],
    [46.38041560970394, 1.0982991275220593], [47.92642946336074, 1.1212879756865917], [49.472443317017536, 1.1442768238511243],
    [49.472443317017536, 5.171370223059764],
  ];
  const section = hydraulicSection(points({ points: pts, roughness: [[0, 0.06367126589537864], [23.682447059958594, 0.021223755298459594]] }), 'manning', SI);
  const spec = {
    hs: section,
    slope: 0.0001764451402564387,
    discharge: 77.31447318168402,
    stations: [5600.989141708293, 1342.6663371300208],
    startDepth: 4.592926141606301,
    regime: 'subcritical' as const,
    criticalDepth: 1.6862344514002956,
    normalDepth: 3.175265005183073,
    averaging: 'conveyance' as const,
    tolerance: 0.0016862344514002956,
  };

  it('odeProfile: an M1 stretch whose integration ends within round-off of the last station still reports that station', () => {
    const ode = odeProfile(spec);
    expect(ode.stop).toBeUndefined();
    expect(ode.depths).toHaveLength(2);
    // the ODE is the reference the other methods are held to (issue 3: within the accuracy goal of it)
    const step = standardStep(spec);
    assertInDelta(ode.depths[1]!, step.depths[1]!, accuracyFor('SI', step.depths[1]!), 'ODE against standard step at the last station');
  });

  it('odeProfile: the same stretch through 78 output stations fills all of them', () => {
    const s0 = spec.stations[0]!;
    const s1 = spec.stations[1]!;
    const stations = Array.from({ length: 78 }, (_, i) => (i === 77 ? s1 : s0 + ((s1 - s0) * i) / 77));
    const ode = odeProfile({ ...spec, stations });
    expect(ode.depths).toHaveLength(78);
    expect(ode.depths.every((d) => Number.isFinite(d) && d > spec.normalDepth)).toBe(true); // M1: above normal depth throughout
  });
});
