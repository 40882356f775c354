import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { points, pointsBounds } from '../../src/geometry/shapes/points.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { integrateWidth, shoelaceArea, wetPockets, widthAt, type Point } from './polygon.js';

/** The part of a ground line between offsets a < b (interpolated end points), for per-zone checks. */
function clip(ground: readonly Point[], a: number, b: number): Point[] {
  const at = (x: number): Point => {
    for (let i = 0; i + 1 < ground.length; i++) {
      const [x0, z0] = ground[i]!;
      const [x1, z1] = ground[i + 1]!;
      if (x0 <= x && x <= x1 && x1 > x0) return [x, z0 + ((z1 - z0) * (x - x0)) / (x1 - x0)];
    }
    return x <= ground[0]![0] ? ground[0]! : ground[ground.length - 1]!;
  };
  // at the section's ends keep every vertex there (a wall at an end belongs to the end zone)
  const start = a <= ground[0]![0] ? ground.filter(([x]) => x === a) : [at(a)];
  const end = b >= ground[ground.length - 1]![0] ? ground.filter(([x]) => x === b) : [at(b)];
  return [...start, ...ground.filter(([x]) => x > a && x < b), ...end];
}

/** A random ground line: 3–60 points, offsets non-decreasing (a wall now and then, never two in a row), ends highest. */
const groundLine = fc
  .array(fc.tuple(fc.double({ min: 0, max: 10, noNaN: true }), fc.double({ min: 0, max: 8, noNaN: true }), fc.boolean()), {
    minLength: 1,
    maxLength: 58,
  })
  .chain((inner) =>
    fc.tuple(fc.double({ min: 0.01, max: 3, noNaN: true }), fc.double({ min: 0.01, max: 3, noNaN: true })).map(([hl, hr]) => {
      const pts: [number, number][] = [];
      let x = 0;
      let wall = false;
      const top = Math.max(...inner.map(([, z]) => z));
      pts.push([x, top + hl]);
      for (const [dx, z, makeWall] of inner) {
        const isWall: boolean = makeWall && !wall && dx < 2;
        x += isWall ? 0 : dx + 0.01;
        wall = isWall;
        pts.push([x, z]);
      }
      pts.push([x + 1, top + hr]);
      return pts;
    }),
  );

