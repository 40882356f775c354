/**
 * Spec tests of the cross-section chart on the invented compound section of ../fixtures.ts. The wetted edges
 * are checked by straight-line interpolation between survey points, worked by hand here (common practice:
 * a surveyed section is a polyline between its points).
 */
import { describe, expect, it } from 'vitest';
import { sectionChart, wettedStretches } from '../../../src/output/charts/sectionChart.js';
import { compileChart } from '../../../src/output/render.js';
import { assertInDelta } from '../../helpers/assert.js';
import { inventedCompoundSection } from '../fixtures.js';

type AnySpec = { layer: { name: string; encoding: Record<string, any> }[]; datasets: Record<string, any[]>; [k: string]: any };

describe('sectionChart(input)', () => {
  const input = inventedCompoundSection();
  const spec = sectionChart(input) as unknown as AnySpec;

  it('wettedStretches(ground, wsel) finds the edges where a level surface meets the ground line', () => {
    // 51.85 lies between (14, 52.3)–(18, 51.1) and (26, 51.0)–(30, 52.2): hand interpolation
    const [s] = wettedStretches(input.ground, 51.85);
    assertInDelta(s!.left, 14 + ((51.85 - 52.3) * (18 - 14)) / (51.1 - 52.3), 1e-12, 'left edge');
    assertInDelta(s!.right, 26 + ((51.85 - 51.0) * (30 - 26)) / (52.2 - 51.0), 1e-12, 'right edge');
    expect(s!.points[0]![1]).toBe(51.85);
    expect(s!.points.at(-1)![1]).toBe(51.85);
    expect(s!.points.slice(1, -1).map((p) => p[0])).toEqual([18, 20, 24, 26]);
  });

  it('wettedStretches(ground, wsel) returns two pools for a surface between two low spots, none below the ground', () => {
    const ground = [[0, 5], [1, 3], [2, 5], [3, 3], [4, 5]] as const;
    const pools = wettedStretches(ground, 4);
    expect(pools.map((p) => [p.left, p.right])).toEqual([[0.5, 1.5], [2.5, 3.5]]);
    expect(wettedStretches(ground, 2)).toEqual([]);
  });

  it('sectionChart(input) holds ground, water body and surface per flow, banks and roughness boundaries', () => {
    const names = spec.layer.map((l) => l.name);
    for (const n of ['ground-fill', 'water', 'ground-line', 'water-surfaces', 'banks', 'bank-labels', 'zone-boundaries', 'zone-labels']) expect(names).toContain(n);
    expect(spec.datasets.ground!.length).toBe(input.ground.length);
    expect(spec.datasets.surfaces!.map((s) => s.flow)).toEqual(['10-year', '100-year']);
    expect(spec.datasets.surfaces!.map((s) => s.elevation)).toEqual([51.85, 52.45]);
    expect(spec.datasets.banks!.map((b) => b.offset)).toEqual([18, 26]);
    // inner boundaries only: the survey ends are not subsection boundaries
    expect(spec.datasets.zones!.map((z) => z.offset)).toEqual([18, 26]);
    expect(spec.datasets.zoneLabels!.map((z) => z.label)).toEqual(['n = 0.05', 'n = 0.03', 'n = 0.045']);
    expect(spec.layer[0]!.encoding.x.title).toBe('Distance across the section (m)');
    expect(spec.layer[0]!.encoding.y.title).toBe('Elevation (m)');
  });

  it('sectionChart(input) compiles without a Vega-Lite warning', async () => {
    expect((await compileChart(sectionChart(input))).warnings).toEqual([]);
  });
});
