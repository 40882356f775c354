/**
 * Bounded nonlinear least squares: minimise ½·Σ rᵢ(p)² over a box lower ≤ p ≤ upper.
 *
 * Levenberg's damped Gauss–Newton step (K. Levenberg, "A method for the solution of certain non-linear problems
 * in least squares", Quarterly of Applied Mathematics 2, 1944) with Marquardt's scaling of the damping by the
 * diagonal of JᵀJ (D. W. Marquardt, "An algorithm for least-squares estimation of nonlinear parameters",
 * J. SIAM 11, 1963):  (JᵀJ + λ·diag(JᵀJ))·δ = −Jᵀr.
 *
 * Bounds by projection: a parameter sitting on a bound whose gradient points out of the box is held there
 * for the step (an active set), the others take the damped step, and the new point is clipped into the box.
 * The Jacobian is by central differences (one-sided at a bound). Every loop is bounded; a residual that is not
 * finite is an error, never a silent NaN.
 */
import { NumericalError } from '../core/errors.js';
import {
  jacobianStep,
  lmCostTolerance,
  lmDampingFactor,
  lmInitialDamping,
  lmMaxDampingSteps,
  lmMaxIterations,
  lmMinimumDamping,
  lmParameterTolerance,
} from './tolerances.js';

export interface LeastSquaresOptions {
  readonly lower: readonly number[];
  readonly upper: readonly number[];
  /** finite-difference step (default jacobianStep) */
  readonly step?: number;
  readonly maxIterations?: number;
  /** called after each accepted step (for progress) */
  readonly onIteration?: (iteration: number, cost: number) => void;
}

export interface LeastSquaresResult {
  parameters: number[];
  residuals: number[];
  /** ½·Σr² at the solution */
  cost: number;
  /** ∂rᵢ/∂pⱼ at the solution */
  jacobian: number[][];
  iterations: number;
  /** residual evaluations */
  evaluations: number;
  /** why it stopped */
  stop: 'parameters converged' | 'cost converged' | 'gradient zero' | 'no descent' | 'iteration limit';
  /** true for a parameter that ended on its bound */
  atBound: boolean[];
}

function checked(r: readonly number[], what: string): number[] {
  for (const v of r) if (!Number.isFinite(v)) throw new NumericalError(`${what}: a residual is not finite`);
  return [...r];
}

const sumSquares = (r: readonly number[]) => r.reduce((s, v) => s + v * v, 0) / 2;

/** Solve the small dense system A·x = b by Gaussian elimination with partial pivoting; null when singular. */
export function solveLinear(a: readonly (readonly number[])[], b: readonly number[]): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]!]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(m[row]![col]!) > Math.abs(m[pivot]![col]!)) pivot = row;
    if (!(Math.abs(m[pivot]![col]!) > 0)) return null;
    [m[col], m[pivot]] = [m[pivot]!, m[col]!];
    for (let row = col + 1; row < n; row++) {
      const f = m[row]![col]! / m[col]![col]!;
      for (let k = col; k <= n; k++) m[row]![k]! -= f * m[col]![k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row--) {
    let s = m[row]![n]!;
    for (let k = row + 1; k < n; k++) s -= m[row]![k]! * x[k]!;
    x[row] = s / m[row]![row]!;
  }
  return x.every(Number.isFinite) ? x : null;
}

/** Jacobian of `f` at p by central differences, one-sided where a bound is within the step. */
export function jacobianOf(
  f: (p: readonly number[]) => number[],
  p: readonly number[],
  r0: readonly number[],
  lower: readonly number[],
  upper: readonly number[],
  h: number,
): { jacobian: number[][]; evaluations: number } {
  const columns: number[][] = [];
  let evaluations = 0;
  for (let j = 0; j < p.length; j++) {
    const up = Math.min(upper[j]!, p[j]! + h);
    const down = Math.max(lower[j]!, p[j]! - h);
    const at = (x: number): readonly number[] => {
      if (x === p[j]) return r0;
      evaluations++;
      const q = [...p];
      q[j] = x;
      return checked(f(q), 'least squares (Jacobian)');
    };
    const rUp = at(up);
    const rDown = at(down);
    columns.push(rUp.map((v, i) => (up > down ? (v - rDown[i]!) / (up - down) : 0)));
  }
  const jacobian = r0.map((_, i) => columns.map((c) => c[i]!));
  return { jacobian, evaluations };
}

