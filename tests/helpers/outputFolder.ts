/**
 * What the tests of `--out` (tests/cli/out.test.ts) and of writeRunOutputs (tests/output/runFiles.test.ts) share:
 * a fresh scratch folder, every file below a folder with its bytes, and a PNG's pixel size read from its header
 * as the PNG specification lays it out (W3C PNG 2nd ed. 2003 / ISO/IEC 15948: the 8-byte signature, then the IHDR
 * chunk with the width and height, big-endian, at bytes 16 and 20).
 */
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect } from 'vitest';

/** A new empty folder under the system's temporary folder. */
export function scratchFolder(prefix: string): string {
  return mkdtempSync(join(tmpdir(), prefix));
}

/** Every file below `dir` (paths relative to it, with / between folders) and its bytes. */
export function filesIn(dir: string): Map<string, Buffer> {
  const out = new Map<string, Buffer>();
  const walk = (sub: string) => {
    for (const e of readdirSync(join(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${e.name}` : e.name;
      if (e.isDirectory()) walk(rel);
      else out.set(rel, readFileSync(join(dir, rel)));
    }
  };
  walk('');
  return out;
}

/** The width and height in pixels of a PNG file, after checking its signature and that IHDR comes first. */
export function pngSize(png: Buffer): { width: number; height: number } {
  expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  expect(png.subarray(12, 16).toString('ascii')).toBe('IHDR');
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}
