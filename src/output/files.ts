/**
 * Writing a run's output files so that a failed run never leaves half a report: every file is first written
 * to a temporary name in its own folder (same file system, so the rename is atomic on POSIX), and only when
 * all of them are written are they renamed into place. If any write fails, the temporary files are removed
 * and the previous outputs stay as they were.
 *
 * The rename phase replaces one file at a time: a crash in the middle of it (power loss) can leave some new
 * and some old files, each of them whole.
 */
import { mkdir, open, rename, rm } from 'node:fs/promises';
import { randomBytes } from 'node:crypto';
import { dirname, isAbsolute, join, normalize, sep } from 'node:path';
import { InputError } from '../core/errors.js';

export interface OutputFile {
  /** path relative to the output folder, e.g. "report.html" or "charts/profile.svg" */
  name: string;
  content: string | Uint8Array;
}

function checkName(name: string, index: number): string {
  const where = `files[${index}].name`;
  if (typeof name !== 'string' || name.trim() === '') throw new InputError({ where, message: 'an output file needs a name', value: name });
  if (isAbsolute(name) || /^[a-zA-Z]:/.test(name)) throw new InputError({ where, message: 'an output file name must be relative to the output folder', value: name });
  const clean = normalize(name);
  if (clean === '..' || clean.startsWith(`..${sep}`) || clean.split(/[\\/]/).includes('..')) {
    throw new InputError({ where, message: 'an output file must stay inside the output folder (no "..")', value: name });
  }
  if (clean.split(/[\\/]/).some((part) => part.startsWith('.gvf-tmp-'))) {
    throw new InputError({ where, message: 'names starting ".gvf-tmp-" are reserved for temporary files', value: name });
  }
  return clean;
}

async function writeWhole(path: string, content: string | Uint8Array): Promise<void> {
  const handle = await open(path, 'wx');
  try {
    await handle.writeFile(content);
    await handle.sync();
  } finally {
    await handle.close();
  }
}

/**
 * Writes `files` into `dir` (created if missing): all to temporary names first, then renamed into place.
 * Returns the final paths. Throws (after cleaning up) if any file cannot be written.
 */
export async function writeOutputs(dir: string, files: readonly OutputFile[]): Promise<string[]> {
  const names = files.map((f, i) => checkName(f.name, i));
  const seen = new Set<string>();
  names.forEach((n, i) => {
    if (seen.has(n)) throw new InputError({ where: `files[${i}].name`, message: 'two output files have the same name', value: files[i]!.name });
    seen.add(n);
  });
  await mkdir(dir, { recursive: true });
  const tag = `${process.pid}-${randomBytes(4).toString('hex')}`;
  const staged: { temp: string; final: string }[] = [];
  try {
    for (let i = 0; i < files.length; i++) {
      const final = join(dir, names[i]!);
      await mkdir(dirname(final), { recursive: true });
      const temp = join(dirname(final), `.gvf-tmp-${tag}-${i}`);
      staged.push({ temp, final });
      await writeWhole(temp, files[i]!.content);
    }
  } catch (error) {
    await Promise.all(staged.map((s) => rm(s.temp, { force: true })));
    throw error;
  }
  for (const s of staged) await rename(s.temp, s.final);
  return staged.map((s) => s.final);
}
