/**
 * The bad-input corpus (tests/corpus/cases.json and the files under tests/corpus/cases/): every malformed
 * input gives exit code 2, a message naming the place (JSON path, file:line:column or the flag) and the fix,
 * no stack trace, nothing on stdout, and leaves every file as it was, including an output folder given with
 * --out that holds an earlier report. The inputs are invented; what a correct message says is common practice
 * for command-line tools (name the place, say what is accepted), not a published rule.
 *
 * Speed: every case runs in this process through the CLI's own main(argv, streams), which returns the exit
 * code and takes the output streams, one case after another from a temporary copy of its folder. Cases marked
 * "spawn" also run as a user runs them (node dist/cli/main.js in a child process, from inside the copy) and
 * must print the same, so the in-process runs stand for the real program.
 */
import { spawn } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { ensureBuilt, mainJs } from '../cli/built.js';

interface BadCase {
  id: string;
  what: string;
  folder?: string;
  args: string[];
  where: string;
  fix: string;
  /** false: do not add --out with an earlier report (the case is about --out itself) */
  out?: boolean;
  spawn?: boolean;
}
interface ValidCase {
  id: string;
  what: string;
  folder: string;
  args: string[];
  stdout: string;
}

const here = import.meta.dirname;
const corpus = JSON.parse(readFileSync(join(here, 'cases.json'), 'utf8')) as { cases: BadCase[]; valid: ValidCase[] };
const casesDir = join(here, 'cases');
const outName = 'earlier-report';
const commandsWithOut = new Set(['run', 'calibrate', 'rating']);
/** flags whose value is a path inside the case folder */
const pathFlags = new Set(['--flows', '--marks', '--csv', '--out']);

interface Ran {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** A temporary copy of the case's folder, with an earlier report in `earlier-report/` when --out is added. */
function copyOf(folder: string, withOut: boolean): string {
  const dir = realpathSync(mkdtempSync(join(tmpdir(), 'gvf-corpus-')));
  cpSync(join(casesDir, folder), dir, { recursive: true });
  if (withOut) {
    const out = join(dir, outName);
    mkdirSync(join(out, 'charts'), { recursive: true });
    writeFileSync(join(out, 'report.html'), '<!doctype html><p>an earlier report</p>\n');
    writeFileSync(join(out, 'result.json'), '{ "earlier": true }\n');
    writeFileSync(join(out, 'stations.csv'), 'flow,station_m\nearlier,0\n');
    writeFileSync(join(out, 'charts', 'profile.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>\n');
    writeFileSync(join(out, 'my-notes.txt'), 'notes the user keeps beside the report\n');
  }
  return dir;
}

/** Every file and folder under `dir` with its bytes ('' for a folder). */
function snapshot(dir: string): Map<string, string> {
  const found = new Map<string, string>();
  const walk = (sub: string) => {
    for (const entry of readdirSync(join(dir, sub), { withFileTypes: true })) {
      const rel = sub === '' ? entry.name : `${sub}/${entry.name}`;
      if (entry.isDirectory()) {
        found.set(`${rel}/`, '');
        walk(rel);
      } else found.set(rel, readFileSync(join(dir, rel)).toString('base64'));
    }
  };
  walk('');
  return found;
}

function withOut(c: BadCase): boolean {
  return c.out !== false && commandsWithOut.has(c.args[0]!);
}

/** The case's arguments, with --out added, and (for the in-process run) paths made absolute inside `dir`. */
function argsOf(c: BadCase, dir: string | undefined): string[] {
  const args = withOut(c) ? [...c.args, '--out', outName] : [...c.args];
  if (dir === undefined) return args;
  return args.map((arg, i) => {
    const isModel = i === 1 && commandsWithOut.has(args[0]!);
    const isFlagPath = i > 0 && pathFlags.has(args[i - 1]!) && arg !== '';
    return isModel || isFlagPath ? join(dir, arg) : arg;
  });
}

async function inProcess(args: string[]): Promise<Ran> {
  let stdout = '';
  let stderr = '';
  const code = await main(args, {
    out: (text) => {
      stdout += text.endsWith('\n') ? text : `${text}\n`;
    },
    err: (text) => {
      stderr += text.endsWith('\n') ? text : `${text}\n`;
    },
  });
  return { code, stdout, stderr };
}

function spawned(args: string[], cwd: string): Promise<Ran> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [mainJs, ...args], { cwd, env: { ...process.env, GVF_DEBUG: '' } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString('utf8')));
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString('utf8')));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

/** A stack frame line, or an error class printed with its message (TypeError: ..., Error: ...). */
const stackLine = /^\s+at\s|(?:^|\s)[A-Z][A-Za-z]*Error(?: \[[A-Z_]+\])?:|^Error:/m;

