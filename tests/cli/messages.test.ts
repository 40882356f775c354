/**
 * The exact words of every message the command line prints of its own (src/input/model/messages.ts holds them;
 * src/cli writes none inline): the report flags' problems (--sections, --energy-at, --energy-flow), the required
 * flags and data files of the analysis commands, the lines saying what was written where, the notes, and the
 * heading of each kind of error. Run in process through main(argv, streams). The models are invented
 * (tests/output/runFixtures.ts, tests/analysis/fixtures/README.md).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import * as msg from '../../src/input/model/messages.js';
import { chuteModelText } from '../output/runFixtures.js';

const temp = mkdtempSync(join(tmpdir(), 'gvf-cli-messages-'));
afterAll(() => rmSync(temp, { recursive: true, force: true }));

async function gvf(...args: string[]): Promise<{ code: number; out: string[]; err: string[] }> {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(args, { out: (t) => void out.push(t), err: (t) => void err.push(t) });
  return { code, out, err };
}

// the invented chute: stations 0 to 400 m, flows "2-year" and "25-year"
const chute = join(temp, 'chute.json');
writeFileSync(chute, chuteModelText());
const analysis = join(import.meta.dirname, '..', 'analysis', 'fixtures');
const drain = join(analysis, 'drain.json');

describe('gvf run report flags: --sections, --energy-at, --energy-flow', () => {
  it('gvf run --sections and --energy-at without --out: each flag named, with the same words', async () => {
    const r = await gvf('run', chute, '--sections', '120', '--energy-at', '200', '--energy-flow', '2-year');
    expect(r.code).toBe(2);
    expect(r.err).toEqual([
      [
        'gvf: bad input (3 problems):',
        '  --sections: draws a chart of the report: use it with --out DIR',
        '  --energy-at: draws a chart of the report: use it with --out DIR',
        '  --energy-flow: draws a chart of the report: use it with --out DIR',
      ].join('\n'),
    ]);
    expect(r.out).toEqual([]);
  });

  it('gvf run --out with --sections and --energy-at off the channel and an unknown --energy-flow: every problem, nothing written', async () => {
    const out = join(temp, 'off');
    const r = await gvf('run', chute, '--out', out, '--sections', '120,9999', '--energy-at', '-5', '--energy-flow', '100-year');
    expect(r.code).toBe(2);
    expect(r.err).toEqual([
      [
        'gvf: bad input (3 problems):',
        '  --sections: station 9999 is outside the channel (stations 0 to 400)',
        '  --energy-at: station -5 is outside the channel (stations 0 to 400)',
        '  --energy-flow: no flow named "100-year"; the flows are 2-year, 25-year',
      ].join('\n'),
    ]);
    expect(r.out).toEqual([]);
  });

  it('the catalogue gives those words: reportFlagNeedsOut, flagStationOutside, noFlowNamed', () => {
    expect(msg.reportFlagNeedsOut()).toBe('draws a chart of the report: use it with --out DIR');
    expect(msg.flagStationOutside(12.5, 0, 1400)).toBe('station 12.5 is outside the channel (stations 0 to 1400)');
    expect(msg.noFlowNamed('q', ['a', 'b'])).toBe('no flow named "q"; the flows are a, b');
  });
});

describe('gvf run, calibrate and rating: what was written where', () => {
  it('gvf run --out --sensitivity --csv says where the station table, the report and the sensitivity files went', async () => {
    const out = join(temp, 'report');
    const csv = join(temp, 'stations.csv');
    const r = await gvf('run', chute, '--out', out, '--csv', csv, '--sensitivity', 'n=±20%');
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(r.out).toContain(`station table written to ${csv}`);
    expect(r.out).toContain(`report written to ${join(out, 'report.html')} (with result.json, stations.csv and 5 charts in ${out})`);
    expect(r.out[r.out.length - 1]).toBe(`sensitivity.csv and charts/sensitivity-profile (.vl.json, .svg, .png) written to ${out}`);
  }, 60_000);

  it('gvf run --json --out prints the JSON alone on stdout (no line about the files written)', async () => {
    const out = join(temp, 'json');
    const r = await gvf('run', chute, '--json', '--out', out, '--sensitivity', 'n=±20%');
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(r.out).toHaveLength(1);
    expect(JSON.parse(r.out[0]!).sensitivity.cases).toHaveLength(3);
    expect(r.err).toEqual([]);
  }, 60_000);

  it('gvf rating --csv --out says where the table and the rating-curve files went', async () => {
    const out = join(temp, 'rating');
    const csv = join(temp, 'rating.csv');
    const r = await gvf('rating', drain, '--stations', '100', '--discharges', '4,8', '--csv', csv, '--out', out);
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(r.out.slice(-2)).toEqual([`rating table written to ${csv}`, `rating.json, rating.csv and charts/rating-curve (.vl.json, .svg, .png) written to ${out}`]);
  }, 60_000);

  it('gvf run --flows notes the flows that replace the model\'s', async () => {
    const r = await gvf('run', drain, '--flows', join(analysis, 'flows.csv'));
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(r.out).toContain(`note: 3 flows from ${join(analysis, 'flows.csv')} replace the model's flows`);
  });

  it('the catalogue gives the calibration lines and the singular forms', () => {
    expect(msg.markTableWritten('m.csv')).toBe('mark table written to m.csv');
    expect(msg.calibrationWritten('out')).toBe('calibration.json, marks.csv and charts/calibration-profile (.vl.json, .svg, .png) written to out');
    expect(msg.reportWritten('out/report.html', 1, 'out')).toBe('report written to out/report.html (with result.json, stations.csv and 1 chart in out)');
    expect(msg.flowsReplaced(1, 'f.csv')).toBe("1 flow from f.csv replace the model's flows");
    expect(msg.progressFlow('100-year')).toBe('flow 100-year');
    expect(msg.progressCase('n+20%')).toBe('case n+20%');
    expect(msg.progressFitStep(3, 0.000123)).toBe('fit step 3, Σw·r²/2 = 1.23e-4');
  });
});

describe('gvf calibrate and rating: required flags and the data files they name', () => {
  it('gvf calibrate without --marks, and with a --marks file that is missing, a folder or unnamed', async () => {
    expect((await gvf('calibrate', drain)).err).toEqual(['gvf: bad input (1 problem):\n  --marks: required: a CSV file of high-water marks (station, elevation, flow[, weight])']);
    const absent = join(temp, 'absent.csv');
    expect((await gvf('calibrate', drain, '--marks', absent)).err).toEqual([`gvf: bad input (1 problem):\n  --marks: ${absent}: no such file`]);
    expect((await gvf('calibrate', drain, '--marks', temp)).err).toEqual([`gvf: bad input (1 problem):\n  --marks: ${temp}: a folder, not a file`]);
    expect((await gvf('calibrate', drain, '--marks', ' ')).err).toEqual(['gvf: bad input (1 problem):\n  --marks: needs a file name']);
  });

  it('gvf rating without --stations and --discharges names both', async () => {
    const r = await gvf('rating', drain);
    expect(r.code).toBe(2);
    expect(r.err).toEqual([
      ['gvf: bad input (2 problems):', '  --stations: required: a list of stations like 120,480', '  --discharges: required: a list like 2,5,10 or a range from:to:step like 1:20:1'].join('\n'),
    ]);
  });

  it('the catalogue gives an unreadable file its reason', () => {
    expect(msg.flagFileUnreadable('m.csv', 'EACCES')).toBe('m.csv: cannot be read (EACCES)');
  });
});

describe('error headings and the hint after a refused flag', () => {
  it('the catalogue gives each heading: invalid model, bad input, cannot be computed, computation failed, unexpected error', () => {
    expect(msg.invalidModelHeading('m.json', 1)).toBe('gvf: m.json is not a valid model (1 problem):');
    expect(msg.badInputHeading(2)).toBe('gvf: bad input (2 problems):');
    expect(msg.cannotBeComputed('why')).toBe('gvf: cannot be computed: why');
    expect(msg.computationFailed('why')).toBe('gvf: the computation failed: why');
    expect(msg.unexpectedError('why')).toBe('gvf: unexpected error: why (set GVF_DEBUG=1 for details)');
  });

  it('gvf run with an unknown option: commander\'s message, then the hint', async () => {
    const r = await gvf('run', chute, '--sectons', '120');
    expect(r.code).toBe(2);
    expect(r.err[r.err.length - 1]).toBe('(run gvf --help, or gvf <command> --help, for the options)');
  });
});
