/**
 * Assembly of what a model adds to the channel beyond sections and reaches: structures (internal controls),
 * a rating curve or a reservoir at the ends, flow changes and lateral inflow, per flow.
 *
 *   Model.structures ──structureControl──▶ InternalControl (src/structures/controls)
 *   boundaries.downstream rating ──ratingCurve──▶ RatingCurve (inline table, or CSV via readRatingCurve)
 *   boundaries.upstream reservoir / flows[i].poolElevation ──▶ ReservoirSpec
 *   flowChanges, lateralInflow (one number, or one per flow id) ──▶ DischargeChange, LateralInflowInput
 *
 * Problems keep the user's JSON path (`structures[2].station`, `boundaries.downstream.table`).
 */
import path from 'node:path';
import { InputError, type Problem } from './core/errors.js';
import type { Units } from './core/units.js';
import { readModelFile } from './input/csv/paths.js';
import { readRatingCurve } from './input/csv/ratingCurve.js';
import * as msg from './input/model/messages.js';
import type { FlowSpec, FreeOverfallSpec, Model } from './input/model/types.js';
import type { DischargeChange, LateralInflowInput } from './profile/channelFlow.js';
import type { InternalControl, ProfileInput, ReachInput } from './profile/types.js';
import { structureControl } from './structures/controls/index.js';
import type { StructuredFlowInput } from './structures/controls/flow.js';
import { type RatingCurve, ratingCurve } from './structures/rating.js';

export interface StructureAssembleOptions {
  /** the model file, for data files named in it (a rating curve's CSV) */
  readonly modelFile?: string;
  /** read data files outside the model's folder (the CLI's --allow-outside) */
  readonly allowOutside?: boolean;
}

/** What a model's structures and special ends give every flow (built once). */
export interface ModelExtras {
  readonly controls: InternalControl[];
  readonly endOverfall?: FreeOverfallSpec;
  readonly rating?: RatingCurve;
  readonly apronLengths: ReadonlyMap<string, number>;
  readonly structureCaution: boolean;
}

function reachLength(reach: ReachInput): number {
  return reach.kind === 'surveyed' ? reach.nodes[reach.nodes.length - 1]!.station - reach.nodes[0]!.station : reach.length;
}

/** The rating curve of a `{type: 'rating'}` downstream boundary (table inline, or a CSV next to the model). */
export function assembleRating(model: Model, units: Units, options: StructureAssembleOptions): RatingCurve | undefined {
  const down = model.boundaries.downstream;
  if (down?.type !== 'rating') return undefined;
  if (down.table !== undefined) {
    return ratingCurve(down.table.map(([stage, discharge]) => ({ stage, discharge })), 'boundaries.downstream.table');
  }
  const file = down.file!;
  if (options.modelFile === undefined) {
    throw new InputError({ where: 'boundaries.downstream.file', message: 'a rating curve file is read relative to the model file: give the model file (runModel option modelFile)', value: file });
  }
  const read = readModelFile(options.modelFile, file, options.allowOutside === true, 'boundaries.downstream.file');
  const label = path.isAbsolute(file) ? file : path.join(path.dirname(options.modelFile), file);
  const pairs = readRatingCurve(read.text, label, units);
  return ratingCurve(pairs.map(([stage, discharge]) => ({ stage, discharge })), label);
}

/** The structures as internal controls, checked against the channel's extent. */
export function assembleExtras(model: Model, reaches: readonly ReachInput[], units: Units, options: StructureAssembleOptions): ModelExtras {
  const origin = reaches[0]!.kind === 'surveyed' ? reaches[0]!.nodes[0]!.station : 0;
  const end = origin + reaches.reduce((s, r) => s + reachLength(r), 0);
  const merge = (end - origin) * 1e-9;
  const problems: Problem[] = [];
  const controls: InternalControl[] = [];
  let endOverfall: FreeOverfallSpec | undefined;
  const apronLengths = new Map<string, number>();
  const seen: Array<{ id: string; station: number }> = [];
  (model.structures ?? []).forEach((spec, i) => {
    const where = `structures[${i}]`;
    const other = seen.find((s) => Math.abs(s.station - spec.station) <= merge);
    if (other) problems.push({ where: `${where}.station`, message: msg.structuresTooClose(other.id), value: spec.station });
    seen.push({ id: spec.id, station: spec.station });
    if (spec.type === 'free-overfall' && Math.abs(spec.station - end) <= merge) {
      endOverfall = spec;
      if (model.boundaries.downstream !== undefined && model.boundaries.downstream.type !== 'critical') {
        problems.push({ where: 'boundaries.downstream', message: msg.overfallWithBoundary() });
      }
      return;
    }
    if (!(spec.station > origin + merge && spec.station < end - merge)) {
      problems.push({ where: `${where}.station`, message: spec.type === 'free-overfall' ? msg.overfallPlacement(end) : msg.structureOutside(origin, end), value: spec.station });
      return;
    }
    if (spec.type === 'spillway' && spec.apronLength !== undefined) apronLengths.set(spec.id, spec.apronLength);
    try {
      controls.push(structureControl(spec, where, units));
    } catch (error) {
      if (error instanceof InputError) problems.push(...error.problems);
      else throw error;
    }
  });
  if (problems.length > 0) throw new InputError(problems);
  const rating = assembleRating(model, units, options);
  return {
    controls,
    ...(endOverfall ? { endOverfall } : {}),
    ...(rating ? { rating } : {}),
    apronLengths,
    structureCaution: (model.structures ?? []).length > 0,
  };
}

function valueFor(value: number | Record<string, number>, flow: FlowSpec): number {
  return typeof value === 'number' ? value : value[flow.id] ?? 0;
}

/** One flow's engine input with the model's structures, special ends, flow changes and lateral inflow. */
export function structuredFlowInput(model: Model, flow: FlowSpec, base: ProfileInput, extras: ModelExtras): StructuredFlowInput {
  const up = model.boundaries.upstream;
  const down = model.boundaries.downstream;
  const boundaries = {
    ...(up === undefined || up.type === 'reservoir' ? {} : { upstream: up }),
    ...(down === undefined || down.type === 'rating' ? {} : { downstream: down }),
  };
  const dischargeChanges: DischargeChange[] = (model.flowChanges ?? []).map((c) => ({
    station: c.station,
    added: valueFor(c.addedDischarge, flow),
    ...(c.id === undefined ? {} : { id: c.id }),
  })).filter((c) => c.added !== 0);
  const lateralInflow: LateralInflowInput[] = (model.lateralInflow ?? []).map((l) => ({
    from: l.from,
    to: l.to,
    inflowPerLength: valueFor(l.inflowPerLength, flow),
    ...(l.id === undefined ? {} : { id: l.id }),
  }));
  return {
    ...base,
    boundaries,
    // with a reservoir the discharge is found; this placeholder only satisfies the engine's input check
    discharge: flow.discharge ?? 1,
    ...(extras.controls.length > 0 ? { controls: extras.controls } : {}),
    ...(dischargeChanges.length > 0 ? { dischargeChanges } : {}),
    ...(lateralInflow.length > 0 ? { lateralInflow } : {}),
    ...(up?.type === 'reservoir'
      ? { reservoir: { poolElevation: flow.poolElevation ?? up.poolElevation, ...(up.entranceLoss === undefined ? {} : { entranceLoss: up.entranceLoss }) } }
      : {}),
    ...(extras.rating ? { rating: extras.rating } : {}),
    ...(extras.endOverfall ? { endOverfall: extras.endOverfall } : {}),
    ...(extras.apronLengths.size > 0 ? { apronLengths: extras.apronLengths } : {}),
  };
}
