/**
 * assembleReport(run): which charts a run gets and with what data. The run is the invented chute of
 * ./runFixtures.ts, computed by the engine; the checks are on the report's bookkeeping (every flow, jump and
 * structure reaches its chart; stations and levels carried over exactly) and on closed forms where a number
 * is computed here: the jump's sequent depth on the energy–force diagram obeys Bélanger's equation
 * y2/y1 = ½(√(1 + 8Fr1²) − 1) for a rectangle (Bélanger 1828; Chow 1959 eq. 3-23, from memory).
 */
import { describe, expect, it } from 'vitest';
import { assembleReport, slug, stationSlug, stationText } from '../../src/output/assembleReport.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { chuteRun, chuteRunWithStructure } from './runFixtures.js';

type Data = Record<string, Record<string, unknown>[]>;
const datasets = (spec: unknown): Data => (spec as { datasets: Data }).datasets;

describe('assembleReport(run)', () => {
  const run = chuteRun();

  it('assembleReport(run) plans a profile, one cross-section per reach, an energy–force diagram at the jump toe and a rating curve', () => {
    const { charts, notes } = assembleReport(run);
    const largest = run.result.flows[1]!;
    const toe = largest.jumps[0]!.station;
    expect(charts.map((c) => c.name)).toEqual(['profile', 'section-at-40', 'section-at-240', `energy-force-25-year-at-${slug(stationText(toe))}`, 'rating']);
    expect(notes).toEqual([]);
    for (const c of charts) expect(c.caption.length).toBeGreaterThan(20);
  });

  it('assembleReport(run) profile chart carries every flow, every jump and guide lines for each flow', () => {
    const profile = assembleReport(run).charts[0]!;
    const data = datasets(profile.spec);
    const series = new Set(data.lines!.map((l) => l.series));
    for (const f of run.result.flows) {
      expect(series).toContain(`Water surface, ${f.id}`);
      expect(series).toContain(`Energy line, ${f.id}`);
      expect(series).toContain(`Critical depth, ${f.id}`);
      expect(series).toContain(`Normal depth, ${f.id}`);
    }
    expect(data.jumps).toHaveLength(run.result.flows.reduce((n, f) => n + f.jumps.length, 0));
    expect(data.labels!.map((l) => l.text)).toEqual(expect.arrayContaining(['S2', 'S1']));
  });

  it('assembleReport(run) says in the profile caption when a stretch carries no label, and the report table still lists its type', async () => {
    // the 2-year flow's S1 stretch on the chute is about 5 m of a 400 m profile: narrower than its label
    const { charts, report } = assembleReport(run);
    const profile = charts[0]!;
    const unlabelled = datasets(profile.spec).unlabelled!;
    expect(unlabelled.map((u) => [u.flow, u.text, u.reason])).toEqual([['2-year', 'S1', 'stretch too short']]);
    expect(profile.caption).toContain('One stretch is too short or too crowded to carry a label on the chart; every profile type is listed in the reach table of its flow.');
    const { buildReport } = await import('../../src/output/report/html.js');
    const html = buildReport({ ...report, charts: [] });
    const s1 = run.result.flows[0]!.reaches[0]!.profiles.find((p) => p.type === 'S1')!;
    expect(html).toContain(`<b>S1</b> ${s1.from.toFixed(1)}–${s1.to.toFixed(1)} m`);
  });

  it('assembleReport(run, {sections}) draws the picked stations with each flow\'s water level there', () => {
    const { charts } = assembleReport(run, { sections: [120, 120, 300] });
    const sections = charts.filter((c) => c.name.startsWith('section'));
    expect(sections.map((c) => c.name)).toEqual(['section-at-120', 'section-at-300']);
    const surfaces = datasets(sections[0]!.spec).surfaces!;
    for (const f of run.result.flows) {
      const at = f.stations.find((s) => s.station === 120)!;
      const drawn = surfaces.find((s) => s.flow === f.id)!;
      assertInDelta(drawn.elevation as number, at.wsel, 1e-6, `water level of ${f.id} at 120 m`);
      // the 3 m wide rectangle: the surface spans the channel from wall to wall
      assertInDelta((drawn.right as number) - (drawn.left as number), 3, 1e-9, 'wetted width');
    }
  });

  it('assembleReport(run) takes the picked stations from the model’s sectionChartsAt, and options.sections replaces them', () => {
    const keyed = chuteRun({ sectionChartsAt: [120, 300] });
    expect(assembleReport(keyed).charts.filter((c) => c.name.startsWith('section')).map((c) => c.name)).toEqual(['section-at-120', 'section-at-300']);
    expect(assembleReport(keyed, { sections: [200] }).charts.filter((c) => c.name.startsWith('section')).map((c) => c.name)).toEqual(['section-at-200']);
    // the inputs echo the model's list, and say when the caller's stations replaced it
    const echoed = (options = {}) => assembleReport(keyed, options).report.inputs.other!.find((g) => g.heading === 'Report')!.items[0]!;
    expect(echoed()).toEqual({ id: 'Cross-section charts', rows: [{ label: 'At stations', value: '120, 300', unit: 'm' }] });
    expect(echoed({ sections: [200] }).rows[1]).toEqual({ label: 'Replaced for this report by stations', value: '200', unit: 'm' });
    expect(assembleReport(run).report.inputs.other!.some((g) => g.heading === 'Report')).toBe(false);
  });

  it('assembleReport(run) draws a cross-section at every structure and a rating curve just upstream of it', () => {
    const { charts } = assembleReport(chuteRunWithStructure());
    const names = charts.map((c) => c.name);
    expect(names).toContain('section-C-1');
    expect(names).not.toContain('section-at-40');
    const profile = datasets(charts[0]!.spec);
    expect(profile.structures!.map((s) => s.label)).toEqual(['C<1> (culvert)']);
    const rating = charts.find((c) => c.name === 'rating')!;
    expect(datasets(rating.spec).rating!.map((r) => r.series)).toEqual(expect.arrayContaining(['Above C<1> (400 m)']));
  });

  it('assembleReport(run) energy–force diagram at the toe marks the supercritical depth and its Bélanger sequent depth', () => {
    const largest = run.result.flows[1]!;
    const jump = largest.jumps[0]!;
    const chart = assembleReport(run).charts.find((c) => c.name.startsWith('energy-force'))!;
    const spec = chart.spec as unknown as { hconcat: { layer: { name: string; data: { values: { label?: string; depth: number }[] } }[] }[] };
    const points = spec.hconcat[1]!.layer.find((l) => l.name === 'force-points')!.data.values;
    const y1 = points.find((p) => p.label?.startsWith('y ='))!.depth;
    const y2 = points.find((p) => p.label?.startsWith('sequent ='))!.depth;
    assertInDelta(y1, jump.upstreamDepth, 1e-6, 'flow depth = toe depth');
    const q = largest.discharge / 3;
    const fr1 = q / Math.sqrt(9.80665 * y1 ** 3);
    assertRelative(y2, (y1 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1), 1e-5, 'Bélanger');
    // the engine's jump has the same sequent depth (its toe is where the two profiles' forces match)
    assertRelative(y2, jump.downstreamDepth, 2e-3, 'engine sequent depth');
  });

  it('assembleReport(run, {energyAt}) puts the diagram where asked, and says so when the flow does not exist', () => {
    const at = assembleReport(run, { energyAt: { station: 300, flow: '2-year' } });
    expect(at.charts.map((c) => c.name)).toContain('energy-force-2-year-at-300');
    const missing = assembleReport(run, { energyAt: { station: 300, flow: 'nope' } });
    expect(missing.charts.some((c) => c.name.startsWith('energy-force'))).toBe(false);
    expect(missing.notes).toEqual(['no energy–force diagram drawn: no flow named "nope"']);
  });

  it('assembleReport(run) draws no rating curve for a single flow', () => {
    const single = chuteRun({ flows: [{ id: 'only', discharge: 8 }] });
    expect(assembleReport(single).charts.map((c) => c.name)).not.toContain('rating');
  });

  it('assembleReport(run) echoes the inputs with units, the controls and the method settings', () => {
    const { report } = assembleReport(run, { modelFile: 'invented.json' });
    const chute = report.inputs.sections.find((s) => s.id === 'chute')!;
    expect(chute.rows).toEqual(expect.arrayContaining([{ label: 'Bottom width', value: 3, unit: 'm' }, { label: "Manning's n", value: 0.014 }]));
    const reach = report.inputs.reaches.find((r) => r.id === 'channel')!;
    expect(reach.rows).toEqual(expect.arrayContaining([{ label: 'Bed slope (fraction)', value: 0.0008 }, { label: 'From station', value: 80, unit: 'm' }]));
    expect(report.inputs.boundaries.map((b) => b.rows[0]!.value)).toEqual(['critical', 'normal']);
    expect(report.controls!.some((c) => c.description.startsWith('upstream boundary'))).toBe(true);
    expect(report.method!.settings!.map((s) => s.label)).toEqual(expect.arrayContaining(['Method', 'Friction-slope averaging', 'Output spacing']));
    expect(report.program.name).toBe('gvf');
    expect(report.modelFile).toBe('invented.json');
  });

  it('assembleReport(run) is deterministic: the same run gives the same specs', () => {
    expect(JSON.stringify(assembleReport(chuteRun()).charts)).toBe(JSON.stringify(assembleReport(chuteRun()).charts));
  });
});

