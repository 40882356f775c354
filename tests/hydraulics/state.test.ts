import { describe, expect, it } from 'vitest';
import { flowState } from '../../src/hydraulics/state.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { pipe, rect, SI, trap } from './sections.js';

describe('flowState', () => {
  it('flowState(rectangular) holds R = y/(1 + 2y/b): the wide-channel rule R ≈ y once b ≥ ~20·y', () => {
    // exact geometry R/y = 1/(1 + 2y/b); the rule of thumb that R ≈ y when b is at least about 20 depths
    // (R/y ≥ 0.909) is common practice, no source
    for (const [b, y] of [[10, 1], [20, 1], [100, 1.5], [4, 2]] as const) {
      const s = flowState(rect(b), y, 5);
      assertRelative(s.hydraulicRadius / y, 1 / (1 + (2 * y) / b), 1e-14, `b/y = ${b / y}`);
      if (b / y >= 20) expect(s.hydraulicRadius / y).toBeGreaterThanOrEqual(0.909);
    }
  });

  it('flowState(trapezoidal) is consistent: E = y + αV²/2g, Sf = (Q/K)², M = Q²/(gA) + Aȳ', () => {
    // definitions (Chow 1959, ch. 2–3); exact from the trapezoid formulas by hand
    const b = 3, z = 2, n = 0.02, y = 1.2, q = 12, alpha = 1.1;
    const s = flowState(trap(b, z, n, SI, alpha), y, q);
    const a = (b + z * y) * y;
    const p = b + 2 * y * Math.sqrt(1 + z * z);
    const k = (1 / n) * a * Math.cbrt((a / p) ** 2);
    const v = q / a;
    assertRelative(s.area, a, 1e-14, 'A');
    assertRelative(s.conveyance, k, 1e-12, 'K');
    assertRelative(s.velocity, v, 1e-14, 'V');
    assertRelative(s.specificEnergy, y + (alpha * v * v) / (2 * SI.g), 1e-14, 'E');
    assertRelative(s.frictionSlope, (q / k) ** 2, 1e-12, 'Sf');
    assertRelative(s.specificForce, (q * q) / (SI.g * a) + (b * y * y) / 2 + (2 * z * y ** 3) / 6, 1e-13, 'M');
    assertRelative(s.hydraulicDepth, a / (b + 2 * z * y), 1e-14, 'D');
    expect(s.alpha).toBe(alpha);
  });

  it('flowState(circular) at the crown: full-pipe R = D/4, T = 0, F = 0', () => {
    // full pipe R = D/4 (geometry)
    const s = flowState(pipe(0.8), 0.8, 0.3);
    assertInDelta(s.hydraulicRadius, 0.2, 1e-14, 'R');
    expect(s.topWidth).toBe(0);
    expect(s.froude).toBe(0);
    for (const [key, value] of Object.entries(s)) expect(Number.isNaN(value), key).toBe(false);
  });
});
