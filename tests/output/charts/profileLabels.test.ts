/**
 * Profile-type labels on the longitudinal profile do not collide. The check is made on what Vega itself lays
 * out: the spec is compiled and run headlessly and the bounding box Vega computes for every label text is read
 * from its scenegraph, so the test does not trust gvf's own size estimates. Runs are the invented fixture of
 * ../fixtures.ts, copied into several flows whose water surfaces lie a few millimetres apart (invented data):
 * the case where labels of different flows on one short stretch used to sit on each other.
 */
import { describe, expect, it } from 'vitest';
import { profileChart } from '../../../src/output/charts/profileChart.js';
import { estimatedPlot, labelWidth, placeProfileLabels } from '../../../src/output/charts/profileLabels.js';
import { compileChart } from '../../../src/output/render.js';
import type { FlowResult, RunResult } from '../../../src/results/types.js';
import { assertInDelta } from '../../helpers/assert.js';
import { twoReachRun } from '../fixtures.js';

type Box = { x1: number; x2: number; y1: number; y2: number; text: string };
type AnySpec = { datasets: Record<string, any[]>; [k: string]: any };

/** `count` copies of the fixture's first flow, each surface `step` m above the one before (invented). */
function crowdedRun(count: number, step = 0.004): RunResult {
  const run = twoReachRun();
  const source = run.flows[0]!;
  const flows: FlowResult[] = Array.from({ length: count }, (_, k) => {
    const f = structuredClone(source);
    f.id = `flow-${k + 1}`;
    for (const s of f.stations) s.wsel += k * step;
    // a 2 m stretch before the jump: about 4 px of a 900 px chart of 400 m, too short for any label
    f.reaches[0]!.profiles = [
      { type: 'S2', from: 0, to: 78 },
      { type: 'S3', from: 78, to: 80 },
      { type: 'S1', from: 80, to: 120 },
    ];
    f.jumps = [];
    f.structures = [];
    return f;
  });
  return { ...run, flows };
}

/** The label texts Vega lays out, with the bounds it computes for each, and the x scale. */
async function laidOutLabels(spec: unknown): Promise<{ boxes: Box[]; x: (station: number) => number }> {
  const { vega: compiled } = await compileChart(spec as never);
  const vega = await import('vega');
  const view = new vega.View(vega.parse(compiled as never), { renderer: 'none' });
  try {
    await view.runAsync();
    const boxes: Box[] = [];
    const visit = (node: any) => {
      if (!node || typeof node !== 'object') return;
      if (node.marktype === 'text' && typeof node.name === 'string' && node.name === 'profile_labels_marks') {
        for (const item of node.items ?? []) boxes.push({ x1: item.bounds.x1, x2: item.bounds.x2, y1: item.bounds.y1, y2: item.bounds.y2, text: item.text });
      }
      for (const child of node.items ?? []) visit(child);
    };
    visit((view.scenegraph() as unknown as { root: unknown }).root);
    const scale = view.scale('x') as (v: number) => number;
    return { boxes, x: (s) => scale(s) };
  } finally {
    view.finalize();
  }
}

const overlap = (a: Box, b: Box) => a.x1 < b.x2 && b.x1 < a.x2 && a.y1 < b.y2 && b.y1 < a.y2;

describe('profileChart(run) profile-type labels', () => {
  it('profileChart(run) with three flows a few millimetres apart lays out no two labels overlapping (Vega’s own text bounds)', async () => {
    const run = crowdedRun(3);
    const spec = profileChart(run) as unknown as AnySpec;
    const { boxes } = await laidOutLabels(spec);
    expect(boxes.length).toBe(spec.datasets.labels!.length);
    expect(boxes.length).toBeGreaterThanOrEqual(6);
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) expect(overlap(boxes[i]!, boxes[j]!), `${boxes[i]!.text} and ${boxes[j]!.text}`).toBe(false);
    }
  });

  it('profileChart(run) keeps each label inside its stretch, one label per stretch at most', async () => {
    const run = crowdedRun(3);
    const spec = profileChart(run) as unknown as AnySpec;
    const labels = spec.datasets.labels!;
    const keys = labels.map((l) => `${l.flow}|${l.reach}|${l.from}`);
    expect(new Set(keys).size).toBe(keys.length);
    const { boxes, x } = await laidOutLabels(spec);
    labels.forEach((l, i) => {
      const box = boxes[i]!;
      expect(box.text).toBe(l.text);
      // Vega's box (estimated text width) lies between the stretch's ends on the chart
      expect(box.x1).toBeGreaterThanOrEqual(x(l.from) - 0.5);
      expect(box.x2).toBeLessThanOrEqual(x(l.to) + 0.5);
    });
  });

  it('profileChart(run) with three flows puts each flow’s label of the same long stretch at a different station', () => {
    const labels = (profileChart(crowdedRun(3)) as unknown as AnySpec).datasets.labels!;
    const m1 = labels.filter((l) => l.text === 'M1').map((l) => l.station);
    expect(m1).toHaveLength(3);
    expect(new Set(m1).size).toBe(3);
    // the preferred places 1/4, 1/2 and 3/4 along 120–400 m are far enough apart to be kept
    expect(m1).toEqual([190, 260, 330]);
  });

  it('profileChart(run) leaves out the label of a stretch narrower than its text, and says so in `unlabelled`', () => {
    const spec = profileChart(crowdedRun(3)) as unknown as AnySpec;
    expect(spec.datasets.labels!.some((l) => l.text === 'S3')).toBe(false);
    const short = spec.datasets.unlabelled!.filter((u) => u.text === 'S3');
    expect(short.map((u) => u.flow)).toEqual(['flow-1', 'flow-2', 'flow-3']);
    for (const u of short) expect(u.reason).toBe('stretch too short');
  });

  it('profileChart(run) with more flows than a short stretch can hold drops the extra labels (no overlap) and lists them', async () => {
    const spec = profileChart(crowdedRun(6)) as unknown as AnySpec;
    const s1 = spec.datasets.labels!.filter((l) => l.text === 'S1');
    const crowded = spec.datasets.unlabelled!.filter((u) => u.text === 'S1');
    expect(s1.length).toBeGreaterThan(0);
    expect(crowded.length).toBeGreaterThan(0);
    expect(s1.length + crowded.length).toBe(6);
    for (const u of crowded) expect(u.reason).toBe('no room clear of other labels');
    const { boxes } = await laidOutLabels(spec);
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(overlap(boxes[i]!, boxes[j]!)).toBe(false);
  });

  it('profileChart(run) with unlabelled stretches compiles without a Vega-Lite warning', async () => {
    const { warnings } = await compileChart(profileChart(crowdedRun(6)));
    expect(warnings).toEqual([]);
  });
});

