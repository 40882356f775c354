/**
 * Properties every depth solver must keep on any valid section (random cases, fast-check): results are
 * finite numbers inside the section, and each satisfies its defining equation.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SI, US } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { points } from '../../src/geometry/shapes/points.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import type { Section } from '../../src/geometry/section.js';
import { criticalDepths } from '../../src/hydraulics/criticalDepth.js';
import { conveyance, hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepths } from '../../src/hydraulics/normalDepth.js';
import { alternateDepth, specificEnergy } from '../../src/hydraulics/specificEnergy.js';
import { sequentDepth, specificForce } from '../../src/hydraulics/specificForce.js';
import { assertRelative } from '../helpers/assert.js';

const units = fc.constantFrom(SI, US);
const n = fc.double({ min: 0.01, max: 0.08, noNaN: true });

const trapezoids = fc
  .record({ b: fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 50, noNaN: true })), zl: fc.double({ min: 0, max: 4, noNaN: true }), zr: fc.double({ min: 0, max: 4, noNaN: true }), n })
  .filter((t) => t.b > 0 || (t.zl > 0.2 && t.zr > 0.2))
  .map((t) => trapezoidal({ bottomWidth: t.b, sideSlopeLeft: t.zl, sideSlopeRight: t.zr, roughness: t.n }));
const circles = fc.record({ d: fc.double({ min: 0.2, max: 6, noNaN: true }), n }).map((c) => circular({ diameter: c.d, roughness: c.n }));
/** a main channel with floodplains on both sides, all dimensions random */
const compounds = fc
  .record({
    bed: fc.double({ min: 1, max: 20, noNaN: true }),
    bank: fc.double({ min: 0.5, max: 3, noNaN: true }),
    plain: fc.double({ min: 5, max: 200, noNaN: true }),
    rise: fc.double({ min: 0, max: 0.5, noNaN: true }),
    wall: fc.double({ min: 0.5, max: 4, noNaN: true }),
    nMain: n,
    nPlain: n,
  })
  .map((c) => {
    const x1 = c.plain;
    const x2 = x1 + c.bank;
    const x3 = x2 + c.bed;
    const x4 = x3 + c.bank;
    const x5 = x4 + c.plain;
    return points({
      points: [[0, c.bank + c.rise + c.wall], [0, c.bank + c.rise], [x1, c.bank], [x2, 0], [x3, 0], [x4, c.bank], [x5, c.bank + c.rise], [x5, c.bank + c.rise + c.wall]],
      roughness: [[0, c.nPlain], [x1, c.nMain], [x4, c.nPlain]],
    });
  });
const sections = fc.oneof(trapezoids, circles, compounds);
/** a discharge scaled to the section: Q = scale·√(g·L⁵) */
const scale = fc.double({ min: 1e-4, max: 3, noNaN: true });

function dischargeFor(hs: HydraulicSection, s: number): number {
  const l = Number.isFinite(hs.section.maxDepth) ? Math.min(hs.section.maxDepth, hs.section.lengthScale) : hs.section.lengthScale;
  return s * Math.sqrt(hs.units.g * l ** 5);
}

function inside(section: Section, y: number): boolean {
  return Number.isFinite(y) && y > 0 && y <= section.maxDepth;
}

describe('depth solvers on random sections', () => {
  it('criticalDepths, normalDepths, alternateDepth and sequentDepth are finite, inside the section, and satisfy their equations', () => {
    fc.assert(
      fc.property(sections, units, scale, fc.double({ min: 1e-5, max: 0.05, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }), (section, u, s, slope, frac) => {
        const hs = hydraulicSection(section, 'manning', u);
        const q = dischargeFor(hs, s);
        let yc: number[];
        try {
          yc = criticalDepths(hs, q);
        } catch (error) {
          // only an irregular section too low for the flow may refuse, and it says so
          expect(String(error)).toMatch(/extend the section/);
          return;
        }
        for (const y of yc) expect(inside(section, y), `yc = ${y}`).toBe(true);
        try {
          const r = normalDepths(hs, q, slope);
          for (const y of r.depths) {
            expect(inside(section, y), `yn = ${y}`).toBe(true);
            assertRelative(conveyance(hs, y) * Math.sqrt(slope), q, 1e-8, 'Q = K√S');
          }
          expect(r.depth === null).toBe(r.fullFlow);
        } catch (error) {
          expect(String(error)).toMatch(/extend the section/);
        }
        const y1 = frac * yc[0]!;
        for (const [conjugate, value] of [
          [alternateDepth, specificEnergy],
          [sequentDepth, specificForce],
        ] as const) {
          let y2: number | null;
          try {
            y2 = conjugate(hs, y1, q);
          } catch (error) {
            expect(String(error)).toMatch(/extend the section/);
            continue;
          }
          if (y2 === null) {
            expect(section.closed).toBe(true);
            continue;
          }
          expect(inside(section, y2), `conjugate ${y2}`).toBe(true);
          // y1 is supercritical for specific energy, so its alternate lies above it; the minimum of specific
          // force (β = 1) lies below the critical depth where α > 1, so a sequent may lie on either side
          if (conjugate === alternateDepth) expect(y2).toBeGreaterThan(y1);
          assertRelative(value(hs, y2, q), value(hs, y1, q), 1e-8, conjugate.name);
        }
      }),
      { numRuns: 300, seed: 20261201 },
    );
  });
});
