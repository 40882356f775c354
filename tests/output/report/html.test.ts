/**
 * buildReport(input) on the invented run of ../fixtures.ts: the page holds every part the report must have,
 * is self-contained (no network), and escapes user text. The standard caution follows the brief of the
 * client (screening aid; licensed engineer; local codes) — common practice for such tools.
 */
import { describe, expect, it } from 'vitest';
import { buildReport, standardCaution, type ReportInput } from '../../../src/output/report/html.js';
import { twoReachInputs, twoReachRun } from '../fixtures.js';

const tinySvg = (label: string) =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="100" height="50" viewBox="0 0 100 50"><rect width="100" height="50" fill="#fff"/><text x="5" y="20">${label}</text></svg>`;

function input(overrides: Partial<ReportInput> = {}): ReportInput {
  return {
    run: twoReachRun(),
    inputs: twoReachInputs(),
    charts: [{ id: 'profile', caption: 'Longitudinal profile, both flows', svg: tinySvg('profile') }],
    program: { name: 'gvf', version: '0.1.0' },
    controls: [{ flow: '10-year', station: 0, description: 'critical depth at the upstream end' }],
    modelFile: 'samples/invented.json',
    ...overrides,
  };
}

describe('buildReport(input)', () => {
  const html = buildReport(input());

  it('buildReport(input) holds title, units, every input group, summaries, charts, station tables, warnings, method, version and cautions', () => {
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).toContain('<h1>Invented test channel (not a real place)</h1>');
    expect(html).toContain('SI (m, m³/s)');
    for (const h of ['Sections', 'Reaches', 'Structures', 'Boundaries', 'Flows']) expect(html).toContain(`<h3>${h}</h3>`);
    for (const id of ['summary', 'charts', 'inputs', 'stations', 'warnings', 'method', 'cautions']) expect(html).toContain(`id="${id}"`);
    expect(html).toContain('<h3>Flow 10-year</h3>');
    expect(html).toContain('<h3>Flow 100-year</h3>');
    expect(html).toContain('<b>S2</b> 0.0–80.0 m');
    expect(html).toContain('<b>M1</b> 120.0–400.0 m');
    expect(html).toContain('critical depth at the upstream end');
    expect(html).toContain('C1: culvert at station 400.00 m');
    expect(html).toContain('<figure class="chart" id="chart-0" data-chart="profile">');
    expect(html).toContain('Figure 1.</b> Longitudinal profile, both flows');
    expect(html).toContain('invented warning: the right bank is overtopped near the culvert');
    expect(html).toContain('Standard step');
    expect(html).toContain('within 1 mm');
    expect(html).toContain('gvf 0.1.0');
    expect(html).toContain(standardCaution);
    expect(html).toContain('Invented fixture caution');
    expect(html).toMatch(/licensed engineer under local codes/);
  });

  it('buildReport(input) lists the jump with its toe, depths, Froude number, type and roller length', () => {
    const j = twoReachRun().flows[0]!.jumps[0]!;
    expect(html).toContain(`<td class="n">${j.station.toFixed(2)}</td><td class="n">${j.upstreamDepth.toFixed(3)}</td><td class="n">${j.downstreamDepth.toFixed(3)}</td><td class="n">${j.froude.toFixed(2)}</td><td>weak</td><td class="n">${j.length.toFixed(2)}</td>`);
  });

  it('buildReport(input) lists freeboard failures per flow and one station-table row per station', () => {
    const run = twoReachRun();
    const failures = run.flows[1]!.freeboard!.filter((f) => !f.pass || f.overtopped).length;
    expect(failures).toBeGreaterThan(0);
    expect(html).toContain(`Freeboard failures</div><div class="v">${failures}</div>`);
    const stationsPart = html.slice(html.indexOf('id="stations"'), html.indexOf('id="warnings"'));
    const rows = stationsPart.split('<tr>').length - 1;
    const headers = 2;
    expect(rows).toBe(run.flows[0]!.stations.length + run.flows[1]!.stations.length + headers);
  });

  it('buildReport(input) is self-contained: inline style, no script, no link, image or URL to fetch', () => {
    expect(html).toContain('<style>');
    expect(html).not.toMatch(/<script|<link|<img|<iframe|@import|url\(/i);
    expect(html).not.toMatch(/(src|href)="(https?:)?\/\//i);
  });

  it('buildReport(input) prints on A4 and Letter: @page rules, page breaks kept out of figures and rows', () => {
    expect(html).toContain('@page {');
    expect(html).toMatch(/break-inside: avoid/);
    expect(html).toMatch(/thead \{ display: table-header-group; \}/);
    expect(buildReport(input({ paper: 'A4' }))).toContain('size: A4 portrait;');
    expect(buildReport(input({ paper: 'Letter' }))).toContain('size: letter portrait;');
  });

  it('buildReport(input) escapes markup in the title, ids, labels, captions and warnings so it shows as text', () => {
    const evil = '<script>window.pwned=1</script><b>Pond</b> & "Co"';
    const run = twoReachRun(evil);
    run.flows[0]!.id = '<img src=x onerror=alert(1)>';
    run.flows[0]!.warnings.push('<i>warning</i>');
    const inputs = twoReachInputs();
    inputs.sections[0]!.id = '<svg onload=alert(1)>';
    inputs.sections[0]!.rows[0]!.label = '<u>Shape</u>';
    const page = buildReport(input({ run, inputs, charts: [{ id: '"><script>', caption: '<em>cap</em>', svg: tinySvg('ok') }] }));
    expect(page).not.toMatch(/<script|<img|<b>Pond|<svg onload|<u>Shape|<em>cap|<i>warning/);
    expect(page).toContain('<title>&lt;script&gt;window.pwned=1&lt;/script&gt;&lt;b&gt;Pond&lt;/b&gt; &amp; &quot;Co&quot;: flow profile report</title>');
    expect(page).toContain('<h1>&lt;script&gt;window.pwned=1&lt;/script&gt;&lt;b&gt;Pond&lt;/b&gt; &amp; &quot;Co&quot;</h1>');
    expect(page).toContain('Flow &lt;img src=x onerror=alert(1)&gt;');
    expect(page).toContain('data-chart="&quot;&gt;&lt;script&gt;"');
  });

  it('buildReport(input) refuses a chart SVG that could run script', () => {
    expect(() => buildReport(input({ charts: [{ id: 'x', caption: 'x', svg: '<svg><script>alert(1)</script></svg>' }] }))).toThrow(/run code/);
  });

  it('buildReport(input) says "none" where there is nothing, and never prints NaN', () => {
    const run = twoReachRun();
    for (const f of run.flows) {
      f.jumps = [];
      f.structures = [];
      f.freeboard = undefined;
      f.reaches[1]!.normalDepth = null;
      f.stations[3]!.criticalDepth = Number.NaN;
    }
    const page = buildReport(input({ run, charts: [], controls: [] }));
    expect(page).toContain('No hydraulic jump.');
    expect(page).toContain('No structure.');
    expect(page).toContain('freeboard not checked');
    expect(page).toContain('No chart was drawn.');
    expect(page).toContain('<td class="n">none</td>');
    expect(page).not.toMatch(/NaN|Infinity|undefined/);
  });
});
