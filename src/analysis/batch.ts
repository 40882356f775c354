/**
 * Flow batches: a table of flows (id, discharge[, downstream stage]) that replaces the model's flows. A row
 * with a stage sets the downstream control of that flow to that water-surface elevation; the others keep the
 * model's downstream control.
 */
import type { Model } from '../input/model/types.js';
import type { ProfileInput } from '../profile/types.js';

export interface BatchFlow {
  readonly id: string;
  readonly discharge: number;
  readonly downstreamStage?: number;
}

export interface FlowBatch {
  /** the model with its flows replaced */
  model: Model;
  /** sets the downstream stage of the flows that give one (for RunOptions.adjustInput) */
  adjustInput: (input: ProfileInput) => ProfileInput;
  notes: string[];
}

export function flowBatch(model: Model, flows: readonly BatchFlow[]): FlowBatch {
  const stages = new Map<string, number>();
  for (const f of flows) if (f.downstreamStage !== undefined) stages.set(f.id, f.downstreamStage);
  const notes: string[] = [];
  const replaced = model.boundaries.downstream;
  if (stages.size > 0 && replaced !== undefined && replaced.type !== 'stage') {
    notes.push(`the downstream ${replaced.type} control of the model is replaced by the stage given for ${stages.size} flow${stages.size === 1 ? '' : 's'}`);
  }
  return {
    model: { ...model, flows: flows.map((f) => ({ id: f.id, discharge: f.discharge })) },
    adjustInput: (input) => {
      const elevation = stages.get(input.flowId);
      if (elevation === undefined) return input;
      return { ...input, boundaries: { ...input.boundaries, downstream: { type: 'stage', elevation } } };
    },
    notes,
  };
}
