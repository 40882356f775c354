/**
 * What every depth solver shares: argument guards, the depth tolerance, the search range, and the two
 * bracketed searches on a curve of depth (its local extrema from a scan, and the depths where it takes a
 * given value). All root finding is bracketed (Brent 1973, in core/roots.ts); no loop is unbounded.
 */
import { HydraulicError, NumericalError } from '../core/errors.js';
import { brentMinimum, brentRoot, expandUpward, type RootOptions } from '../core/roots.js';
import {
  crownRoundoffFraction,
  depthAbsoluteTolerance,
  depthRelativeTolerance,
  extremumRelativeTolerance,
  minimumDepthFraction,
} from '../core/tolerances.js';
import type { Section } from '../geometry/section.js';
import { type ExtremaIndex, indexedExtrema } from './extremaIndex.js';

/** The shallowest depth a solver looks at (thinner flow counts as dry). */
export function smallestDepth(section: Section): number {
  return minimumDepthFraction * section.lengthScale;
}

/**
 * Absolute depth tolerance for a root bracketed from `near` upward: relative to the depth, floored by the length
 * scale. A bracket that starts below the smallest depth (core/roots expandUpward searched down for a root thinner
 * than it) gets the relative tolerance alone: the floor would be larger than the root itself.
 */
export function depthTolerance(section: Section, near: number): number {
  const relative = depthRelativeTolerance * Math.abs(near);
  if (Math.abs(near) < smallestDepth(section)) return relative;
  return Math.max(depthAbsoluteTolerance * section.lengthScale, relative);
}

/** Throws a HydraulicError unless the discharge is a finite number > 0. */
export function requireDischarge(discharge: number, what: string): void {
  if (!Number.isFinite(discharge) || discharge <= 0) {
    throw new HydraulicError(`${what}: the discharge must be a finite number > 0, got ${discharge}`);
  }
}

/** Throws a HydraulicError unless the slope is a finite number. */
export function requireSlope(slope: number, what: string): void {
  if (!Number.isFinite(slope)) throw new HydraulicError(`${what}: the bed slope must be a finite number, got ${slope}`);
}

/**
 * Throws a HydraulicError unless 0 < depth ≤ the section's limit; returns the depth, pulled back to the limit
 * when it lies above it by round-off only.
 */
export function requireDepth(section: Section, depth: number, what: string): number {
  if (!Number.isFinite(depth) || depth <= 0) {
    throw new HydraulicError(`${what}: the depth must be a finite number > 0, got ${depth}`);
  }
  const limit = section.maxDepth;
  if (depth > limit) {
    if (depth <= limit * (1 + crownRoundoffFraction)) return limit;
    if (section.closed) {
      throw new HydraulicError(
        `${what}: depth ${depth} is above the crown of the ${section.shape} conduit (full depth ${limit})`,
      );
    }
    throw new HydraulicError(
      `${what}: depth ${depth} is above the lower end point of the ${section.shape} section (depth ${limit}); extend the section`,
    );
  }
  return depth;
}

/** Message for a solution that would lie above an open section's end points. */
export function extendSectionError(section: Section, what: string): HydraulicError {
  return new HydraulicError(
    `${what} lies above the lower end point of the ${section.shape} section (depth ${section.maxDepth}); ` +
      'extend the section (add points higher up the banks)',
  );
}

/**
 * The top of the search range for an unbounded section: the first depth (doubling up from the length
 * scale) where `rising` is ≥ 0, times `margin`. `rising` must be negative at small depth.
 */
export function unboundedTop(section: Section, rising: (y: number) => number, what: string, margin = 1): number {
  const bracket = expandUpward(rising, smallestDepth(section), section.lengthScale);
  if (!bracket) {
    throw new NumericalError(`${what}: no bracket found doubling the depth up from ${section.lengthScale}`);
  }
  return bracket[1] * margin;
}

