import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { assertRelative } from '../helpers/assert.js';
import { integrateWidth, shoelaceArea } from './polygon.js';

describe('trapezoidal', () => {
  it('trapezoidal(b, z).elements(y) equals the exact geometry A = (b + z·y)·y, P = b + 2y·√(1 + z²), T = b + 2z·y', () => {
    // exact geometry of a symmetric trapezoid (Chow 1959, Table 2-1; table number from memory)
    const b = 3;
    const z = 2;
    const y = 1.2;
    const e = trapezoidal({ bottomWidth: b, sideSlopeLeft: z, roughness: 0.015 }).elements(y);
    assertRelative(e.area, (b + z * y) * y, 1e-15, 'A'); // 6.48
    assertRelative(e.wettedPerimeter, b + 2 * y * Math.sqrt(1 + z * z), 1e-15, 'P');
    assertRelative(e.topWidth, b + 2 * z * y, 1e-15, 'T');
    // centroid of a trapezoid below its top: ȳ = y·(3b + 2zy)/(3(2b + 2zy)) (exact geometry)
    const yBar = (y * (3 * b + 2 * z * y)) / (3 * (2 * b + 2 * z * y));
    assertRelative(e.firstMoment, (b + z * y) * y * yBar, 1e-14, 'Aȳ');
  });

  it('trapezoidal(b, zLeft, zRight).elements(y) takes each side slope on its own side', () => {
    // exact geometry: the sides contribute y·√(1 + z²) each, the top width b + (zL + zR)·y
    const e = trapezoidal({ bottomWidth: 2, sideSlopeLeft: 1, sideSlopeRight: 3, roughness: 0.02 }).elements(2);
    assertRelative(e.area, (2 + 0.5 * 4 * 2) * 2, 1e-15, 'A'); // 12
    assertRelative(e.topWidth, 10, 1e-15, 'T');
    assertRelative(e.wettedPerimeter, 2 + 2 * Math.SQRT2 + 2 * Math.sqrt(10), 1e-15, 'P');
  });

  it('trapezoidal(b, zL, zR).elements(y) agrees with the shoelace area and the integrated width at random depths', () => {
    // independent method: shoelace area of the wetted polygon; first moment from ∫ T(η)(y − η) dη
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 1e-4, max: 10, noNaN: true }),
        (b, zl, zr, y) => {
          const e = trapezoidal({ bottomWidth: b, sideSlopeLeft: zl, sideSlopeRight: zr, roughness: 0.02 }).elements(y);
          const polygon = [[-zl * y, y], [0, 0], [b, 0], [b + zr * y, y]] as const;
          assertRelative(e.area, shoelaceArea(polygon), 1e-12, 'A');
          assertRelative(e.firstMoment, integrateWidth((eta) => b + (zl + zr) * eta, y).firstMoment, 1e-12, 'Aȳ');
          const sides = Math.hypot(zl * y, y) + Math.hypot(zr * y, y);
          assertRelative(e.wettedPerimeter, b + sides, 1e-12, 'P');
        },
      ),
    );
  });

  it('trapezoidal(b, z).subsections(y) is one subsection equal to the whole section', () => {
    const s = trapezoidal({ bottomWidth: 3, sideSlopeLeft: 2, roughness: 0.015 });
    const [sub, ...rest] = s.subsections(1);
    expect(rest).toHaveLength(0);
    expect(sub!.area).toBe(s.elements(1).area);
    expect(sub!.roughness).toBe(0.015);
  });
});
