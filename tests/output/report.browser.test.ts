/**
 * The report in a real browser: headless Chromium from the Debian package, driven by playwright-core.
 * Opens report.html built from the invented run of ./fixtures.ts with every chart kind, checks each chart's
 * SVG is laid out with non-zero size, that the page logs no error and fetches nothing, that markup in the
 * title shows as text, and that it prints to A4 and Letter (with an invented sensitivity table, the widest
 * table the report has); leaves a screenshot in output/.
 * Skips, saying why, only when /usr/bin/chromium is absent (.ci/run installs it).
 */
import { CHROMIUM, hasChromium, launchChromium } from '../helpers/chromium.js';
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { energyForceChart } from '../../src/output/charts/energyForceChart.js';
import { profileChart } from '../../src/output/charts/profileChart.js';
import { ratingChart, ratingSeriesFromRun } from '../../src/output/charts/ratingChart.js';
import { sectionChart } from '../../src/output/charts/sectionChart.js';
import { renderChart } from '../../src/output/render.js';
import { buildReport } from '../../src/output/report/html.js';
import { inventedCompoundSection, rectangleEnergyForce, twoReachInputs, twoReachRun } from './fixtures.js';

const outputDir = fileURLToPath(new URL('../../output/', import.meta.url));
const title = 'Invented <b>test</b> channel & "culvert" <img src=x onerror="window.pwned=1">';

if (!hasChromium) console.warn(`report.browser.test: skipped because ${CHROMIUM} is absent (apt-get install -y chromium)`);

describe.skipIf(!hasChromium)(hasChromium ? 'report.html in headless Chromium' : `report.html in headless Chromium (skipped: ${CHROMIUM} is absent)`, () => {
  let work = '';
  let reportPath = '';
  const chartCount = 4;
  // playwright-core is loaded here so that the file loads (and skips) without a browser
  let context: import('playwright-core').BrowserContext;

  beforeAll(async () => {
    work = await mkdtemp(join(tmpdir(), 'gvf-browser-'));
    const run = twoReachRun(title);
    const charts = await Promise.all([
      renderChart(profileChart(run), { png: false }),
      renderChart(sectionChart(inventedCompoundSection()), { png: false }),
      renderChart(energyForceChart(rectangleEnergyForce()), { png: false }),
      renderChart(ratingChart({ units: 'SI', series: ratingSeriesFromRun(run, [0, 200, 400]) }), { png: false }),
    ]);
    const html = buildReport({
      run,
      inputs: twoReachInputs(),
      charts: [
        { id: 'profile', caption: 'Longitudinal profile (invented data)', svg: charts[0]!.svg },
        { id: 'section', caption: 'Cross-section at 250 m (invented data)', svg: charts[1]!.svg },
        { id: 'energy-force', caption: 'Specific energy and force at 80 m (invented data)', svg: charts[2]!.svg },
        { id: 'rating', caption: 'Rating curves (invented data)', svg: charts[3]!.svg },
      ],
      program: { name: 'gvf', version: '0.1.0' },
      // an invented sensitivity table (the widest table the report prints), so the print checks cover it
      sensitivity: {
        varied: 'n ±20 %, Q ±10 %',
        computed: 9,
        cases: 9,
        flows: run.flows.map((f) => ({
          id: f.id,
          reaches: 2,
          widest: f.reaches.map((r, i) => ({ reach: r.id, station: r.from, base: 51.2 + i, low: 50.9 + i, high: 51.6 + i, range: 0.7, lowCase: 'n −20 %, Q −10 %', highCase: 'n +20 %, Q +10 %' })),
          jumpToeRange: { lowest: 74.5, highest: 86.25 },
          notes: ['n +20 %: the profile types of reach lower change from M1 to M2 (invented)'],
        })),
        warnings: [],
      },
    });
    reportPath = join(work, 'report.html');
    await writeFile(reportPath, html);
    context = await launchChromium(join(work, 'profile'));
  }, 60_000);

  afterAll(async () => {
    await context?.close();
    if (work) await rm(work, { recursive: true, force: true });
  });

  it('report.html renders every chart with non-zero size, logs no error, fetches nothing, and shows markup in the title as text', async () => {
    const page = await context.newPage();
    const errors: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    page.on('pageerror', (e) => errors.push(String(e)));
    page.on('request', (r) => requests.push(r.url()));
    await page.goto(pathToFileURL(reportPath).href, { waitUntil: 'load' });

    const sizes = await page.$$eval('figure.chart svg', (svgs) => svgs.map((s) => { const b = s.getBoundingClientRect(); return { w: b.width, h: b.height }; }));
    expect(sizes).toHaveLength(chartCount);
    for (const s of sizes) {
      expect(s.w).toBeGreaterThan(100);
      expect(s.h).toBeGreaterThan(100);
    }
    // each chart drew marks, not an empty frame
    const paths = await page.$$eval('figure.chart svg', (svgs) => svgs.map((s) => s.querySelectorAll('path, line, text').length));
    for (const n of paths) expect(n).toBeGreaterThan(20);

    expect(await page.textContent('h1')).toBe(title);
    expect(await page.$('h1 b')).toBeNull();
    expect(await page.$('img')).toBeNull();
    expect(await page.evaluate(() => (globalThis as unknown as { pwned?: number }).pwned)).toBeUndefined();

    expect(errors).toEqual([]);
    expect(requests.every((u) => u.startsWith('file:') || u.startsWith('data:'))).toBe(true);

    await mkdir(outputDir, { recursive: true });
    const shot = join(outputDir, 'report-screenshot.png');
    await page.screenshot({ path: shot, fullPage: false });
    await page.locator('#charts').screenshot({ path: join(outputDir, 'report-charts.png') });
    const png = await readFile(shot);
    expect(png.subarray(1, 4).toString('ascii')).toBe('PNG');
    await page.close();
  });

  it('report.html in print layout fits the narrower printable width of A4 and Letter: no table or chart sticks out', async () => {
    // A4 is 210 mm wide, Letter 215.9 mm; less the 13 mm side margins of the print CSS, A4 leaves 184 mm = 695 CSS px (96 px/in)
    const page = await context.newPage();
    await page.setViewportSize({ width: 695, height: 1000 });
    await page.emulateMedia({ media: 'print' });
    await page.goto(pathToFileURL(reportPath).href, { waitUntil: 'load' });
    const overflow = await page.evaluate(() => {
      const d = (globalThis as any).document;
      const limit = d.documentElement.clientWidth + 1;
      return [...d.querySelectorAll('table, figure.chart svg')].map((e: any) => e.getBoundingClientRect().right).filter((r: number) => r > limit);
    });
    expect(overflow).toEqual([]);
    await page.close();
  });

  it('report.html prints to A4 and to Letter', async () => {
    const page = await context.newPage();
    await page.goto(pathToFileURL(reportPath).href, { waitUntil: 'load' });
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, printBackground: true });
      expect(pdf.subarray(0, 5).toString('ascii')).toBe('%PDF-');
      // a multi-page report: the station tables start on a page of their own
      const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      expect(pages, format).toBeGreaterThan(2);
      await writeFile(join(outputDir, `report-${format}.pdf`), pdf);
    }
    await page.close();
  });
});
