/**
 * The report after a sensitivity run (`gvf run --sensitivity … --out`): the band on the report's profile chart
 * and the short table of widest water-surface ranges. Runs are invented channels computed by gvf's engine
 * (./runFixtures.ts, ../analysis/models.ts). The numbers are checked against Manning's normal depth
 * (Manning 1891), solved independently in the test: on a long uniform canal with normal depth at both ends,
 * every case is uniform flow, so the widest range is the normal depth of the roughest, largest case less that
 * of the smoothest, smallest one.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sensitivityAnalysis } from '../../src/analysis/sensitivity.js';
import { main } from '../../src/cli/main.js';
import { assembleReport, reportSensitivity } from '../../src/output/assembleReport.js';
import { buildReport } from '../../src/output/report/html.js';
import { runFiles } from '../../src/output/runFiles.js';
import { runModel } from '../../src/run.js';
import { assertInDelta } from '../helpers/assert.js';
import { manningRectangleDepth, twoReachModel, uniformModel } from '../analysis/models.js';
import { chuteRun } from './runFixtures.js';

type Data = Record<string, Record<string, unknown>[]>;
const datasets = (spec: unknown): Data => (spec as { datasets: Data }).datasets;
const variations = [
  { parameter: 'n', percent: 20 },
  { parameter: 'Q', percent: 10 },
] as const;

function withSensitivity(model = twoReachModel()) {
  const base = runModel(model);
  const { sensitivity } = sensitivityAnalysis(model, [...variations], { base });
  return { run: base, sensitivity };
}

/** The tiny SVG a test report carries instead of rendered charts. */
const tinySvg = '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>';

describe('assembleReport(run, {sensitivity})', () => {
  const { run, sensitivity } = withSensitivity();

  it('assembleReport(run, {sensitivity}) draws each flow’s range as a band on the profile, station by station', () => {
    const { charts } = assembleReport(run, { sensitivity });
    const profile = charts.find((c) => c.name === 'profile')!;
    const bands = datasets(profile.spec).bands!;
    for (const f of sensitivity.flows) {
      const mine = bands.filter((b) => b.flow === f.id);
      expect(mine).toHaveLength(f.stations.length);
      mine.forEach((b, i) => {
        assertInDelta(b.station as number, f.stations[i]!.station, 1e-6, 'station');
        assertInDelta(b.low as number, f.stations[i]!.low, 1e-6, 'low');
        assertInDelta(b.high as number, f.stations[i]!.high, 1e-6, 'high');
      });
    }
    expect(profile.caption).toContain('The pale band along each flow\'s water surface spans the lowest to the highest water surface met when n ±20 %, Q ±10 % are varied');
    // every other chart is as without the sensitivity run
    expect(charts.map((c) => c.name)).toEqual(assembleReport(run).charts.map((c) => c.name));
  });

  it('assembleReport(run) without a sensitivity run draws no band and has no sensitivity part', () => {
    const { charts, report } = assembleReport(run);
    expect(datasets(charts[0]!.spec).bands).toBeUndefined();
    expect(report.sensitivity).toBeUndefined();
  });

  it('reportSensitivity(s, flows) lists the widest range of each reach with its station, read from the envelope', () => {
    const table = reportSensitivity(sensitivity, run.result.flows);
    expect(table.varied).toBe('n ±20 %, Q ±10 %');
    expect([table.computed, table.cases]).toEqual([9, 9]);
    table.flows.forEach((f, i) => {
      const envelope = sensitivity.flows[i]!;
      const reaches = run.result.flows[i]!.reaches;
      expect(f.widest.map((w) => w.reach)).toEqual(reaches.map((r) => r.id));
      f.widest.forEach((w, k) => {
        const r = reaches.find((x) => x.id === w.reach)!;
        // no station of the reach has a wider range (brute force over the envelope; a station at a reach break
        // listed for the reach upstream is not listed again)
        const listed = f.widest.slice(0, k).map((x) => x.station);
        const inReach = envelope.stations.filter((e) => e.station >= r.from && e.station <= r.to && !listed.includes(e.station));
        expect(w.range).toBe(Math.max(...inReach.map((e) => e.range)));
        const at = envelope.stations.find((e) => e.station === w.station)!;
        expect([w.base, w.low, w.high, w.range, w.lowCase, w.highCase]).toEqual([at.base, at.low, at.high, at.range, at.lowCase, at.highCase]);
      });
      // the flow's widest row is the envelope's own widest range
      assertInDelta(Math.max(...f.widest.map((w) => w.range)), envelope.largestRange!.range, 1e-12, 'largest range');
    });
  });

  it('reportSensitivity(uniform canal) gives the widest range as Manning’s normal depth of (1.2 n, 1.1 Q) less that of (0.8 n, 0.9 Q) (Manning 1891)', () => {
    const canal = withSensitivity(uniformModel());
    const table = reportSensitivity(canal.sensitivity, canal.run.result.flows);
    const row = table.flows[0]!.widest[0]!;
    // invented canal: b = 6 m, n = 0.02, S0 = 0.001, Q = 12 m³/s (tests/analysis/models.ts)
    const high = manningRectangleDepth(12 * 1.1, 6, 0.02 * 1.2, 0.001);
    const low = manningRectangleDepth(12 * 0.9, 6, 0.02 * 0.8, 0.001);
    assertInDelta(row.range, high - low, 2e-3, 'widest range');
    expect(row.highCase).toBe('n +20 %, Q +10 %');
    expect(row.lowCase).toBe('n −20 %, Q −10 %');
  });

  it('reportSensitivity(s, flows, limit) keeps only the widest reaches, in station order', () => {
    const table = reportSensitivity(sensitivity, run.result.flows, 1);
    for (const [i, f] of table.flows.entries()) {
      expect(f.widest).toHaveLength(1);
      expect(f.reaches).toBe(2);
      assertInDelta(f.widest[0]!.range, sensitivity.flows[i]!.largestRange!.range, 1e-12, 'kept the widest');
    }
    const html = buildReport({ ...assembleReport(run).report, sensitivity: table, charts: [] });
    expect(html).toContain('(for a flow through many reaches, only the reaches where it is widest)');
  });
});

