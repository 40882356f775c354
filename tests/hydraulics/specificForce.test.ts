import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { criticalDepth } from '../../src/hydraulics/criticalDepth.js';
import { sequentDepth, specificForce } from '../../src/hydraulics/specificForce.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { compound, pipe, rect, SI, trap, US } from './sections.js';

describe('specificForce', () => {
  it('specificForce(rectangular) is q²b/(gy) + by²/2', () => {
    // definition of the momentum function with β = 1 (Chow 1959, ch. 3); exact
    const b = 2, y = 0.7, q = 3;
    assertRelative(specificForce(rect(b), y, q), (q * q) / (SI.g * b * y) + (b * y * y) / 2, 1e-14, 'M');
  });

  it('specificForce is least at critical depth for α = 1', () => {
    // dM/dy = A − Q²T/(gA²) vanishes at the Froude condition (Chow 1959, ch. 3); property
    for (const [hs, q] of [[rect(3), 6], [trap(2, 1.5, 0.02), 8], [pipe(1.2), 1.5]] as const) {
      const yc = criticalDepth(hs, q);
      const m = specificForce(hs, yc, q);
      for (const f of [0.99, 0.999, 1.001, 1.01]) {
        expect(specificForce(hs, yc * f, q), `${hs.section.shape} at ${f}·yc`).toBeGreaterThan(m);
      }
    }
  });

  it('sequentDepth(rectangular) follows Bélanger: F1 = √3 → 2, √10 → 4, 4 → 5.1789', () => {
    // Bélanger's equation y2/y1 = ½(√(1 + 8F1²) − 1) (Chow 1959, eq. 3-21; published); values computed from it
    const b = 3, y1 = 0.4;
    for (const [f1, ratio] of [[Math.sqrt(3), 2], [Math.sqrt(10), 4], [4, 5.1789]] as const) {
      const q = f1 * b * Math.sqrt(SI.g * y1 ** 3);
      const y2 = sequentDepth(rect(b), y1, q)!;
      assertInDelta(y2 / y1, ratio, 1e-4, `F1 = ${f1}`);
      assertRelative(y2 / y1, 0.5 * (Math.sqrt(1 + 8 * f1 * f1) - 1), 1e-9, `Bélanger F1 = ${f1}`);
      // and back: the sequent of the subcritical depth is the supercritical one
      assertRelative(sequentDepth(rect(b), y2, q)!, y1, 1e-9, 'round trip');
    }
  });

  it('sequentDepth gives equal specific force for any shape', () => {
    // the jump momentum balance (Chow 1959, ch. 3 and 15): M(y1) = M(y2)
    const cases = [
      [trap(6, 2, 0.025, US), 300, 0.8],
      [pipe(1.5), 1.2, 0.3],
      [compound(), 40, 0.5],
    ] as const;
    for (const [hs, q, y1] of cases) {
      const y2 = sequentDepth(hs, y1, q)!;
      expect(y2, hs.section.shape).toBeGreaterThan(y1);
      assertRelative(specificForce(hs, y2, q), specificForce(hs, y1, q), 1e-10, `${hs.section.shape}`);
    }
  });

  it('sequentDepth(circular) is null when the sequent would lie above the crown', () => {
    // M(D) = Q²/(gAf) + Af·D/2 bounds a part-full subcritical flow: a faster inflow needs a pressurised jump
    const d = 1;
    const hs = pipe(d);
    const q = 2;
    expect(specificForce(hs, 0.25, q)).toBeGreaterThan(specificForce(hs, d, q));
    expect(sequentDepth(hs, 0.25, q)).toBeNull();
  });

  it('sequentDepth rejects impossible depths', () => {
    expect(() => sequentDepth(rect(3), 0, 5)).toThrow(HydraulicError);
    expect(() => sequentDepth(pipe(1), 1.5, 1)).toThrow(/crown/);
  });
});
