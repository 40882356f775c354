/**
 * runModel: a validated model → the result of every flow, with the intermediate stages kept for inspection.
 *
 *   Model ─1─▶ HydraulicSections ─2─▶ ProfileInput per flow ─3─▶ FlowResult per flow ─4─▶ RunResult
 *                                                                 (─5─▶ method comparison, on request)
 *
 * 1. assembleSections: each named section built through the geometry registry (problems keep their JSON path).
 * 2. assembleProfileInputs: reaches joined upstream to downstream, controls and method per flow.
 * 3. the profile engine computes each flow.
 * 4. results gathered with the model's title, units, method and the cautions.
 * 5. with `compare`, all three methods run against a tight-tolerance ODE reference (profile/compare.ts) and the
 *    largest depth difference of each is reported against the accuracy goal.
 *
 * This module sits above the engine (and results) and below output and the CLI.
 */
import { assembleProfileInputs, assembleSections } from './assemble.js';
import type { HydraulicSection } from './hydraulics/hydraulicSection.js';
import type { Model } from './input/model/types.js';
import { computeProfile } from './profile/engine.js';
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
   * Changes each flow's engine input before it is computed (src/analysis: roughness multipliers, varied
   * discharges, a downstream stage per flow of a batch). The stages and the comparison see the changed inputs.
   */
  readonly adjustInput?: (input: ProfileInput, index: number) => ProfileInput;
  /** called after each flow is computed (the CLI's progress bar) */
  readonly onProgress?: (done: number, total: number, flowId: string) => void;
}

export interface RunStages {
  readonly model: Model;
  readonly sections: ReadonlyMap<string, HydraulicSection>;
  readonly inputs: readonly ProfileInput[];
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
  const assembled = assembleProfileInputs(model, sections, options);
  const adjust = options.adjustInput;
  const inputs = adjust === undefined ? assembled : assembled.map((input, i) => adjust(input, i));
  const method = options.method ?? model.method;
  const flows = inputs.map((input, i) => {
    const flow = computeProfile(input);
    options.onProgress?.(i + 1, inputs.length, input.flowId);
    return flow;
  });
  const result: RunResult = {
    ...(model.title === undefined ? {} : { title: model.title }),
    units: model.units,
    method,
    flows,
    cautions: [screeningCaution],
  };
  const run: ModelRun = { result, stages: { model, sections, inputs } };
  if (options.compare) run.comparison = compareAll(inputs);
  return run;
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
