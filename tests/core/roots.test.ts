/**
 * core/roots expandUpward: the bracket search every depth solver starts from. The functions are closed forms
 * (straight lines and powers) whose roots are known exactly, so each bracket can be checked against its root.
 */
import { describe, expect, it } from 'vitest';
import { brentRoot, expandUpward } from '../../src/core/roots.js';

describe('expandUpward(f, lo, hi)', () => {
  it('expandUpward(f, lo, hi) doubles hi until a rising f changes sign (root 1000 of x − 1000)', () => {
    const bracket = expandUpward((x) => x - 1000, 1e-3, 1);
    expect(bracket).toBeDefined();
    const [a, b] = bracket!;
    expect(a).toBeLessThanOrEqual(1000);
    expect(b).toBeGreaterThanOrEqual(1000);
    expect(b).toBe(1024); // 1·2^10, the first doubling past the root
  });

  it('expandUpward(f, lo, hi) halves lo when a rising f is already positive there (root 1e-12 of x − 1e-12 below lo = 1e-9)', () => {
    const root = 1e-12;
    const f = (x: number) => x - root;
    const bracket = expandUpward(f, 1e-9, 1);
    expect(bracket).toBeDefined();
    const [a, b] = bracket!;
    expect(f(a)).toBeLessThanOrEqual(0);
    expect(f(b)).toBeGreaterThan(0);
    expect(b).toBe(2 * a);
    expect(b).toBeLessThan(1e-9);
    // Brent with a tolerance relative to the bracket finds the root to that tolerance
    expect(Math.abs(brentRoot(f, a, b, { xTolerance: 1e-10 * a }) - root)).toBeLessThanOrEqual(1e-10 * a);
  });

  it('expandUpward(f, lo, hi) finds the root of y³ − 1e-30 (a critical depth of 1e-10) below lo', () => {
    const bracket = expandUpward((y) => y ** 3 - 1e-30, 1e-9, 3);
    expect(bracket).toBeDefined();
    const [a, b] = bracket!;
    expect(a).toBeLessThanOrEqual(1e-10);
    expect(b).toBeGreaterThanOrEqual(1e-10);
  });

  it('expandUpward(f, lo, hi) gives up within its bounds where f has no root (x + 1, positive everywhere above 0)', () => {
    let calls = 0;
    const f = (x: number) => {
      calls++;
      return x + 1;
    };
    expect(expandUpward(f, 1e-9, 1)).toBeUndefined();
    // 61 values going up, 60 going down, one at lo: every loop is bounded
    expect(calls).toBeLessThanOrEqual(1 + 61 + 60);
  });

  it('expandUpward(f, lo, hi, n, ceiling) never looks below lo where f(lo) ≤ 0 (a root must lie at or above lo)', () => {
    // f = x − 5 is negative at lo and stays negative up to the ceiling 4: no bracket, and none below lo either
    expect(expandUpward((x) => x - 5, 1, 2, 60, 4)).toBeUndefined();
    // f = (x − 0.5)(x − 10) is positive at lo = 0.1 and has its first root above lo: the upward search finds the pair
    const found = expandUpward((x) => (x - 0.5) * (x - 10), 0.1, 0.2);
    expect(found).toBeDefined();
    expect(found![0]).toBeGreaterThanOrEqual(0.1);
  });
});
