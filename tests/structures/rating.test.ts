import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core/errors.js';
import { dischargeFromRating, ratingCurve, stageFromRating } from '../../src/structures/rating.js';
import { assertInDelta } from '../helpers/assert.js';

const table = ratingCurve(
  [
    { stage: 101, discharge: 10 },
    { stage: 100, discharge: 0 },
    { stage: 102.5, discharge: 40 },
  ],
  'boundaries.downstream.rating',
);

describe('rating curve', () => {
  it('stageFromRating() interpolates linearly between table points', () => {
    // linear interpolation (definition): halfway between (10, 101) and (40, 102.5)
    assertInDelta(stageFromRating(table, 25), 101.75, 1e-12, 'stage');
    assertInDelta(stageFromRating(table, 10), 101, 1e-12, 'at a point');
    assertInDelta(dischargeFromRating(table, 100.5), 5, 1e-12, 'inverse');
  });

  it('stageFromRating() outside the table names its range and the table', () => {
    expect(() => stageFromRating(table, 50)).toThrow(/covers discharges 0 to 40/);
    expect(() => stageFromRating(table, 50)).toThrow(/boundaries\.downstream\.rating/);
    expect(() => dischargeFromRating(table, 99)).toThrow(InputError);
  });

  it('ratingCurve() refuses falling stages, too few points and bad numbers', () => {
    expect(() => ratingCurve([{ stage: 1, discharge: 0 }, { stage: 0.5, discharge: 3 }], 'r')).toThrow(/must both rise/);
    expect(() => ratingCurve([{ stage: 1, discharge: 0 }], 'r')).toThrow(/at least two/);
    expect(() => ratingCurve([{ stage: 1, discharge: 0 }, { stage: NaN, discharge: 3 }], 'r')).toThrow(/r\[1\]\.stage/);
  });

  it('stageFromRating() rises with discharge', () => {
    let last = -Infinity;
    for (let q = 0; q <= 40; q += 2.5) {
      const s = stageFromRating(table, q);
      expect(s).toBeGreaterThan(last);
      last = s;
    }
  });
});