describe('slug(text), stationText(x)', () => {
  it('slug(text) keeps file names to letters, digits, dot, dash and underscore', () => {
    expect(slug('C<1>')).toBe('C-1');
    expect(slug('../../etc')).toBe('etc');
    expect(slug('   ')).toBe('x');
    expect(stationText(54.9060001)).toBe('54.906');
    expect(stationSlug(-20)).toBe('minus-20');
  });
});

describe('buildReport(assembleReport(run)) with a flow change', () => {
  it('buildReport(...) shows each row of a reach split where its discharge changes with its own profile types and the local discharge', async () => {
    const { buildReport } = await import('../../src/output/report/html.js');
    const run = chuteRun({ flowChanges: [{ id: 'invented side inlet', station: 240, addedDischarge: 2 }] });
    const flow = run.result.flows[0]!;
    const rows = flow.reaches.filter((r) => r.id === 'channel');
    expect(rows.length).toBe(2);
    const { report, charts } = assembleReport(run);
    const html = buildReport({ ...report, charts: [] });
    for (const r of rows) for (const p of r.profiles) expect(html).toContain(`<b>${p.type}</b> ${p.from.toFixed(1)}–${p.to.toFixed(1)} m`);
    // the rating curve at the downstream end carries the discharge there (2 m³/s more than upstream)
    const rating = datasets(charts.find((c) => c.name === 'rating')!.spec).rating!;
    const downstream = rating.filter((p) => String(p.series).startsWith('Downstream end')).map((p) => p.discharge);
    expect(downstream).toEqual(run.result.flows.map((f) => f.discharge + 2));
  });
});
