/**
 * `gvf section`, run as a user runs it (the built dist/cli/main.js in a child process): exit codes, the JSON
 * keys, null where a value does not exist, and one clear message naming the option for each bad input.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { packagesLoaded } from '../helpers/packages.js';
import { ensureBuilt, gvf, mainJs } from './built.js';

beforeAll(() => ensureBuilt(), 300_000);

const g = 9.80665; // standard gravity (CGPM 1901)

function json(args: string[]) {
  const run = gvf(['section', ...args, '--json']);
  expect(run.stderr).toBe('');
  expect(run.code).toBe(0);
  expect(run.stdout).not.toMatch(/NaN|Infinity/);
  return JSON.parse(run.stdout);
}

/** A bad input: exit code 2, nothing on stdout, one message on stderr that names `flag`, and no stack trace. */
function refused(args: string[], flag: string): string {
  const run = gvf(['section', ...args]);
  expect(run.code).toBe(2);
  expect(run.stdout).toBe('');
  expect(run.stderr).toContain(flag);
  expect(run.stderr).not.toMatch(/\n\s+at |\.js:\d+|Error:/);
  return run.stderr;
}

const rectangle = ['--shape', 'rectangular', '--bottom-width', '2', '--n', '0.013', '--slope', '0.001', '--discharge', '3'];

