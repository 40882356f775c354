/**
 * sectionGround: the ground line drawn for a section. Checked by an independent method: the area between a
 * level water surface and the drawn ground line (shoelace formula over the wetted polygon) equals the flow
 * area the geometry layer computes at that depth (exact for polygons; for the circle, the segment formula
 * A = (D²/8)(θ − sin θ), θ = 2 arccos(1 − 2y/D), standard geometry).
 */
import { describe, expect, it } from 'vitest';
import { trapezoidal } from '../../../src/geometry/shapes/trapezoidal.js';
import { rectangular } from '../../../src/geometry/shapes/rectangular.js';
import { circular } from '../../../src/geometry/shapes/circular.js';
import { points } from '../../../src/geometry/shapes/points.js';
import { sectionGround } from '../../../src/output/assemble/sectionGround.js';
import { wettedStretches } from '../../../src/output/charts/sectionChart.js';
import { assertRelative } from '../../helpers/assert.js';

/** Area under `wsel` above the ground line: shoelace over each wetted stretch closed along the surface. */
function wettedArea(ground: readonly (readonly [number, number])[], wsel: number): number {
  let total = 0;
  for (const s of wettedStretches(ground, wsel)) {
    const poly = s.points;
    let twice = 0;
    for (let i = 0; i < poly.length; i++) {
      const [x1, y1] = poly[i]!;
      const [x2, y2] = poly[(i + 1) % poly.length]!;
      twice += x1 * y2 - x2 * y1;
    }
    total += Math.abs(twice) / 2;
  }
  return total;
}

describe('sectionGround(section, law, invert, height)', () => {
  it('sectionGround(trapezoidal) encloses the flow area of the geometry layer at every depth drawn', () => {
    const s = trapezoidal({ bottomWidth: 1.2, sideSlopeLeft: 2, sideSlopeRight: 3, roughness: 0.018 });
    const g = sectionGround(s, 'manning', 48, 2);
    for (const y of [0.2, 0.9, 1.7]) assertRelative(wettedArea(g.ground, 48 + y), s.elements(y).area, 1e-9, `area at ${y}`);
    expect(g.zones).toHaveLength(1);
    expect(g.zones[0]!.label).toBe('n = 0.018');
    // the lowest point sits at the invert, the outline reaches the height asked for
    expect(Math.min(...g.ground.map((p) => p[1]))).toBe(48);
    expect(Math.max(...g.ground.map((p) => p[1]))).toBeCloseTo(50, 12);
    // offsets never go backwards (a ground line, as the chart requires)
    for (let i = 1; i < g.ground.length; i++) expect(g.ground[i]![0]).toBeGreaterThanOrEqual(g.ground[i - 1]![0]);
  });

  it('sectionGround(rectangular) gives level ground beside the walls and labels Chézy roughness as C', () => {
    const s = rectangular({ bottomWidth: 3, roughness: 60 });
    const g = sectionGround(s, 'chezy', 0, 1.5);
    assertRelative(wettedArea(g.ground, 1.0), 3, 1e-12, 'area 3 m × 1 m');
    expect(g.ground[0]![1]).toBe(1.5);
    expect(g.ground[0]![0]).toBeLessThan(-1.5);
    expect(g.zones[0]!.label).toBe('C = 60');
  });

  it('sectionGround(points) keeps the surveyed points and their roughness zones, shifted to the invert', () => {
    const s = points({ points: [[0, 12], [4, 10.5], [6, 10], [8, 10.6], [14, 12.2]], roughness: [[0, 0.05], [4, 0.03], [8, 0.045]] });
    const g = sectionGround(s, 'manning', 100, 1);
    expect(g.ground).toEqual([[0, 102], [4, 100.5], [6, 100], [8, 100.6], [14, 102.2]]);
    expect(g.zones.map((z) => z.label)).toEqual(['n = 0.05', 'n = 0.03', 'n = 0.045']);
    assertRelative(wettedArea(g.ground, 101.2), s.elements(1.2).area, 1e-9, 'area at 1.2');
  });

  it('sectionGround(circular) draws the lower half: the segment area up to the springline, with a note', () => {
    const D = 1.2;
    const g = sectionGround(circular({ diameter: D, roughness: 0.013 }), 'manning', 10, 2);
    const y = 0.45;
    const theta = 2 * Math.acos(1 - (2 * y) / D);
    // a 36-sided polygon inscribed in the circle falls short of the segment area by well under 1 %
    assertRelative(wettedArea(g.ground, 10 + y), ((D * D) / 8) * (theta - Math.sin(theta)), 0.01, 'segment area');
    expect(g.closedNote).toContain('lower half');
  });
});
