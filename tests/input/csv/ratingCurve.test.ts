/**
 * readRatingCurve: a downstream stage–discharge table (invented data). A rating curve used as a boundary
 * must give one stage per discharge, so discharge rises strictly with stage (common practice: a single-valued
 * rating, as for a stable control).
 */
import { describe, expect, it } from 'vitest';
import { readRatingCurve } from '../../../src/input/csv/ratingCurve.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';

function problemsOf(text: string, units = SI): string[] {
  try {
    readRatingCurve(text, 'rating.csv', units);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

describe('readRatingCurve', () => {
  it('readRatingCurve(text) returns [stage, discharge] pairs sorted by stage', () => {
    const text = 'stage_m,Q (m3/s)\n49.5,6.2\n48.0,0\n48.8,2.5\n';
    expect(readRatingCurve(text, 'rating.csv', SI)).toEqual([[48, 0], [48.8, 2.5], [49.5, 6.2]]);
  });

  it('readRatingCurve(units) reads US customary headers (ft, cfs)', () => {
    expect(readRatingCurve('WSEL (ft),flow (cfs)\n100,0\n102,150\n', 'r.csv', US)).toEqual([[100, 0], [102, 150]]);
  });

  it('readRatingCurve(text) refuses discharge that does not rise with stage', () => {
    expect(problemsOf('stage,discharge\n48.0,0\n48.5,3\n49.0,2.5\n49.5,2.5\n')).toEqual([
      'rating.csv:4:2: discharge 2.5 at stage 49 is not more than 3 at the lower stage 48.5 (line 3); discharge must increase with stage',
      'rating.csv:5:2: discharge 2.5 at stage 49.5 is not more than 2.5 at the lower stage 49 (line 4); discharge must increase with stage',
    ]);
  });

  it('readRatingCurve(text) refuses a repeated stage at the later line, and a negative discharge', () => {
    expect(problemsOf('stage,discharge\n48.5,3\n48.0,0\n48.5,4\n49,-1\n')).toEqual([
      'rating.csv:4:1: stage 48.5 appears twice (also at line 2); a rating curve gives one discharge per stage',
      'rating.csv:5:2: discharge -1 is negative; it must be zero or more',
    ]);
  });

  it('readRatingCurve(text) refuses fewer than two rows, non-numbers and a discharge unit of the other system', () => {
    expect(problemsOf('stage,discharge\n48,1\n')).toEqual([
      'rating.csv:1: a rating curve needs at least two (stage, discharge) rows; found 1',
    ]);
    expect(problemsOf('stage,discharge\n48,1\n49,lots\n')).toEqual(['rating.csv:3:2: discharge: expected a number, got "lots"']);
    expect(problemsOf('stage,Q_cfs\n48,1\n49,2\n')[0]).toContain('rating.csv:1:2: column "Q_cfs" is in ft³/s');
  });
});
