/**
 * runModel: a validated model → the result of every flow, with the intermediate stages kept for inspection.
 *
 *   Model ─1─▶ HydraulicSections ─2─▶ ProfileInput per flow ─3─▶ FlowResult per flow ─4─▶ RunResult
 *                                                                 (─5─▶ method comparison, on request)
 *
 * 1. assembleSections: each named section built through the geometry registry (problems keep their JSON path).
 * 2. assembleProfileInputs: reaches joined upstream to downstream, controls and method per flow.
 * 3. the profile engine computes each flow; surveyed reaches (src/survey) are read from their files first, given
 *    interpolated sections where the accuracy goal needs them, and every flow gets bank elevations, freeboard
 *    and the user's stationing.
 * 4. results gathered with the model's title, units, method and the cautions.
 * 5. with `compare`, all three methods run against a tight-tolerance ODE reference (profile/compare.ts) and the
 *    largest depth difference of each is reported against the accuracy goal.
 *
 * This module sits above the engine (and results) and below output and the CLI.
 */
import { assembleProfileInputs, assembleSections } from './assemble.js';
import { InputError } from './core/errors.js';
import { maxOutputStations } from './input/model/limits.js';
import { tooManyStations } from './input/model/messages.js';
import type { HydraulicSection } from './hydraulics/hydraulicSection.js';
import type { Model } from './input/model/types.js';
import { type ChannelSurvey, computeChannelFlow, loadChannelSurvey } from './survey/channel.js';
import { stationingNote } from './survey/stationing.js';
import { computeModelFlow } from './runStructures.js';
import { structureCaution } from './structures/cautions.js';
import { compareMethods } from './profile/compare.js';
import type { ProfileInput, ProfileMethod } from './profile/types.js';
import type { RunResult } from './results/types.js';
import { screeningCaution } from './runSection.js';

export interface RunOptions {
  /** overrides the model's method */
  readonly method?: ProfileMethod;
  /** overrides the model's output spacing */
  readonly outputSpacing?: number;
  /** also run the other two methods and compare */
  readonly compare?: boolean;
  /**
   * Each reach's roughness multiplier by reach id (src/analysis: calibration, sensitivity; 1 when absent; m > 1
   * rougher). It is applied to the section specs before sections are built: a prismatic reach's section, and
   * every surveyed section of a surveyed reach, so the sections interpolated between them carry it too.
   */
  readonly roughnessMultiplier?: (reachId: string) => number;
  /**
   * Changes each flow's engine input before it is computed (src/analysis: varied discharges, a downstream stage
   * per flow of a batch). The stages and the comparison see the changed inputs. Not for roughness: a surveyed
   * reach's nodes are replaced by its survey's (with interpolated ones) after this, so use roughnessMultiplier.
   */
  readonly adjustInput?: (input: ProfileInput, index: number) => ProfileInput;
  /** called after each flow is computed (the CLI's progress bar) */
  readonly onProgress?: (done: number, total: number, flowId: string) => void;
  /** the model file: surveyed reaches read their files relative to it */
  readonly modelFile?: string;
  /** let surveyed reaches read files outside the model's folder (the CLI's --allow-outside) */
  readonly allowOutside?: boolean;
  /** insert interpolated sections between surveyed ones where the accuracy goal needs them (default true) */
  readonly interpolate?: boolean;
  /** accept unusual roughness in survey files (the CLI's --force) */
  readonly force?: boolean;
}

export interface RunStages {
  readonly model: Model;
  readonly sections: ReadonlyMap<string, HydraulicSection>;
  readonly inputs: readonly ProfileInput[];
  /** the surveyed reaches, read from their files (absent when the model has none) */
  readonly survey?: ChannelSurvey;
}

