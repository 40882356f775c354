import { describe, expect, it } from 'vitest';
import { points } from '../../src/geometry/shapes/points.js';
import { conveyanceAndAlpha, conveyanceWithSlopes, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
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

describe('conveyanceWithSlopes', () => {
  // The compound section of the hand calculation above: above the floodplain level (y > 1) each floodplain is
  // 20 m × (y − 1) with perimeter 20 + (y − 1) (its outer wall wets), and the main channel 19 + 10·(y − 2) with a
  // fixed perimeter 8 + 2√2 (the division lines carry none). K(y) and α(y) in closed form, differentiated here by a
  // five-point stencil (an independent route to the derivatives the module forms from dA/dy = T and dP/dy).
  const section = points({
    points: [[0, 3], [0, 1], [20, 1], [21, 0], [29, 0], [30, 1], [50, 1], [50, 3]],
    roughness: [[0, 0.05], [20, 0.03], [30, 0.05]],
  });
  const hs = hydraulicSection(section, 'manning', SI);
  const closedForm = (y: number) => {
    const fpA = 20 * (y - 1);
    const fpP = 20 + (y - 1);
    const mA = 9 + 10 * (y - 1);
    const mP = 8 + 2 * Math.SQRT2;
    const kFp = (1 / 0.05) * fpA * Math.cbrt((fpA / fpP) ** 2);
    const kM = (1 / 0.03) * mA * Math.cbrt((mA / mP) ** 2);
    const k = 2 * kFp + kM;
    const a = 2 * fpA + mA;
    return { k, alpha: (2 * kFp ** 3 / fpA ** 2 + kM ** 3 / mA ** 2) / (k ** 3 / a ** 2) };
  };
  const stencil = (f: (y: number) => number, y: number, h: number) =>
    (-f(y + 2 * h) + 8 * f(y + h) - 8 * f(y - h) + f(y - 2 * h)) / (12 * h);

  it('conveyanceWithSlopes(compound) gives dK/dy and dα/dy of the closed-form subsection sums', () => {
    for (const y of [1.2, 1.5, 2, 2.7]) {
      const got = conveyanceWithSlopes(hs, y)!;
      expect(got).toBeDefined();
      assertRelative(got.conveyance, closedForm(y).k, 1e-12, `K at ${y}`);
      assertRelative(got.alpha, closedForm(y).alpha, 1e-12, `α at ${y}`);
      assertRelative(got.conveyanceSlope, stencil((d) => closedForm(d).k, y, 1e-3), 1e-9, `dK/dy at ${y}`);
      assertRelative(got.alphaSlope, stencil((d) => closedForm(d).alpha, y, 1e-3), 1e-8, `dα/dy at ${y}`);
    }
  });

  it('conveyanceWithSlopes gives the same conveyance and α as conveyanceAndAlpha, to the last bit', () => {
    for (let y = 0.05; y < 3; y += 0.173) {
      const a = conveyanceAndAlpha(hs, y);
      const b = conveyanceWithSlopes(hs, y)!;
      expect(b.conveyance).toBe(a.conveyance);
      expect(b.alpha).toBe(a.alpha);
      assertRelative(b.area, section.elements(y).area, 1e-12, `A at ${y}`);
      assertRelative(b.topWidth, section.elements(y).topWidth, 1e-12, `T at ${y}`);
    }
  });

  it('conveyanceWithSlopes is undefined for Darcy–Weisbach (conveyance depends on the discharge) and 0 for a fixed α', () => {
    expect(conveyanceWithSlopes(hydraulicSection(section, 'darcy-weisbach', SI), 2)).toBeUndefined();
    expect(conveyanceWithSlopes(hydraulicSection(section, 'manning', SI, 1.2), 2)!.alphaSlope).toBe(0);
  });
});
