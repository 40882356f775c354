/**
 * Everything `gvf run MODEL --out DIR` writes, built in memory first and then written in one staged step:
 *
 *   ModelRun ─assembleReport─▶ chart specs ─renderChart─▶ SVG + PNG ─buildReport─▶ report.html
 *            ─resultJson─▶ result.json     ─stationsCsv─▶ stations.csv
 *            (with --sensitivity) ─sensitivityCsv─▶ sensitivity.csv, the band chart charts/sensitivity-profile.*
 *   all files and their record ─writeOutputs─▶ DIR (temporary names, renamed only when every file is written)
 *
 * A chart that fails to render, or a file that cannot be written, fails the whole step before anything in
 * DIR is replaced, so the previous outputs stay as they were. Every file gvf writes is recorded in
 * DIR/.gvf-outputs; the files an earlier run recorded that this run does not write (a cross-section at a
 * station no longer picked, the sensitivity files of an earlier run with --sensitivity) are removed afterwards.
 * Only recorded names of the kinds gvf writes are ever removed, so nothing else in DIR is touched.
 *
 * The record written with the new files still lists the earlier files to be removed, and is rewritten without
 * them once they are gone: a run stopped between the two steps leaves them recorded, and the next run removes
 * them (an earlier output is never forgotten while it is still on disk).
 *
 * Deterministic: the same run gives the same bytes in result.json, stations.csv and every chart file
 * (no clock, no random names); the report carries the program version, not a time.
 */
import { lstat, readFile, readdir, rm } from 'node:fs/promises';
import { join, posix } from 'node:path';
import type { ModelRun } from '../run.js';
import { assembleReport, type PlannedChart, type ReportOptions } from './assembleReport.js';
import { stationsCsv } from './csv.js';
import { type OutputFile, writeOutputs } from './files.js';
import type { RenderedChart } from './render.js';
import { buildReport } from './report/html.js';
import { sensitivityChart, sensitivityChartName, sensitivityCsv, sensitivityCsvName } from './sensitivityFiles.js';

/** The record of the files gvf wrote into an output folder, one relative name a line. */
export const manifestName = '.gvf-outputs';

export interface RunFilesOptions extends ReportOptions {
  /** renders one chart (default: render.ts's renderChart, loaded on first use); tests pass their own */
  render?: (spec: PlannedChart['spec']) => Promise<RenderedChart>;
  /** called after each step: the run's charts are drawn one by one */
  onProgress?: (done: number, total: number, label: string) => void;
}

