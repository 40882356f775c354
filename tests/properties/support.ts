/**
 * Shared pieces of the property tests: the run settings (seed and number of runs, from GVF_SEED and GVF_RUNS),
 * random valid channels in both unit systems, and independent checks of a FlowResult.
 *
 * Every random channel is invented by the generators below; the checks recompute what they check from
 * hydraulics/ (flowState, specificForce) rather than trusting the engine's own numbers.
 *
 *   npx vitest run tests/properties                   the CI size: a fixed seed, a few thousand cases
 *   npm run test:properties:long                      ten times as many cases, a fresh seed (printed)
 *   GVF_SEED=123 GVF_RUNS=5 npm run test:properties:long   replay or resize a run (GVF_RUNS: a factor on the CI runs)
 * In a long run without GVF_SEED each test file draws its own seed and prints it; a failure also shows it.
 */
import fc from 'fast-check';
import { SI, US, type Units } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { points } from '../../src/geometry/shapes/points.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { triangular } from '../../src/geometry/shapes/triangular.js';
import type { Section } from '../../src/geometry/section.js';
import { criticalDepth } from '../../src/hydraulics/criticalDepth.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../src/hydraulics/normalDepth.js';
import type { Boundary, ProfileInput, ProfileMethod } from '../../src/profile/types.js';
import type { FlowResult } from '../../src/results/types.js';

/* ---------- run settings ---------- */

const long = process.env.GVF_LONG === '1';
const seedText = process.env.GVF_SEED;
/** The seed of every property in this run: GVF_SEED, else fixed for CI (so CI is repeatable), else fresh in a long run. */
export const seed = seedText !== undefined && seedText !== '' ? Number(seedText) : long ? (Date.now() ^ (Math.random() * 0x7fffffff)) | 0 : 20261201;
if (!Number.isInteger(seed)) throw new Error(`GVF_SEED must be an integer, got ${seedText}`);
const runsText = process.env.GVF_RUNS;
const runFactor = runsText !== undefined && runsText !== '' ? Number(runsText) : long ? 10 : 1;
if (!(runFactor > 0)) throw new Error(`GVF_RUNS must be a number > 0 (a factor on each property's CI run count), got ${runsText}`);

let announced = false;
/** fast-check parameters for a property with `ciRuns` runs in CI; prints the seed once so a failure can be replayed. */
export function settings(ciRuns: number): fc.Parameters<unknown> {
  if (!announced) {
    announced = true;
    console.log(`property tests: seed ${seed}, runs ×${runFactor} (replay: GVF_SEED=${seed} GVF_RUNS=${runFactor} npm run test:properties:long)`);
  }
  return { seed, numRuns: Math.max(1, Math.round(ciRuns * runFactor)), endOnFailure: true };
}

/* ---------- random sections (all five shapes) ---------- */

const units: fc.Arbitrary<Units> = fc.constantFrom(SI, US);
const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** Manning's n of lined and earthen channels (the CLI's usual range is 0.005–0.2) */
const manningN = dbl(0.01, 0.06);

export interface SectionCase {
  readonly hs: HydraulicSection;
  readonly label: string;
}