describe('buildReport(...) with a sensitivity run', () => {
  const { run, sensitivity } = withSensitivity();
  const { report } = assembleReport(run, { sensitivity });
  const html = buildReport({ ...report, charts: [{ id: 'profile', caption: 'profile', svg: tinySvg }] });
  const part = html.slice(html.indexOf('<section class="part sensitivity" id="sensitivity">'), html.indexOf('<section class="part" id="inputs">'));

  it('buildReport(...) adds the part "Sensitivity of the water surface" after the charts, numbered and in the contents', () => {
    expect(part.length).toBeGreaterThan(100);
    expect(part).toContain('<h2><span class="num">3</span>Sensitivity of the water surface</h2>');
    expect(html).toContain('<h2><span class="num">4</span>Inputs</h2>');
    expect(html).toContain('<h2><span class="num">8</span>Cautions</h2>');
    expect(html).toContain('<li><a href="#sensitivity">Sensitivity of the water surface</a></li>');
    expect(html.indexOf('id="charts"')).toBeLessThan(html.indexOf('id="sensitivity"'));
  });

  it('buildReport(...) says what was varied and tables each flow’s widest range per reach, the widest in bold', () => {
    expect(part).toContain("Every flow was computed again for each combination of n ±20 %, Q ±10 % about the model's values (9 of 9 cases computed, the model itself among them).");
    expect(part).toContain('<th>Flow</th><th>Reach</th><th class="n">Station (m)</th><th class="n">Model water surface (m)</th><th class="n">Lowest (m)</th><th class="n">Highest (m)</th><th class="n">Range (m)</th><th>Lowest in case</th><th>Highest in case</th>');
    const body = part.slice(part.indexOf('<tbody>'), part.indexOf('</tbody>'));
    expect(body.split('<tr>').length - 1).toBe(4); // two flows, two reaches each
    for (const f of sensitivity.flows) {
      const top = f.largestRange!;
      expect(body).toContain(`<td class="n">${top.station.toFixed(2)}</td>`);
      expect(body).toContain(`<td class="n"><b>${top.range.toFixed(3)}</b></td>`);
    }
    expect(part).toContain('<h4>What changes between cases</h4>');
    expect(part).toContain('n +20 %: the profile types of reach lower change from M1 to M2');
  });

  it('buildReport(...) without a sensitivity run keeps the seven parts as they were', () => {
    const plain = buildReport({ ...assembleReport(run).report, charts: [] });
    expect(plain).not.toContain('id="sensitivity"');
    expect(plain).toContain('<h2><span class="num">3</span>Inputs</h2>');
    expect(plain).toContain('<h2><span class="num">7</span>Cautions</h2>');
  });

  it('buildReport(...) keeps the sensitivity table whole when printed and escapes case labels and flow ids', () => {
    expect(html).toMatch(/@media print \{[^@]*table\.sensitivity[^}]*break-inside: avoid/);
    const odd = reportSensitivity(sensitivity, run.result.flows);
    odd.flows[0]!.id = '<i>minor</i>';
    odd.flows[0]!.widest[0]!.highCase = 'n +20 % & <b>more</b>';
    const escaped = buildReport({ ...report, sensitivity: odd, charts: [] });
    expect(escaped).toContain('&lt;i&gt;minor&lt;/i&gt;');
    // spaces inside one part of a case label do not break (the line wraps after a comma)
    expect(escaped).toContain('n&nbsp;+20&nbsp;%&nbsp;&amp;&nbsp;&lt;b&gt;more&lt;/b&gt;');
    expect(escaped).not.toContain('<b>more</b>');
    expect(escaped).not.toContain('<i>minor</i>');
  });
});

