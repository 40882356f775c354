import { describe, expect, it } from 'vitest';
import { HydraulicError, InputError } from '../../src/core/errors.js';
import { blendSections } from '../../src/geometry/blend.js';
import { createSection } from '../../src/geometry/index.js';
import type { Section } from '../../src/geometry/section.js';
import { isPointsSection, points } from '../../src/geometry/shapes/points.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { assertInDelta } from '../helpers/assert.js';

function sameGeometry(a: Section, b: Section, depths: number[], delta: number): void {
  for (const y of depths) {
    const ea = a.elements(y);
    const eb = b.elements(y);
    assertInDelta(ea.area, eb.area, delta, `A at ${y}`);
    assertInDelta(ea.wettedPerimeter, eb.wettedPerimeter, delta, `P at ${y}`);
    assertInDelta(ea.topWidth, eb.topWidth, delta, `T at ${y}`);
    assertInDelta(ea.firstMoment, eb.firstMoment, delta, `Aȳ at ${y}`);
    const sa = a.subsections(y);
    const sb = b.subsections(y);
    expect(sa.map((s) => s.roughness)).toEqual(sb.map((s) => s.roughness));
    sa.forEach((s, i) => assertInDelta(s.area, sb[i]!.area, delta, `subsection ${i} A at ${y}`));
  }
}

// invented surveyed sections: a channel with berms (three zones) and a wider, deeper one downstream
const upstream = points({
  points: [[0, 104], [6, 102.2], [10, 102], [13, 100.1], [17, 100], [20, 102], [30, 102.4], [32, 104.5]],
  roughness: [[0, 0.05], [10, 0.032], [20, 0.06]],
});
const downstream = points({
  points: [[100, 103.5], [104, 101.9], [109, 101.5], [112, 99.6], [118, 99.5], [121, 101.6], [128, 101.8], [131, 103.4], [135, 103.8]],
  roughness: [[100, 0.045], [109, 0.03], [121, 0.055]],
});

