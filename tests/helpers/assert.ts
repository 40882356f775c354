/** Shared assertions for the tests (after d3's assertInDelta). */
import { expect } from 'vitest';

/** |actual − expected| ≤ delta, with a message that shows all three. */
export function assertInDelta(actual: number, expected: number, delta: number, label = ''): void {
  const ok = Number.isFinite(actual) && Math.abs(actual - expected) <= delta;
  expect(ok, `${label}${label ? ': ' : ''}expected ${expected} ± ${delta}, got ${actual}`).toBe(true);
}

/** Relative closeness: |actual − expected| ≤ rel·|expected|. */
export function assertRelative(actual: number, expected: number, rel: number, label = ''): void {
  assertInDelta(actual, expected, Math.abs(expected) * rel, label);
}
