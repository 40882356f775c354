/** A model folder written for a test: model.json and its survey files in a fresh temporary directory. */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';

export interface Folder {
  readonly dir: string;
  readonly model: string;
}

/** Write `files` (path relative to the folder → text) and model.json (an object) into a new folder. */
export function modelFolder(model: Record<string, unknown>, files: Record<string, string>): Folder {
  const dir = mkdtempSync(join(tmpdir(), 'gvf-survey-'));
  for (const [path, text] of Object.entries(files)) {
    const full = join(dir, path);
    mkdirSync(dirname(full), { recursive: true });
    writeFileSync(full, text);
  }
  const file = join(dir, 'model.json');
  writeFileSync(file, JSON.stringify(model, null, 2));
  return { dir, model: file };
}

/** A cross-section file of one compound section repeated under each id (offsets, elevations relative to `bed`). */
export function crossSectionRows(id: string, points: ReadonlyArray<readonly [number, number, number?]>, bed = 0): string {
  return points.map(([x, z, n]) => `${id},${x},${z + bed},${n ?? ''}`).join('\n');
}
