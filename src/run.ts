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
 * 5. with `compare`, all three methods run and the largest depth difference between them is reported.
 *
 * This module sits above the engine (and results) and below output and the CLI.
 */
import { accuracyFor } from './core/tolerances.js';
import { assembleProfileInputs, assembleSections } from './assemble.js';
import type { HydraulicSection } from './hydraulics/hydraulicSection.js';
import type { Model } from './input/model/types.js';
import { computeProfile } from './profile/engine.js';
import { ProfileMethod, type ProfileInput } from './profile/types.js';
import type { FlowResult, RunResult } from './results/types.js';
import { screeningCaution } from './runSection.js';

export interface RunOptions {
  /** overrides the model's method */
  readonly method?: ProfileMethod;
  /** overrides the model's output spacing */
  readonly outputSpacing?: number;
  /** also run the other two methods and compare */
  readonly compare?: boolean;
}

export interface RunStages {
  readonly model: Model;
  readonly sections: ReadonlyMap<string, HydraulicSection>;
  readonly inputs: readonly ProfileInput[];
}

/** The largest depth difference between any two methods for one flow. */
export interface FlowComparison {
  id: string;
  largestDifference: number;
  station: number;
  between: [ProfileMethod, ProfileMethod];
  /** the accuracy goal at that station's depth (1 mm SI, 0.003 ft US, or 0.1 % of depth) */
  accuracyGoal: number;
  /** true when every compared station lies within its accuracy goal */
  withinGoal: boolean;
  /** the largest shift of a jump toe between methods (0 without jumps) */
  largestToeShift: number;
}

export interface MethodComparison {
  methods: ProfileMethod[];
  flows: FlowComparison[];
}

export interface ModelRun {
  result: RunResult;
  stages: RunStages;
  comparison?: MethodComparison;
}

export function runModel(model: Model, options: RunOptions = {}): ModelRun {
  const sections = assembleSections(model);
  const inputs = assembleProfileInputs(model, sections, options);
  const method = options.method ?? model.method;
  const flows = inputs.map((input) => computeProfile(input));
  const result: RunResult = {
    ...(model.title === undefined ? {} : { title: model.title }),
    units: model.units,
    method,
    flows,
    cautions: [screeningCaution],
  };
  const run: ModelRun = { result, stages: { model, sections, inputs } };
  if (options.compare) run.comparison = compareMethods(inputs, flows, method);
  return run;
}

/** Depth at `station` along a computed profile, linear between output stations (null outside it). */
function depthAt(flow: FlowResult, station: number): number | null {
  const s = flow.stations;
  if (s.length === 0) return null;
  for (let i = 0; i < s.length; i++) {
    const here = s[i]!;
    if (here.station === station) return here.depth;
    const next = s[i + 1];
    if (next !== undefined && here.station < station && station < next.station) {
      const t = (station - here.station) / (next.station - here.station);
      return here.depth + t * (next.depth - here.depth);
    }
  }
  return null;
}

/** Station intervals around jump toes where depth is discontinuous: compared there, a tiny toe shift looks huge. */
function jumpWindows(a: FlowResult, b: FlowResult): Array<[number, number]> {
  const windows: Array<[number, number]> = [];
  const stations = a.stations.map((s) => s.station);
  const around = (t: number): [number, number] => {
    let lo = t;
    let hi = t;
    for (const x of stations) {
      if (x <= t) lo = x;
      if (x >= t) {
        hi = x;
        break;
      }
    }
    return [lo, hi];
  };
  const count = Math.max(a.jumps.length, b.jumps.length);
  for (let i = 0; i < count; i++) {
    const ta = a.jumps[i]?.station;
    const tb = b.jumps[i]?.station;
    const toes = [ta, tb].filter((t): t is number => t !== undefined);
    const lo = around(Math.min(...toes))[0];
    const hi = around(Math.max(...toes))[1];
    windows.push([lo, hi]);
  }
  return windows;
}

function compareMethods(inputs: readonly ProfileInput[], base: readonly FlowResult[], baseMethod: ProfileMethod): MethodComparison {
  const methods = Object.keys(ProfileMethod) as ProfileMethod[];
  const runs = new Map<ProfileMethod, readonly FlowResult[]>([[baseMethod, base]]);
  for (const m of methods) if (!runs.has(m)) runs.set(m, inputs.map((input) => computeProfile({ ...input, method: m })));
  const flows: FlowComparison[] = inputs.map((input, f) => {
    const system = input.units.system;
    const worst: FlowComparison = {
      id: input.flowId,
      largestDifference: 0,
      station: 0,
      between: [methods[0]!, methods[1]!],
      accuracyGoal: accuracyFor(system, 0),
      withinGoal: true,
      largestToeShift: 0,
    };
    for (let a = 0; a < methods.length; a++) {
      for (let b = a + 1; b < methods.length; b++) {
        const fa = runs.get(methods[a]!)![f]!;
        const fb = runs.get(methods[b]!)![f]!;
        const windows = jumpWindows(fa, fb);
        for (let j = 0; j < Math.min(fa.jumps.length, fb.jumps.length); j++) {
          worst.largestToeShift = Math.max(worst.largestToeShift, Math.abs(fa.jumps[j]!.station - fb.jumps[j]!.station));
        }
        for (const st of fa.stations) {
          if (windows.some(([lo, hi]) => st.station >= lo && st.station <= hi)) continue;
          const other = depthAt(fb, st.station);
          if (other === null) continue;
          const diff = Math.abs(st.depth - other);
          if (diff > accuracyFor(system, st.depth)) worst.withinGoal = false;
          if (diff > worst.largestDifference) {
            worst.largestDifference = diff;
            worst.station = st.station;
            worst.between = [methods[a]!, methods[b]!];
            worst.accuracyGoal = accuracyFor(system, st.depth);
          }
        }
      }
    }
    return worst;
  });
  return { methods, flows };
}