function natural(n: number, u: Units): fc.Arbitrary<Section> {
  // a main channel between banks, floodplains rising to the end points, and one to three roughness zones
  return fc
    .record({
      bed: dbl(2, 30),
      depth: dbl(0.8, 4),
      bank: dbl(0.5, 4),
      plain: dbl(3, 80),
      rise: dbl(0.05, 1),
      wall: dbl(1, 5),
      wobble: dbl(0, 0.4),
      zones: fc.integer({ min: 1, max: 3 }),
      rougher: dbl(1, 3),
      count: fc.integer({ min: 8, max: 40 }),
    })
    .map((c) => {
      const k = u.system === 'US' ? 3 : 1; // keep the same shapes at a sensible size in feet
      const x1 = c.plain * k;
      const x2 = x1 + c.bank * k;
      const x3 = x2 + c.bed * k;
      const x4 = x3 + c.bank * k;
      const x5 = x4 + c.plain * k;
      const top = (c.depth + c.rise) * k;
      const pts: [number, number][] = [[0, top + c.wall * k]];
      // ground points across the section (the bed wobbles a little), left to right
      for (let i = 0; i <= c.count; i++) {
        const x = i === c.count ? x5 : (x5 * i) / c.count;
        let z: number;
        if (x <= x1) z = top - (c.rise * k * x) / x1;
        else if (x < x2) z = c.depth * k * (1 - (x - x1) / (x2 - x1));
        else if (x <= x3) z = c.wobble * k * Math.abs(Math.sin(i * 1.7));
        else if (x < x4) z = (c.depth * k * (x - x3)) / (x4 - x3);
        else z = c.depth * k + (c.rise * k * (x - x4)) / (x5 - x4);
        pts.push([x, z]);
      }
      pts.push([x5, top + c.wall * k]);
      const roughness: [number, number][] =
        c.zones === 1 ? [[0, n]] : c.zones === 2 ? [[0, n * c.rougher], [x2, n]] : [[0, n * c.rougher], [x1, n], [x4, n * c.rougher * 0.8]];
      return points({ points: pts, roughness });
    });
}

/** A random valid section of any of the five shapes, Manning's n, in either unit system. */
export const sections: fc.Arbitrary<SectionCase> = fc.tuple(units, manningN).chain(([u, n]) => {
  const k = u.system === 'US' ? 3.28 : 1;
  const shape = fc.oneof(
    dbl(0.5, 30).map((b) => ['rectangular', rectangular({ bottomWidth: b * k, roughness: n })] as const),
    fc
      .record({ b: dbl(0.5, 30), zl: dbl(0, 4), zr: dbl(0, 4) })
      .map((t) => ['trapezoidal', trapezoidal({ bottomWidth: t.b * k, sideSlopeLeft: t.zl, sideSlopeRight: t.zr, roughness: n })] as const),
    fc
      .record({ zl: dbl(0.3, 4), zr: dbl(0.3, 4) })
      .map((t) => ['triangular', triangular({ sideSlopeLeft: t.zl, sideSlopeRight: t.zr, roughness: n })] as const),
    dbl(0.3, 5).map((d) => ['circular', circular({ diameter: d * k, roughness: n })] as const),
    natural(n, u).map((s) => ['points', s] as const),
  );
  return shape.map(([label, section]) => {
    const d = section.describe();
    // the label names the section fully (points sections by their ground points), so a failure can be rebuilt
    const what = label === 'points' ? JSON.stringify({ points: (section as { points?: unknown }).points, zones: (section as { zones?: unknown }).zones }) : JSON.stringify(d);
    return { hs: hydraulicSection(section, 'manning', u), label: `${label} ${u.system} ${what}` };
  });
});

/* ---------- random channels ---------- */

export interface ChannelCase {
  readonly input: ProfileInput;
  readonly label: string;
}

/** The depth the section can reasonably be filled to (closed conduits and surveyed sections have a top). */
export function usableDepth(hs: HydraulicSection): number {
  return Number.isFinite(hs.section.maxDepth) ? hs.section.maxDepth : Infinity;
}

/**
 * A discharge that keeps critical depth (and normal depth, where there is one) within 70 % of a section's top,
 * from a fraction of the discharge at that depth; null when none fits (the case is then skipped).
 */
export function fittingDischarge(hs: HydraulicSection, fraction: number, slope: number): number | null {
  const top = usableDepth(hs);
  const reference = Number.isFinite(top) ? 0.5 * top : hs.section.lengthScale;
  const area = hs.section.elements(reference).area;
  const q = fraction * area * Math.sqrt(hs.units.g * reference);
  try {
    const yc = criticalDepth(hs, q);
    const yn = slope > 0 ? normalDepth(hs, q, slope) : null;
    if (slope > 0 && yn === null) return null;
    if (Number.isFinite(top) && (yc > 0.7 * top || (yn !== null && yn > 0.7 * top))) return null;
    return q;
  } catch {
    return null;
  }
}

