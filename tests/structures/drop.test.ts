import { describe, expect, it } from 'vitest';
import { SI } from '../../src/core/units.js';
import { freeOverfall, rectangularCriticalDepth } from '../../src/structures/drop.js';
import { assertInDelta } from '../helpers/assert.js';

describe('free overfall', () => {
  it('rectangularCriticalDepth(q = 2 m²/s) equals (q²/g)^(1/3) = 0.74162 m', () => {
    // exact critical-depth formula for a rectangle (Chow 1959 §3-2)
    assertInDelta(rectangularCriticalDepth(2, SI), 0.74162, 1e-5, 'yc');
  });

  it('freeOverfall(rectangular) brink depth is 0.715·yc and the control is yc at the brink', () => {
    // Rouse (1936): yb ≈ 0.715·yc (ratio from memory); critical energy 1.5·yc for a rectangle.
    const yc = rectangularCriticalDepth(2, SI);
    const out = freeOverfall({ brinkElevation: 5, shape: 'rectangular' }, 10, yc, SI);
    assertInDelta(Number(out.values['brinkDepth']), 0.715 * yc, 1e-12, 'yb');
    assertInDelta(out.headwaterStage, 5 + yc, 1e-12, 'stage');
    assertInDelta(out.headwaterEnergy, 5 + 1.5 * yc, 1e-12, 'energy');
    expect(out.values['brinkRatioIsApproximation']).toBe(false);
  });

  it('freeOverfall(other) says the ratio is an approximation', () => {
    const out = freeOverfall({ brinkElevation: 0, shape: 'other' }, 10, 1, SI, 0.4);
    expect(out.values['brinkRatioIsApproximation']).toBe(true);
    expect(out.notes.join(' ')).toMatch(/approximation/);
    assertInDelta(out.headwaterEnergy, 1.4, 1e-12, 'energy');
  });

  it('freeOverfall() headwater rises with discharge', () => {
    let last = -Infinity;
    for (const q of [0.5, 1, 2, 5]) {
      const out = freeOverfall({ brinkElevation: 0, shape: 'rectangular' }, q * 4, rectangularCriticalDepth(q, SI), SI);
      expect(out.headwaterStage).toBeGreaterThan(last);
      last = out.headwaterStage;
    }
  });
});