describe('blendSections', () => {
  it('blendSections(up, down, 0) and (…, 1) reproduce the end sections', () => {
    // the union of both sections' points keeps each end section's ground line (exact geometry at t = 0 and 1)
    const depths = [0.1, 0.5, 1.5, 2.5, 3.5];
    sameGeometry(blendSections(upstream, downstream, 0), upstream, depths, 1e-9);
    sameGeometry(blendSections(upstream, downstream, 1), downstream, depths, 1e-9);
    const b = trapezoidal({ bottomWidth: 3, sideSlopeLeft: 2, roughness: 0.02 });
    const c = trapezoidal({ bottomWidth: 6, sideSlopeLeft: 1, sideSlopeRight: 3, roughness: 0.03 });
    expect(blendSections(b, c, 0).describe()).toEqual(b.describe());
    expect(blendSections(b, c, 1).describe()).toEqual(c.describe());
  });

  it('blendSections(rectangle 2, rectangle 4, 0.5) is a rectangle of width 3', () => {
    // linear interpolation of the geometry by relative position (common practice)
    const r2 = createSection({ shape: 'rectangular', bottomWidth: 2, roughness: 0.02 });
    const r4 = createSection({ shape: 'rectangular', bottomWidth: 4, roughness: 0.02 });
    const mid = blendSections(r2, r4, 0.5);
    expect(mid.describe()).toEqual({ shape: 'rectangular', bottomWidth: 3, roughness: 0.02 });
    // the same pair surveyed as points: the chords give the same rectangle
    const p2 = points({ points: [[0, 5], [0, 0], [2, 0], [2, 5]], roughness: 0.02 });
    const p4 = points({ points: [[10, 5], [10, 0], [14, 0], [14, 5]], roughness: 0.02 });
    const pm = blendSections(p2, p4, 0.5);
    sameGeometry(pm, createSection({ shape: 'rectangular', bottomWidth: 3, roughness: 0.02 }), [0.5, 2, 4.5], 1e-12);
  });

  it('blendSections(trapezoid points, trapezoid points, t) with zone boundaries at the toes is the blended trapezoid', () => {
    // corresponding points at the toes (zone boundaries) and ends: each side and the bottom blend as straight lines,
    // so the result is the trapezoid of blended b, zL, zR (exact geometry)
    const h = 2;
    const outline = (b: number, zl: number, zr: number) =>
      points({
        points: [[-zl * h, h], [0, 0], [b, 0], [b + zr * h, h]],
        roughness: [[-zl * h, 0.05], [0, 0.03], [b, 0.05]],
      });
    const t = 0.3;
    const blended = blendSections(outline(3, 2, 1), outline(5, 1, 2), t);
    const expected = trapezoidal({ bottomWidth: 3.6, sideSlopeLeft: 1.7, sideSlopeRight: 1.3, roughness: 0.04 });
    for (const y of [0.2, 1, 1.9]) {
      const a = blended.elements(y);
      const e = expected.elements(y);
      assertInDelta(a.area, e.area, 1e-12, `A at ${y}`);
      assertInDelta(a.wettedPerimeter, e.wettedPerimeter, 1e-12, `P at ${y}`);
      assertInDelta(a.firstMoment, e.firstMoment, 1e-12, `Aȳ at ${y}`);
    }
    expect(blended.subsections(1).map((s) => s.roughness)).toEqual([0.05, 0.03, 0.05]);
  });

  it('blendSections(points, points, t) blends invert, depth range and roughness zones linearly', () => {
    const mid = blendSections(upstream, downstream, 0.5);
    if (!isPointsSection(mid)) throw new Error('expected a points section');
    assertInDelta(mid.invertElevation, (100 + 99.5) / 2, 1e-12, 'invert'); // bed elevation linear (issue 4)
    // the ends blend to 4 (left: 4 and 4) and 4.4 (right: 4.5 and 4.3) above the invert: the lower one bounds the depth
    assertInDelta(mid.maxDepth, 4, 1e-12, 'lower end point above the invert');
    mid.zones.forEach((z, i) => assertInDelta(z.value, [0.0475, 0.031, 0.0575][i]!, 1e-15, `zone ${i} roughness`));
    expect(mid.zones).toHaveLength(3);
    assertInDelta(mid.zones[1]!.from, (10 + 109) / 2, 1e-12, 'bank station');
    // areas lie between the end sections' at every depth
    for (const y of [0.5, 1.5, 3]) {
      const a = mid.elements(y).area;
      const lo = Math.min(upstream.elements(y).area, downstream.elements(y).area);
      const hi = Math.max(upstream.elements(y).area, downstream.elements(y).area);
      expect(a).toBeGreaterThanOrEqual(lo);
      expect(a).toBeLessThanOrEqual(hi);
    }
    const placed = blendSections(upstream, downstream, 0.5, { invertElevation: 50 });
    expect(isPointsSection(placed) && placed.invertElevation).toBe(50);
  });

  it('blendSections(prismatic, points, t) converts the prismatic section to points', () => {
    const t = trapezoidal({ bottomWidth: 4, sideSlopeLeft: 2, roughness: 0.03 });
    const mid = blendSections(t, upstream, 0);
    // at t = 0 the trapezoid, up to the points section's depth range (exact geometry)
    sameGeometry(mid, trapezoidal({ bottomWidth: 4, sideSlopeLeft: 2, roughness: 0.03 }), [0.3, 1, 3.9], 1e-9);
    expect(mid.maxDepth).toBeCloseTo(upstream.maxDepth, 12);
  });

  it('blendSections refuses a closed conduit with an open section and t outside [0, 1]', () => {
    const pipe = createSection({ shape: 'circular', diameter: 1, roughness: 0.013 });
    expect(() => blendSections(pipe, upstream, 0.5)).toThrow(HydraulicError);
    expect(() => blendSections(upstream, downstream, 1.5)).toThrow(InputError);
    const pipe2 = createSection({ shape: 'circular', diameter: 2, roughness: 0.013 });
    expect(blendSections(pipe, pipe2, 0.25).describe()).toMatchObject({ diameter: 1.25 });
  });
});