describe('points', () => {
  it('points(trapezoid outline).elements(y) equals trapezoidal(b, zL, zR).elements(y) at random depths', () => {
    // the same exact geometry given two ways (trapezoid: A = (b + (zL + zR)y/2)·y, exact)
    const ground: [number, number][] = [[0, 104], [8, 100], [11, 100], [14, 102], [17, 104]];
    const p = points({ points: ground, roughness: 0.03 });
    const t = trapezoidal({ bottomWidth: 3, sideSlopeLeft: 2, sideSlopeRight: 1.5, roughness: 0.03 });
    expect(p.maxDepth).toBe(4);
    expect(p.invertElevation).toBe(100);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 4, noNaN: true }), (y) => {
        const a = p.elements(y);
        const b = t.elements(y);
        assertInDelta(a.area, b.area, 1e-12, 'A');
        assertInDelta(a.wettedPerimeter, b.wettedPerimeter, 1e-12, 'P');
        assertInDelta(a.topWidth, b.topWidth, 1e-12, 'T');
        assertInDelta(a.firstMoment, b.firstMoment, 1e-12, 'Aȳ');
      }),
    );
  });

  it('points(rectangle with vertical walls).elements(y) equals rectangular(b).elements(y)', () => {
    // exact geometry: A = b·y, P = b + 2y (vertical walls carry wetted perimeter, no top width)
    const p = points({ points: [[5, 13], [5, 10], [7.5, 10], [7.5, 13]], roughness: 0.015 });
    const r = rectangular({ bottomWidth: 2.5, roughness: 0.015 });
    for (const y of [0, 0.4, 1.7, 3]) {
      const a = p.elements(y);
      const b = r.elements(y);
      assertInDelta(a.area, b.area, 1e-13, `A at ${y}`);
      assertInDelta(a.wettedPerimeter, b.wettedPerimeter, 1e-13, `P at ${y}`);
      assertInDelta(a.topWidth, b.topWidth, 1e-13, `T at ${y}`);
      assertInDelta(a.firstMoment, b.firstMoment, 1e-13, `Aȳ at ${y}`);
    }
  });

  it('points(compound).subsections(y) splits by vertical lines with no wetted perimeter (Chow 1959 §6-4)', () => {
    // hand calculation, exact geometry: main channel 0–2 m deep with 2:1 banks, berms at 2 m, n changes at the bank tops
    const ground: [number, number][] = [[0, 3], [10, 2], [14, 0], [18, 0], [22, 2], [40, 2.5], [41, 3]];
    const s = points({ points: ground, roughness: [[0, 0.05], [14 - 4, 0.03], [22, 0.06]] });
    expect(s.compound).toBe(true);
    const y = 2.5;
    const subs = s.subsections(y);
    expect(subs.map((x) => x.roughness)).toEqual([0.05, 0.03, 0.06]);
    // left berm (0–10): ground 3 → 2 over 10 m, water at 2.5 → wet from x = 5: triangle ½·5·0.5
    assertInDelta(subs[0]!.area, 1.25, 1e-12, 'left berm A');
    assertInDelta(subs[0]!.wettedPerimeter, Math.hypot(5, 0.5), 1e-12, 'left berm P (no divider)');
    assertInDelta(subs[0]!.topWidth, 5, 1e-12, 'left berm T');
    // main channel (10–22): top width 12 m, bottom 4 m, depth 2 below the berm level plus 0.5 over its width
    assertInDelta(subs[1]!.area, ((12 + 4) / 2) * 2 + 12 * 0.5, 1e-12, 'channel A');
    assertInDelta(subs[1]!.wettedPerimeter, 4 + 2 * Math.hypot(4, 2), 1e-12, 'channel P (no divider)');
    // right berm (22–41): ground 2 → 2.5 over 18 m, wet to x = 40: triangle ½·18·0.5
    assertInDelta(subs[2]!.area, 4.5, 1e-12, 'right berm A');
    assertInDelta(subs[2]!.wettedPerimeter, Math.hypot(18, 0.5), 1e-12, 'right berm P');
    const e = s.elements(y);
    assertInDelta(subs.reduce((sum, x) => sum + x.area, 0), e.area, 1e-12, 'ΣA = A');
    assertInDelta(subs.reduce((sum, x) => sum + x.wettedPerimeter, 0), e.wettedPerimeter, 1e-12, 'ΣP = P');
    assertInDelta(subs.reduce((sum, x) => sum + x.topWidth, 0), e.topWidth, 1e-12, 'ΣT = T');
    // below the berms only the channel zone is wet: one subsection
    expect(s.subsections(1).map((x) => x.roughness)).toEqual([0.03]);
  });

  it('points(spec).subsections(y) merges neighbouring zones of equal roughness (no change of n, no divider)', () => {
    const s = points({ points: [[0, 2], [1, 0], [3, 0], [4, 2]], roughness: [[0, 0.03], [2, 0.03]] });
    expect(s.compound).toBe(false);
    expect(s.subsections(1)).toHaveLength(1);
  });

  it('points(spec).elements(y) above the lower end point throws, naming the water level and both end elevations', () => {
    const s = points({ points: [[0, 12.5], [3, 10], [6, 12]], roughness: 0.035 });
    expect(s.maxDepth).toBe(2);
    expect(pointsBounds(s)).toEqual({ left: { offset: 0, elevation: 12.5 }, right: { offset: 6, elevation: 12 } });
    expect(() => s.elements(2.2)).toThrow(HydraulicError);
    expect(() => s.subsections(2.2)).toThrow(/water surface at elevation 12\.2.*left end elevation 12\.5, right end elevation 12\b.*extended/);
    expect(s.elements(2).topWidth).toBeCloseTo(6 - 0.6, 12); // at the limit itself it holds
  });

  it('points(two pockets).elements(y) wets only the ground below the level surface (level-pool assumption)', () => {
    // hand calculation, exact geometry: pockets at elevations 0 and 1 separated by a ridge at 3
    const s = points({ points: [[0, 5], [2, 0], [4, 3], [6, 1], [8, 5]], roughness: 0.04 });
    const one = s.elements(0.5); // only the deep pocket: a triangle of top width 0.5·(2/5) + 0.5·(2/3)
    assertInDelta(one.topWidth, 0.2 + 1 / 3, 1e-12, 'T, one pocket');
    const two = s.elements(2); // both: left triangle (1.2–3.333, 2 deep), right triangle (5–6.5, 1 deep)
    assertInDelta(two.topWidth, (10 / 3 - 1.2) + 1.5, 1e-12, 'T, two pockets');
    assertInDelta(two.area, 0.5 * (10 / 3 - 1.2) * 2 + 0.5 * 1.5 * 1, 1e-12, 'A, two pockets');
    const p = Math.hypot(0.8, 2) + Math.hypot(4 / 3, 2) + Math.hypot(1, 1) + Math.hypot(0.5, 1);
    assertInDelta(two.wettedPerimeter, p, 1e-12, 'P, two pockets');
    // Aȳ of each triangle with its apex down: A·(depth/3)
    assertInDelta(two.firstMoment, 0.5 * (10 / 3 - 1.2) * 2 * (2 / 3) + 0.75 * (1 / 3), 1e-12, 'Aȳ, two pockets');
  });

  it('points(spec).elements(y) stays finite and exact on nearly flat ground (rises of 1e-9 and of a subnormal)', () => {
    // independent method: shoelace area of the wet pockets; found by a random case (a rise of 5e-324)
    for (const ground of [
      [[0, 2], [1, 0], [2, 5e-324], [12, 1e-9], [13, 2]],
      [[0, 2], [1, 1e-9], [11, 0], [11.5, 0], [13, 2]],
    ] as [number, number][][]) {
      const s = points({ points: ground, roughness: 0.03 });
      for (const y of [0, 5e-10, 1e-9, 0.5, 2]) {
        const e = s.elements(y);
        const area = wetPockets(ground, y).reduce((sum, p) => sum + shoelaceArea(p.polygon), 0);
        assertInDelta(e.area, area, 1e-12, `A at ${y}`);
        expect([e.wettedPerimeter, e.topWidth, e.firstMoment].every(Number.isFinite)).toBe(true);
        // (at y = 0 ground flat at the invert counts as wet, as for a rectangle's bottom; widthAt counts it dry)
        if (y > 0) assertInDelta(e.topWidth, widthAt(ground, y), 1e-9, `T at ${y}`);
      }
    }
  });

  it('points(spec).elements(y) agrees with the shoelace area of the wet pockets and the integrated width, for random sections and depths', () => {
    // independent method: the ground line cut by the surface into closed polygons (shoelace area, clipped wetted
    // length), and A, Aȳ by integrating the top width over the depth (Gauss–Legendre, exact between kinks)
    fc.assert(
      fc.property(groundLine, fc.double({ min: 0.001, max: 1, noNaN: true }), (ground, f) => {
        const s = points({ points: ground, roughness: 0.03 });
        const y = f * s.maxDepth;
        const level = s.invertElevation + y;
        const e = s.elements(y);
        const pockets = wetPockets(ground, level);
        const area = pockets.reduce((sum, p) => sum + shoelaceArea(p.polygon), 0);
        const perimeter = pockets.reduce((sum, p) => sum + p.perimeter, 0);
        const scale = Math.max(1, e.area);
        assertInDelta(e.area, area, 1e-10 * scale, 'A (shoelace)');
        assertInDelta(e.wettedPerimeter, perimeter, 1e-10 * Math.max(1, perimeter), 'P');
        assertInDelta(e.topWidth, widthAt(ground, level), 1e-10 * Math.max(1, e.topWidth), 'T');
        const breaks = ground.map(([, z]) => z - s.invertElevation);
        const integrated = integrateWidth((eta) => widthAt(ground, s.invertElevation + eta), y, breaks, 2);
        assertInDelta(e.area, integrated.area, 1e-10 * scale, 'A (integrated width)');
        assertInDelta(e.firstMoment, integrated.firstMoment, 1e-10 * Math.max(1, e.firstMoment), 'Aȳ (integrated width)');
      }),
      { numRuns: 200 },
    );
  });

  it('points(zones).subsections(y) gives each zone the water over its ground, summing to the whole, for random sections', () => {
    // independent method: per zone, the width of the ground line clipped to the zone integrated over the depth,
    // and the clipped wetted length; the dividers add no perimeter
    fc.assert(
      fc.property(groundLine, fc.double({ min: 0.05, max: 0.45, noNaN: true }), fc.double({ min: 0.55, max: 0.95, noNaN: true }), fc.double({ min: 0.001, max: 1, noNaN: true }), (ground, f1, f2, f) => {
        const left = ground[0]![0];
        const right = ground[ground.length - 1]![0];
        const b1 = left + f1 * (right - left);
        const b2 = left + f2 * (right - left);
        const s = points({ points: ground, roughness: [[left, 0.06], [b1, 0.03], [b2, 0.05]] });
        const y = f * s.maxDepth;
        const level = s.invertElevation + y;
        const subs = s.subsections(y);
        const e = s.elements(y);
        const scale = Math.max(1, e.area);
        assertInDelta(subs.reduce((sum, x) => sum + x.area, 0), e.area, 1e-10 * scale, 'ΣA = A');
        assertInDelta(subs.reduce((sum, x) => sum + x.wettedPerimeter, 0), e.wettedPerimeter, 1e-10 * Math.max(1, e.wettedPerimeter), 'ΣP = P');
        const bounds: [number, number, number][] = [[left, b1, 0.06], [b1, b2, 0.03], [b2, right, 0.05]];
        for (const [a, b, n] of bounds) {
          const piece = clip(ground, a, b);
          const breaks = piece.map(([, z]) => z - s.invertElevation);
          const area = integrateWidth((eta) => widthAt(piece, s.invertElevation + eta), y, breaks, 2).area;
          const perimeter = wetPockets(piece, level).reduce((sum, p) => sum + p.perimeter, 0);
          const sub = subs.find((x) => x.roughness === n);
          assertInDelta(sub?.area ?? 0, area, 1e-10 * scale, `A of zone n = ${n}`);
          assertInDelta(sub?.wettedPerimeter ?? 0, perimeter, 1e-10 * Math.max(1, perimeter), `P of zone n = ${n}`);
        }
      }),
      { numRuns: 200 },
    );
  });
});
