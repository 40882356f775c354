import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { assertRelative } from '../helpers/assert.js';
import { integrateWidth, shoelaceArea } from './polygon.js';

describe('rectangular', () => {
  it('rectangular(b).elements(y) equals the exact geometry A = b·y, P = b + 2y, T = b, Aȳ = b·y²/2', () => {
    // exact geometry of a rectangle (as tabulated in Chow 1959, Table 2-1; table number from memory)
    const s = rectangular({ bottomWidth: 3, roughness: 0.015 });
    const e = s.elements(1.2);
    assertRelative(e.area, 3.6, 1e-15, 'A');
    assertRelative(e.wettedPerimeter, 5.4, 1e-15, 'P');
    assertRelative(e.topWidth, 3, 1e-15, 'T');
    assertRelative(e.firstMoment, 2.16, 1e-15, 'Aȳ');
    expect(s.closed).toBe(false);
    expect(s.maxDepth).toBe(Infinity);
    const subs = s.subsections(1.2);
    expect(subs).toHaveLength(1);
    assertRelative(subs[0]!.area, 3.6, 1e-15, 'subsection A');
    expect(subs[0]!.roughness).toBe(0.015);
  });

  it('rectangular(b).elements(y) agrees with the shoelace area and the integrated width at random depths', () => {
    // independent method: shoelace area of the wetted polygon, first moment by integrating T(η)(y − η)
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 50, noNaN: true }), fc.double({ min: 1e-6, max: 20, noNaN: true }), (b, y) => {
        const e = rectangular({ bottomWidth: b, roughness: 0.02 }).elements(y);
        assertRelative(e.area, shoelaceArea([[0, y], [0, 0], [b, 0], [b, y]]), 1e-12, 'A');
        assertRelative(e.firstMoment, integrateWidth(() => b, y).firstMoment, 1e-12, 'Aȳ');
      }),
    );
  });

  it('rectangular(b).elements(y) refuses a negative or non-finite depth', () => {
    const s = rectangular({ bottomWidth: 3, roughness: 0.015 });
    expect(() => s.elements(-0.1)).toThrow(HydraulicError);
    expect(() => s.elements(Number.NaN)).toThrow(/finite number ≥ 0/);
  });
});