/** Local extrema of a curve of depth, ascending, and how precisely they are located. */
export interface Extrema {
  readonly minima: readonly number[];
  readonly maxima: readonly number[];
  /** a depth within this of an extremum counts as being at it */
  readonly tolerance: (depth: number) => number;
  /** the top of the range searched (the section's limit, or a depth beyond every extremum) */
  readonly top: number;
  /** true when the curve is still falling at `top` (a minimum lies above the range) */
  readonly fallingAtTop: boolean;
}

/** Tolerance function for extrema located by Brent's minimiser. */
export function minimiserTolerance(section: Section): (depth: number) => number {
  return (depth) => Math.max(depthAbsoluteTolerance * section.lengthScale, extremumRelativeTolerance * depth);
}

/**
 * Local extrema of f from its values v at ascending depths x (a scan), each refined by Brent's minimiser
 * on the two sample intervals around the sampled extremum.
 */
export function scannedExtrema(
  section: Section,
  f: (y: number) => number,
  x: ArrayLike<number>,
  v: ArrayLike<number>,
  what: string,
): Extrema {
  const minima: number[] = [];
  const maxima: number[] = [];
  const n = x.length;
  const negative = (y: number) => -f(y);
  // the options are made only where a sample is an extremum (the scan itself allocates nothing)
  const options = (a: number) => ({ xTolerance: depthTolerance(section, a), what });
  for (let i = 1; i < n - 1; i++) {
    const before = v[i - 1]!;
    const here = v[i]!;
    const after = v[i + 1]!;
    if (here < before && here <= after) minima.push(brentMinimum(f, x[i - 1]!, x[i + 1]!, options(x[i - 1]!)));
    else if (here > before && here >= after) maxima.push(brentMinimum(negative, x[i - 1]!, x[i + 1]!, options(x[i - 1]!)));
  }
  return {
    minima,
    maxima,
    tolerance: minimiserTolerance(section),
    top: x[n - 1]!,
    fallingAtTop: n >= 2 && v[n - 1]! < v[n - 2]!,
  };
}

/** Stands for the label of a refinement until a message needs it (see weightedExtrema). */
const pendingLabel = '\u0000pending label';

/**
 * The curve's slope df/dy in the same discharge-free form as the curve itself: at the samples
 * base + q2·weight[i] (NaN where unknown), and exactly at any depth by `at`. With it an extremum is located
 * as the root of df/dy in the one sample interval where its sign changes (Brent's method, ends already known),
 * which takes a few evaluations where minimising f takes a few tens (f is flat there).
 */
export interface SampledSlope {
  /** the discharge-free part: one number for every sample, or one per sample */
  readonly base: number | ArrayLike<number>;
  readonly weight: ArrayLike<number>;
  readonly at: (y: number) => number;
}

/**
 * The extremum sampled at x[i] as the root of the curve's slope, where the slope (sampled values slopeAt(j), exact
 * values at) changes sign in one of the two sample intervals beside it, the extremum's way (a minimum: − to +; a
 * maximum: + to −): Brent's method in that interval, its end values known. Undefined where it changes sign in
 * neither (a jump of the curve, or slopes unknown): the caller then minimises the curve itself.
 */
export function slopeRootBeside(
  x: ArrayLike<number>,
  i: number,
  minimum: boolean,
  slopeAt: (j: number) => number,
  at: (y: number) => number,
  options: (a: number) => RootOptions,
): number | undefined {
  const sign = minimum ? 1 : -1;
  const below = sign * slopeAt(i - 1);
  const middle = sign * slopeAt(i);
  const above = sign * slopeAt(i + 1);
  // on the extremum's side the signed slope rises through 0: below < 0 ≤ middle, or middle < 0 ≤ above
  const j = below < 0 && middle >= 0 ? i - 1 : middle < 0 && above >= 0 ? i : -1;
  if (j < 0) return undefined;
  const a = x[j]!;
  const b = x[j + 1]!;
  const fa = slopeAt(j);
  const fb = slopeAt(j + 1);
  if (fb === 0) return b;
  return brentRoot((y) => (y === a ? fa : y === b ? fb : at(y)), a, b, options(a));
}