describe('placeProfileLabels', () => {
  const frame = { plotWidth: 800, plotHeight: 300, stations: [0, 400] as [number, number], elevations: [0, 3] as [number, number], flows: 2 };

  it('placeProfileLabels moves a second label along its stretch when the preferred place is taken', () => {
    // two flows, one stretch 100–160 m each, the same surface: the second label cannot sit at its 2/3 place
    // (10 m = 20 px from the first) and goes further along
    const flat = () => 1.5;
    const { placed, leftOut } = placeProfileLabels(
      [
        { flow: 'a', flowIndex: 0, reach: 'r', text: 'M2', from: 100, to: 160 },
        { flow: 'b', flowIndex: 1, reach: 'r', text: 'M2', from: 100, to: 160 },
      ],
      flat,
      frame,
    );
    expect(leftOut).toEqual([]);
    expect(placed[0]!.station).toBe(120);
    const gapPx = Math.abs(placed[1]!.station - placed[0]!.station) * 2;
    expect(gapPx).toBeGreaterThanOrEqual(labelWidth('M2'));
    expect(placed[1]!.station).toBeLessThanOrEqual(160 - labelWidth('M2') / 4);
  });

  it('placeProfileLabels keeps two labels at one station when their surfaces are far apart in height', () => {
    // a 12 m stretch (24 px) just holds one 21 px label, so both must sit at its middle; 1 m apart in height is 100 px
    const { placed, leftOut } = placeProfileLabels(
      [
        { flow: 'a', flowIndex: 0, reach: 'r', text: 'M1', from: 100, to: 112 },
        { flow: 'b', flowIndex: 1, reach: 'r', text: 'M1', from: 100, to: 112 },
      ],
      (i) => (i === 0 ? 1 : 2),
      frame,
    );
    expect(leftOut).toEqual([]);
    expect(placed).toHaveLength(2);
    assertInDelta(placed[0]!.station, 106, 1, 'first label near the middle');
    assertInDelta(placed[1]!.station, 106, 1, 'second label near the middle');
  });

  it('placeProfileLabels leaves out the second of two labels that can only sit at one place at one height', () => {
    const { placed, leftOut } = placeProfileLabels(
      [
        { flow: 'a', flowIndex: 0, reach: 'r', text: 'M1', from: 100, to: 112 },
        { flow: 'b', flowIndex: 1, reach: 'r', text: 'M1', from: 100, to: 112 },
      ],
      () => 1.5,
      frame,
    );
    expect(placed.map((p) => p.flow)).toEqual(['a']);
    expect(leftOut).toEqual([{ text: 'M1', flow: 'b', reach: 'r', from: 100, to: 112, reason: 'no room clear of other labels' }]);
  });

  it('estimatedPlot(900, 480, 4 key rows, 1 title line) is no larger than the 820 × 297 px plot Vega draws for the invented chute', () => {
    // measured on the SVG of the two-flow chute profile of tests/output/runFixtures.ts (background path 820 × 297)
    const plot = estimatedPlot(900, 480, 4, 1);
    expect(plot.width).toBeLessThanOrEqual(820);
    expect(plot.height).toBeLessThanOrEqual(297);
    expect(plot.width).toBeGreaterThan(0.9 * 820);
    expect(plot.height).toBeGreaterThan(0.9 * 297);
  });
});
