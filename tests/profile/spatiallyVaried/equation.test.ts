import { describe, expect, it } from 'vitest';
import { rectangular } from '../../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection } from '../../../src/hydraulics/hydraulicSection.js';
import { SI, US } from '../../../src/core/units.js';
import {
  lateralCriticalDepth,
  momentumFunction,
  spatiallyVariedSlope,
  spatiallyVariedTerms,
} from '../../../src/profile/spatiallyVaried/equation.js';
import { assertRelative } from '../../helpers/assert.js';

describe('spatiallyVariedSlope', () => {
  it('spatiallyVariedSlope(q* = 0) is the gradually varied flow equation (S0 − Sf)/(1 − F²)', () => {
    // GVF equation: Chow 1959 eq. 9-13 (from memory for the number); Manning's K = (1/n)·A·R^(2/3).
    const b = 4;
    const n = 0.014;
    const hs = hydraulicSection(rectangular({ bottomWidth: b, roughness: n }), 'manning', SI);
    for (const [y, q, s0] of [[0.8, 6, 0.001], [0.3, 6, 0.02], [2.5, 1, 0]] as const) {
      const a = b * y;
      const r = a / (b + 2 * y);
      const k = (1 / n) * a * Math.cbrt(r * r);
      const expected = (s0 - (q / k) ** 2) / (1 - (q * q * b) / (SI.g * a ** 3));
      assertRelative(spatiallyVariedSlope(hs, y, q, 0, s0), expected, 1e-13, `y = ${y}`);
    }
  });

  it('spatiallyVariedSlope adds −2βQq*/(gA²) to the numerator (momentum form, Chow 1959 ch. 12; Novak et al., Hydraulic Structures, eq. 4.25)', () => {
    const hs = hydraulicSection(trapezoidal({ bottomWidth: 2, sideSlopeLeft: 1.5, roughness: 0.02 }), 'manning', US);
    const y = 1.7;
    const q = 40;
    const inflow = 0.8;
    const beta = 1.05;
    const t0 = spatiallyVariedTerms(hs, y, q, 0, 0.004, beta);
    const t = spatiallyVariedTerms(hs, y, q, inflow, 0.004, beta);
    const area = (2 + 1.5 * y) * y;
    assertRelative(t0.numerator - t.numerator, (2 * beta * q * inflow) / (US.g * area * area), 1e-12);
    expect(t.denominator).toBe(t0.denominator);
  });
});

describe('lateralCriticalDepth', () => {
  it('lateralCriticalDepth(rectangular) equals (βQ²/(g·b²))^(1/3) (exact geometry)', () => {
    const hs = hydraulicSection(rectangular({ bottomWidth: 3, roughness: 0.015 }), 'manning', SI);
    for (const beta of [1, 1.1]) {
      assertRelative(lateralCriticalDepth(hs, 5, beta), Math.cbrt((beta * 25) / (SI.g * 9)), 1e-10, `β = ${beta}`);
    }
  });

  it('lateralCriticalDepth gives the least specific force (Chow 1959 §3-6: dM/dy = A(1 − F²))', () => {
    const hs = hydraulicSection(trapezoidal({ bottomWidth: 1, sideSlopeLeft: 2, sideSlopeRight: 0.5, roughness: 0.02 }), 'manning', SI);
    const yc = lateralCriticalDepth(hs, 3);
    const m = momentumFunction(hs, yc, 3);
    expect(momentumFunction(hs, yc * 1.001, 3)).toBeGreaterThan(m);
    expect(momentumFunction(hs, yc * 0.999, 3)).toBeGreaterThan(m);
  });
});
