/**
 * gvf calibrate and gvf run --sensitivity on surveyed reaches, through the CLI entry (main, in process, with
 * captured streams), on the invented sample samples/survey-drain.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { wselAt } from '../../src/analysis/sample.js';
import { main } from '../../src/cli/main.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';
import { assertInDelta } from '../helpers/assert.js';

async function gvf(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  return { code, out, err };
}

const temp = mkdtempSync(join(tmpdir(), 'gvf-survey-analysis-'));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

describe('gvf calibrate and gvf run --sensitivity on surveyed reaches', () => {
  const drain = 'samples/survey-drain/model.json';

  it('gvf calibrate samples/survey-drain gives back 1.2 from synthetic marks (made by gvf with n × 1.2, to 0.1 mm)', async () => {
    // synthetic marks: the 100-year flow computed by gvf with every surveyed section's n times 1.2
    const flow = runModel(readModelFile(drain), { modelFile: drain, roughnessMultiplier: () => 1.2 }).result.flows.find((f) => f.id === '100-year')!;
    const file = join(temp, 'survey-marks.csv');
    writeFileSync(file, ['station_m,elevation_m,event', ...[80, 160, 240, 300].map((s) => `${s},${wselAt(flow, s)!.toFixed(4)},100-year`)].join('\n'));
    const r = await gvf('calibrate', drain, '--marks', file);
    expect(r.code, r.err).toBe(0);
    const row = /^whole model\s+(\d+\.\d+)\s.*reach upper \(surveyed\) n varies → ×1\.200; reach lower \(surveyed\) n varies → ×1\.200$/m.exec(r.out);
    expect(row, r.out).not.toBeNull();
    assertInDelta(Number(row![1]), 1.2, 1e-3, 'multiplier');
  });

  it('gvf run samples/survey-drain --sensitivity n=±20% --json gives a band that contains the base profile', async () => {
    const r = await gvf('run', drain, '--sensitivity', 'n=±20%', '--json');
    expect(r.code, r.err).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.sensitivity.cases.map((c: { computed: boolean }) => c.computed)).toEqual([true, true, true]);
    for (const f of json.sensitivity.flows as { stations: { station: number; base: number; low: number; high: number; range: number }[] }[]) {
      for (const e of f.stations) expect(e.low <= e.base && e.base <= e.high).toBe(true);
      expect(f.stations.find((e) => e.station === 320)!.range).toBeGreaterThan(0.05);
    }
  });
});
