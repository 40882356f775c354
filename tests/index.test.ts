/**
 * src/index.ts, the library's public names: the analysis layer is exported with the rest, and importing the
 * library (the built dist/index.js, as a user's program does) loads no charting stack (vega, vega-lite, resvg):
 * DEVELOPERS.md promises that the library loads fast, and charts are wanted only by the output layer.
 */
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as analysis from '../src/analysis/index.js';
import * as gvf from '../src/index.js';
import { ensureBuilt, root } from './cli/built.js';
import { packagesLoaded } from './helpers/packages.js';

beforeAll(() => ensureBuilt(), 300_000);

describe('the library (src/index.ts)', () => {
  it('index exports every public value of the analysis layer (calibration, sensitivity, rating tables, flow batches)', () => {
    const names = Object.keys(analysis);
    for (const name of ['calibrateRoughness', 'sensitivityAnalysis', 'ratingTable', 'flowBatch', 'boundedLeastSquares']) {
      expect(names, name).toContain(name);
    }
    const exported = gvf as Record<string, unknown>;
    for (const name of names) expect(exported[name], `gvf.${name}`).toBe((analysis as Record<string, unknown>)[name]);
  });

  it('import "gvf" (dist/index.js) loads no charting package: neither vega, vega-lite nor @resvg/resvg-js', () => {
    const index = join(root, 'dist', 'index.js');
    // the import must reach the analysis layer, or the check would pass on a library that left it out
    const program = `import(${JSON.stringify(index)}).then((m) => { if (typeof m.ratingTable !== 'function') process.exit(3); })`;
    const run = packagesLoaded(['--input-type=module', '-e', program]);
    expect(run.status, run.stderr).toBe(0);
    expect(run.packages.length, 'the trace saw no package at all: is the hook working?').toBeGreaterThan(0);
    for (const charting of ['vega', 'vega-lite', '@resvg/resvg-js']) expect(run.packages, charting).not.toContain(charting);
  });
});
