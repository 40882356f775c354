/**
 * Sensitivity of the profile to roughness and discharge: the varied cases of variation.ts are run through the
 * same model, and for every flow the result gives, per output station of the base case, the lowest and highest
 * water surface of all cases (the envelope a chart draws as a band), and where the varied cases change the
 * profile types of a reach or move, create or remove a hydraulic jump.
 *
 * The base case is one of the cases, so the band always contains the base profile; the other cases are read
 * at the base case's stations by straight lines between their own output stations.
 */
import { GvfError } from '../core/errors.js';
import type { Model } from '../input/model/types.js';
import type { FlowResult } from '../results/types.js';
import { type ModelRun, type RunOptions, runModel } from '../run.js';
import * as say from './messages.js';
import { sampleProfile, stationRange } from './sample.js';
import { jumpShiftFraction } from './tolerances.js';
import { type SensitivityCase, type Variation, caseRoughness, sensitivityCases, variedDischarge } from './variation.js';

export interface StationEnvelope {
  station: number;
  bedElevation: number;
  base: number;
  low: number;
  high: number;
  /** high − low */
  range: number;
  /** the cases giving the lowest and the highest water surface */
  lowCase: string;
  highCase: string;
}

export interface ProfileTypeChange {
  case: string;
  reach: string;
  base: string[];
  varied: string[];
}

export interface JumpChange {
  case: string;
  /** toe station in the base case (null: no jump there in the base case) */
  base: number | null;
  /** toe station in the varied case (null: the jump does not form) */
  varied: number | null;
  shift: number | null;
}

export interface FlowSensitivity {
  id: string;
  discharge: number;
  stations: StationEnvelope[];
  /** the widest range and where */
  largestRange: { station: number; range: number } | null;
  profileTypeChanges: ProfileTypeChange[];
  jumpChanges: JumpChange[];
  /** every jump toe station of every case, for a quick look at how far the jump wanders */
  jumpToeRange: { lowest: number; highest: number } | null;
  notes: string[];
}

export interface SensitivityCaseResult {
  label: string;
  n: number;
  Q: number;
  computed: boolean;
}

export interface Sensitivity {
  variations: Variation[];
  cases: SensitivityCaseResult[];
  flows: FlowSensitivity[];
  warnings: string[];
}

export interface SensitivityRun {
  sensitivity: Sensitivity;
  base: ModelRun;
  /** the runs of the cases that could be computed, base first */
  runs: { case: SensitivityCase; run: ModelRun }[];
}

export interface SensitivityOptions {
  /** options of every run; an `adjustInput` here (a flow batch's stages) is applied before each case's variation */
  readonly run?: Omit<RunOptions, 'compare' | 'roughnessMultiplier'>;
  /** the base run, when the caller has it already (it must come from the same model and options) */
  readonly base?: ModelRun;
  /** after each case (for progress) */
  readonly onCase?: (done: number, total: number, label: string) => void;
}

const typesOf = (flow: FlowResult, reach: string) => flow.reaches.find((r) => r.id === reach)?.profiles.map((p) => p.type) ?? [];
const toes = (flow: FlowResult) => flow.jumps.map((j) => j.station).filter(Number.isFinite).sort((a, b) => a - b);

/** Jumps of a case against the base: pairs in station order; extra ones appear or vanish. */
function compareJumps(label: string, base: readonly number[], varied: readonly number[], tolerance: number): JumpChange[] {
  const out: JumpChange[] = [];
  const n = Math.max(base.length, varied.length);
  for (let i = 0; i < n; i++) {
    const b = base[i] ?? null;
    const v = varied[i] ?? null;
    if (b !== null && v !== null && Math.abs(v - b) <= tolerance) continue;
    out.push({ case: label, base: b, varied: v, shift: b !== null && v !== null ? v - b : null });
  }
  return out;
}

