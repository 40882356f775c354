/**
 * Inverting a rising relation (discharge against head, headwater against discharge): bracket the root by
 * doubling from a guess (core/roots expandUpward), then Brent's method. Bounded, never NaN.
 */
import { NumericalError } from '../core/errors.js';
import { brentRoot, expandUpward } from '../core/roots.js';
import { depthAbsoluteTolerance, depthRelativeTolerance } from '../core/tolerances.js';

export interface InvertOptions {
  /** lowest admissible x; f(lo) must not exceed the target */
  readonly lo: number;
  /** a first upper end for the bracket (doubled until it brackets the target) */
  readonly guess: number;
  /** a length typical of the problem (sets the tolerance) */
  readonly scale: number;
  /** what is being solved for, for messages */
  readonly what: string;
}

/** x ≥ lo with f(x) = target, for f rising in x. */
export function invertRising(f: (x: number) => number, target: number, options: InvertOptions): number {
  const g = (x: number) => f(x) - target;
  const gLo = g(options.lo);
  if (!Number.isFinite(gLo)) throw new NumericalError(`${options.what}: not finite at ${options.lo}`);
  if (gLo > 0) {
    throw new NumericalError(`${options.what}: the target ${target} lies below the value ${f(options.lo)} at the lowest admissible ${options.lo}`);
  }
  if (gLo === 0) return options.lo;
  const hi = Math.max(options.guess, options.lo + options.scale);
  const bracket = expandUpward(g, options.lo, hi);
  if (!bracket) {
    throw new NumericalError(`${options.what}: no value up to ${hi}·2^60 reaches the target ${target}`);
  }
  const tolerance = Math.max(depthAbsoluteTolerance * options.scale, depthRelativeTolerance * options.scale);
  return brentRoot(g, bracket[0], bracket[1], { xTolerance: tolerance, what: options.what });
}

/** Absolute tolerance used by structure root finding for a problem of this length scale. */
export function structureTolerance(scale: number): number {
  return Math.max(depthAbsoluteTolerance * scale, depthRelativeTolerance * scale);
}