describe('gvf section', () => {
  it('gvf section --json gives normalDepth, criticalDepth, slopeClass and units', () => {
    const r = json(rectangle);
    expect(r.units).toBe('SI');
    expect(r.unitLabels).toMatchObject({ length: 'm', discharge: 'm³/s' });
    // closed form for a rectangle: yc = (q²/g)^(1/3) (Chow 1959, Open-Channel Hydraulics, §3-2; published)
    assertRelative(r.criticalDepth, Math.cbrt(1.5 ** 2 / g), 1e-8, 'critical depth');
    // the normal depth satisfies Manning's equation Q = (1/n)·A·R^(2/3)·√S (Manning 1891; Chow 1959 eq. 5-7)
    const y = r.normalDepth as number;
    const area = 2 * y;
    const radius = area / (2 + 2 * y);
    assertRelative((1 / 0.013) * area * radius ** (2 / 3) * Math.sqrt(0.001), 3, 1e-8, 'Manning discharge at normal depth');
    expect(r.slopeClass).toBe(y > r.criticalDepth ? 'mild' : 'steep');
    expect(r.atNormalDepth.velocity).toBeCloseTo(3 / area, 10);
  });

  it('gvf section reproduces Chow 1959 Example 10-1 normal and critical depth in US units', () => {
    // Chow 1959, Example 10-1: trapezoid b = 20 ft, z = 2, S0 = 0.0016, n = 0.025, Q = 400 ft³/s, α = 1.10;
    // yn ≈ 3.36 ft, yc ≈ 2.22 ft (from memory; the book rounds to 0.01 ft)
    const r = json([
      '--shape', 'trapezoidal', '--bottom-width', '20', '--side-slope', '2', '--n', '0.025',
      '--slope', '0.0016', '--discharge', '400', '--alpha', '1.10', '--units', 'US',
    ]);
    expect(r.units).toBe('US');
    expect(r.unitLabels.length).toBe('ft');
    assertInDelta(r.normalDepth, 3.36, 0.01, 'normal depth');
    assertInDelta(r.criticalDepth, 2.22, 0.01, 'critical depth');
    expect(r.slopeClass).toBe('mild');
  });

  it('gvf section gives null normal depth and its reason on horizontal and adverse beds', () => {
    for (const [slope, cls] of [['0', 'horizontal'], ['-0.002', 'adverse']] as const) {
      const r = json([...rectangle.slice(0, 6), '--slope', slope, '--discharge', '3']);
      expect(r.normalDepth).toBeNull();
      expect(r.atNormalDepth).toBeNull();
      expect(r.slopeClass).toBe(cls);
      expect(r.notes[0]).toContain('no normal depth');
    }
  });

  it('gvf section reports a part-full conduit above its capacity as flowing full, and two normal depths below it', () => {
    // full-pipe Manning discharge: A = πD²/4, R = D/4 (geometry); the part-full maximum is 1.0757·Qfull at
    // y/D = 0.9382, and Q = Qfull again at y/D = 0.8196 (computed from the segment geometry; ASCE MOP 37 chart, from memory)
    const qFull = (1 / 0.013) * (Math.PI / 4) * 0.25 ** (2 / 3) * Math.sqrt(0.01);
    const pipe = ['--shape', 'circular', '--diameter', '1', '--n', '0.013', '--slope', '0.01'];
    const full = json([...pipe, '--discharge', String(1.1 * qFull)]);
    expect(full.normalDepth).toBeNull();
    expect(full.fullFlow).toBe(true);
    const two = json([...pipe, '--discharge', String(1.05 * qFull)]);
    expect(two.normalDepths).toHaveLength(2);
    expect(two.normalDepths[0]).toBeGreaterThan(0.8196);
    expect(two.normalDepths[0]).toBeLessThan(0.9382);
    expect(two.normalDepths[1]).toBeGreaterThan(0.9382);
    expect(two.normalDepth).toBe(two.normalDepths[0]);
    // at the crown the top width is 0: hydraulic depth does not exist and is null, not Infinity
    const crown = json([...pipe, '--discharge', '1', '--depth', '1']);
    expect(crown.atDepth.hydraulicDepth).toBeNull();
    expect(crown.atDepth.full).toBe(true);
  });

  it('gvf section --depth reports every element at that depth (rectangle: exact geometry)', () => {
    const r = json([...rectangle, '--depth', '0.8']);
    expect(r.atDepth).toMatchObject({ depth: 0.8, area: 1.6, wettedPerimeter: 3.6, topWidth: 2, regime: 'subcritical' });
    assertRelative(r.atDepth.hydraulicRadius, 1.6 / 3.6, 1e-12);
    // E = y + Q²/(2gA²) and M = Q²/(gA) + b·y²/2 (Chow 1959 §3-1 and §3-4; definitions)
    assertRelative(r.atDepth.specificEnergy, 0.8 + 9 / (2 * g * 1.6 ** 2), 1e-12);
    assertRelative(r.atDepth.specificForce, 9 / (g * 1.6) + (2 * 0.8 ** 2) / 2, 1e-12);
  });

  it('gvf section without --json prints a table that states its units', () => {
    const run = gvf(['section', ...rectangle, '--depth', '0.8']);
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/^units\s+SI \(lengths in m, discharge in m³\/s\)/);
    expect(run.stdout).toMatch(/normal depth\s+\d+\.\d{3} m\n/);
    expect(run.stdout).toMatch(/critical depth\s+\d+\.\d{3} m\n/);
    expect(run.stdout).toContain('flow area A           m²');
    expect(run.stdout).toContain('caution: Results are a screening aid');
    expect(run.stdout).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('gvf section --chezy and --ks select the friction law', () => {
    const chezy = json([...rectangle.slice(0, 4), '--chezy', '60', '--slope', '0.001', '--discharge', '3']);
    expect(chezy.friction).toBe('chezy');
    // Chézy: Q = C·A·√(R·S) at normal depth (Chézy 1775; Chow 1959 eq. 5-1)
    const y = chezy.normalDepth as number;
    assertRelative(60 * 2 * y * Math.sqrt(((2 * y) / (2 + 2 * y)) * 0.001), 3, 1e-8);
    const ks = json([...rectangle.slice(0, 4), '--ks', '0.001', '--friction', 'darcy-weisbach', '--slope', '0.001', '--discharge', '3']);
    expect(ks.friction).toBe('darcy-weisbach');
    expect(ks.normalDepth).toBeGreaterThan(0);
  });

  it('gvf section refuses bad input with exit code 2, naming the option and the accepted range', () => {
    expect(refused([...rectangle.slice(0, 8), '--discharge', '-3'], '--discharge')).toContain('greater than 0, got -3');
    const n = refused(['--shape', 'rectangular', '--bottom-width', '2', '--n', '0.5', '--slope', '0.001', '--discharge', '3'], '--n');
    expect(n).toContain('between 0.005 and 0.2');
    expect(n).toContain('--force');
    expect(
      refused(['--shape', 'trapezoidal', '--bottom-width', '2', '--side-slope', '-1', '--n', '0.013', '--slope', '0.001', '--discharge', '3'], '--side-slope'),
    ).toContain('at least 0, got -1');
    expect(
      refused(['--shape', 'circular', '--diameter', '0.6', '--n', '0.013', '--slope', '0.01', '--discharge', '0.2', '--depth', '0.7'], '--depth'),
    ).toContain("above the conduit's crown at 0.6 m");
    expect(refused(['--shape', 'oval', ...rectangle.slice(2)], '--shape')).toContain('rectangular, trapezoidal, triangular, circular');
    expect(refused([...rectangle, '--width', '3'], '--width')).toContain('unknown option');
    expect(refused([...rectangle.slice(0, 8)], '--discharge')).toContain('required');
    expect(refused([...rectangle.slice(0, 8), '--discharge', 'lots'], '--discharge')).toContain('expected a number, got "lots"');
    expect(refused([...rectangle, '--units', 'metric'], '--units')).toContain('"SI", "US"');
  });

  it('gvf section --force accepts an unusual roughness', () => {
    const run = gvf(['section', '--shape', 'rectangular', '--bottom-width', '2', '--n', '0.3', '--slope', '0.001', '--discharge', '3', '--force', '--json']);
    expect(run.code).toBe(0);
    expect(JSON.parse(run.stdout).normalDepth).toBeGreaterThan(0);
  });

  it('gvf --help and gvf section --help exit 0', () => {
    expect(gvf(['--help']).code).toBe(0);
    const help = gvf(['section', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('--bottom-width');
  });

  it('gvf section loads no package but commander (no schema library, no charting stack: a fast cold start)', () => {
    const run = packagesLoaded([mainJs, 'section', ...rectangle, '--json']);
    expect(run.status).toBe(0);
    expect(run.packages).toEqual(['commander']);
  });
});
