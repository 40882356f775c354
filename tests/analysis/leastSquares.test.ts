import { describe, expect, it } from 'vitest';
import { boundedLeastSquares, solveLinear } from '../../src/analysis/leastSquares.js';
import { assertInDelta } from '../helpers/assert.js';

describe('boundedLeastSquares', () => {
  it('boundedLeastSquares(Rosenbrock residuals) finds the minimum at (1, 1)', () => {
    // Rosenbrock 1960, "An automatic method for finding the greatest or least value of a function" (Computer
    // Journal 3): f = 100(y − x²)² + (1 − x)², written as residuals r1 = 10(y − x²), r2 = 1 − x; published
    // minimum (1, 1) from the start (−1.2, 1), the classic test of Levenberg–Marquardt codes.
    const fit = boundedLeastSquares((p) => [10 * (p[1]! - p[0]! * p[0]!), 1 - p[0]!], [-1.2, 1], {
      lower: [-5, -5],
      upper: [5, 5],
      step: 1e-6,
      maxIterations: 200,
    });
    assertInDelta(fit.parameters[0]!, 1, 1e-6, 'x');
    assertInDelta(fit.parameters[1]!, 1, 1e-6, 'y');
    expect(fit.cost).toBeLessThan(1e-12);
  });

  it('boundedLeastSquares(linear model) equals the normal-equations solution', () => {
    // closed form: for r = A·p − b the least-squares p solves AᵀA·p = Aᵀb (Gauss); data invented
    const xs = [0, 1, 2, 3, 4, 5];
    const ys = [1.1, 2.9, 5.2, 7.1, 8.8, 11.2];
    const fit = boundedLeastSquares((p) => xs.map((x, i) => p[0]! + p[1]! * x - ys[i]!), [0, 0], { lower: [-10, -10], upper: [10, 10] });
    const n = xs.length;
    const sx = xs.reduce((s, x) => s + x, 0);
    const sxx = xs.reduce((s, x) => s + x * x, 0);
    const sy = ys.reduce((s, y) => s + y, 0);
    const sxy = xs.reduce((s, x, i) => s + x * ys[i]!, 0);
    const slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
    const intercept = (sy - slope * sx) / n;
    assertInDelta(fit.parameters[0]!, intercept, 1e-8, 'intercept');
    assertInDelta(fit.parameters[1]!, slope, 1e-8, 'slope');
  });

  it('boundedLeastSquares stops on the bound the unconstrained minimum lies beyond (the KKT point)', () => {
    // minimise (p − 3)² + (q + 1)² on 0 ≤ p ≤ 2, 0 ≤ q ≤ 2: the box's nearest point to (3, −1) is (2, 0)
    const fit = boundedLeastSquares((p) => [p[0]! - 3, p[1]! + 1], [1, 1], { lower: [0, 0], upper: [2, 2] });
    expect(fit.parameters).toEqual([2, 0]);
    expect(fit.atBound).toEqual([true, true]);
  });

  it('boundedLeastSquares refuses a residual that is not finite', () => {
    expect(() => boundedLeastSquares(() => [Number.NaN], [1], { lower: [0], upper: [2] })).toThrow(/not finite/);
  });

  it('boundedLeastSquares refuses bounds that are not ordered', () => {
    expect(() => boundedLeastSquares((p) => [p[0]!], [1], { lower: [2], upper: [1] })).toThrow(/not below/);
  });
});

describe('solveLinear', () => {
  it('solveLinear(3×3) matches the hand-solved system and reports a singular one', () => {
    // 2x + y − z = 8, −3x − y + 2z = −11, −2x + y + 2z = −3  →  (2, 3, −1): the standard worked example of
    // Gaussian elimination (common practice; found in most linear-algebra texts)
    const x = solveLinear(
      [
        [2, 1, -1],
        [-3, -1, 2],
        [-2, 1, 2],
      ],
      [8, -11, -3],
    )!;
    assertInDelta(x[0]!, 2, 1e-12);
    assertInDelta(x[1]!, 3, 1e-12);
    assertInDelta(x[2]!, -1, 1e-12);
    expect(solveLinear([[1, 2], [2, 4]], [1, 2])).toBeNull();
  });
});