function flowSensitivity(baseFlow: FlowResult, cases: readonly { case: SensitivityCase; flow: FlowResult }[], unit: string): FlowSensitivity {
  const range = stationRange(baseFlow);
  const tolerance = jumpShiftFraction * (range === null ? 1 : Math.max(range[1] - range[0], 1));
  const stations: StationEnvelope[] = [];
  for (const s of baseFlow.stations) {
    if (!Number.isFinite(s.station) || !Number.isFinite(s.wsel)) continue;
    let low = s.wsel;
    let high = s.wsel;
    let lowCase = 'base';
    let highCase = 'base';
    for (const c of cases) {
      if (c.case.base) continue;
      const w = sampleProfile(c.flow, s.station)?.wsel;
      if (w === undefined || !Number.isFinite(w)) continue;
      if (w < low) [low, lowCase] = [w, c.case.label];
      if (w > high) [high, highCase] = [w, c.case.label];
    }
    stations.push({ station: s.station, bedElevation: s.bedElevation, base: s.wsel, low, high, range: high - low, lowCase, highCase });
  }
  let largestRange: FlowSensitivity['largestRange'] = null;
  for (const e of stations) if (largestRange === null || e.range > largestRange.range) largestRange = { station: e.station, range: e.range };

  const profileTypeChanges: ProfileTypeChange[] = [];
  const jumpChanges: JumpChange[] = [];
  const notes: string[] = [];
  const baseToes = toes(baseFlow);
  const allToes: number[] = [...baseToes];
  for (const c of cases) {
    if (c.case.base) continue;
    for (const reach of baseFlow.reaches) {
      const b = typesOf(baseFlow, reach.id);
      const v = typesOf(c.flow, reach.id);
      if (b.join() !== v.join()) {
        profileTypeChanges.push({ case: c.case.label, reach: reach.id, base: b, varied: v });
        notes.push(say.profileTypesChanged(c.case.label, reach.id, b.join(' then ') || 'none', v.join(' then ') || 'none'));
      }
    }
    const caseToes = toes(c.flow);
    allToes.push(...caseToes);
    for (const j of compareJumps(c.case.label, baseToes, caseToes, tolerance)) {
      jumpChanges.push(j);
      if (j.base !== null && j.varied !== null) notes.push(say.jumpMoved(j.case, j.base, j.varied, unit));
      else if (j.varied !== null) notes.push(say.jumpAppears(j.case, j.varied));
      else if (j.base !== null) notes.push(say.jumpVanishes(j.case, j.base));
    }
  }
  return {
    id: baseFlow.id,
    discharge: baseFlow.discharge,
    stations,
    largestRange,
    profileTypeChanges,
    jumpChanges,
    jumpToeRange: allToes.length === 0 ? null : { lowest: Math.min(...allToes), highest: Math.max(...allToes) },
    notes,
  };
}

/** Run the base and every varied case; envelope, profile-type and jump changes per flow. */
export function sensitivityAnalysis(model: Model, variations: readonly Variation[], options: SensitivityOptions = {}): SensitivityRun {
  const cases = sensitivityCases(variations);
  const warnings: string[] = [];
  const runs: { case: SensitivityCase; run: ModelRun }[] = [];
  const computed: SensitivityCaseResult[] = [];
  cases.forEach((c, i) => {
    let run: ModelRun | undefined;
    if (c.base) run = options.base ?? runModel(model, { ...options.run });
    else {
      try {
        const first = options.run?.adjustInput;
        const roughness = caseRoughness(c);
        run = runModel(model, {
          ...options.run,
          ...(roughness === undefined ? {} : { roughnessMultiplier: roughness }),
          adjustInput: (input, k) => variedDischarge(first === undefined ? input : first(input, k), c),
        });
      } catch (error) {
        // a varied case the physics or the model cannot take (a structure overtopped, a control that cannot
        // hold) is reported and left out of the envelope; the base case must compute
        if (!(error instanceof GvfError)) throw error;
        warnings.push(say.caseFailed(c.label, error.message.split('\n')[0] ?? error.message));
      }
    }
    computed.push({ label: c.label, n: c.n, Q: c.Q, computed: run !== undefined });
    if (run !== undefined) runs.push({ case: c, run });
    options.onCase?.(i + 1, cases.length, c.label);
  });
  const base = runs[0]!.run;
  const unit = model.units === 'US' ? 'ft' : 'm';
  const flows = base.result.flows.map((flow) =>
    flowSensitivity(
      flow,
      runs.flatMap((r) => {
        const f = r.run.result.flows.find((x) => x.id === flow.id);
        return f === undefined ? [] : [{ case: r.case, flow: f }];
      }),
      unit,
    ),
  );
  return { sensitivity: { variations: [...variations], cases: computed, flows, warnings }, base, runs };
}