interface Outcome {
  ran: Ran;
  dir: string;
  before: Map<string, string>;
  after: Map<string, string>;
}

const outcomes = new Map<string, Outcome>();
const spawnedOutcomes = new Map<string, { ran: Ran; dir: string }>();
const valid = new Map<string, Ran>();
let debugBefore: string | undefined;

beforeAll(async () => {
  debugBefore = process.env.GVF_DEBUG;
  process.env.GVF_DEBUG = '';
  for (const c of corpus.cases) {
    const dir = copyOf(c.folder ?? c.id, withOut(c));
    const before = snapshot(dir);
    const ran = await inProcess(argsOf(c, dir));
    outcomes.set(c.id, { ran, dir, before, after: snapshot(dir) });
  }
  for (const v of corpus.valid) {
    const dir = copyOf(v.folder, false);
    valid.set(v.id, await inProcess(argsOf({ ...v, where: '', fix: '', out: false }, dir)));
  }
  // the real program, for the cases marked "spawn", all at once
  ensureBuilt();
  await Promise.all(
    corpus.cases
      .filter((c) => c.spawn === true)
      .map(async (c) => {
        const dir = copyOf(c.folder ?? c.id, withOut(c));
        spawnedOutcomes.set(c.id, { ran: await spawned(argsOf(c, undefined), dir), dir });
      }),
  );
}, 300_000);

afterAll(() => {
  if (debugBefore === undefined) delete process.env.GVF_DEBUG;
  else process.env.GVF_DEBUG = debugBefore;
});

describe('the bad-input corpus', () => {
  it('main(argv) is given at least 50 malformed inputs, each with its own id, and every case folder is used', () => {
    expect(corpus.cases.length).toBeGreaterThanOrEqual(50);
    expect(new Set(corpus.cases.map((c) => c.id)).size).toBe(corpus.cases.length);
    const used = new Set([...corpus.cases.map((c) => c.folder ?? c.id), ...corpus.valid.map((v) => v.folder)]);
    for (const folder of readdirSync(casesDir)) expect(used.has(folder), `tests/corpus/cases/${folder} is used by no case`).toBe(true);
    for (const folder of used) expect(existsSync(join(casesDir, folder)), `tests/corpus/cases/${folder}`).toBe(true);
  });

  for (const c of corpus.cases) {
    const call = `gvf ${argsOf(c, undefined).map((a) => (a === '' ? '""' : a)).join(' ')}`;
    it(`${call} (${c.id}) exits 2 naming ${c.where}, with the fix, no stack trace, files untouched`, () => {
      const { ran, before, after } = outcomes.get(c.id)!;
      const context = `${c.id}: ${c.what}\n${ran.stderr}`;
      expect(ran.code, context).toBe(2);
      expect(ran.stderr, context).toContain(c.where);
      expect(ran.stderr, context).toContain(c.fix);
      expect(ran.stderr, context).not.toMatch(stackLine);
      expect(ran.stderr, context).not.toContain('unexpected error');
      expect(ran.stdout, context).toBe('');
      // nothing written, renamed or left behind: the earlier report and the case's own files byte for byte
      expect([...after.keys()].sort(), context).toEqual([...before.keys()].sort());
      for (const [name, bytes] of before) expect(after.get(name) === bytes, `${c.id}: ${name} changed`).toBe(true);
    });
  }

  for (const c of corpus.cases.filter((x) => x.spawn === true)) {
    it(`node dist/cli/main.js ${argsOf(c, undefined).join(' ')} (${c.id}) exits 2 and prints what main(argv) prints`, () => {
      const { ran, dir } = spawnedOutcomes.get(c.id)!;
      const inside = outcomes.get(c.id)!;
      expect(ran.code, ran.stderr).toBe(2);
      expect(ran.stdout).toBe('');
      expect(ran.stderr).not.toMatch(stackLine);
      // the same words, once each run's temporary folder is taken out of the paths
      const plain = (text: string, folder: string) => text.split(`${folder}/`).join('').split(folder).join('<case>');
      expect(plain(ran.stderr, dir)).toBe(plain(inside.ran.stderr, inside.dir));
    });
  }

  for (const v of corpus.valid) {
    it(`gvf ${v.args.join(' ')} (${v.id}) runs: ${v.what}`, () => {
      const ran = valid.get(v.id)!;
      expect(ran.code, ran.stderr).toBe(0);
      expect(ran.stderr).toBe('');
      expect(ran.stdout).toContain(v.stdout);
      expect(ran.stdout).not.toMatch(/NaN|Infinity|undefined/);
    });
  }
});