export interface RunFiles {
  files: OutputFile[];
  /** the report's chart names, in report order (the sensitivity band chart, not a figure of the report, is not among them) */
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

/** The three files of one drawn chart: its spec (to restyle and render again), SVG and PNG. */
function chartOutputs(name: string, spec: PlannedChart['spec'], out: RenderedChart): OutputFile[] {
  if (out.svg.length === 0) throw new Error(`chart ${name} rendered empty`);
  return [
    { name: `charts/${name}.vl.json`, content: `${JSON.stringify(spec, null, 2)}\n` },
    { name: `charts/${name}.svg`, content: out.svg },
    { name: `charts/${name}.png`, content: out.png },
  ];
}

/** Every output file of a run, in memory. Throws (writing nothing) if a chart cannot be drawn. */
export async function runFiles(run: ModelRun, options: RunFilesOptions = {}): Promise<RunFiles> {
  const { report, charts, notes } = assembleReport(run, options);
  const render = options.render ?? defaultRender;
  const files: OutputFile[] = [];
  const drawn: { id: string; caption: string; svg: string }[] = [];
  const sensitivity = options.sensitivity;
  const total = charts.length + (sensitivity === undefined ? 0 : 1) + 1;
  for (let i = 0; i < charts.length; i++) {
    const chart = charts[i]!;
    const out = await render(chart.spec);
    files.push(...chartOutputs(chart.name, chart.spec, out));
    drawn.push({ id: chart.name, caption: chart.caption, svg: out.svg });
    options.onProgress?.(i + 1, total, `chart ${chart.name}`);
  }
  if (sensitivity !== undefined) {
    // the band chart on its own; the report draws the bands on its own profile figure and tables the widest ranges
    const spec = sensitivityChart(sensitivity, run.result);
    files.push({ name: sensitivityCsvName, content: sensitivityCsv(sensitivity, run.result.units) }, ...chartOutputs(sensitivityChartName, spec, await render(spec)));
    options.onProgress?.(charts.length + 1, total, `chart ${sensitivityChartName}`);
  }
  const html = buildReport({ ...report, charts: drawn });
  // report.html goes last: files are renamed into place in this order, so the page a reader opens is the
  // last to change (it holds its charts inline and never depends on the chart files)
  files.unshift({ name: 'result.json', content: resultJson(run) }, { name: 'stations.csv', content: stationsCsv(run.result) });
  files.push({ name: 'report.html', content: html });
  options.onProgress?.(total, total, 'report');
  return { files, charts: charts.map((c) => c.name), notes };
}

/**
 * The kinds of name gvf writes into an output folder: the record holds only these, and only these are ever
 * removed, so a record edited by hand or copied from elsewhere can name nothing outside DIR and nothing of
 * another kind a user keeps there (notes, data files, folders of their own).
 */
const outputName = /^(report\.html|result\.json|stations\.csv|sensitivity\.csv|charts\/[A-Za-z0-9][A-Za-z0-9._-]*\.(vl\.json|svg|png))$/;

/** A name as the record holds it (forward slashes, no "./"), or null when it is not of a kind gvf writes. */
export function recordedName(name: string): string | null {
  if (name.includes('\0') || name.includes('\\')) return null;
  const clean = posix.normalize(name.trim());
  return outputName.test(clean) ? clean : null;
}

/** The names the folder's record lists that gvf may remove, each once, in their order there. */
async function previousRecord(dir: string): Promise<string[]> {
  let text: string;
  try {
    text = await readFile(join(dir, manifestName), 'utf8');
  } catch {
    return [];
  }
  return [...new Set(text.split('\n').map(recordedName).filter((n): n is string => n !== null))];
}

function recordFile(names: readonly string[]): OutputFile {
  return { name: manifestName, content: names.map((n) => `${n}\n`).join('') };
}

function errorCode(error: unknown): string {
  return (error as NodeJS.ErrnoException).code ?? (error instanceof Error ? error.message : String(error));
}

/**
 * Removes one earlier output. Only a regular file is what gvf wrote there: a name that is now a folder or a
 * link was made by someone else, and is left alone (and no longer recorded).
 */
async function removeEarlier(path: string): Promise<'removed' | 'absent' | 'not a file' | { failed: string }> {
  try {
    if (!(await lstat(path)).isFile()) return 'not a file';
    await rm(path);
    return 'removed';
  } catch (error) {
    return errorCode(error) === 'ENOENT' ? 'absent' : { failed: errorCode(error) };
  }
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
  /** charts that could not be drawn, and earlier outputs that could not be removed, with why */
  notes: string[];
}

/**
 * Builds every output file, writes them into `dir` in one staged step together with their record, then
 * removes the outputs an earlier run recorded that this run does not write, and records what remains.
 */
export async function writeRunOutputs(dir: string, run: ModelRun, options: RunFilesOptions = {}): Promise<WrittenRun> {
  const built = await runFiles(run, options);
  const names = built.files.map((f) => {
    const name = recordedName(f.name);
    // a file the record could not hold would never be cleaned up by a later run: a bug, caught before writing
    if (name === null) throw new Error(`output file ${JSON.stringify(f.name)} is not of a kind ${manifestName} records`);
    return name;
  });
  const keep = new Set(names);
  const stale = (await previousRecord(dir)).filter((n) => !keep.has(n));
  await removeLeftovers(dir);
  // the earlier outputs stay recorded until they are removed (see the header)
  const written = await writeOutputs(dir, [...built.files, recordFile([...names, ...stale])]);
  const removed: string[] = [];
  const left: string[] = [];
  const notes = [...built.notes];
  for (const name of stale) {
    const path = join(dir, name);
    const outcome = await removeEarlier(path);
    if (outcome === 'removed') removed.push(path);
    else if (typeof outcome === 'object') {
      left.push(name);
      notes.push(`${path}, written by an earlier run, could not be removed (${outcome.failed}); it stays listed in ${manifestName} and the next run tries again`);
    }
  }
  if (stale.length > 0) await writeOutputs(dir, [recordFile([...names, ...left])]);
  return { written: written.filter((p) => !p.endsWith(manifestName)), report: join(dir, 'report.html'), removed, charts: built.charts, notes };
}
