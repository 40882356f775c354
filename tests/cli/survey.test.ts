/**
 * `gvf run` on surveyed models as a user runs it (the built CLI): the invented sample runs; bad survey files
 * exit with code 2, name file:line:column and write nothing; --allow-outside lets a trusted model read a file
 * outside its folder; --no-interpolate turns interpolation off.
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, gvf, root } from './built.js';

beforeAll(() => ensureBuilt(), 300_000);

const sample = join(root, 'samples', 'survey-drain', 'model.json');

function folder(stations: string, model: Record<string, unknown> = {}) {
  const dir = mkdtempSync(join(tmpdir(), 'gvf-cli-survey-'));
  mkdirSync(join(dir, 'survey'));
  writeFileSync(join(dir, 'survey', 'stations.csv'), stations);
  writeFileSync(
    join(dir, 'model.json'),
    JSON.stringify({
      units: 'SI',
      sections: { ditch: { shape: 'trapezoidal', bottomWidth: 1.5, sideSlope: 2, n: 0.03 } },
      reaches: [{ id: 'd', survey: { stations: 'survey/stations.csv', stationing: 'increasing-downstream' } }],
      flows: [{ id: 'q', discharge: 2 }],
      boundaries: { downstream: { type: 'depth', depth: 1 } },
      ...model,
    }),
  );
  return dir;
}

describe('gvf run with surveyed reaches', () => {
  it('gvf run samples/survey-drain/model.json: freeboard rows, interpolated stations and the survey\'s own (upstream-increasing) numbers', () => {
    const run = gvf(['run', sample, '--json']);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.stationing.direction).toBe('increasing-upstream');
    for (const flow of result.flows) {
      expect(flow.stations[0].station).toBe(400);
      expect(flow.stations.at(-1).station).toBe(0);
      expect(flow.stations.some((s: { interpolated?: boolean }) => s.interpolated)).toBe(true);
      expect(flow.freeboard.length).toBe(flow.stations.length);
      expect(flow.freeboard.some((r: { pass: boolean }) => !r.pass)).toBe(true);
      expect(flow.jumps).toHaveLength(1);
    }
  });

  it('gvf run --csv adds bank and freeboard columns to the station table', () => {
    const out = join(mkdtempSync(join(tmpdir(), 'gvf-cli-survey-')), 'stations.csv');
    const run = gvf(['run', sample, '--csv', out]);
    expect(run.code).toBe(0);
    const header = readFileSync(out, 'utf8').split('\n')[0]!;
    expect(header).toContain('left_bank_m,right_bank_m,freeboard_left_m,freeboard_right_m,freeboard_required_m,freeboard_pass,overtopped');
    expect(header.endsWith(',interpolated')).toBe(true);
  });

  it('gvf run: a bad stations file exits 2, names file:line:column and writes nothing', () => {
    const dir = folder('station,bed,section\n0,10.2,ditch\n100,abc,ditch\n');
    const out = join(dir, 'out');
    const csv = join(dir, 'table.csv');
    const run = gvf(['run', join(dir, 'model.json'), '--out', out, '--csv', csv]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(`${join(dir, 'survey', 'stations.csv')}:3:2: bed elevation: expected a number, got "abc"`);
    expect(run.stderr).not.toMatch(/at .*\.js:\d+/); // no stack trace
    expect(existsSync(out)).toBe(false);
    expect(existsSync(csv)).toBe(false);
  });

  it('gvf run: a survey file outside the model folder is refused (exit 2) unless --allow-outside', () => {
    const outside = mkdtempSync(join(tmpdir(), 'gvf-cli-outside-'));
    writeFileSync(join(outside, 'st.csv'), 'station,bed,section\n0,10.2,ditch\n100,10,ditch\n');
    const dir = folder('unused', { reaches: [{ id: 'd', survey: { stations: join('..', outside.split('/').pop()!, 'st.csv'), stationing: 'increasing-downstream' } }] });
    const refused = gvf(['run', join(dir, 'model.json')]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('reaches[0].survey.stations');
    expect(refused.stderr).toContain('--allow-outside');
    const allowed = gvf(['run', join(dir, 'model.json'), '--allow-outside', '--json']);
    expect(allowed.stderr).toBe('');
    expect(allowed.code).toBe(0);
  });

  it('gvf run --no-interpolate: no interpolated stations, and a note says the accuracy goal is not checked', () => {
    const run = gvf(['run', sample, '--json', '--no-interpolate']);
    expect(run.code).toBe(0);
    const result = JSON.parse(run.stdout);
    for (const flow of result.flows) {
      expect(flow.stations.some((s: { interpolated?: boolean }) => s.interpolated)).toBe(false);
      expect(flow.notes.some((n: string) => n.includes('--no-interpolate'))).toBe(true);
    }
  });
});