/** A refinement's error with its label made now (see pendingLabel). */
function relabel(error: unknown, what: () => string): unknown {
  if (error instanceof NumericalError && error.message.startsWith(pendingLabel)) {
    return new NumericalError(what() + error.message.slice(pendingLabel.length));
  }
  return error;
}

/**
 * scannedExtrema of the sampled curve v[i] = q2·weight[i] + base[i] (specific energy: base = depth,
 * weight = α/(2gA²); specific force: base = Aȳ, weight = 1/(gA)), computed as the scan goes: the same
 * comparisons as scannedExtrema over those values, with nothing stored. Each sampled extremum is refined in
 * [x[i−1], x[i+1]]: by the root of the slope where `slope` is given and its sign changes from one side of the
 * extremum to the other inside that range (a minimum: − to +; a maximum: + to −), otherwise (no slope, or a
 * jump of the curve, where the sign does not change) by Brent's minimiser.
 */
export function weightedExtrema(
  section: Section,
  f: (y: number) => number,
  x: ArrayLike<number>,
  base: ArrayLike<number>,
  weight: ArrayLike<number>,
  q2: number,
  what: () => string,
  slope?: SampledSlope,
  /** the curve's extrema index (hydraulics/extremaIndex.ts): the same extrema as the scan without scanning */
  index?: ExtremaIndex,
): Extrema {
  const minima: number[] = [];
  const maxima: number[] = [];
  const n = x.length;
  const negative = (y: number) => -f(y);
  // the label (it formats the discharge, which costs about as much as a refinement) is made only for a message
  const options = (a: number) => ({ xTolerance: depthTolerance(section, a), what: pendingLabel });
  /** the extremum sampled at i: the slope's root in the interval beside i where its sign changes, if any */
  const slopeBase = slope === undefined ? undefined : slope.base;
  const slopeAt = (i: number): number =>
    typeof slopeBase === 'number' ? slopeBase + q2 * slope!.weight[i]! : slopeBase![i]! + q2 * slope!.weight[i]!;
  const refine = (i: number, minimum: boolean): number => {
    const root = slope === undefined ? undefined : slopeRootBeside(x, i, minimum, slopeAt, slope.at, (a) => options(a));
    return root ?? brentMinimum(minimum ? f : negative, x[i - 1]!, x[i + 1]!, options(x[i - 1]!));
  };
  const visit = (i: number, minimum: boolean): void => {
    if (minimum) minima.push(refine(i, true));
    else maxima.push(refine(i, false));
  };
  if (index !== undefined) {
    let fallingAtTop: boolean;
    try {
      fallingAtTop = indexedExtrema(index, q2, visit);
    } catch (error) {
      throw relabel(error, what);
    }
    return { minima, maxima, tolerance: minimiserTolerance(section), top: x[n - 1]!, fallingAtTop };
  }
  let before = n > 0 ? base[0]! + q2 * weight[0]! : NaN;
  let here = n > 1 ? base[1]! + q2 * weight[1]! : NaN;
  try {
    for (let i = 1; i < n - 1; i++) {
      const after = base[i + 1]! + q2 * weight[i + 1]!;
      if (here < before && here <= after) minima.push(refine(i, true));
      else if (here > before && here >= after) maxima.push(refine(i, false));
      before = here;
      here = after;
    }
  } catch (error) {
    throw relabel(error, what);
  }
  return {
    minima,
    maxima,
    tolerance: minimiserTolerance(section),
    top: x[n - 1]!,
    // after the loop `here` is the last value and `before` the one below it
    fallingAtTop: n >= 2 && here < before,
  };
}

export interface Crossings {
  /** every depth in the range where f = level, ascending */
  readonly depths: number[];
  /** true when f is below level at the finite top of the range while rising: a crossing lies above it */
  readonly beyondTop: boolean;
}

/**
 * Every depth where f(y) = level, one bracketed Brent search per monotone piece between the extrema
 * (so no crossing is missed where the extrema are right). With an infinite top the last piece is bracketed
 * by doubling upward.
 */
