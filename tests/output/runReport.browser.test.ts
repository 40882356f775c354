/**
 * The report that `gvf run SAMPLE --out DIR` writes (the sample `npm start` runs), in headless Chromium from the
 * Debian package driven by playwright-core: every chart laid out with non-zero size, no console error, nothing
 * fetched, and a screenshot left in output/ for a person to look at. Skips, saying why, only when
 * /usr/bin/chromium is absent (.ci/run installs it).
 */
import { CHROMIUM, hasChromium, launchChromium } from '../helpers/chromium.js';
import { readFileSync } from 'node:fs';
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, gvf, root } from '../cli/built.js';

const outputDir = fileURLToPath(new URL('../../output/', import.meta.url));

/** The sample `npm start` runs, read from package.json so this test follows it. */
function startSample(): string {
  const start = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts.start ?? '';
  const m = /\brun\s+(samples\/[^\s]+\.json)/.exec(start);
  if (!m) throw new Error(`npm start does not run a sample: ${start}`);
  return m[1]!;
}

if (!hasChromium) console.warn(`runReport.browser.test: skipped because ${CHROMIUM} is absent (apt-get install -y chromium)`);

describe.skipIf(!hasChromium)(hasChromium ? 'gvf run --out report in headless Chromium' : `gvf run --out report in headless Chromium (skipped: ${CHROMIUM} is absent)`, () => {
  let work = '';
  let context: import('playwright-core').BrowserContext;
  const sample = startSample();

  beforeAll(async () => {
    ensureBuilt();
    work = await mkdtemp(join(tmpdir(), 'gvf-run-browser-'));
    const run = gvf(['run', sample, '--out', join(work, 'out')]);
    if (run.code !== 0) throw new Error(`gvf run ${sample} --out failed: ${run.stderr}`);
    context = await launchChromium(join(work, 'profile'));
  }, 300_000);

  afterAll(async () => {
    await context?.close();
    if (work) await rm(work, { recursive: true, force: true });
  });

  it(`report.html of gvf run ${sample} --out shows every chart with non-zero size, logs no error and fetches nothing`, async () => {
    const page = await context.newPage();
    const errors: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    page.on('pageerror', (e) => errors.push(String(e)));
    page.on('request', (r) => requests.push(r.url()));
    const report = join(work, 'out', 'report.html');
    await page.goto(pathToFileURL(report).href, { waitUntil: 'load' });

    const charts = (readFileSync(join(work, 'out', '.gvf-outputs'), 'utf8').match(/^charts\/.+\.svg$/gm) ?? []).length;
    expect(charts).toBeGreaterThanOrEqual(4);
    const sizes = await page.$$eval('figure.chart svg', (svgs) => svgs.map((s) => { const b = s.getBoundingClientRect(); return { w: b.width, h: b.height }; }));
    expect(sizes).toHaveLength(charts);
    for (const s of sizes) {
      expect(s.w).toBeGreaterThan(100);
      expect(s.h).toBeGreaterThan(100);
    }
    const marks = await page.$$eval('figure.chart svg', (svgs) => svgs.map((s) => s.querySelectorAll('path, line, text').length));
    for (const n of marks) expect(n).toBeGreaterThan(20);
    expect(await page.textContent('h1')).toMatch(/invented/i);
    expect(errors).toEqual([]);
    expect(requests.every((u) => u.startsWith('file:') || u.startsWith('data:'))).toBe(true);

    await mkdir(outputDir, { recursive: true });
    await page.screenshot({ path: join(outputDir, 'sample-report.png'), fullPage: false });
    await page.locator('#charts').screenshot({ path: join(outputDir, 'sample-report-charts.png') });
    await page.locator('#summary').screenshot({ path: join(outputDir, 'sample-report-summary.png') });
    expect(readFileSync(join(outputDir, 'sample-report.png')).subarray(1, 4).toString('ascii')).toBe('PNG');
    await page.close();
  });
});
