import { describe, expect, it } from 'vitest';
import { parseBounds, parseDischarges, parseSensitivity, parseStations } from '../../src/analysis/options.js';
import { InputError } from '../../src/core/errors.js';

function problemOf(f: () => unknown): { where: string; message: string } {
  try {
    f();
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems[0]!;
  }
  throw new Error('expected an InputError');
}

describe('parseSensitivity', () => {
  it('parseSensitivity reads n=±20%,Q=±10% and the +- spelling', () => {
    expect(parseSensitivity('n=±20%,Q=±10%')).toEqual([
      { parameter: 'n', percent: 20 },
      { parameter: 'Q', percent: 10 },
    ]);
    expect(parseSensitivity('n=+-15%')).toEqual([{ parameter: 'n', percent: 15 }]);
    expect(parseSensitivity(' Q = 5 % ')).toEqual([{ parameter: 'Q', percent: 5 }]);
  });

  it('parseSensitivity names the flag, the value and the accepted form', () => {
    expect(problemOf(() => parseSensitivity('n=20'))).toEqual({
      where: '--sensitivity',
      message: 'expected a list like n=±20%,Q=±10% (n: roughness, Q: discharge; ± may be written +-), got "n=20"',
      value: 'n=20',
    });
    expect(problemOf(() => parseSensitivity('slope=±5%')).message).toBe(
      'unknown parameter "slope": vary n (roughness) or Q (discharge), e.g. n=±20%,Q=±10%',
    );
    expect(problemOf(() => parseSensitivity('n=±120%')).message).toBe('a variation must be greater than 0 % and at most 90 %, got 120 %');
    expect(problemOf(() => parseSensitivity('n=±0%')).message).toBe('a variation must be greater than 0 % and at most 90 %, got 0 %');
    expect(problemOf(() => parseSensitivity('n=±10%,n=±20%')).message).toBe('n is given twice; give each parameter once');
    expect(problemOf(() => parseSensitivity('')).where).toBe('--sensitivity');
  });
});

describe('parseDischarges', () => {
  it('parseDischarges reads a list and a from:to:step range with both ends', () => {
    expect(parseDischarges('2,5,10')).toEqual([2, 5, 10]);
    expect(parseDischarges('1:20:1')).toHaveLength(20);
    expect(parseDischarges('1:20:1').at(-1)).toBe(20);
    // 0.1 steps without accumulated round-off
    expect(parseDischarges('0.5:1.2:0.1')).toEqual([0.5, 0.6, 0.7, 0.8, 0.9, 1, 1.1, 1.2]);
  });

  it('parseDischarges names the flag, the value and the accepted form', () => {
    expect(problemOf(() => parseDischarges('1:20'))).toEqual({
      where: '--discharges',
      message: 'expected a list of discharges like 2,5,10 or a range from:to:step like 1:20:1 (all greater than 0), got "1:20"',
      value: '1:20',
    });
    expect(problemOf(() => parseDischarges('20:1:1')).message).toBe('the step 1 does not lead from 20 to 1: give a step greater than 0 and from ≤ to');
    expect(problemOf(() => parseDischarges('0:5:1')).message).toMatch(/\(0 is not greater than 0\)$/);
    expect(problemOf(() => parseDischarges('2,x')).message).toMatch(/got "2,x"$/);
    expect(problemOf(() => parseDischarges('1:100000:1')).message).toBe('that is 100000 discharges; at most 10000 are computed in one table');
    expect(problemOf(() => parseDischarges('2,2')).message).toBe('discharge 2 is listed twice; list each once');
  });
});

describe('parseStations and parseBounds', () => {
  it('parseStations reads a list and refuses text', () => {
    expect(parseStations('120, 480')).toEqual([120, 480]);
    expect(problemOf(() => parseStations('120;480'))).toEqual({
      where: '--stations',
      message: 'expected a list of stations like 120,480 (numbers along the channel), got "120;480"',
      value: '120;480',
    });
  });

  it('parseBounds reads lower:upper around 1 and refuses the rest', () => {
    expect(parseBounds('0.5:2')).toEqual({ lower: 0.5, upper: 2 });
    expect(problemOf(() => parseBounds('1.2:2')).message).toBe('bounds 1.2:2 must satisfy 0.05 ≤ lower < 1 < upper ≤ 20');
    expect(problemOf(() => parseBounds('half')).where).toBe('--bounds');
  });
});
