/**
 * Properties every depth solver must keep on any valid section (random cases, fast-check): results are
 * finite numbers inside the section, and each satisfies its defining equation.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SI, US } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { points } from '../../src/geometry/shapes/points.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import type { Section } from '../../src/geometry/section.js';
import type { FrictionLaw } from '../../src/hydraulics/friction.js';
import { criticalDepths } from '../../src/hydraulics/criticalDepth.js';
import { depthTolerance, smallestDepth } from '../../src/hydraulics/depthSearch.js';
import { conveyance, hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepths } from '../../src/hydraulics/normalDepth.js';
import { alternateDepth, specificEnergy } from '../../src/hydraulics/specificEnergy.js';
import { sequentDepth, specificForce } from '../../src/hydraulics/specificForce.js';
import { assertRelative } from '../helpers/assert.js';

const units = fc.constantFrom(SI, US);
/** a friction law with a roughness value in its own range, and a factor for a rougher floodplain */
const laws = fc.oneof(
  fc.record({ law: fc.constant<FrictionLaw>('manning'), r: fc.double({ min: 0.01, max: 0.08, noNaN: true }), rougher: fc.double({ min: 1, max: 3, noNaN: true }) }),
  fc.record({ law: fc.constant<FrictionLaw>('chezy'), r: fc.double({ min: 20, max: 90, noNaN: true }), rougher: fc.double({ min: 1 / 3, max: 1, noNaN: true }) }),
  fc.record({ law: fc.constant<FrictionLaw>('darcy-weisbach'), r: fc.double({ min: 1e-4, max: 0.05, noNaN: true }), rougher: fc.double({ min: 1, max: 10, noNaN: true }) }),
);

function trapezoids(r: number) {
  return fc
    .record({ b: fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 50, noNaN: true })), zl: fc.double({ min: 0, max: 4, noNaN: true }), zr: fc.double({ min: 0, max: 4, noNaN: true }) })
    .filter((t) => t.b > 0 || (t.zl > 0.2 && t.zr > 0.2))
    .map((t): Section => trapezoidal({ bottomWidth: t.b, sideSlopeLeft: t.zl, sideSlopeRight: t.zr, roughness: r }));
}
function circles(r: number) {
  return fc.double({ min: 0.2, max: 6, noNaN: true }).map((d): Section => circular({ diameter: d, roughness: r }));
}
/** a main channel with floodplains on both sides, all dimensions random */
function compounds(r: number, rougher: number) {
  return fc
    .record({
      bed: fc.double({ min: 1, max: 20, noNaN: true }),
      bank: fc.double({ min: 0.5, max: 3, noNaN: true }),
      plain: fc.double({ min: 5, max: 200, noNaN: true }),
      rise: fc.double({ min: 0, max: 0.5, noNaN: true }),
      wall: fc.double({ min: 0.5, max: 4, noNaN: true }),
    })
    .map((c): Section => {
      const x1 = c.plain;
      const x2 = x1 + c.bank;
      const x3 = x2 + c.bed;
      const x4 = x3 + c.bank;
      const x5 = x4 + c.plain;
      const top = c.bank + c.rise;
      return points({
        points: [[0, top + c.wall], [0, top], [x1, c.bank], [x2, 0], [x3, 0], [x4, c.bank], [x5, top], [x5, top + c.wall]],
        roughness: [[0, r * rougher], [x1, r], [x4, r * rougher]],
      });
    });
}
const cases = laws.chain(({ law, r, rougher }) =>
  fc.record({ law: fc.constant(law), section: fc.oneof(trapezoids(r), circles(r), compounds(r, rougher)) }),
);
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
      fc.property(cases, units, scale, fc.double({ min: 1e-5, max: 0.05, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }), ({ law, section }, u, s, slope, frac) => {
        const hs = hydraulicSection(section, law, u);
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
            assertRelative(conveyance(hs, y, q) * Math.sqrt(slope), q, 1e-8, 'Q = K√S');
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
      { numRuns: 400, seed: 20261201 },
    );
  });
});

/**
 * Thin flow: a discharge so small for its section that the depth lies below smallestDepth (10⁻⁹ of the length
 * scale), where the solvers' usual lower end sits. They used to fail with "no bracket found"; the bracket now
 * reaches down (core/roots expandUpward) and the tolerance becomes relative (depthTolerance). Checked against the
 * closed forms of a rectangular channel (Chow 1959, ch. 3 and 6; from memory): critical depth (q²/g)^(1/3) with
 * q = Q/b, and Manning's normal depth of a wide channel, y = (Q·n/(k·b·√S0))^(3/5) when 2y/b is negligible
 * (here 2y/b < 10⁻⁸, so the wide-channel formula is exact to well inside the test's 10⁻⁷).
 */
describe('depth solvers on thin flow (depth below the smallest depth of the section)', () => {
  const wide = (b: number) => hydraulicSection(rectangular({ bottomWidth: b, roughness: 0.013 }), 'manning', SI);

  it('criticalDepths(rectangular 1000 m, Q = 1e-6 m³/s) equals (q²/g)^(1/3) = 4.67e-7 m, below smallestDepth', () => {
    const hs = wide(1000);
    const q = 1e-6 / 1000;
    const expected = Math.cbrt((q * q) / SI.g);
    expect(expected).toBeLessThan(smallestDepth(hs.section));
    const [yc] = criticalDepths(hs, 1e-6);
    assertRelative(yc!, expected, 1e-8, 'critical depth');
  });

  it('criticalDepths(rectangular 10,000 ft, Q = 1e-6 ft³/s) equals (q²/g)^(1/3) in US units', () => {
    const hs = hydraulicSection(rectangular({ bottomWidth: 1e4, roughness: 0.013 }), 'manning', US);
    const q = 1e-6 / 1e4;
    const [yc] = criticalDepths(hs, 1e-6);
    assertRelative(yc!, Math.cbrt((q * q) / US.g), 1e-8, 'critical depth');
  });

  it("normalDepths(rectangular 1e6 m, Q = 1e-6 m³/s, S0 = 0.01) equals the wide-channel Manning depth", () => {
    const hs = wide(1e6);
    const n = 0.013;
    const b = 1e6;
    const expected = Math.pow((1e-6 * n) / (SI.manningFactor * b * Math.sqrt(0.01)), 3 / 5);
    expect(expected).toBeLessThan(smallestDepth(hs.section));
    const { depth } = normalDepths(hs, 1e-6, 0.01);
    assertRelative(depth!, expected, 1e-7, 'normal depth');
  });

  it('depthTolerance(section, near) is relative below the smallest depth and floored by the length scale above it', () => {
    const section = rectangular({ bottomWidth: 1000, roughness: 0.013 });
    const lo = smallestDepth(section);
    expect(depthTolerance(section, lo / 4)).toBe(1e-10 * (lo / 4));
    expect(depthTolerance(section, lo)).toBe(1e-12 * 1000);
    expect(depthTolerance(section, 5)).toBe(1e-12 * 1000);
  });
});
