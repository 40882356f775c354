/**
 * Which packages a Node process loads: a resolve hook (Node's module.register, Node ≥ 20.6) writes
 * "package NAME" to stderr for every module resolved under node_modules. Used to keep cold starts light
 * (gvf section loads commander only; importing the library loads no charting stack).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface TracedRun {
  status: number | null;
  stderr: string;
  /** every package loaded, in the order first loaded */
  packages: string[];
}

/** Run `node --import HOOK ...args` and list the packages the process loaded. */
export function packagesLoaded(args: readonly string[]): TracedRun {
  const hook = join(mkdtempSync(join(tmpdir(), 'gvf-trace-')), 'trace.mjs');
  const resolver = `export async function resolve(s, c, next) { const r = await next(s, c);
    const m = /node_modules\\/((@[^/]+\\/)?[^/]+)/.exec(r.url); if (m) process.stderr.write('package ' + m[1] + '\\n'); return r; }`;
  writeFileSync(hook, `import { register } from 'node:module';\nregister('data:text/javascript,' + encodeURIComponent(${JSON.stringify(resolver)}));\n`);
  const run = spawnSync(process.execPath, ['--import', hook, ...args], { encoding: 'utf8' });
  const packages = [...new Set(run.stderr.split('\n').filter((l) => l.startsWith('package ')).map((l) => l.slice(8)))];
  return { status: run.status, stderr: run.stderr, packages };
}
