/**
 * One flow of a model run with its structures and special ends (src/structures/controls/flow.ts). A channel of
 * prismatic reaches goes through computeStructuredFlow (reservoir, rating curve, flow changes, lateral inflow,
 * structures, end overfall); a channel with surveyed reaches goes through the survey's own run
 * (src/survey/channel.ts), which takes the structures as internal controls and a rating curve as a stage.
 */
import { InputError } from './core/errors.js';
import { unitsOf } from './core/units.js';
import type { Model } from './input/model/types.js';
import type { ProfileInput } from './profile/types.js';
import type { FlowResult } from './results/types.js';
import { computeStructuredFlow, finishStructures, needsStructuredRun, type StructuredFlowInput, withRatingStage } from './structures/controls/flow.js';

export interface FlowComputation {
  input: ProfileInput;
  result: FlowResult;
}

/**
 * `surveyed` computes a flow through surveyed reaches (banks, interpolation, stationing) — the survey run.
 * Reservoirs, flow changes and lateral inflow are computed on prismatic reaches only, for now.
 */
export function computeModelFlow(
  model: Model,
  input: ProfileInput,
  hasSurvey: boolean,
  surveyed: (input: ProfileInput) => FlowComputation,
): FlowComputation {
  const structured = input as StructuredFlowInput;
  const units = unitsOf(model.units);
  if (!hasSurvey && needsStructuredRun(structured)) {
    const result = computeStructuredFlow(structured, units);
    // the discharge found from a reservoir replaces the placeholder (a method comparison then runs at it)
    return { input: { ...input, discharge: result.discharge }, result };
  }
  if (hasSurvey && (structured.reservoir || structured.lateralInflow || structured.dischargeChanges)) {
    const where = structured.reservoir ? 'boundaries.upstream' : structured.lateralInflow ? 'lateralInflow' : 'flowChanges';
    throw new InputError({ where, message: 'reservoirs, flow changes and lateral inflow are computed on channels of prismatic reaches only (not yet with surveyed reaches)' });
  }
  const prepared = withRatingStage(structured);
  const computed = surveyed(prepared);
  return { input: computed.input, result: finishStructures(computed.result, structured, units) };
}
