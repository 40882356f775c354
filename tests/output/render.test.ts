/**
 * Rendering tests. The PNG checks read the file as the PNG specification lays it out (W3C PNG, 2nd ed. 2003 /
 * ISO/IEC 15948: an 8-byte signature 89 50 4E 47 0D 0A 1A 0A, then the IHDR chunk whose data start with the
 * width and height as 4-byte big-endian integers at byte offsets 16 and 20).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { profileChart } from '../../src/output/charts/profileChart.js';
import { energyForceChart } from '../../src/output/charts/energyForceChart.js';
import { sectionChart } from '../../src/output/charts/sectionChart.js';
import { renderChart, svgToPng } from '../../src/output/render.js';
import { checkedSvg } from '../../src/output/report/escape.js';
import { inventedCompoundSection, rectangleEnergyForce, twoReachRun } from './fixtures.js';

function pngSize(png: Uint8Array): { width: number; height: number } {
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  expect([...png.subarray(0, 8)]).toEqual(signature);
  expect(Buffer.from(png.subarray(12, 16)).toString('ascii')).toBe('IHDR');
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

describe('renderChart(spec)', () => {
  it('renderChart(profileChart(run)) gives an SVG and a PNG of the stated size', async () => {
    const out = await renderChart(profileChart(twoReachRun(), { width: 800, height: 450 }), { scale: 2 });
    expect(out.svg.startsWith('<svg')).toBe(true);
    expect(out.svg).toMatch(/^<svg[^>]* width="800" height="450"/);
    expect(out.width).toBe(800);
    expect(out.height).toBe(450);
    expect(out.png.length).toBeGreaterThan(10_000);
    expect(pngSize(out.png)).toEqual({ width: 1600, height: 900 });
    expect([out.pngWidth, out.pngHeight]).toEqual([1600, 900]);
    expect(out.warnings).toEqual([]);
    expect((out.vega as { $schema?: string }).$schema).toMatch(/vega\/v\d/);
  });

  it('renderChart(spec, {scale: 1}) gives a PNG pixel for each SVG pixel', async () => {
    const out = await renderChart(sectionChart(inventedCompoundSection()), { scale: 1 });
    expect(pngSize(out.png)).toEqual({ width: 640, height: 380 });
  });

  it('renderChart(energyForceChart(input)) reports the size of its two panels side by side, and the PNG matches it', async () => {
    const out = await renderChart(energyForceChart(rectangleEnergyForce()));
    expect(out.width).toBeGreaterThan(2 * 300);
    const size = pngSize(out.png);
    expect(size).toEqual({ width: out.width * 2, height: out.height * 2 });
  });

  it('renderChart(spec, {png: false}) skips the PNG', async () => {
    const out = await renderChart(sectionChart(inventedCompoundSection()), { png: false });
    expect(out.png.length).toBe(0);
    expect(out.svg.length).toBeGreaterThan(1000);
  });

  it('renderChart(spec) escapes markup in titles and labels, so the SVG shows it as text and stays well-formed', async () => {
    const evil = 'Pond <script>alert("x")</script> & <b>bold</b>';
    const run = twoReachRun(evil);
    run.flows[0]!.id = '<img src=x onerror=alert(1)>';
    run.flows[0]!.structures![0]!.id = '"C1" <i>';
    const out = await renderChart(profileChart(run));
    expect(out.svg).not.toContain('<script');
    expect(out.svg).not.toContain('<img');
    expect(out.svg).not.toContain('<b>');
    expect(out.svg).toContain('Pond &lt;script&gt;alert("x")&lt;/script&gt; &amp; &lt;b&gt;bold&lt;/b&gt;');
    expect(out.svg).toContain('Water surface, &lt;img src=x onerror=alert(1)&gt;');
    // resvg parses the SVG as XML: a stray tag or quote would fail here
    expect(out.pngWidth).toBe(1800);
    expect(() => checkedSvg(out.svg)).not.toThrow();
  });

  it('renderChart(profileChart(run)) keeps the plot the same size under a very long title (the title is cut, not the plot)', async () => {
    const frame = (svg: string) => /class="background"[^>]*d="M[^h]*h([\d.]+)v([\d.]+)/.exec(svg)!.slice(1).map(Number);
    const short = await renderChart(profileChart(twoReachRun('short')), { png: false });
    const long = await renderChart(profileChart(twoReachRun('x'.repeat(200))), { png: false });
    expect(frame(long.svg)).toEqual(frame(short.svg));
    expect(frame(short.svg)[0]).toBeGreaterThan(700);
  });

  it('renderChart(spec) gives byte-identical SVG and PNG for the same run (no clock, no random ids)', async () => {
    const a = await renderChart(profileChart(twoReachRun()));
    const b = await renderChart(profileChart(twoReachRun()));
    expect(a.svg).toBe(b.svg);
    expect(Buffer.from(a.png).equals(Buffer.from(b.png))).toBe(true);
  });

  it('svgToPng(svg, scale) refuses a scale outside (0, 16]', async () => {
    await expect(svgToPng('<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"/>', 0)).rejects.toThrow(/scale/);
    await expect(svgToPng('<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"/>', Number.NaN)).rejects.toThrow(/scale/);
  });

  it('render.ts and the chart builders load vega, vega-lite and resvg only when a chart is drawn (types only at the top)', () => {
    const files = ['render.ts', 'charts/profileChart.ts', 'charts/sectionChart.ts', 'charts/energyForceChart.ts', 'charts/ratingChart.ts', 'charts/style.ts', 'charts/series.ts', 'report/html.ts'];
    for (const f of files) {
      const text = readFileSync(fileURLToPath(new URL(`../../src/output/${f}`, import.meta.url)), 'utf8');
      const eager = text.split('\n').filter((l) => /^import\s(?!type\b).*from\s+'(vega|vega-lite|@resvg\/resvg-js)'/.test(l));
      expect(eager, f).toEqual([]);
    }
  });
});
