/**
 * readHighWaterMarks: observed flood marks for calibration (invented data). Weights in a weighted least-squares
 * fit must be positive (a zero or negative weight removes or inverts a residual: common practice).
 */
import { describe, expect, it } from 'vitest';
import { readHighWaterMarks } from '../../../src/input/csv/marks.js';
import { InputError } from '../../../src/core/errors.js';
import { SI } from '../../../src/core/units.js';

function problemsOf(text: string, flows?: string[]): string[] {
  try {
    readHighWaterMarks(text, 'marks.csv', SI, flows ? { flows } : {});
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

describe('readHighWaterMarks', () => {
  it('readHighWaterMarks(text) reads marks in file order, weight 1 where blank', () => {
    const text = 'station_m,HWM (m),event,weight\n120,50.31,2031-flood,2\n340,49.87,2031-flood,\n';
    expect(readHighWaterMarks(text, 'marks.csv', SI, { flows: ['2031-flood'] })).toEqual([
      { station: 120, elevation: 50.31, flow: '2031-flood', weight: 2, line: 2 },
      { station: 340, elevation: 49.87, flow: '2031-flood', weight: 1, line: 3 },
    ]);
  });

  it('readHighWaterMarks(text) refuses a weight that is not positive, an unknown flow and a non-number', () => {
    expect(problemsOf('station,elevation,flow,w\n120,50.3,big,0\n130,50.2,small,1\n140,high,big,1\n', ['big'])).toEqual([
      'marks.csv:2:4: weight 0 must be more than zero',
      'marks.csv:3:3: flow "small" is not one of the model\'s flows ("big")',
      'marks.csv:4:2: mark elevation: expected a number, got "high"',
    ]);
  });
});
