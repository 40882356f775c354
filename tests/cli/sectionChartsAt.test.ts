/**
 * The model file's `sectionChartsAt` (stations of the report's cross-section charts) through the CLI entry
 * (main, in process): the report draws a chart at each listed station, `--sections` replaces the list, and on
 * surveyed reaches (numbered by the survey, so known only once it is read) a station off the channel is a
 * problem of the model file at its JSON path, exit 2. Models are the invented chute of
 * ../output/runFixtures.ts and the invented sample samples/survey-drain (said so in its description).
 */
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { chuteModelText } from '../output/runFixtures.js';

const temp = mkdtempSync(join(tmpdir(), 'gvf-section-charts-'));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

async function gvf(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  return { code, out, err };
}

const sectionCharts = (dir: string) =>
  readFileSync(join(dir, '.gvf-outputs'), 'utf8')
    .split('\n')
    .filter((l) => /^charts\/section-.*\.svg$/.test(l));

describe('gvf run MODEL --out DIR with sectionChartsAt', () => {
  const model = join(temp, 'chute.json');
  writeFileSync(model, chuteModelText({ sectionChartsAt: [120, 300] }));

  it('gvf run --out draws a cross-section at each station of sectionChartsAt (instead of one per reach)', async () => {
    const out = join(temp, 'from-key');
    const r = await gvf('run', model, '--out', out);
    expect(r.code, r.err).toBe(0);
    expect(sectionCharts(out)).toEqual(['charts/section-at-120.svg', 'charts/section-at-300.svg']);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).toContain('at station 120 m (station picked)');
  }, 60_000);

  it('gvf run --out --sections replaces the model’s sectionChartsAt', async () => {
    const out = join(temp, 'from-flag');
    const r = await gvf('run', model, '--out', out, '--sections', '200');
    expect(r.code, r.err).toBe(0);
    expect(sectionCharts(out)).toEqual(['charts/section-at-200.svg']);
  }, 60_000);

  it('gvf run with a sectionChartsAt station off the channel: exit 2 naming the file and the JSON path, nothing written', async () => {
    const bad = join(temp, 'bad.json');
    writeFileSync(bad, JSON.stringify(JSON.parse(chuteModelText({ sectionChartsAt: [120, 450] })), null, 2));
    const out = join(temp, 'bad-out');
    const r = await gvf('run', bad, '--out', out);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toEqual([
      `gvf: ${bad} is not a valid model (1 problem):`,
      '  sectionChartsAt[1]: station 450 m lies on no reach: a cross-section chart is drawn on the channel, between stations 0 and 400 m',
      '',
    ]);
    expect(existsSync(out)).toBe(false);
  });
});

describe('gvf run SURVEYED-MODEL with sectionChartsAt', () => {
  // the invented surveyed drain, copied with its survey files so the key can be added
  const copy = join(temp, 'survey-drain');
  cpSync(join(import.meta.dirname, '..', '..', 'samples', 'survey-drain'), copy, { recursive: true });
  const withStations = (name: string, stations: number[]) => {
    const json = JSON.parse(readFileSync(join(copy, 'model.json'), 'utf8')) as Record<string, unknown>;
    delete json.$schema;
    json.sectionChartsAt = stations;
    const file = join(copy, name);
    writeFileSync(file, JSON.stringify(json, null, 2));
    return file;
  };

  it('gvf run on surveyed reaches with a sectionChartsAt station beyond the survey: exit 2 naming the key and the survey’s stations', async () => {
    const file = withStations('off.json', [200, 450]);
    const r = await gvf('run', file);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toEqual([
      `gvf: ${file} is not a valid model (1 problem):`,
      '  sectionChartsAt[1]: station 450 m lies on no reach: a cross-section chart is drawn on the channel, between stations 0 and 400 m',
      '',
    ]);
  }, 60_000);

  it('gvf run --out on surveyed reaches draws the surveyed section nearest each station of sectionChartsAt', async () => {
    const out = join(copy, 'out');
    const r = await gvf('run', withStations('on.json', [200]), '--out', out);
    expect(r.code, r.err).toBe(0);
    expect(sectionCharts(out)).toEqual(['charts/section-at-200.svg']);
  }, 60_000);
});
