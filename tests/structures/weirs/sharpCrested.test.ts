import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';
import {
  rectangularWeirDischarge,
  sharpCrestedRectangular,
  triangularNotch,
  triangularNotchDischarge,
} from '../../../src/structures/weirs/sharpCrested.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

const fullWidth = { crestLength: 2, crestHeight: 1, crestElevation: 100 };
/** The check values below were computed with the textbook g = 9.81 m/s². */
const SI981 = { ...SI, g: 9.81 };

describe('sharp-crested rectangular weir', () => {
  it('rectangularWeirDischarge(rehbock) gives 0.6162 m³/s for H = 0.3 m, P = 1 m, b = 2 m', () => {
    // Rehbock (1929) Cd = 0.611 + 0.08·H/P in Q = (2/3)·Cd·√(2g)·b·H^1.5 (coefficient line from memory);
    // value computed from that equation with g = 9.81 (0.61613 with g = 9.80665).
    assertInDelta(rectangularWeirDischarge({ ...fullWidth, method: 'rehbock' }, 0.3, SI981), 0.6162, 5e-5, 'Q');
    assertInDelta(rectangularWeirDischarge({ ...fullWidth, method: 'rehbock' }, 0.3, SI), 0.61613, 5e-6, 'Q, standard g');
  });

  it('rectangularWeirDischarge(kindsvater-carter) gives 0.6088 m³/s for the same full-width weir', () => {
    // Kindsvater–Carter, USBR Water Measurement Manual ch. 7 eq. 7-1 (confirmed form); for L/B = 1
    // Ce = 0.602 + 0.075·h/p, kb = −0.0009 m, kh = 0.001 m (ISO 1438 / Bos 1989, from memory).
    // computed with g = 9.81.
    assertInDelta(rectangularWeirDischarge(fullWidth, 0.3, SI981), 0.6088, 5e-5, 'Q');
  });

  it('rectangularWeirDischarge(kindsvater-carter) uses the published Ce line at L/B = 0.5', () => {
    // Ce = 0.592 + 0.011·h/p at L/B = 0.5 (Bos 1989; from memory): recover Ce from Q.
    const spec = { crestLength: 1, approachWidth: 2, crestHeight: 1, crestElevation: 0 };
    const h = 0.25;
    const kb = 0.003; // interpolated between 0.0027 (L/B 0.4) and 0.0036 (0.6), from memory
    const q = rectangularWeirDischarge(spec, h, SI);
    const ce = q / ((2 / 3) * Math.sqrt(2 * SI.g) * (1 + kb) * Math.pow(h + 0.001, 1.5));
    assertInDelta(ce, 0.592 + 0.011 * h, 2e-4, 'Ce');
  });

  it('rectangularWeirDischarge(kindsvater-carter) is the same weir in SI and US units', () => {
    // Independent check: unit conversion (1 ft = 0.3048 m exactly); kh differs slightly (0.003 ft vs 0.001 m).
    const ft = 0.3048;
    const si = rectangularWeirDischarge(fullWidth, 0.3, SI);
    const us = rectangularWeirDischarge({ crestLength: 2 / ft, crestHeight: 1 / ft, crestElevation: 0 }, 0.3 / ft, US);
    assertRelative(us * ft ** 3, si, 2e-3, 'Q in m³/s');
  });

  it('sharpCrestedRectangular() inverts the discharge back to the head', () => {
    const out = sharpCrestedRectangular(fullWidth, 0.6088, null, SI);
    assertInDelta(out.headwaterStage - 100, 0.3, 1e-4, 'head');
    expect(out.condition).toBe('free');
    expect(out.caution).toMatch(/licensed engineer/);
    expect(out.values['effectiveCoefficient']).toBeCloseTo(0.602 + 0.075 * 0.3, 4);
  });

  it('sharpCrestedRectangular() headwater rises with discharge (both methods)', () => {
    for (const method of ['kindsvater-carter', 'rehbock'] as const) {
      let last = -Infinity;
      for (const q of [0.01, 0.05, 0.2, 0.6, 1.5, 4]) {
        const stage = sharpCrestedRectangular({ ...fullWidth, method }, q, null, SI).headwaterStage;
        expect(stage).toBeGreaterThan(last);
        last = stage;
      }
    }
  });

  it('sharpCrestedRectangular() with an approach section puts the energy grade above the water surface by Q²/(2gA²)', () => {
    // energy equation in the approach channel (definition)
    const area = (stage: number) => 2 * (stage - 99);
    const out = sharpCrestedRectangular({ ...fullWidth, approachArea: area }, 0.6, null, SI);
    const a = area(out.headwaterStage);
    assertInDelta(out.headwaterEnergy - out.headwaterStage, (0.6 * 0.6) / (2 * SI.g * a * a), 1e-12, 'velocity head');
  });

  it('sharpCrestedRectangular(rehbock) refuses a contracted weir, naming the field', () => {
    expect(() => sharpCrestedRectangular({ ...fullWidth, approachWidth: 3, method: 'rehbock', where: 'structures[0]' }, 0.5, null, SI)).toThrow(
      /structures\[0\]\.approachWidth/,
    );
    expect(() => sharpCrestedRectangular({ ...fullWidth, crestLength: -1 }, 0.5, null, SI)).toThrow(InputError);
  });
});

describe('triangular notch', () => {
  it('triangularNotchDischarge(90°) agrees with the 90° V-notch formula Q = 2.49·h^2.48 (US) within 1 %', () => {
    // Cone's 90° V-notch formula as given in USBR Water Measurement Manual ch. 7 (from memory);
    // Kindsvater–Shen with Ce = 0.578, kh = 0.0028 ft (90°, from memory).
    for (const h of [0.5, 1.0, 1.5]) {
      assertRelative(triangularNotchDischarge({ angleDegrees: 90, crestElevation: 0 }, h, US), 2.49 * Math.pow(h, 2.48), 0.01, `h = ${h}`);
    }
  });

  it('triangularNotchDischarge(90°) agrees with Thomson’s Q = 1.38·h^2.5 (SI) within 1.5 %', () => {
    // Thomson's 90° notch coefficient 1.38 m^½/s (common practice); Thomson has no head correction kh,
    // which matters more at low heads (about 2 % at 0.1 m), so the check starts at 0.15 m.
    for (const h of [0.15, 0.2, 0.3]) {
      assertRelative(triangularNotchDischarge({ angleDegrees: 90, crestElevation: 0 }, h, SI), 1.38 * Math.pow(h, 2.5), 0.015, `h = ${h}`);
    }
  });

  it('triangularNotch() headwater rises with discharge and inverts its own law', () => {
    const spec = { angleDegrees: 60, crestElevation: 10 };
    let last = -Infinity;
    for (const q of [0.001, 0.01, 0.05, 0.1]) {
      const out = triangularNotch(spec, q, null, SI);
      expect(out.headwaterStage).toBeGreaterThan(last);
      assertRelative(triangularNotchDischarge(spec, out.headwaterStage - 10, SI), q, 1e-8, 'Q(h)');
      last = out.headwaterStage;
    }
  });

  it('triangularNotch() refuses an angle outside the built-in 25–100° without own coefficients', () => {
    expect(() => triangularNotch({ angleDegrees: 120, crestElevation: 0, where: 'w' }, 0.01, null, SI)).toThrow(/w\.angleDegrees/);
    expect(() => triangularNotch({ angleDegrees: 120, crestElevation: 0, coefficient: 0.58, headCorrection: 0.001 }, 0.01, null, SI)).not.toThrow();
  });
});