/** One method against the tight-tolerance ODE reference, for one flow. */
export interface MethodDifference {
  method: ProfileMethod;
  /** largest |depth − reference depth| over the compared output stations */
  largestDifference: number;
  /** where it occurs (null when no station could be compared) */
  station: number | null;
  /** the accuracy goal there (1 mm SI, 0.003 ft US, or 0.1 % of the depth) */
  accuracyGoal: number;
  /** every compared station within its goal */
  withinGoal: boolean;
  /** largest shift of a jump toe from the reference's (null without matching jumps) */
  toeShift: number | null;
}

export interface FlowComparison {
  id: string;
  largestDifference: number;
  withinGoal: boolean;
  methods: MethodDifference[];
}

export interface MethodComparison {
  /** what the methods are compared with */
  reference: string;
  flows: FlowComparison[];
}

export interface ModelRun {
  result: RunResult;
  stages: RunStages;
  comparison?: MethodComparison;
}

export function runModel(model: Model, options: RunOptions = {}): ModelRun {
  const sections = assembleSections(model);
  const survey = loadChannelSurvey(model, sections, options);
  const assembled = assembleProfileInputs(model, sections, survey === undefined ? options : { ...options, surveyReaches: survey.reaches });
  const adjust = options.adjustInput;
  const inputs = adjust === undefined ? assembled : assembled.map((input, i) => adjust(input, i));
  for (const input of inputs) checkOutputSpacing(input, model, options.outputSpacing !== undefined);
  const method = options.method ?? model.method;
  // each flow through the channel: interpolation on surveyed reaches, banks and freeboard, the user's stations
  const computed = inputs.map((input, i) => {
    const flow = computeModelFlow(model, input, survey !== undefined, (prepared) => computeChannelFlow(model, prepared, survey, options));
    options.onProgress?.(i + 1, inputs.length, input.flowId);
    return flow;
  });
  const flows = computed.map((c) => c.result);
  const result: RunResult = {
    ...(model.title === undefined ? {} : { title: model.title }),
    units: model.units,
    method,
    flows,
    cautions: (model.structures ?? []).length > 0 ? [screeningCaution, structureCaution] : [screeningCaution],
  };
  if (survey !== undefined) result.stationing = { direction: survey.stations.direction, note: stationingNote(survey.stations) };
  const computedInputs = computed.map((c) => c.input);
  const run: ModelRun = { result, stages: { model, sections, inputs: computedInputs, ...(survey === undefined ? {} : { survey }) } };
  if (options.compare) run.comparison = compareAll(computedInputs);
  return run;
}

/**
 * An output spacing too fine for the prismatic length would fill memory before a depth is computed: refuse it,
 * naming the smallest spacing allowed (surveyed reaches report at their own stations and do not count).
 */
function checkOutputSpacing(input: ProfileInput, model: Model, fromOverride: boolean): void {
  const spacing = input.outputSpacing;
  if (spacing === undefined) return;
  const length = input.reaches.reduce((sum, r) => sum + (r.kind === 'surveyed' ? 0 : r.length), 0);
  if (!(length / spacing > maxOutputStations)) return;
  // the override is the CLI's --step (the model's own key is checked with the model file)
  const where = fromOverride ? '--step' : 'outputSpacing';
  throw new InputError({ where, message: tooManyStations(spacing, length, model.units === 'US' ? 'ft' : 'm', where), value: spacing });
}

function compareAll(inputs: readonly ProfileInput[]): MethodComparison {
  const flows = inputs.map((input): FlowComparison => {
    const c = compareMethods(input);
    return {
      id: input.flowId,
      largestDifference: c.largestDifference,
      withinGoal: c.withinGoal,
      methods: c.methods.map((m) => ({
        method: m.method,
        largestDifference: m.maxDifference,
        station: Number.isFinite(m.station) ? m.station : null,
        accuracyGoal: m.allowed,
        withinGoal: m.withinGoal,
        toeShift: m.toeShift,
      })),
    };
  });
  return { reference: 'the ODE method at a tight tolerance', flows };
}
