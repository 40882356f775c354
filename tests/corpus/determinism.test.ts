/**
 * Determinism of `gvf run MODEL --out DIR`: the same input gives byte-identical result.json and stations.csv
 * wherever the files lie. tests/cli/out.test.ts runs one model twice from the same path; here each sample is
 * copied (with its survey files) into two differently named folders and written to two differently named
 * output folders, so a path, a folder name, a clock or an ordering that depends on the run would show.
 * The samples are invented scenarios (said so in each sample file).
 */
import { cpSync, mkdtempSync, readFileSync, realpathSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';

const samples = join(import.meta.dirname, '..', '..', 'samples');

/** The sample (a model file, or a folder holding model.json) copied under a new folder named `name`. */
function copySample(sample: string, name: string): string {
  const root = join(realpathSync(mkdtempSync(join(tmpdir(), 'gvf-determinism-'))), name);
  if (sample.endsWith('.json')) {
    cpSync(join(samples, sample), join(root, 'model.json'));
  } else {
    cpSync(join(samples, sample), root, { recursive: true });
  }
  return root;
}

async function runTo(model: string, out: string): Promise<{ code: number; stderr: string }> {
  let stderr = '';
  const code = await main(['run', model, '--out', out], { out: () => {}, err: (t) => (stderr += `${t}\n`) });
  return { code, stderr };
}

describe('gvf run MODEL --out DIR, the same input from two places', () => {
  // a surveyed channel (CSV files beside the model) and one with a culvert: two code paths the out test does not take
  for (const sample of ['survey-drain', 'culvert-backwater.json']) {
    it(`gvf run ${sample} --out DIR from two folders gives byte-identical result.json and stations.csv`, async () => {
      const first = copySample(sample, 'first-copy');
      const second = copySample(sample, 'a-second-place');
      const a = await runTo(join(first, 'model.json'), join(first, 'out-one'));
      const b = await runTo(join(second, 'model.json'), join(second, 'elsewhere', 'out-two'));
      expect(a.code, a.stderr).toBe(0);
      expect(b.code, b.stderr).toBe(0);
      for (const file of ['result.json', 'stations.csv']) {
        const one = readFileSync(join(first, 'out-one', file));
        const two = readFileSync(join(second, 'elsewhere', 'out-two', file));
        expect(one.length, file).toBeGreaterThan(0);
        expect(one.equals(two), `${sample}: ${file} differs between the two places`).toBe(true);
        const text = one.toString('utf8');
        // no folder of the run and no clock in the results
        for (const word of ['first-copy', 'out-one', tmpdir()]) expect(text, file).not.toContain(word);
        expect(text, file).not.toMatch(/\b20\d\d-\d\d-\d\dT?|\b\d\d:\d\d:\d\d\b/);
      }
    }, 120_000);
  }
});
