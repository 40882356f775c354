/**
 * One flow of a model with structures and special boundaries, computed end to end:
 *
 *   rating curve ─▶ downstream stage for the outflow discharge (interpolated, an error outside the table)
 *   reservoir    ─▶ the discharge from the pool (profile/reservoir.ts), each trial a whole-channel run
 *   channel      ─▶ computeChannelProfile (flow changes, lateral inflow) with the structures as internal controls
 *   after the run ─▶ the free overfall at the downstream end reported; the jump below each structure placed
 */
import { InputError } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { FreeOverfallSpec } from '../../input/model/types.js';
import { type ChannelInput, channelEnd, computeChannelProfile, outflowDischarge } from '../../profile/channelFlow.js';
import type { EngineOptions } from '../../profile/engine.js';
import { computeReservoirProfile, type ReservoirSpec } from '../../profile/reservoir.js';
import type { FlowResult } from '../../results/types.js';
import { type RatingCurve, stageFromRating } from '../rating.js';
import { withJumpPositions } from './apron.js';
import { endOverfallResult } from './freeOverfall.js';

export interface StructuredFlowInput extends ChannelInput {
  /** a reservoir upstream: the discharge is found (ChannelInput.discharge is then only the first guess's scale) */
  readonly reservoir?: ReservoirSpec;
  /** a stage–discharge rating curve at the downstream end (replaces boundaries.downstream) */
  readonly rating?: RatingCurve;
  /** a free overfall at the downstream end (the downstream boundary is critical depth) */
  readonly endOverfall?: FreeOverfallSpec;
  /** apron lengths of spillways (and gates) by structure id, for the jump check */
  readonly apronLengths?: ReadonlyMap<string, number>;
}

function show(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

/** The channel input with the rating curve's stage for its outflow as the downstream boundary. */
function withRating(input: StructuredFlowInput): ChannelInput {
  if (!input.rating) return input;
  const q = outflowDischarge(input);
  const stage = stageFromRating(input.rating, q);
  return { ...input, boundaries: { ...input.boundaries, downstream: { type: 'stage', elevation: stage } } };
}

function describeRating(result: FlowResult, input: StructuredFlowInput): FlowResult {
  if (!input.rating) return result;
  const q = result.stations[result.stations.length - 1]?.discharge ?? outflowDischarge({ ...input, discharge: result.discharge });
  const stage = stageFromRating(input.rating, q);
  const pts = input.rating.points;
  return {
    ...result,
    controls: (result.controls ?? []).map((c) =>
      c.kind === 'downstream boundary'
        ? { ...c, kind: 'rating curve', reason: `stage ${show(stage)} interpolated in the rating curve (${pts.length} points, discharges ${show(pts[0]!.discharge)} to ${show(pts[pts.length - 1]!.discharge)}) at the outflow ${show(q)}` }
        : c,
    ),
  };
}

export function computeStructuredFlow(input: StructuredFlowInput, units: Units, options: EngineOptions = {}): FlowResult {
  if (input.endOverfall && input.boundaries.downstream && input.boundaries.downstream.type !== 'critical') {
    throw new InputError({ where: 'boundaries.downstream', message: 'a free overfall at the downstream end is the downstream control (critical depth at the brink): leave out boundaries.downstream, or give {"type": "critical"}' });
  }
  const base: StructuredFlowInput = input.endOverfall ? { ...input, boundaries: { ...input.boundaries, downstream: { type: 'critical' } } } : input;
  let result: FlowResult;
  if (base.reservoir) {
    result = computeReservoirProfile(base, base.reservoir, options, (trial) => computeChannelProfile(withRating({ ...base, ...trial }), options)).result;
  } else {
    result = computeChannelProfile(withRating(base), options);
  }
  return finishStructures(result, base, units);
}

/** True when a flow needs more than the engine alone: a reservoir, a rating curve, flow changes, lateral inflow, an end overfall. */
export function needsStructuredRun(input: StructuredFlowInput): boolean {
  return (
    input.reservoir !== undefined ||
    input.rating !== undefined ||
    input.endOverfall !== undefined ||
    (input.dischargeChanges?.length ?? 0) > 0 ||
    (input.lateralInflow?.length ?? 0) > 0 ||
    (input.controls?.length ?? 0) > 0
  );
}

/** The input with a rating curve's stage (for its outflow) as the downstream boundary; others unchanged. */
export function withRatingStage(input: StructuredFlowInput): StructuredFlowInput {
  if (!input.rating) return input;
  const stage = stageFromRating(input.rating, outflowDischarge(input));
  return { ...input, boundaries: { ...input.boundaries, downstream: { type: 'stage', elevation: stage } } };
}

/** After the run: the rating curve named, the free overfall at the end reported, the jump below each structure placed. */
export function finishStructures(computed: FlowResult, input: StructuredFlowInput, units: Units): FlowResult {
  const result = describeRating(computed, input);
  const structures = [...(result.structures ?? [])];
  if (input.endOverfall) {
    const end = channelEnd(input);
    const q = result.stations[result.stations.length - 1]?.discharge ?? outflowDischarge({ ...input, discharge: result.discharge });
    structures.push(endOverfallResult(input.endOverfall, end.section, end.bedElevation, q, units));
  }
  const placed = withJumpPositions({ ...result, structures }, input.apronLengths ?? new Map());
  return placed.length > 0 ? { ...result, structures: placed } : result;
}
