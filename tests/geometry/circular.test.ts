import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { circular, isFull } from '../../src/geometry/shapes/circular.js';
import { hydraulicRadius } from '../../src/geometry/section.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { assertRelative } from '../helpers/assert.js';
import { integrateWidth, shoelaceArea, type Point } from './polygon.js';

const D = 1.5;
const pipe = circular({ diameter: D, roughness: 0.013 });
const full = pipe.elements(D);

describe('circular', () => {
  it('circular(D).elements(D/2) is half the full area with R/Rfull = 1', () => {
    // computed from the segment geometry: a half circle has half the area and half the perimeter
    const e = pipe.elements(D / 2);
    assertRelative(e.area / full.area, 0.5, 1e-14, 'A/Afull');
    assertRelative(hydraulicRadius(e) / hydraulicRadius(full), 1, 1e-14, 'R/Rfull');
    assertRelative(e.topWidth, D, 1e-14, 'T');
  });

  it('circular(D).elements(0.75·D) gives A/Afull = 0.80450 and R/Rfull = 1.20675', () => {
    // computed from the segment geometry: θ = 2·acos(1 − 2y/D) = 4π/3, A/Afull = (θ − sin θ)/(2π) = 2/3 + √3/(4π),
    // R/Rfull = 1 − sin θ/θ = 1 + 3√3/(8π)
    const e = pipe.elements(0.75 * D);
    assertRelative(e.area / full.area, 2 / 3 + Math.sqrt(3) / (4 * Math.PI), 1e-14, 'A/Afull');
    assertRelative(e.area / full.area, 0.8045, 1e-4, 'A/Afull (rounded value)');
    assertRelative(hydraulicRadius(e) / hydraulicRadius(full), 1 + (3 * Math.sqrt(3)) / (8 * Math.PI), 1e-14, 'R/Rfull');
    assertRelative(hydraulicRadius(e) / hydraulicRadius(full), 1.20675, 1e-5, 'R/Rfull (rounded value)');
  });

  it('circular(D).elements(D) is the full pipe: R = D/4, P = πD, T = 0, Aȳ = A·D/2', () => {
    // geometry of a full circle
    assertRelative(full.area, (Math.PI * D * D) / 4, 1e-15, 'A');
    assertRelative(full.wettedPerimeter, Math.PI * D, 1e-15, 'P');
    assertRelative(hydraulicRadius(full), D / 4, 1e-15, 'R');
    expect(full.topWidth).toBe(0);
    assertRelative(full.firstMoment, full.area * (D / 2), 1e-15, 'Aȳ');
    expect(pipe.closed).toBe(true);
    expect(pipe.maxDepth).toBe(D);
  });

  it('circular(D).elements(y) above the crown throws a HydraulicError naming the depth and the diameter', () => {
    expect(() => pipe.elements(1.6)).toThrow(HydraulicError);
    expect(() => pipe.elements(1.6)).toThrow(/depth 1\.6 .*diameter 1\.5/);
    // round-off just above the crown is the crown
    expect(pipe.elements(D * (1 + 1e-15)).area).toBe(full.area);
  });

  it('isFull(section, depth) is true at the crown only, and never for an open channel', () => {
    expect(isFull(pipe, D)).toBe(true);
    expect(isFull(pipe, 0.999 * D)).toBe(false);
    expect(isFull(trapezoidal({ bottomWidth: 1, sideSlopeLeft: 1, roughness: 0.02 }), 1e9)).toBe(false);
  });

  it('circular(D).elements(y) agrees with the shoelace area of the wetted segment and the integrated width at random depths', () => {
    // independent method: the wetted segment as a polygon of 20 000 arc points (shoelace area, error ~ 1e-8 relative),
    // and A, Aȳ by integrating the chord width w(η) = 2·√(η(D − η)) (substitution η = D·sin²(u/2) removes the root)
    fc.assert(
      // (up to y/D = 1 − 1e-6: closer to the crown acos(1 − 2y/D), the reference, loses digits; full flow is checked above)
      fc.property(fc.double({ min: 1e-3, max: 1 - 1e-6, noNaN: true }), (f) => {
        const y = f * D;
        const e = pipe.elements(y);
        const r = D / 2;
        const half = Math.acos(1 - (2 * y) / D);
        const arc: Point[] = [];
        const m = 20_000;
        for (let i = 0; i <= m; i++) {
          const a = -half + (2 * half * i) / m;
          arc.push([r * Math.sin(a), r - r * Math.cos(a)]);
        }
        assertRelative(e.area, shoelaceArea(arc), 1e-7, 'A (shoelace)');
        // ∫₀ʸ g(η) dη with η = r(1 − cos u): dη = r·sin u du, w = 2r·sin u
        const byAngle = (g: (eta: number) => number) =>
          integrateWidth((u) => g(r * (1 - Math.cos(u))) * 2 * r * Math.sin(u) * r * Math.sin(u), half).area;
        assertRelative(e.area, byAngle(() => 1), 1e-12, 'A (integrated width)');
        assertRelative(e.firstMoment, byAngle((eta) => y - eta), 1e-12, 'Aȳ (integrated width)');
        // (acos loses a few digits near the crown, hence 1e-12)
        assertRelative(e.wettedPerimeter, D * half, 1e-12, 'P = D·acos(1 − 2y/D)');
      }),
    );
  });

  it('circular(D).elements(y) keeps its precision near the invert: A → (4/3)·√D·y^1.5, Aȳ → (8/15)·√D·y^2.5', () => {
    // leading terms of the segment geometry for y ≪ D (w ≈ 2√(D·η)); relative corrections are O(y/D)
    for (const f of [1e-12, 1e-8, 1e-6]) {
      const y = f * D;
      const e = pipe.elements(y);
      assertRelative(e.area, (4 / 3) * Math.sqrt(D) * y ** 1.5, 2 * f, `A at y/D = ${f}`);
      assertRelative(e.firstMoment, (8 / 15) * Math.sqrt(D) * y ** 2.5, 2 * f, `Aȳ at y/D = ${f}`);
    }
    // the series branch and the direct formula meet without a step (φ = 0.5 is the switch, y = D·sin²(φ/2))
    const yAt = D * Math.sin(0.25) ** 2;
    const below = pipe.elements(yAt * (1 - 1e-9));
    const above = pipe.elements(yAt * (1 + 1e-9));
    assertRelative(below.area, above.area, 1e-8, 'A across the series switch');
    assertRelative(below.firstMoment, above.firstMoment, 1e-8, 'Aȳ across the series switch');
  });
});
