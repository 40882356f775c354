/**
 * `gvf run MODEL.json` and `gvf profile`, run as a user runs them (the built CLI in a child process):
 * the JSON structure of the profile-engine issue, CSV output, method comparison, and bad input refused
 * with exit code 2 and nothing written. The swale model is the core example (an invented scenario).
 */
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { assertInDelta } from '../helpers/assert.js';
import { ensureBuilt, gvf, root } from './built.js';

beforeAll(() => ensureBuilt(), 300_000);

const swale = join(root, 'tests', 'cli', 'fixtures', 'swale.json');
const scratch = () => mkdtempSync(join(tmpdir(), 'gvf-cli-'));

function ok(args: string[]) {
  const run = gvf(args);
  expect(run.stderr).toBe('');
  expect(run.code).toBe(0);
  expect(run.stdout).not.toMatch(/NaN|Infinity|undefined/);
  return run;
}

describe('gvf run MODEL.json', () => {
  it('gvf run --json gives one entry per flow with stations, reaches, jumps and warnings', () => {
    const result = JSON.parse(ok(['run', swale, '--json']).stdout);
    expect(result.units).toBe('SI');
    expect(result.flows.map((f: { id: string }) => f.id)).toEqual(['10-year', '100-year']);
    for (const flow of result.flows) {
      expect(Object.keys(flow)).toEqual(expect.arrayContaining(['id', 'discharge', 'stations', 'reaches', 'jumps', 'warnings']));
      expect(Object.keys(flow.stations[0])).toEqual(
        expect.arrayContaining(['station', 'bedElevation', 'depth', 'wsel', 'energyElevation', 'velocity', 'froude', 'regime']),
      );
      expect(Object.keys(flow.reaches[0])).toEqual(
        expect.arrayContaining(['id', 'from', 'to', 'slopeClass', 'normalDepth', 'criticalDepth', 'profiles']),
      );
      // beds follow from the slopes and the downstream bed elevation: 48.0 + 0.001·400 + 0.015·90 = 49.75 (arithmetic)
      assertInDelta(flow.stations[0].bedElevation, 49.75, 1e-9, 'upstream bed');
      const last = flow.stations[flow.stations.length - 1];
      assertInDelta(last.bedElevation, 48.0, 1e-9, 'downstream bed');
      // the downstream stage control holds the water surface there
      assertInDelta(last.wsel, 49.3, 1e-9, 'downstream stage');
      expect(flow.reaches.map((r: { slopeClass: string }) => r.slopeClass)).toEqual(['steep', 'mild']);
    }
    // steep into mild with a tailwater: a jump (its keys as the issue lists them)
    const jump = result.flows[0].jumps[0];
    expect(Object.keys(jump)).toEqual(
      expect.arrayContaining(['station', 'upstreamDepth', 'downstreamDepth', 'froude', 'type', 'length', 'energyLoss']),
    );
    expect(jump.froude).toBeGreaterThan(1);
    expect(jump.downstreamDepth).toBeGreaterThan(jump.upstreamDepth);
    expect(result.cautions[0]).toContain('licensed engineer');
  });

  it('gvf run prints a readable summary and station table with units', () => {
    const text = ok(['run', swale]).stdout;
    expect(text).toContain('SI units (lengths in m, discharge in m³/s)');
    expect(text).toContain('station (m)');
    expect(text).toContain('hydraulic jumps:');
    expect(text).toContain('caution:');
  });

  it('gvf run --csv writes the station table with unit-labelled headers, the same bytes each run', () => {
    const dir = scratch();
    const file = join(dir, 'stations.csv');
    ok(['run', swale, '--csv', file]);
    const first = readFileSync(file, 'utf8');
    expect(first.split('\n')[0]).toMatch(/^flow,discharge_m3_s,station_m,reach,bed_elevation_m,depth_m,wsel_m,/);
    ok(['run', swale, '--csv', file]);
    expect(readFileSync(file, 'utf8')).toBe(first);
  });

  it('gvf run --compare reports each method against the ODE reference, within the accuracy goal', () => {
    const result = JSON.parse(ok(['run', swale, '--compare', '--json']).stdout);
    expect(result.comparison.flows).toHaveLength(2);
    for (const flow of result.comparison.flows) {
      expect(flow.methods.map((m: { method: string }) => m.method)).toEqual(['standard-step', 'direct-step', 'ode']);
      // the accuracy goal of the profile-engine issue: 1 mm in SI, or 0.1 % of the depth where larger
      for (const m of flow.methods) {
        expect(m.withinGoal).toBe(true);
        expect(m.largestDifference).toBeLessThanOrEqual(m.accuracyGoal);
        expect(m.accuracyGoal).toBeGreaterThanOrEqual(0.001);
      }
      expect(flow.withinGoal).toBe(true);
    }
    const text = ok(['run', swale, '--compare']).stdout;
    expect(text).toContain('method comparison against the ODE method at a tight tolerance:');
    expect(text).toContain('largest difference (m)');
  });

  it('gvf run refuses an invalid model with exit code 2, every problem with its JSON path, and writes nothing', () => {
    const dir = scratch();
    const model = JSON.parse(readFileSync(swale, 'utf8'));
    model.reaches[1].slope = '0.01%';
    model.reaches[0].section = 'lind';
    model.colour = 'blue';
    const file = join(dir, 'bad.json');
    writeFileSync(file, JSON.stringify(model));
    const csv = join(dir, 'out.csv');
    const run = gvf(['run', file, '--csv', csv]);
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr.split('\n')).toEqual([
      `gvf: ${file} is not a valid model (3 problems):`,
      '  reaches[0].section: no section named "lind" (did you mean "lined"?); the sections defined are "lined"',
      '  reaches[1].slope: expected a number, got "0.01%"',
      expect.stringMatching(/^ {2}colour: unknown key; the keys allowed here are /),
      '',
    ]);
    expect(existsSync(csv)).toBe(false);
  });

  it('gvf run reports a geometry problem of a section at its JSON path in the model', () => {
    const dir = scratch();
    const file = join(dir, 'wall.json');
    writeFileSync(
      file,
      JSON.stringify({
        units: 'SI',
        sections: { p: { shape: 'points', points: [[0, 2], [1, 0], [1, 0.5], [1, -1], [3, 2]], n: 0.03 } },
        reaches: [{ id: 'r', section: 'p', length: 10, slope: 0.001 }],
        flows: [{ id: 'q', discharge: 1 }],
      }),
    );
    const run = gvf(['run', file]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(`gvf: ${file} is not a valid model (1 problem):`);
    expect(run.stderr).toContain('  sections.p.points[3]: ');
  });

  it('gvf run names a JSON syntax error by file, line and column, and a missing file', () => {
    const dir = scratch();
    const file = join(dir, 'cut.json');
    writeFileSync(file, readFileSync(swale, 'utf8').replace('"units": "SI",', '"units": "SI"'));
    const run = gvf(['run', file]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(new RegExp(`${file.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:5:3: not valid JSON: expected "," or "}"`));
    const missing = gvf(['run', join(dir, 'none.json')]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('none.json: no such file');
  });
});

describe('gvf profile', () => {
  const reach = ['--shape', 'rectangular', '--bottom-width', '3', '--n', '0.015', '--slope', '0.001', '--discharge', '5', '--length', '3000'];

  it('gvf profile gives an M1 backwater that starts at the control depth and tends to normal depth upstream', () => {
    const result = JSON.parse(ok(['profile', ...reach, '--downstream', '2', '--step', '100', '--json']).stdout);
    const flow = result.flows[0];
    const yn = flow.reaches[0].normalDepth as number;
    expect(flow.reaches[0].slopeClass).toBe('mild');
    expect(flow.reaches[0].profiles.map((p: { type: string }) => p.type)).toContain('M1');
    assertInDelta(flow.stations[flow.stations.length - 1].depth, 2, 1e-9, 'control depth');
    // an M1 curve falls monotonically upstream towards normal depth (Chow 1959 §9-3; theory)
    const depths = flow.stations.map((s: { depth: number }) => s.depth);
    for (let i = 1; i < depths.length; i++) expect(depths[i]).toBeGreaterThanOrEqual(depths[i - 1]);
    expect(depths[0]).toBeGreaterThan(yn);
    expect(depths[0] - yn).toBeLessThan(2 - yn);
    // output every 100 m over 3000 m, plus the ends
    expect(flow.stations.length).toBeGreaterThanOrEqual(31);
  });

  it('gvf profile explains a control that cannot hold and one the regime does not need', () => {
    // below critical depth at the end of a mild reach the flow passes through critical depth (Chow 1959 §9-3; theory)
    const flow = JSON.parse(ok(['profile', ...reach, '--downstream', '0.3', '--upstream', '2', '--json']).stdout).flows[0];
    expect(flow.warnings.join(' ')).toContain('cannot hold');
    expect(flow.notes.join(' ')).toContain('ignored');
    assertInDelta(flow.stations[flow.stations.length - 1].depth, flow.reaches[0].criticalDepth, 1e-9, 'critical depth at the end');
    // over 3000 m the M2 drawdown rises to normal depth upstream (uniform flow there)
    expect(flow.reaches[0].profiles.map((p: { type: string }) => p.type).at(-1)).toBe('M2');
  });

  it('gvf profile refuses a bad control or length, naming the option', () => {
    const bad = gvf(['profile', ...reach.slice(0, -2), '--length', '-5', '--downstream', 'weir']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--length: expected a number greater than 0, got -5');
    expect(bad.stderr).toContain('--downstream: expected "normal", "critical" or a depth greater than 0, got "weir"');
    const method = gvf(['profile', ...reach, '--method', 'euler']);
    expect(method.code).toBe(2);
    expect(method.stderr).toContain('--method');
  });
});