const slopes = fc.oneof(
  { weight: 6, arbitrary: dbl(1e-4, 0.003) }, // mild, usually
  { weight: 3, arbitrary: dbl(0.005, 0.05) }, // steep, usually
  { weight: 1, arbitrary: fc.constant(0) }, // horizontal
  { weight: 1, arbitrary: dbl(-0.003, -1e-4) }, // adverse
);

/** A boundary from a few kinds, given the reach's critical depth and top (null: none given). */
function boundary(kind: number, factor: number, yc: number, top: number, bed: number): Boundary | undefined {
  switch (kind) {
    case 0:
      return undefined;
    case 1:
      return { type: 'normal' };
    case 2:
      return { type: 'critical' };
    case 3:
      return { type: 'depth', depth: Math.min(yc * factor, 0.9 * top) };
    default:
      return { type: 'stage', elevation: bed + Math.min(yc * factor, 0.9 * top) };
  }
}

/**
 * A random channel of one or two prismatic reaches (the same section, so a break changes only the slope: mild
 * into steep, steep into mild with a jump, and so on), random boundaries at both ends, in either unit system.
 */
export function channels(methods: readonly ProfileMethod[]): fc.Arbitrary<ChannelCase> {
  return fc
    .record({
      section: sections,
      slope1: slopes,
      slope2: fc.option(slopes, { nil: undefined, freq: 2 }),
      fraction: dbl(0.05, 1.5),
      lengthFactor: dbl(5, 400),
      split: dbl(0.2, 0.8),
      down: fc.integer({ min: 0, max: 4 }),
      downFactor: dbl(0.3, 4),
      up: fc.constantFrom(0, 2, 3),
      upFactor: dbl(0.2, 0.95),
      method: fc.constantFrom(...methods),
    })
    .map((c) => {
      const hs = c.section.hs;
      const reachSlopes = c.slope2 === undefined ? [c.slope1] : [c.slope1, c.slope2];
      // a discharge that fits on every reach's slope (normal depth inside the section where it exists)
      let q: number | null = fittingDischarge(hs, c.fraction, Math.max(...reachSlopes));
      for (const s of reachSlopes) if (q !== null && fittingDischarge(hs, c.fraction, s) === null) q = null;
      if (q === null) return null;
      const yc = criticalDepth(hs, q);
      const top = usableDepth(hs);
      const total = c.lengthFactor * Math.max(yc, 0.05 * hs.section.lengthScale) * 20;
      const lengths = reachSlopes.length === 1 ? [total] : [total * c.split, total * (1 - c.split)];
      const reaches = reachSlopes.map((slope, i) => ({ id: `reach ${i + 1}`, section: hs, length: lengths[i]!, slope }));
      const downstream = boundary(c.down, c.downFactor, yc, top, 0);
      const upstream = c.up === 0 ? undefined : c.up === 2 ? ({ type: 'critical' } as const) : ({ type: 'depth', depth: yc * c.upFactor } as const);
      const input: ProfileInput = {
        units: hs.units,
        reaches,
        discharge: q,
        flowId: 'property',
        boundaries: { ...(upstream ? { upstream } : {}), ...(downstream ? { downstream } : {}) },
        method: c.method,
      };
      return { input, label: `${c.section.label}, lengths ${lengths.join(', ')}, slopes ${reachSlopes.join(' → ')}, Q ${q}, ${c.method}, boundaries ${JSON.stringify(input.boundaries)}` };
    })
    .filter((c): c is ChannelCase => c !== null);
}

/* ---------- checks ---------- */

/** Every number anywhere in a value, with its JSON path: NaN and ±Infinity are reported. */
export function nonFinite(value: unknown, path = '$', found: string[] = []): string[] {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) found.push(`${path} = ${value}`);
  } else if (Array.isArray(value)) value.forEach((v, i) => nonFinite(v, `${path}[${i}]`, found));
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) nonFinite(v, `${path}.${k}`, found);
  return found;
}