export function levelCrossings(
  section: Section,
  f: (y: number) => number,
  level: number,
  extrema: Extrema,
  lo: number,
  what: string,
): Crossings {
  const g = (y: number): number => {
    const value = f(y) - level;
    if (Number.isNaN(value)) throw new NumericalError(`${what}: the function is not a number at depth ${y}`);
    // an infinite value near a dry bed is simply "far above the level"
    return Number.isFinite(value) ? value : value > 0 ? Number.MAX_VALUE : -Number.MAX_VALUE;
  };
  const points = [...extrema.minima, ...extrema.maxima].filter((p) => p > lo && p < extrema.top).sort((p, q) => p - q);
  const breaks = [lo, ...points, extrema.top];
  const depths: number[] = [];
  const push = (y: number) => {
    const last = depths[depths.length - 1];
    if (last === undefined || Math.abs(y - last) > depthTolerance(section, y)) depths.push(y);
  };
  let beyondTop = false;
  for (let i = 0; i + 1 < breaks.length; i++) {
    let a = breaks[i]!;
    let b = breaks[i + 1]!;
    const options = { xTolerance: depthTolerance(section, a), what };
    if (!Number.isFinite(b)) {
      // the last piece of an unbounded section rises without bound: a crossing only if it starts below the level
      const start = g(a);
      if (start === 0) push(a);
      if (start >= 0) continue;
      const bracket = expandUpward(g, a, Math.max(2 * a, section.lengthScale));
      if (!bracket) throw new NumericalError(`${what}: no bracket found doubling the depth up from ${a}`);
      [a, b] = bracket;
    }
    const ga = g(a);
    const gb = g(b);
    if (ga === 0) push(a);
    else if (ga * gb < 0) push(brentRoot(g, a, b, options));
    if (i + 2 === breaks.length) {
      if (gb === 0) push(b);
      else if (Number.isFinite(extrema.top) && gb < 0 && ga < gb) beyondTop = true;
    }
  }
  return { depths, beyondTop };
}

/** Which side of the curve's extrema a depth is on. */
export type Branch = 'falling' | 'rising' | 'extremum';

/** Whether f is falling or rising at y (or y is at a minimum), judged from the located extrema alone. */
export function branchAt(extrema: Extrema, y: number): Branch {
  const tolerance = extrema.tolerance(y);
  if (extrema.minima.some((m) => Math.abs(m - y) <= tolerance)) return 'extremum';
  const nextMin = extrema.minima.find((m) => m > y);
  const nextMax = extrema.maxima.find((m) => m > y);
  if (nextMin === undefined) return nextMax === undefined && extrema.fallingAtTop ? 'falling' : 'rising';
  return nextMax === undefined || nextMin < nextMax ? 'falling' : 'rising';
}

/**
 * The conjugate of y on a curve with minima (alternate depth on specific energy, sequent depth on specific
 * force): from a falling branch, the first crossing above the next minimum; from a rising branch, the last
 * crossing below the previous minimum. At a minimum the conjugate is y itself. `undefined` when none lies
 * in the range; `beyond` tells whether one lies above its finite top.
 */
export function conjugateDepth(
  section: Section,
  f: (y: number) => number,
  extrema: Extrema,
  y: number,
  what: string,
): { depth?: number; beyond: boolean } {
  const branch = branchAt(extrema, y);
  if (branch === 'extremum') return { depth: y, beyond: false };
  const level = f(y);
  const crossings = levelCrossings(section, f, level, extrema, smallestDepth(section), what);
  if (branch === 'falling') {
    const next = extrema.minima.find((m) => m > y);
    // still falling at the top of the range: the minimum, and so the conjugate, lie above it
    if (next === undefined) return { beyond: true };
    const above = crossings.depths.filter((d) => d > next);
    const first = above[0];
    // none found: it lies above the top if the curve ends below the level, rising or still falling
    return first === undefined ? { beyond: crossings.beyondTop || extrema.fallingAtTop } : { depth: first, beyond: false };
  }
  const previous = [...extrema.minima].reverse().find((m) => m < y);
  const below = previous === undefined ? [] : crossings.depths.filter((d) => d < previous);
  const last = below[below.length - 1];
  return last === undefined ? { beyond: false } : { depth: last, beyond: false };
}