describe('runFiles(run, {sensitivity})', () => {
  it('runFiles(run, {sensitivity}) gives the same bytes twice and puts the band into the report’s own profile SVG', async () => {
    const make = async () => {
      const run = chuteRun();
      const { sensitivity } = sensitivityAnalysis(run.stages.model, [{ parameter: 'Q', percent: 10 }], { base: run });
      return runFiles(run, { sensitivity });
    };
    const a = await make();
    const b = await make();
    expect(a.files.map((f) => f.name)).toEqual(b.files.map((f) => f.name));
    a.files.forEach((f, i) => expect(Buffer.from(f.content).equals(Buffer.from(b.files[i]!.content)), f.name).toBe(true));
    const html = a.files.find((f) => f.name === 'report.html')!.content as string;
    expect(html).toContain('id="sensitivity"');
    expect(html).toContain('Range of water surface, 25-year');
    expect(html).not.toMatch(/\b20\d\d-\d\d-\d\d|\d\d:\d\d:\d\d/);
  }, 60_000);
});

describe('gvf run MODEL --sensitivity LIST --out DIR', () => {
  it('gvf run --sensitivity --out shows the range in report.html: the band on its profile and the table of widest ranges', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'gvf-sensitivity-report-')), 'out');
    let err = '';
    const code = await main(['run', join(import.meta.dirname, '..', 'analysis', 'fixtures', 'drain.json'), '--sensitivity', 'n=±20%', '--out', out], { out: () => {}, err: (t) => (err += t) });
    try {
      expect(code, err).toBe(0);
      const html = readFileSync(join(out, 'report.html'), 'utf8');
      expect(html).toContain('<h2><span class="num">3</span>Sensitivity of the water surface</h2>');
      expect(html).toContain('(3 of 3 cases computed, the model itself among them)');
      // the report's own profile figure (not only charts/sensitivity-profile.svg) carries the bands' key entries
      const start = html.indexOf('data-chart="profile"');
      const profile = html.slice(start, html.indexOf('</figure>', start));
      expect(profile).toContain('Range of water surface, minor');
      expect(profile).toContain('Range of water surface, major');
      const spec = JSON.parse(readFileSync(join(out, 'charts', 'profile.vl.json'), 'utf8'));
      expect(spec.datasets.bands.length).toBeGreaterThan(0);
      expect(existsSync(join(out, 'sensitivity.csv'))).toBe(true);
    } finally {
      rmSync(join(out, '..'), { recursive: true, force: true });
    }
  }, 60_000);
});
