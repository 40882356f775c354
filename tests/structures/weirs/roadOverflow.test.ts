import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { idealBroadCrestedCoefficient } from '../../../src/structures/weirs/broadCrested.js';
import { pavedRoadCoefficient, roadOverflow } from '../../../src/structures/weirs/roadOverflow.js';
import { assertRelative } from '../../helpers/assert.js';

describe('road embankment overflow', () => {
  it('pavedRoadCoefficient() is 3.0 ft^½/s and 1.66 m^½/s', () => {
    // FHWA HDS-1 (Bradley 1978) paved-road value for H/Lr > 0.15 (from memory); SI by √g scaling.
    assertRelative(pavedRoadCoefficient(US), 3.0, 1e-12, 'US');
    assertRelative(pavedRoadCoefficient(SI), 1.66, 3e-3, 'SI');
  });

  it('pavedRoadCoefficient() lies below the ideal broad-crested coefficient (critical flow limit)', () => {
    // physics: no broad crest passes more than critical flow on the crest (Henderson 1966 §6.6)
    expect(pavedRoadCoefficient(US)).toBeLessThan(idealBroadCrestedCoefficient(US));
  });

  it('roadOverflow() recovers Q = Cr·L·H^1.5 and its headwater rises with discharge', () => {
    const spec = { length: 100, crestElevation: 50, crestWidth: 10 };
    let last = -Infinity;
    for (const q of [5, 20, 80, 200]) {
      const out = roadOverflow(spec, q, null, SI);
      const h = out.headwaterEnergy - 50;
      assertRelative(pavedRoadCoefficient(SI) * 100 * Math.pow(h, 1.5), q, 1e-8, 'Q');
      expect(out.headwaterEnergy).toBeGreaterThan(last);
      last = out.headwaterEnergy;
    }
  });

  it('roadOverflow() notes H/Lr ≤ 0.15 where the default coefficient is doubtful', () => {
    const out = roadOverflow({ length: 100, crestElevation: 50, crestWidth: 10 }, 5, null, SI);
    expect(out.notes.join(' ')).toMatch(/H\/Lr ≤ 0\.15/);
  });
});
