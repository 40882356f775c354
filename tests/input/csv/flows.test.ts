/**
 * readFlowTable: a batch of flows (invented data). A profile needs a positive discharge (common practice:
 * zero flow has no profile; reversed flow is another problem).
 */
import { describe, expect, it } from 'vitest';
import { readFlowTable } from '../../../src/input/csv/flows.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';

function problemsOf(text: string): string[] {
  try {
    readFlowTable(text, 'flows.csv', SI);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

describe('readFlowTable', () => {
  it('readFlowTable(text) reads ids, discharges and optional downstream stages', () => {
    expect(readFlowTable('id,Q (cfs),tailwater (ft)\n2-year,120,101.5\n100-year,610,\n', 'f.csv', US)).toEqual([
      { id: '2-year', discharge: 120, downstreamStage: 101.5, line: 2 },
      { id: '100-year', discharge: 610, line: 3 },
    ]);
  });

  it('readFlowTable(text) refuses a repeated id and a discharge that is not positive', () => {
    expect(problemsOf('id,discharge\nA,3\nB,0\nA,4\n')).toEqual([
      'flows.csv:3:2: discharge 0 must be more than zero',
      'flows.csv:4:1: flow id "A" appears twice (first at line 2); give each flow its own id',
    ]);
  });
});
