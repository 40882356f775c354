import { describe, expect, it } from 'vitest';
import { points } from '../../src/geometry/shapes/points.js';
import { conveyanceAndAlpha, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { assertRelative } from '../helpers/assert.js';
import { SI } from './sections.js';

describe('conveyanceAndAlpha', () => {
  it('conveyanceAndAlpha(compound) sums subsection conveyances and gives α > 1 (Chow 1959 subsection method)', () => {
    // Divided-channel method: vertical division lines at the changes of n carry no wetted perimeter;
    // K = ΣKi, α = Σ(Ki³/Ai²)/(K³/A²) (Chow 1959, ch. 2 and 6; published). Hand calculation at y = 2 m for
    // floodplains 20 m wide (n = 0.05) at 1 m beside a main channel 8 m at the bed, 1:1 banks (n = 0.03).
    const section = points({
      points: [[0, 3], [0, 1], [20, 1], [21, 0], [29, 0], [30, 1], [50, 1], [50, 3]],
      roughness: [[0, 0.05], [20, 0.03], [30, 0.05]],
    });
    const hs = hydraulicSection(section, 'manning', SI);
    const fpA = 20, fpP = 21; // 20 m × 1 m; bed 20 m + outer wall 1 m
    const mA = 9 + 10, mP = 8 + 2 * Math.SQRT2; // trapezoid below bank level plus 10 m × 1 m above it
    const kFp = (1 / 0.05) * fpA * Math.cbrt((fpA / fpP) ** 2);
    const kM = (1 / 0.03) * mA * Math.cbrt((mA / mP) ** 2);
    const k = 2 * kFp + kM;
    const a = 2 * fpA + mA;
    const alpha = (2 * kFp ** 3 / fpA ** 2 + kM ** 3 / mA ** 2) / (k ** 3 / a ** 2);
    const got = conveyanceAndAlpha(hs, 2);
    assertRelative(got.conveyance, k, 1e-12, 'K');
    assertRelative(got.alpha, alpha, 1e-12, 'α');
    expect(got.alpha).toBeGreaterThan(1.5);
  });

  it('conveyanceAndAlpha takes a fixed α from the user', () => {
    const section = points({ points: [[0, 2], [1, 0], [3, 0], [4, 2]], roughness: 0.03 });
    expect(conveyanceAndAlpha(hydraulicSection(section, 'manning', SI, 1.25), 1).alpha).toBe(1.25);
    expect(conveyanceAndAlpha(hydraulicSection(section, 'manning', SI), 1).alpha).toBe(1);
  });
});
