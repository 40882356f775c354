import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { triangular } from '../../src/geometry/shapes/triangular.js';
import { assertRelative } from '../helpers/assert.js';
import { integrateWidth, shoelaceArea } from './polygon.js';

describe('triangular', () => {
  it('triangular(z).elements(y) equals the exact geometry A = z·y², P = 2y·√(1 + z²), T = 2z·y, ȳ = y/3', () => {
    // exact geometry of a V-notch channel (Chow 1959, Table 2-1; table number from memory)
    const e = triangular({ sideSlopeLeft: 1.5, roughness: 0.013 }).elements(0.8);
    assertRelative(e.area, 1.5 * 0.64, 1e-15, 'A');
    assertRelative(e.wettedPerimeter, 2 * 0.8 * Math.sqrt(1 + 2.25), 1e-15, 'P');
    assertRelative(e.topWidth, 2.4, 1e-15, 'T');
    assertRelative(e.firstMoment, 1.5 * 0.64 * (0.8 / 3), 1e-15, 'Aȳ');
    expect(triangular({ sideSlopeLeft: 1.5, roughness: 0.013 }).elements(0).area).toBe(0);
  });

  it('triangular(zL, zR).elements(y) agrees with the shoelace area and the integrated width at random depths', () => {
    // independent method: shoelace area of the wetted triangle; first moment from ∫ T(η)(y − η) dη
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0.01, max: 10, noNaN: true }),
        fc.double({ min: 1e-4, max: 10, noNaN: true }),
        (zl, zr, y) => {
          const e = triangular({ sideSlopeLeft: zl, sideSlopeRight: zr, roughness: 0.02 }).elements(y);
          assertRelative(e.area, shoelaceArea([[-zl * y, y], [0, 0], [zr * y, y]]), 1e-12, 'A');
          assertRelative(e.firstMoment, integrateWidth((eta) => (zl + zr) * eta, y).firstMoment, 1e-12, 'Aȳ');
        },
      ),
    );
  });
});
