/**
 * Bracketed root finding and minimisation. Every loop has a bound; failure throws a NumericalError
 * that says what was tried. Nothing here returns NaN: a non-finite function value is an error.
 *
 * Brent's root finder and Brent's minimiser follow R. P. Brent, Algorithms for Minimization without
 * Derivatives, Prentice-Hall, 1973, chapters 4 and 5 (zero and localmin).
 */
import { NumericalError } from './errors.js';
import { rootMaxIterations, scanSamples } from './tolerances.js';

export interface RootOptions {
  /** absolute tolerance on x */
  readonly xTolerance: number;
  /** iteration bound (default rootMaxIterations) */
  readonly maxIterations?: number;
  /** a label for error messages, e.g. "normal depth" */
  readonly what?: string;
}

function finite(value: number, x: number, what: string): number {
  if (!Number.isFinite(value)) {
    throw new NumericalError(`${what}: the function is not finite at x = ${x}`);
  }
  return value;
}

/** Brent's method on [a, b] with f(a), f(b) of opposite sign (or one of them zero). */
export function brentRoot(f: (x: number) => number, a: number, b: number, options: RootOptions): number {
  const what = options.what ?? 'root';
  const maxIterations = options.maxIterations ?? rootMaxIterations;
  let fa = finite(f(a), a, what);
  let fb = finite(f(b), b, what);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) {
    throw new NumericalError(`${what}: no sign change between ${a} and ${b} (f = ${fa}, ${fb})`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * options.xTolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = finite(f(b), b, what);
  }
  throw new NumericalError(`${what}: no convergence in ${maxIterations} iterations near x = ${b}`);
}

/**
 * Expand [lo, hi] upward (hi doubles) until f changes sign, at most `maxExpansions` times.
 * Returns the bracket or undefined when none was found within the bound.
 *
 * Every caller's f rises through its root (negative below it, positive above). Where f is already positive
 * at lo and no sign change lies above it, the root lies below lo (a depth thinner than the solver's usual
 * lower end, for a very small discharge in a wide section): lo is then halved, at most `maxExpansions` times,
 * until f is no longer positive there. Callers that need a root at or above lo check f(lo) ≤ 0 first, so
 * they never reach the downward search.
 */
export function expandUpward(
  f: (x: number) => number,
  lo: number,
  hi: number,
  maxExpansions = 60,
  ceiling = Infinity,
): [number, number] | undefined {
  const atLo = f(lo);
  let flo = atLo;
  let a = lo;
  let b = Math.min(hi, ceiling);
  for (let i = 0; i <= maxExpansions; i++) {
    const fb = f(b);
    if (Number.isFinite(flo) && Number.isFinite(fb) && flo * fb <= 0) return [a, b];
    if (b >= ceiling) break;
    a = b;
    flo = fb;
    b = Math.min(b * 2, ceiling);
  }
  return atLo > 0 && Number.isFinite(atLo) ? expandDownward(f, lo, maxExpansions) : undefined;
}

/** Halve x from `hi` (where f > 0) until f(x) ≤ 0, at most `maxHalvings` times: the bracket [x, 2x], or undefined. */
function expandDownward(f: (x: number) => number, hi: number, maxHalvings: number): [number, number] | undefined {
  if (!(hi > 0)) return undefined;
  let b = hi;
  for (let i = 0; i < maxHalvings; i++) {
    const a = b / 2;
    const fa = f(a);
    if (!Number.isFinite(fa)) return undefined;
    if (fa <= 0) return [a, b];
    b = a;
  }
  return undefined;
}

/** Every interval [x_i, x_{i+1}] of an even scan of [lo, hi] where f changes sign. */
export function scanSignChanges(
  f: (x: number) => number,
  lo: number,
  hi: number,
  samples = scanSamples,
): Array<[number, number]> {
  const brackets: Array<[number, number]> = [];
  let x0 = lo;
  let f0 = f(lo);
  for (let i = 1; i <= samples; i++) {
    const x1 = lo + ((hi - lo) * i) / samples;
    const f1 = f(x1);
    if (Number.isFinite(f0) && Number.isFinite(f1) && (f0 === 0 || f0 * f1 < 0)) brackets.push([x0, x1]);
    x0 = x1;
    f0 = f1;
  }
  if (f0 === 0) brackets.push([hi, hi]);
  return brackets;
}

/** Brent's minimiser on [a, b]: golden section with parabolic steps. Returns the minimising x. */
export function brentMinimum(f: (x: number) => number, a: number, b: number, options: RootOptions): number {
  const what = options.what ?? 'minimum';
  const maxIterations = options.maxIterations ?? rootMaxIterations;
  const golden = 0.5 * (3 - Math.sqrt(5));
  let x = a + golden * (b - a);
  let w = x;
  let v = x;
  let fx = finite(f(x), x, what);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const mid = 0.5 * (a + b);
    const tol = Math.sqrt(Number.EPSILON) * Math.abs(x) + options.xTolerance / 3;
    const tol2 = 2 * tol;
    if (Math.abs(x - mid) <= tol2 - 0.5 * (b - a)) return x;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      const eOld = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * eOld) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < mid ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < mid ? b : a) - x;
      d = golden * e;
    }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = finite(f(u), u, what);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  throw new NumericalError(`${what}: no convergence in ${maxIterations} iterations near x = ${x}`);
}
