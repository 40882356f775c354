import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { broadCrested, broadCrestedDischarge, idealBroadCrestedCoefficient } from '../../../src/structures/weirs/broadCrested.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

describe('broad-crested weir', () => {
  it('idealBroadCrestedCoefficient() is 1.705 in SI and 3.088 in US', () => {
    // (2/3)^1.5·√g, critical depth 2H/3 on the crest (Henderson 1966 §6.6; computed).
    assertInDelta(idealBroadCrestedCoefficient(SI), 1.705, 5e-4, 'SI');
    assertInDelta(idealBroadCrestedCoefficient(US), 3.088, 5e-4, 'US');
  });

  it('broadCrestedDischarge(Cd = 1) equals 1.705·b·H^1.5 and equals √g·b·yc^1.5 with yc = 2H/3', () => {
    const spec = { crestWidth: 4, crestElevation: 0, coefficient: 1 };
    assertRelative(broadCrestedDischarge(spec, 0.5, SI), 1.705 * 4 * Math.pow(0.5, 1.5), 3e-4, 'Q');
    // independent form: critical flow q = √(g·yc³)
    const yc = (2 / 3) * 0.5;
    assertRelative(broadCrestedDischarge(spec, 0.5, SI), 4 * Math.sqrt(SI.g * yc ** 3), 1e-12, 'Q from yc');
  });

  it('broadCrested() default coefficient 0.85 gives a higher headwater than the ideal weir', () => {
    const ideal = broadCrested({ crestWidth: 4, crestElevation: 0, coefficient: 1 }, 3, null, SI);
    const def = broadCrested({ crestWidth: 4, crestElevation: 0 }, 3, null, SI);
    expect(def.headwaterEnergy).toBeGreaterThan(ideal.headwaterEnergy);
    // H scales as Cd^(−2/3)
    assertRelative(def.headwaterEnergy / ideal.headwaterEnergy, Math.pow(0.85, -2 / 3), 1e-8, 'ratio');
  });

  it('broadCrested() with an approach section: water surface below the energy grade by the velocity head', () => {
    const area = (stage: number) => 4 * (stage + 1); // approach bed 1 m below the crest
    const out = broadCrested({ crestWidth: 4, crestElevation: 0, coefficient: 0.9, approachArea: area }, 3, null, SI);
    const a = area(out.headwaterStage);
    assertInDelta(out.headwaterEnergy - out.headwaterStage, 9 / (2 * SI.g * a * a), 1e-9, 'velocity head');
    expect(out.headwaterStage).toBeGreaterThan(0);
  });

  it('broadCrested() headwater rises with discharge', () => {
    let last = -Infinity;
    for (const q of [0.1, 0.5, 2, 8, 20]) {
      const e = broadCrested({ crestWidth: 4, crestElevation: 0 }, q, null, SI).headwaterEnergy;
      expect(e).toBeGreaterThan(last);
      last = e;
    }
  });
});
