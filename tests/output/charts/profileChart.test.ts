/**
 * Spec tests of the longitudinal profile. The relations checked are definitions of the trade (common
 * practice): a guide line's elevation is bed elevation + depth (Chow 1959, Open-Channel Hydraulics, ch. 9
 * draws critical- and normal-depth lines this way), the water surface is the computed stage, a jump is drawn
 * at its toe. Data come from the invented fixture in ../fixtures.ts.
 */
import { describe, expect, it } from 'vitest';
import { profileChart, type LineRow } from '../../../src/output/charts/profileChart.js';
import { compileChart } from '../../../src/output/render.js';
import type { RunResult } from '../../../src/results/types.js';
import { assertInDelta } from '../../helpers/assert.js';
import { twoReachRun } from '../fixtures.js';

type AnySpec = { layer: { name: string; data: { name: string }; encoding: Record<string, any>; transform?: unknown[] }[]; datasets: Record<string, any[]>; [k: string]: any };
const specOf = (run: RunResult, options = {}) => profileChart(run, options) as unknown as AnySpec;
const rowsOf = (spec: AnySpec, series: string): LineRow[] => spec.datasets.lines!.filter((l: LineRow) => l.series === series);

describe('profileChart(run)', () => {
  const run = twoReachRun();
  const spec = specOf(run);

  it('profileChart(run) holds every layer the profile needs', () => {
    const names = spec.layer.map((l) => l.name);
    for (const n of ['ground', 'water', 'lines', 'structures', 'structure-labels-left', 'structure-labels-right', 'jump-rollers', 'jump-faces', 'jump-toes', 'jump-labels', 'profile-labels']) {
      expect(names, n).toContain(n);
    }
  });

  it('profileChart(run) draws bed, banks and, per flow, water surface, energy, critical and normal lines', () => {
    const series = new Set(spec.datasets.lines!.map((l: LineRow) => l.series));
    for (const s of ['Channel bed', 'Left bank top', 'Right bank top']) expect(series).toContain(s);
    for (const f of ['10-year', '100-year']) {
      for (const kind of ['Water surface', 'Energy line', 'Critical depth', 'Normal depth']) expect(series).toContain(`${kind}, ${f}`);
    }
  });

  it('profileChart(run) puts each flow’s computed water surface and energy line in the data unchanged', () => {
    for (const flow of run.flows) {
      const ws = rowsOf(spec, `Water surface, ${flow.id}`);
      const en = rowsOf(spec, `Energy line, ${flow.id}`);
      expect(ws.length).toBe(flow.stations.length);
      flow.stations.forEach((s, i) => {
        assertInDelta(ws[i]!.station, s.station, 1e-9, 'station');
        assertInDelta(ws[i]!.elevation, s.wsel, 1e-7, 'wsel');
        assertInDelta(en[i]!.elevation, s.energyElevation, 1e-7, 'energy');
      });
    }
  });

  it('profileChart(run) draws critical- and normal-depth lines per reach at bed + depth, never joined across a reach break', () => {
    for (const flow of run.flows) {
      for (const [kind, depthOf] of [
        ['Critical depth', (r: (typeof flow.reaches)[number]) => r.criticalDepth],
        ['Normal depth', (r: (typeof flow.reaches)[number]) => r.normalDepth as number],
      ] as const) {
        const rows = rowsOf(spec, `${kind}, ${flow.id}`);
        const segments = new Map<string, LineRow[]>();
        for (const r of rows) segments.set(r.segment, [...(segments.get(r.segment) ?? []), r]);
        expect(segments.size).toBe(flow.reaches.length);
        for (const seg of segments.values()) {
          const reach = flow.reaches.find((r) => r.id === seg[0]!.reach)!;
          for (const r of seg) {
            expect(r.station).toBeGreaterThanOrEqual(reach.from);
            expect(r.station).toBeLessThanOrEqual(reach.to);
            const st = flow.stations.find((s) => s.station === r.station)!;
            assertInDelta(r.elevation, st.bedElevation + depthOf(reach), 1e-7, `${kind} at ${r.station}`);
          }
          // both reach ends are on the line, so it reaches the break
          expect(seg[0]!.station).toBe(reach.from);
          expect(seg[seg.length - 1]!.station).toBe(reach.to);
        }
      }
    }
  });

  it('profileChart(run) leaves out the normal-depth line of a reach that has none (adverse or horizontal)', () => {
    const r2 = twoReachRun();
    for (const f of r2.flows) {
      f.reaches[1]!.normalDepth = null;
      for (const s of f.stations) if (s.reach === 'lower') s.normalDepth = null;
    }
    const rows = rowsOf(specOf(r2), 'Normal depth, 10-year');
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => r.reach === 'chute')).toBe(true);
  });

  it('profileChart(run) marks each jump at its toe with its roller length as a bar', () => {
    const jumps = spec.datasets.jumps!;
    expect(jumps.length).toBe(2);
    for (const flow of run.flows) {
      const j = flow.jumps[0]!;
      const row = jumps.find((x) => x.flow === flow.id)!;
      const bed = flow.stations.find((s) => s.station === j.station)!.bedElevation;
      assertInDelta(row.station, j.station, 1e-9, 'toe');
      assertInDelta(row.end - row.station, j.length, 1e-7, 'roller length');
      assertInDelta(row.toeElevation, bed + j.upstreamDepth, 1e-7, 'toe depth');
      assertInDelta(row.sequentElevation, bed + j.downstreamDepth, 1e-7, 'sequent depth');
    }
    const roller = spec.layer.find((l) => l.name === 'jump-rollers')!;
    expect(roller.encoding.x.field).toBe('station');
    expect(roller.encoding.x2.field).toBe('end');
  });

  it('profileChart(run) draws each structure at its station, from the bed up, with its id and type', () => {
    const s = spec.datasets.structures!;
    expect(s).toHaveLength(1);
    expect(s[0]!.station).toBe(400);
    expect(s[0]!.label).toBe('C1 (culvert)');
    assertInDelta(s[0]!.bed, run.flows[0]!.stations.at(-1)!.bedElevation, 1e-7, 'rule foot');
    expect(s[0]!.side).toBe('left'); // at the right edge the label goes left of the rule
  });

  it('profileChart(run) labels every profile stretch with its type, inside the stretch, on its flow’s surface', () => {
    const labels = spec.datasets.labels!;
    for (const flow of run.flows) {
      const mine = labels.filter((l) => l.flow === flow.id);
      expect(mine.map((l) => l.text)).toEqual(['S2', 'S1', 'M1']);
      for (const l of mine) {
        expect(l.station).toBeGreaterThan(l.from);
        expect(l.station).toBeLessThan(l.to);
      }
    }
  });

  it('profileChart(run) states units on its axes and uses plain words in one shared key', () => {
    const first = spec.layer[0]!;
    expect(first.encoding.x.title).toBe('Station (m)');
    expect(first.encoding.y.title).toBe('Elevation (m)');
    const us = specOf({ ...run, units: 'US' });
    expect(us.layer[0]!.encoding.x.title).toBe('Station (ft)');
    expect(us.layer[0]!.encoding.y.title).toBe('Elevation (ft)');
    const colour = spec.layer.find((l) => l.name === 'lines')!.encoding.color;
    expect(colour.scale.domain.length).toBe(colour.scale.range.length);
    expect(colour.scale.domain).toContain('Jump toe and roller');
    expect(colour.scale.domain).toContain('Structure');
    // every series drawn is in the key
    for (const s of new Set(spec.datasets.lines!.map((l: LineRow) => l.series))) expect(colour.scale.domain).toContain(s);
  });

  it('profileChart(run) sets the whole chart size and compiles without a Vega-Lite warning', async () => {
    expect(spec.width).toBe(900);
    expect(spec.height).toBe(480);
    expect(spec.autosize).toEqual({ type: 'fit', contains: 'padding' });
    const { warnings } = await compileChart(profileChart(run));
    expect(warnings).toEqual([]);
  });

  it('profileChart(run) keeps non-finite values out of the spec and breaks the line there', () => {
    const r2 = twoReachRun();
    r2.flows[0]!.stations[5]!.wsel = Number.NaN;
    const s2 = specOf(r2);
    const ws = rowsOf(s2, 'Water surface, 10-year');
    expect(ws.length).toBe(r2.flows[0]!.stations.length - 1);
    expect(new Set(ws.map((r) => r.segment)).size).toBe(2);
    expect(JSON.stringify(s2)).not.toMatch(/NaN|Infinity/);
    expect(s2.datasets.lines!.every((l: LineRow) => Number.isFinite(l.elevation) && Number.isFinite(l.station))).toBe(true);
  });

  it('profileChart(run, {flows, guideFlows, reverseStations}) draws only what is asked', () => {
    const s2 = specOf(run, { flows: ['100-year'], guideFlows: [], reverseStations: true });
    const series = new Set(s2.datasets.lines!.map((l: LineRow) => l.series));
    expect(series).toContain('Water surface, 100-year');
    expect(series).not.toContain('Water surface, 10-year');
    expect([...series].some((s) => s.startsWith('Energy line'))).toBe(false);
    expect(s2.layer[0]!.encoding.x.scale.reverse).toBe(true);
  });
});
