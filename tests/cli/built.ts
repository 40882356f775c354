/**
 * The CLI tests run the built program (dist/cli/main.js) as a user would, in a child process.
 * ensureBuilt() builds once for all test files (a lock directory keeps parallel workers from building twice)
 * and skips the build when dist is newer than every source file.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';

export const root = join(import.meta.dirname, '..', '..');
export const mainJs = join(root, 'dist', 'cli', 'main.js');
const lock = join(root, 'dist', '.build-lock');

function newest(dir: string): number {
  let latest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    latest = Math.max(latest, entry.isDirectory() ? newest(path) : statSync(path).mtimeMs);
  }
  return latest;
}

const upToDate = () => existsSync(mainJs) && statSync(mainJs).mtimeMs >= newest(join(root, 'src'));

function sleep(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

export function ensureBuilt(): void {
  mkdirSync(join(root, 'dist'), { recursive: true });
  for (let attempt = 0; attempt < 1200; attempt++) {
    if (upToDate()) return;
    try {
      mkdirSync(lock);
    } catch {
      sleep(250); // another worker is building
      continue;
    }
    try {
      const build = spawnSync('npm', ['run', 'build'], { cwd: root, encoding: 'utf8' });
      if (build.status !== 0) throw new Error(`npm run build failed:\n${build.stdout}\n${build.stderr}`);
      return;
    } finally {
      rmSync(lock, { recursive: true, force: true });
    }
  }
  throw new Error('gave up waiting for the build (a stale dist/.build-lock?)');
}

export interface Ran {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function gvf(args: readonly string[], env: Record<string, string> = {}): Ran {
  const run = spawnSync(process.execPath, [mainJs, ...args], {
    cwd: root,
    encoding: 'utf8',
    env: { ...process.env, GVF_DEBUG: '', ...env },
  });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}
