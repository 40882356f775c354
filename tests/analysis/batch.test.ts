import { describe, expect, it } from 'vitest';
import { flowBatch } from '../../src/analysis/batch.js';
import { SI } from '../../src/core/units.js';
import { readFlowTable } from '../../src/input/csv/flows.js';
import { runModel } from '../../src/run.js';
import { uniformModel, twoReachModel } from './models.js';

describe('flowBatch', () => {
  it('flowBatch(flows.csv) replaces the model flows, with a downstream stage where a row gives one', () => {
    const csv = 'id,discharge,downstream_stage\nlow,3,\nmid,9,2.5\nhigh,16,3.0\n';
    const rows = readFlowTable(csv, 'flows.csv', SI);
    const model = twoReachModel();
    const batch = flowBatch(model, rows);
    expect(batch.model.flows).toEqual([
      { id: 'low', discharge: 3 },
      { id: 'mid', discharge: 9 },
      { id: 'high', discharge: 16 },
    ]);
    expect(model.flows.map((f) => f.id)).toEqual(['minor', 'major']);
    const run = runModel(batch.model, { adjustInput: batch.adjustInput });
    expect(run.result.flows.map((f) => [f.id, f.discharge])).toEqual([
      ['low', 3],
      ['mid', 9],
      ['high', 16],
    ]);
    // the stage of each row holds at the downstream end; the row without one keeps the model's 2.2
    expect(run.result.flows.map((f) => f.stations.at(-1)!.wsel)).toEqual([2.2, 2.5, 3.0]);
    expect(batch.notes).toEqual([]);
  });

  it('flowBatch notes when a stage replaces a downstream control of another kind', () => {
    const batch = flowBatch(uniformModel(), [{ id: 'a', discharge: 5, downstreamStage: 3.5 }]);
    expect(batch.notes).toEqual(['the downstream normal control of the model is replaced by the stage given for 1 flow']);
    const run = runModel(batch.model, { adjustInput: batch.adjustInput });
    expect(run.result.flows[0]!.stations.at(-1)!.wsel).toBe(3.5);
  });
});