/** Levenberg–Marquardt on a box. `f` returns the residual vector for parameters p. */
export function boundedLeastSquares(
  f: (p: readonly number[]) => number[],
  start: readonly number[],
  options: LeastSquaresOptions,
): LeastSquaresResult {
  const { lower, upper } = options;
  const n = start.length;
  if (lower.length !== n || upper.length !== n) throw new RangeError('least squares: bounds and start differ in length');
  for (let j = 0; j < n; j++) {
    if (!(lower[j]! < upper[j]!)) throw new RangeError(`least squares: lower bound ${lower[j]} is not below upper bound ${upper[j]}`);
  }
  const h = options.step ?? jacobianStep;
  const maxIterations = options.maxIterations ?? lmMaxIterations;
  const clip = (x: number, j: number) => Math.min(upper[j]!, Math.max(lower[j]!, x));

  let p = start.map(clip);
  let r = checked(f(p), 'least squares');
  let cost = sumSquares(r);
  let evaluations = 1;
  let lambda = lmInitialDamping;
  let stop: LeastSquaresResult['stop'] = 'iteration limit';
  let jac = jacobianOf(f, p, r, lower, upper, h);
  evaluations += jac.evaluations;
  let iterations = 0;

  for (; iterations < maxIterations; iterations++) {
    const J = jac.jacobian;
    const g = Array.from({ length: n }, (_, j) => J.reduce((s, row, i) => s + row[j]! * r[i]!, 0));
    const A = Array.from({ length: n }, (_, j) => Array.from({ length: n }, (_, k) => J.reduce((s, row) => s + row[j]! * row[k]!, 0)));
    // active set: on a bound with the descent direction (−g) pointing out of the box, or no sensitivity at all
    const free = Array.from({ length: n }, (_, j) => {
      if (!(A[j]![j]! > 0)) return false;
      if (p[j]! <= lower[j]! && g[j]! > 0) return false;
      if (p[j]! >= upper[j]! && g[j]! < 0) return false;
      return true;
    });
    const idx = free.flatMap((ok, j) => (ok ? [j] : []));
    if (idx.length === 0 || idx.every((j) => g[j] === 0)) {
      stop = 'gradient zero';
      break;
    }
    let accepted = false;
    let moved = 0;
    let drop = 0;
    for (let attempt = 0; attempt < lmMaxDampingSteps; attempt++) {
      const M = idx.map((j) => idx.map((k) => A[j]![k]! + (j === k ? lambda * A[j]![j]! : 0)));
      const delta = solveLinear(M, idx.map((j) => -g[j]!));
      if (delta === null) {
        lambda *= lmDampingFactor;
        continue;
      }
      const q = [...p];
      idx.forEach((j, t) => (q[j] = clip(p[j]! + delta[t]!, j)));
      moved = Math.max(...q.map((v, j) => Math.abs(v - p[j]!)));
      if (moved === 0) break;
      const rq = checked(f(q), 'least squares');
      evaluations++;
      const cq = sumSquares(rq);
      if (cq < cost) {
        drop = (cost - cq) / Math.max(cost, Number.MIN_VALUE);
        p = q;
        r = rq;
        cost = cq;
        lambda = Math.max(lambda / lmDampingFactor, lmMinimumDamping);
        accepted = true;
        break;
      }
      lambda *= lmDampingFactor;
    }
    if (!accepted) {
      stop = 'no descent';
      break;
    }
    options.onIteration?.(iterations + 1, cost);
    jac = jacobianOf(f, p, r, lower, upper, h);
    evaluations += jac.evaluations;
    if (moved < lmParameterTolerance) {
      stop = 'parameters converged';
      iterations++;
      break;
    }
    if (drop < lmCostTolerance || cost === 0) {
      stop = 'cost converged';
      iterations++;
      break;
    }
  }
  return {
    parameters: p,
    residuals: r,
    cost,
    jacobian: jac.jacobian,
    iterations,
    evaluations,
    stop,
    atBound: p.map((v, j) => v <= lower[j]! || v >= upper[j]!),
  };
}
