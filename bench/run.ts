/**
 * `npm run bench`: the performance figures of issue 7, measured with tinybench (median of the timed samples),
 * each printed with its target, pass or fail, the accuracy it was taken at, and the machine.
 *
 *   GVF_BENCH_QUICK=1   fewer samples (a smoke run; figures less steady)
 *   GVF_BENCH_ONLY=name run only the figures whose name contains `name`
 *
 * `npm run bench` builds the CLI (the cold-start figure spawns dist/cli/main.js), compiles the bench with plain
 * tsc (bench/tsconfig.json, into node_modules/.cache/gvf-bench: the same JavaScript the package ships, no loader
 * in the way) and runs it with node.
 */
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { promisify } from 'node:util';
import { Bench } from 'tinybench';
import { accuracyGoal } from '../src/core/tolerances.js';
import { conveyanceAndAlpha } from '../src/hydraulics/hydraulicSection.js';
import { computeProfile } from '../src/profile/engine.js';
import { ProfileMethod } from '../src/profile/types.js';
import { type Figure, passes } from './cases.js';
import { prismaticInput, surveySection } from './channels.js';
import { describeMachine, machine } from './machine.js';
import { buildSurvey, flowCount, runSurveyedEngine, surveyCount } from './surveyed.js';

const quick = process.env.GVF_BENCH_QUICK === '1';
const only = process.env.GVF_BENCH_ONLY;
const wanted = (name: string) => only === undefined || name.includes(only);
const defaultAccuracy = `default goal: ${accuracyGoal.SI * 1000} mm or ${accuracyGoal.relative * 100} % of depth`;

async function median(
  name: string,
  fn: () => unknown,
  options: { time: number; iterations: number; warmups?: number; beforeEach?: () => void },
): Promise<number> {
  const bench = new Bench({
    name,
    time: quick ? options.time / 4 : options.time,
    iterations: quick ? Math.max(2, options.iterations >> 2) : options.iterations,
    warmupIterations: quick ? 1 : (options.warmups ?? 3),
  });
  bench.add(name, fn, options.beforeEach ? { beforeEach: options.beforeEach } : {});
  await bench.run();
  const result = bench.tasks[0]!.result;
  if (result.state !== 'completed') throw new Error(`${name}: ${result.state}${'error' in result ? `: ${String(result.error)}` : ''}`);
  return result.latency.p50;
}

async function prismatic(figures: Figure[]): Promise<void> {
  for (const method of Object.keys(ProfileMethod) as ProfileMethod[]) {
    const name = `prismatic 10 km, output every 1 m, ${method}`;
    if (!wanted(name)) continue;
    const input = prismaticInput(method);
    const stations = computeProfile(input).stations.length;
    const value = await median(name, () => computeProfile(input), { time: 2000, iterations: 20 });
    figures.push({ name, value, unit: 'ms', target: 20, sense: 'max', accuracy: defaultAccuracy, note: `${stations} stations` });
  }
}

async function surveyed(figures: Figure[]): Promise<void> {
  const name = `surveyed ${surveyCount} sections × 60 points, 3 roughness zones, ${flowCount} flows, standard step + mixed-flow checks`;
  if (!wanted('surveyed')) return;
  const started = performance.now();
  let survey = buildSurvey();
  const built = performance.now() - started;
  // fresh sections before every sample: the per-section energy tables (kept after a section's first use) are
  // built inside the timing, as in a real run of a new survey
  // and the garbage of the sample before collected first (npm run bench starts node with --expose-gc), so that a
  // sample does not pay for its predecessor's: a run of a new survey in its own process starts clean
  const fresh = () => {
    survey = buildSurvey();
    (globalThis as { gc?: () => void }).gc?.();
  };
  const value = await median(name, () => runSurveyedEngine(survey), { time: 0, iterations: 5, warmups: 1, beforeEach: fresh });
  figures.push({
    name,
    value,
    unit: 'ms',
    target: 1000,
    sense: 'max',
    accuracy: defaultAccuracy,
    note: `whole results: every station's depth, state and critical depth; the sections' tables built inside the timing (building the ${surveyCount} sections themselves, ${built.toFixed(0)} ms, not counted)`,
  });
}

