/**
 * Everything `gvf run MODEL --out DIR` writes, built in memory first and then written in one staged step:
 *
 *   ModelRun ─assembleReport─▶ chart specs ─renderChart─▶ SVG + PNG ─buildReport─▶ report.html
 *            ─resultJson─▶ result.json     ─stationsCsv─▶ stations.csv
 *   all files ─writeOutputs─▶ DIR (temporary names, renamed only when every file is written)
 *
 * A chart that fails to render, or a file that cannot be written, fails the whole step before anything in
 * DIR is replaced, so the previous outputs stay as they were. Files a previous run wrote that this run does
 * not (a cross-section at a station no longer picked) are removed afterwards; the list of what gvf wrote is
 * kept in DIR/.gvf-outputs, and nothing else in DIR is ever touched.
 *
 * Deterministic: the same run gives the same bytes in result.json, stations.csv and every chart file
 * (no clock, no random names); the report carries the program version, not a time.
 */
import { readFile, readdir, rm } from 'node:fs/promises';
import { join, normalize } from 'node:path';
import type { ModelRun } from '../run.js';
import { assembleReport, type PlannedChart, type ReportOptions } from './assembleReport.js';
import { stationsCsv } from './csv.js';
import { type OutputFile, writeOutputs } from './files.js';
import type { RenderedChart } from './render.js';
import { buildReport } from './report/html.js';

/** The list of files gvf wrote into an output folder, one relative name a line. */
export const manifestName = '.gvf-outputs';

export interface RunFilesOptions extends ReportOptions {
  /** renders one chart (default: render.ts's renderChart, loaded on first use); tests pass their own */
  render?: (spec: PlannedChart['spec']) => Promise<RenderedChart>;
  /** called after each step: the run's charts are drawn one by one */
  onProgress?: (done: number, total: number, label: string) => void;
}

export interface RunFiles {
  files: OutputFile[];
  /** chart names, in report order */
  charts: string[];
  /** charts that could not be drawn, with why */
  notes: string[];
}

/** The `--json` structure: the run's result (with the method comparison when asked for), non-finite numbers as null. */
export function resultJson(run: ModelRun): string {
  const value = run.comparison === undefined ? run.result : { ...run.result, comparison: run.comparison };
  return `${JSON.stringify(value, (_key, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`;
}

async function defaultRender(spec: PlannedChart['spec']): Promise<RenderedChart> {
  const { renderChart } = await import('./render.js');
  return renderChart(spec);
}

/** Every output file of a run, in memory. Throws (writing nothing) if a chart cannot be drawn. */
export async function runFiles(run: ModelRun, options: RunFilesOptions = {}): Promise<RunFiles> {
  const { report, charts, notes } = assembleReport(run, options);
  const render = options.render ?? defaultRender;
  const files: OutputFile[] = [];
  const drawn: { id: string; caption: string; svg: string }[] = [];
  const total = charts.length + 1;
  for (let i = 0; i < charts.length; i++) {
    const chart = charts[i]!;
    const out = await render(chart.spec);
    if (out.svg.length === 0) throw new Error(`chart ${chart.name} rendered empty`);
    files.push(
      { name: `charts/${chart.name}.vl.json`, content: `${JSON.stringify(chart.spec, null, 2)}\n` },
      { name: `charts/${chart.name}.svg`, content: out.svg },
      { name: `charts/${chart.name}.png`, content: out.png },
    );
    drawn.push({ id: chart.name, caption: chart.caption, svg: out.svg });
    options.onProgress?.(i + 1, total, `chart ${chart.name}`);
  }
  const html = buildReport({ ...report, charts: drawn });
  // report.html goes last: files are renamed into place in this order, so the page a reader opens is the
  // last to change (it holds its charts inline and never depends on the chart files)
  files.unshift({ name: 'result.json', content: resultJson(run) }, { name: 'stations.csv', content: stationsCsv(run.result) });
  files.push({ name: 'report.html', content: html });
  options.onProgress?.(total, total, 'report');
  return { files, charts: charts.map((c) => c.name), notes };
}

async function previousManifest(dir: string): Promise<string[]> {
  try {
    const text = await readFile(join(dir, manifestName), 'utf8');
    return text.split('\n').map((l) => l.trim()).filter((l) => l !== '');
  } catch {
    return [];
  }
}

/** A name from an old manifest that is safe to remove: relative, inside DIR, one gvf writes. */
function removable(name: string): boolean {
  const clean = normalize(name);
  return !clean.startsWith('..') && !clean.startsWith('/') && !clean.includes('\0') && /^(report\.html|result\.json|stations\.csv|charts\/[A-Za-z0-9._-]+\.(vl\.json|svg|png))$/.test(clean);
}

/** Temporary files an interrupted earlier run left behind (the ".gvf-tmp-" prefix is reserved for them). */
async function removeLeftovers(dir: string): Promise<void> {
  for (const sub of ['', 'charts']) {
    let names: string[];
    try {
      names = await readdir(join(dir, sub));
    } catch {
      continue;
    }
    for (const name of names) if (name.startsWith('.gvf-tmp-')) await rm(join(dir, sub, name), { force: true });
  }
}

export interface WrittenRun {
  /** full paths of the files written */
  written: string[];
  /** full path of report.html */
  report: string;
  /** full paths of outputs of an earlier run removed because this run does not write them */
  removed: string[];
  charts: string[];
  notes: string[];
}

/** Builds every output file, writes them into `dir` in one staged step, then removes stale outputs. */
export async function writeRunOutputs(dir: string, run: ModelRun, options: RunFilesOptions = {}): Promise<WrittenRun> {
  const built = await runFiles(run, options);
  const names = built.files.map((f) => f.name);
  const old = await previousManifest(dir);
  await removeLeftovers(dir);
  const written = await writeOutputs(dir, [...built.files, { name: manifestName, content: `${names.join('\n')}\n` }]);
  const keep = new Set(names.map((n) => normalize(n)));
  const removed: string[] = [];
  for (const name of old) {
    if (keep.has(normalize(name)) || !removable(name)) continue;
    const path = join(dir, normalize(name));
    await rm(path, { force: true });
    removed.push(path);
  }
  return { written: written.filter((p) => !p.endsWith(manifestName)), report: join(dir, 'report.html'), removed, charts: built.charts, notes: built.notes };
}
