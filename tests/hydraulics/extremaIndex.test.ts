import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { extremaIndex, indexedExtrema } from '../../src/hydraulics/extremaIndex.js';

/** The scan the index replaces (hydraulics/depthSearch.ts scannedExtrema's comparisons), written out plainly. */
function scanned(base: number[], weight: number[], q2: number): { found: string[]; fallingAtTop: boolean } {
  const v = base.map((b, i) => b + q2 * weight[i]!);
  const found: string[] = [];
  for (let i = 1; i < v.length - 1; i++) {
    if (v[i]! < v[i - 1]! && v[i]! <= v[i + 1]!) found.push(`min ${i}`);
    else if (v[i]! > v[i - 1]! && v[i]! >= v[i + 1]!) found.push(`max ${i}`);
  }
  return { found, fallingAtTop: v[v.length - 1]! < v[v.length - 2]! };
}

function indexed(base: number[], weight: number[], q2: number): { found: string[]; fallingAtTop: boolean } {
  const found: string[] = [];
  const fallingAtTop = indexedExtrema(extremaIndex(base, weight)!, q2, (i, minimum) => found.push(`${minimum ? 'min' : 'max'} ${i}`));
  return { found, fallingAtTop };
}

describe('extremaIndex', () => {
  it('indexedExtrema(rectangle) finds the one minimum of E = y + q²/(2g y²) next to critical depth (q²/g)^(1/3)', () => {
    // closed form (Chow 1959 ch. 3): a rectangle's critical depth per unit width is (q²/g)^(1/3)
    const g = 9.80665;
    const y = Array.from({ length: 401 }, (_, i) => 0.01 + (i * 5) / 400);
    const w = y.map((d) => 1 / (2 * g * d * d));
    for (const q of [0.5, 2, 7]) {
      const yc = Math.cbrt((q * q) / g);
      const found: number[] = [];
      indexedExtrema(extremaIndex(y, w)!, q * q, (i, minimum) => {
        expect(minimum).toBe(true);
        found.push(i);
      });
      expect(found).toHaveLength(1);
      expect(Math.abs(y[found[0]!]! - yc)).toBeLessThanOrEqual(5 / 400);
    }
  });

  it('indexedExtrema gives exactly the scan’s extrema on random curves with several minima and maxima', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 1e-3, max: 1, noNaN: true }), { minLength: 3, maxLength: 60 }),
        fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 60, maxLength: 60 }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        (rises, noise, q2) => {
          const base: number[] = [0];
          for (const r of rises) base.push(base[base.length - 1]! + r);
          const weight = base.map((_, i) => 1 / (1 + i) + 0.01 * noise[i % noise.length]!);
          const a = scanned(base, weight, q2);
          const b = indexed(base, weight, q2);
          // a sample exactly level with its neighbour is the only place the two may differ (a tie of measure zero)
          expect(b).toEqual(a);
        },
      ),
      { seed: 20261201, numRuns: 500 },
    );
  });

  it('extremaIndex is undefined where a weight is not finite or the base does not rise (the caller scans)', () => {
    expect(extremaIndex([0, 1, 2], [1, Infinity, 0])).toBeUndefined();
    expect(extremaIndex([0, 1, 1], [3, 2, 1])).toBeUndefined();
  });
});
