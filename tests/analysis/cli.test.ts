/**
 * The analysis commands through the CLI entry (main, in process, with captured streams): gvf calibrate,
 * gvf rating, gvf run --flows and --sensitivity. Fixtures in ./fixtures are invented (see its README).
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { assertInDelta } from '../helpers/assert.js';

const here = join(import.meta.dirname, 'fixtures');
const model = join(here, 'drain.json');
const marks = join(here, 'marks.csv');
const flows = join(here, 'flows.csv');

async function gvf(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  return { code, out, err };
}

const temp = mkdtempSync(join(tmpdir(), 'gvf-analysis-'));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

describe('gvf calibrate', () => {
  it('gvf calibrate --json gives back the multiplier the marks were made with (1.2, marks rounded to 0.1 mm)', async () => {
    const r = await gvf('calibrate', model, '--marks', marks, '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.scope).toBe('whole model');
    assertInDelta(json.multipliers[0].multiplier, 1.2, 1e-3, 'multiplier');
    expect(json.rmse).toBeLessThan(1e-3);
    expect(json.marks).toHaveLength(12);
    expect(json.cautions[0]).toMatch(/screening aid/);
    expect(json.calibratedRun.flows).toHaveLength(2);
  });

  it('gvf calibrate --per-reach --out writes calibration.json, marks.csv and the chart files', async () => {
    const dir = join(temp, 'calibration');
    const r = await gvf('calibrate', model, '--marks', marks, '--per-reach', '--out', dir);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^upper\s+1\.200\d/m);
    for (const name of ['calibration.json', 'marks.csv', 'charts/calibration-profile.vl.json', 'charts/calibration-profile.svg', 'charts/calibration-profile.png']) {
      expect(existsSync(join(dir, name)), name).toBe(true);
    }
    expect(readFileSync(join(dir, 'marks.csv'), 'utf8').split('\n')[0]).toBe(
      'station_m,flow,observed_m,before_m,calibrated_m,residual_m,weight,sensitivity_m,informs_roughness',
    );
    const spec = JSON.parse(readFileSync(join(dir, 'charts/calibration-profile.vl.json'), 'utf8'));
    expect(spec.datasets.observations).toHaveLength(12);
  });

  it('gvf calibrate without --marks, with bad --bounds or a missing file: exit 2 naming the flag', async () => {
    let r = await gvf('calibrate', model);
    expect(r.code).toBe(2);
    expect(r.err).toContain('--marks: required: a CSV file of high-water marks (station, elevation, flow[, weight])');
    r = await gvf('calibrate', model, '--marks', marks, '--bounds', '2:3');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--bounds: bounds 2:3 must satisfy 0.05 ≤ lower < 1 < upper ≤ 20');
    r = await gvf('calibrate', model, '--marks', join(here, 'absent.csv'));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--marks: .*absent\.csv: no such file/);
    r = await gvf('calibrate', model, '--marks', marks, '--method', 'guess');
    expect(r.code).toBe(2);
  });
});

describe('gvf rating', () => {
  it('gvf rating --json: stages rise with discharge at both stations', async () => {
    const r = await gvf('rating', model, '--stations', '100,1300', '--discharges', '2:20:3', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.rows.map((row: { discharge: number }) => row.discharge)).toEqual([2, 5, 8, 11, 14, 17, 20]);
    for (let i = 1; i < json.rows.length; i++) {
      for (let j = 0; j < 2; j++) expect(json.rows[i].values[j].stage).toBeGreaterThan(json.rows[i - 1].values[j].stage);
    }
  });

  it('gvf rating --csv writes one row per discharge and station', async () => {
    const file = join(temp, 'rating.csv');
    const r = await gvf('rating', model, '--stations', '100', '--discharges', '4,8', '--csv', file);
    expect(r.code).toBe(0);
    const lines = readFileSync(file, 'utf8').trim().split('\n');
    expect(lines[0]).toBe('discharge_m3_s,station_m,stage_m,depth_m,velocity_m_s,regime');
    expect(lines).toHaveLength(3);
  });

  it('gvf rating with a bad range or a station off the channel: exit 2 with flag, value and accepted form', async () => {
    let r = await gvf('rating', model, '--stations', '100', '--discharges', '1:20');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--discharges: expected a list of discharges like 2,5,10 or a range from:to:step like 1:20:1 (all greater than 0), got "1:20"');
    r = await gvf('rating', model, '--stations', '5000', '--discharges', '5');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--stations: station 5000 lies outside the channel (stations 0 to 1400)');
    r = await gvf('rating', model, '--discharges', '5');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--stations: required');
  });
});

describe('gvf run --flows and --sensitivity', () => {
  it('gvf run --flows replaces the model flows, each stage holding downstream', async () => {
    const r = await gvf('run', model, '--flows', flows, '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.flows.map((f: { id: string; discharge: number }) => [f.id, f.discharge])).toEqual([
      ['low', 3],
      ['mid', 9],
      ['high', 16],
    ]);
    expect(json.flows.map((f: { stations: { wsel: number }[] }) => f.stations.at(-1)!.wsel)).toEqual([2.2, 2.5, 3]);
  });

  it('gvf run --flows with a bad flows file: exit 2 at file:line:column', async () => {
    const r = await gvf('run', model, '--flows', marks);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/marks\.csv:1:1: missing required column "discharge"/);
  });

  it('gvf run --sensitivity --json adds the envelope to the result, containing the base profile', async () => {
    const r = await gvf('run', model, '--sensitivity', 'n=±20%,Q=±10%', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.sensitivity.cases).toHaveLength(9);
    json.sensitivity.flows.forEach((f: { stations: { base: number; low: number; high: number }[] }, i: number) => {
      expect(f.stations).toHaveLength(json.flows[i].stations.length);
      for (const e of f.stations) expect(e.low <= e.base && e.base <= e.high).toBe(true);
    });
  });

  it('gvf run --sensitivity prints the envelope table and the changes of profile type', async () => {
    const r = await gvf('run', model, '--sensitivity', 'n=+-20%');
    expect(r.code).toBe(0);
    expect(r.out).toContain('Sensitivity (n ±20 %; 3 of 3 cases computed, every combination)');
    expect(r.out).toContain('n +20 %: the profile types of reach lower change from M1 to M2');
  });

  it('gvf run --sensitivity with a bad list: exit 2 naming the flag, the value and the accepted form', async () => {
    const r = await gvf('run', model, '--sensitivity', 'n=20');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--sensitivity: expected a list like n=±20%,Q=±10% (n: roughness, Q: discharge; ± may be written +-), got "n=20"');
  });
});