async function lookups(figures: Figure[]): Promise<void> {
  const name = 'section look-ups: elements + conveyance + α, 60-point section, 3 zones';
  if (!wanted('look-ups')) return;
  const hs = surveySection(0.37);
  const batch = 10_000;
  const depths = Float64Array.from({ length: batch }, (_, i) => 0.2 + (6 * i) / batch);
  let sink = 0;
  const ms = await median(
    name,
    () => {
      for (let i = 0; i < batch; i++) {
        const y = depths[i]!;
        const e = hs.section.elements(y);
        const k = conveyanceAndAlpha(hs, y);
        sink += e.area + e.wettedPerimeter + e.topWidth + e.firstMoment + k.conveyance + k.alpha;
      }
    },
    { time: 1500, iterations: 50 },
  );
  if (!Number.isFinite(sink)) throw new Error('look-ups: not finite');
  figures.push({ name, value: (batch / ms) * 1000, unit: 'per s', target: 1e6, sense: 'min', accuracy: 'exact polygon formulas (no tolerance)', note: `median of batches of ${batch}` });
}

async function coldStart(figures: Figure[]): Promise<void> {
  const name = 'cold start: node dist/cli/main.js section … --json';
  if (!wanted('cold')) return;
  // npm runs scripts from the package root; the bench itself runs from its own compiled copy
  const main = resolve(process.cwd(), 'dist/cli/main.js');
  if (!existsSync(main)) throw new Error(`${main} is missing: run npm run build first`);
  const run = promisify(execFile);
  const args = [main, 'section', '--shape', 'trapezoidal', '--bottom-width', '3', '--side-slope', '2', '--n', '0.015', '--slope', '0.0008', '--discharge', '12', '--json'];
  const check = await run(process.execPath, args);
  if (!('normalDepth' in JSON.parse(check.stdout))) throw new Error('cold start: unexpected output');
  const value = await median(name, () => run(process.execPath, args), { time: 0, iterations: 10 });
  figures.push({ name, value, unit: 'ms', target: 300, sense: 'max', accuracy: 'depth solvers at 1e-10 relative', note: 'median of spawns' });
}

function format(value: number, unit: Figure['unit']): string {
  if (unit === 'per s') return `${(value / 1e6).toFixed(2)} M/s`;
  return value >= 100 ? `${value.toFixed(0)} ms` : `${value.toFixed(1)} ms`;
}

function table(figures: readonly Figure[]): string {
  const rows = figures.map((f) => [
    f.name,
    format(f.value, f.unit),
    `${f.sense === 'max' ? '≤' : '≥'} ${format(f.target, f.unit)}`,
    passes(f) ? 'pass' : 'FAIL',
    f.accuracy,
    f.note ?? '',
  ]);
  const head = ['figure', 'median', 'target', 'result', 'accuracy', 'note'];
  const widths = head.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c]!.length)));
  const line = (r: string[]) => r.map((cell, c) => cell.padEnd(widths[c]!)).join(' | ');
  return [line(head), widths.map((w) => '-'.repeat(w)).join('-|-'), ...rows.map(line)].join('\n');
}

const figures: Figure[] = [];
console.log(`gvf benchmarks on ${describeMachine(machine())}${quick ? ' (quick run)' : ''}`);
await coldStart(figures); // first: spawning from a process with a large heap is slower
await prismatic(figures);
await lookups(figures);
await surveyed(figures);
console.log(table(figures));
console.log(`load average at the end: ${machine().load.toFixed(1)} (on ${machine().cores} cores; well above that, every figure is inflated)`);
if (process.env.GVF_BENCH_JSON) console.log(JSON.stringify({ machine: machine(), figures }, null, 2));
