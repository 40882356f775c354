/**
 * Calibration of roughness to observed high-water marks: a multiplier on the model's roughness, one for the
 * whole model or one per reach, fitted by bounded least squares (Levenberg 1944, Marquardt 1963; see
 * leastSquares.ts) so that the computed water surface passes as close as the marks allow:
 *
 *   minimise Σ wᵢ·(WSELᵢ(m) − observedᵢ)²   subject to lower ≤ m ≤ upper   (default 0.5 ≤ m ≤ 2)
 *
 * WSELᵢ(m) is the profile engine's water surface at the mark's station for the mark's flow, read between output
 * stations by straight lines. Each evaluation is a full run of the flows that have marks.
 *
 * Roughness can only move the water where friction sets it. A mark just upstream of a brink, on a stretch held
 * by a structure's headwater or next to a fixed stage sits where ∂WSEL/∂m ≈ 0: such marks are found from the
 * Jacobian at the solution and reported (they carry no information about n), and a multiplier that no mark
 * responds to is left at 1 rather than wandering to a bound.
 */
import { InputError, type Problem } from '../core/errors.js';
import { scaleRoughness } from '../input/model/roughness.js';
import { resolveRoughness } from '../input/model/rules.js';
import { isSurveyReach } from '../input/model/survey.js';
import type { Model } from '../input/model/types.js';
import type { FlowResult } from '../results/types.js';
import { type ModelRun, type RunOptions, runModel } from '../run.js';
import { boundedLeastSquares, jacobianOf, solveLinear } from './leastSquares.js';
import * as say from './messages.js';
import { sampleProfile, stationRange } from './sample.js';
import { atCriticalFraction, insensitiveMarkFraction, jacobianStep, multiplierBounds } from './tolerances.js';

export const calibrationMethod =
  'bounded Levenberg–Marquardt least squares (Levenberg 1944; Marquardt 1963) on roughness multipliers, central-difference Jacobian';

export interface ObservedMark {
  readonly station: number;
  readonly elevation: number;
  /** the model flow that left the mark */
  readonly flow: string;
  /** relative weight (default 1) */
  readonly weight?: number;
  /** where the mark came from, for messages (e.g. "marks.csv:4") */
  readonly where?: string;
}

export interface CalibrationOptions {
  /** one multiplier per reach instead of one for the whole model */
  readonly perReach?: boolean;
  readonly lower?: number;
  readonly upper?: number;
  /** options of every run (method, output spacing, the model file for surveyed reaches...) */
  readonly run?: Omit<RunOptions, 'adjustInput' | 'roughnessMultiplier' | 'compare' | 'onProgress'>;
  /** after each accepted step of the fit */
  readonly onIteration?: (iteration: number, cost: number) => void;
}

export interface SectionRoughness {
  /** the model section's name, or "reach ID (surveyed)" for the sections of a surveyed reach (their roughness varies) */
  section: string;
  /** 'n', 'chezy' or 'ks' */
  key: string;
  /** the model's value (null where it varies across the section) */
  model: number | null;
  /** the value the multiplier gives */
  calibrated: number | null;
}

export interface FittedMultiplier {
  /** the reach id, or "whole model" */
  id: string;
  reaches: string[];
  multiplier: number;
  lower: number;
  upper: number;
  /** false when no mark responds to it (left at 1) */
  fitted: boolean;
  atBound: 'lower' | 'upper' | null;
  /** approximate standard error from the linearised fit (null with no more marks than multipliers) */
  standardError: number | null;
  roughness: SectionRoughness[];
}

export interface MarkResidual {
  station: number;
  flow: string;
  observed: number;
  weight: number;
  /** computed with the model's roughness */
  before: number;
  /** computed with the calibrated roughness */
  computed: number;
  /** computed − observed (positive: the profile lies above the mark) */
  residual: number;
  /** ∂WSEL/∂m, the change of the water surface per unit change of all multipliers at the solution */
  sensitivity: number;
  /** true where roughness cannot move the water here */
  insensitive: boolean;
  depth: number;
  where?: string;
}

export interface Calibration {
  method: string;
  scope: 'whole model' | 'per reach';
  multipliers: FittedMultiplier[];
  marks: MarkResidual[];
  /** root-mean-square of the residuals (unweighted), before and after */
  rmseBefore: number;
  rmse: number;
  /** √(Σw·r² / Σw) */
  weightedRmse: number;
  iterations: number;
  evaluations: number;
  stop: string;
  warnings: string[];
  /** the calibrated run (every flow of the model) */
  run: ModelRun;
}

interface Parameter {
  id: string;
  reaches: string[];
}

const wholeModel = 'whole model';

function parametersOf(model: Model, perReach: boolean): Parameter[] {
  const ids = model.reaches.map((r) => r.id);
  return perReach ? ids.map((id) => ({ id, reaches: [id] })) : [{ id: wholeModel, reaches: ids }];
}

/**
 * The run with the multipliers of `params` at values `m`: through runModel's roughnessMultiplier, which scales
 * the section specs of prismatic and surveyed reaches alike (and so the sections interpolated in a survey).
 */
function runWith(model: Model, params: readonly Parameter[], m: readonly number[], options: CalibrationOptions): ModelRun {
  const of = new Map<string, number>();
  params.forEach((p, j) => p.reaches.forEach((id) => of.set(id, m[j]!)));
  return runModel(model, { ...options.run, roughnessMultiplier: (id) => of.get(id) ?? 1 });
}

function flowOf(run: ModelRun, id: string): FlowResult {
  const flow = run.result.flows.find((f) => f.id === id);
  if (flow === undefined) throw new RangeError(`calibration: flow ${id} was not computed`);
  return flow;
}

/** Every mark must name a model flow and lie on the computed profile. */
function checkMarks(model: Model, marks: readonly ObservedMark[], run: ModelRun): void {
  const problems: Problem[] = [];
  const known = model.flows.map((f) => f.id);
  marks.forEach((mark, i) => {
    const where = mark.where ?? `marks[${i}]`;
    if (!known.includes(mark.flow)) {
      problems.push({ where, message: say.markFlowUnknown(mark.flow, known), value: mark.flow });
      return;
    }
    const flow = flowOf(run, mark.flow);
    const range = stationRange(flow);
    if (range === null || sampleProfile(flow, mark.station) === null) {
      problems.push({ where, message: say.markOutside(mark.station, mark.flow, range?.[0] ?? NaN, range?.[1] ?? NaN), value: mark.station });
    }
  });
  if (problems.length > 0) throw new InputError(problems);
}

function wselsOf(run: ModelRun, marks: readonly ObservedMark[]): number[] {
  return marks.map((mark) => {
    const s = sampleProfile(flowOf(run, mark.flow), mark.station);
    if (s === null) throw new RangeError(`calibration: mark at ${mark.station} fell off the profile`);
    return s.wsel;
  });
}

/** Why a mark's water surface does not respond: critical depth at or next to it, or the control that holds it. */
function whyInsensitive(flow: FlowResult, station: number): string {
  const s = sampleProfile(flow, station);
  if (s !== null && s.criticalDepth !== null && Math.abs(s.depth - s.criticalDepth) <= atCriticalFraction * s.criticalDepth) {
    return say.whyCritical(station);
  }
  // the nearest control in use: downstream of a subcritical mark, upstream of a supercritical one
  const downstream = (flow.stations[0]?.station ?? 0) <= (flow.stations[flow.stations.length - 1]?.station ?? 0);
  const supercritical = s?.regime === 'supercritical';
  let best: { kind: string; station: number; distance: number } | null = null;
  for (const c of flow.controls ?? []) {
    if (c.status !== 'used') continue;
    const ahead = (c.station - station) * (downstream ? 1 : -1);
    if (supercritical ? ahead > 0 : ahead < 0) continue;
    const distance = Math.abs(ahead);
    if (best === null || distance < best.distance) best = { kind: c.kind, station: c.station, distance };
  }
  if (best !== null) return best.kind.includes('critical') ? say.whyCritical(best.station) : say.whyControl(best.kind, best.station);
  return say.whyUnknown();
}

function rms(values: readonly number[], weights?: readonly number[]): number {
  if (values.length === 0) return 0;
  let s = 0;
  let w = 0;
  values.forEach((v, i) => {
    const wi = weights?.[i] ?? 1;
    s += wi * v * v;
    w += wi;
  });
  return Math.sqrt(s / w);
}

function roughnessOf(model: Model, run: ModelRun, reaches: readonly string[], m: number): SectionRoughness[] {
  const out: SectionRoughness[] = [];
  for (const id of reaches) {
    const index = model.reaches.findIndex((r) => r.id === id);
    const reach = model.reaches[index];
    if (reach === undefined) continue;
    // a surveyed reach: its survey's roughness (by station and zone) is multiplied as a whole; the key is that of
    // its sections (Manning's n in the survey files, a model section's own key where a station names one)
    if (isSurveyReach(reach)) {
      const keys = new Set((run.stages.survey?.sites.get(index) ?? []).map((site) => {
        const spec = model.sections[site.sectionId];
        return spec === undefined ? 'n' : (resolveRoughness(spec)?.key ?? 'n');
      }));
      for (const key of keys.size === 0 ? ['n'] : keys) out.push({ section: `reach ${id} (surveyed)`, key, model: null, calibrated: null });
      continue;
    }
    const name = reach.section;
    if (out.some((r) => r.section === name)) continue;
    const spec = model.sections[name];
    const rough = spec === undefined ? undefined : resolveRoughness(spec);
    if (rough === undefined) continue;
    const value = typeof rough.value === 'number' ? rough.value : null;
    const calibrated = value === null ? null : scaleRoughness(value, rough.friction, m);
    out.push({ section: name, key: rough.key, model: value, calibrated });
  }
  return out;
}

/** Approximate standard errors: √diag(σ²·(JᵀJ)⁻¹), σ² = Σr²/(N − P), over the fitted parameters. */
function standardErrors(jacobian: readonly number[][], residuals: readonly number[], fitted: readonly number[]): (number | null)[] {
  const n = residuals.length;
  const p = fitted.length;
  const out = new Array<number | null>(jacobian[0]?.length ?? 0).fill(null);
  if (n <= p || p === 0) return out;
  const sigma2 = residuals.reduce((s, r) => s + r * r, 0) / (n - p);
  const A = fitted.map((j) => fitted.map((k) => jacobian.reduce((s, row) => s + row[j]! * row[k]!, 0)));
  fitted.forEach((j, t) => {
    const e = fitted.map((_, u) => (u === t ? 1 : 0));
    const column = solveLinear(A, e);
    const v = column?.[t];
    out[j] = v !== undefined && v >= 0 ? Math.sqrt(sigma2 * v) : null;
  });
  return out;
}

/** Fit roughness multipliers to high-water marks. */
export function calibrateRoughness(model: Model, marks: readonly ObservedMark[], options: CalibrationOptions = {}): Calibration {
  if (marks.length === 0) throw new InputError({ where: 'marks', message: say.noMarks() });
  const lower = options.lower ?? multiplierBounds.lower;
  const upper = options.upper ?? multiplierBounds.upper;
  const unit = model.units === 'US' ? 'ft' : 'm';
  const warnings: string[] = [];

  // only the flows that left marks are run while fitting
  const markedFlows = new Set(marks.map((m) => m.flow));
  const fitModel: Model = { ...model, flows: model.flows.filter((f) => markedFlows.has(f.id)) };
  const params = parametersOf(model, options.perReach === true);
  const ones = params.map(() => 1);
  const baseRun = runWith(model, params, ones, options);
  checkMarks(model, marks, baseRun);

  const weights = marks.map((m) => m.weight ?? 1);
  const roots = weights.map(Math.sqrt);
  const observed = marks.map((m) => m.elevation);
  const before = wselsOf(baseRun, marks);
  const depths = marks.map((m) => sampleProfile(flowOf(baseRun, m.flow), m.station)!.depth);

  // which multipliers any mark responds to (a first Jacobian at the model's roughness)
  const residualsAt = (active: readonly number[]) => (q: readonly number[]) => {
    const m = [...ones];
    active.forEach((j, t) => (m[j] = q[t]!));
    const w = wselsOf(runWith(fitModel, params, m, options), marks);
    return w.map((v, i) => roots[i]! * (v - observed[i]!));
  };
  const all = params.map((_, j) => j);
  const lowers = params.map(() => lower);
  const uppers = params.map(() => upper);
  const jacobianAt = (q: readonly number[]) => {
    const f = residualsAt(all);
    return jacobianOf(f, q, f(q), lowers, uppers, jacobianStep);
  };
  const probe = jacobianAt(ones);
  const responds = all.filter((j) => marks.some((_, i) => Math.abs(probe.jacobian[i]![j]! / roots[i]!) >= insensitiveMarkFraction * depths[i]!));
  for (const j of all) if (!responds.includes(j)) warnings.push(say.parameterNotFitted(params[j]!.id));

  let evaluations = probe.evaluations + 1;
  let iterations = 0;
  let stop = 'gradient zero';
  const m = [...ones];
  if (responds.length > 0) {
    const fit = boundedLeastSquares(residualsAt(responds), responds.map(() => 1), {
      lower: responds.map(() => lower),
      upper: responds.map(() => upper),
      ...(options.onIteration === undefined ? {} : { onIteration: options.onIteration }),
    });
    responds.forEach((j, t) => (m[j] = fit.parameters[t]!));
    evaluations += fit.evaluations;
    iterations = fit.iterations;
    stop = fit.stop;
  }

  const run = runWith(model, params, m, options);
  evaluations++;
  const computed = wselsOf(run, marks);
  const residuals = computed.map((c, i) => c - observed[i]!);
  // the Jacobian at the solution, for every multiplier (∂WSEL/∂m per mark), for the warnings and standard errors
  const final = jacobianAt(m);
  evaluations += final.evaluations + 1;
  const dW = marks.map((_, i) => params.map((__, j) => final.jacobian[i]![j]! / roots[i]!));
  const errors = standardErrors(final.jacobian, residuals.map((r, i) => roots[i]! * r), responds);
  if (responds.length > 0 && marks.length <= responds.length) warnings.push(say.fewMarks(marks.length, responds.length));

  const markRows: MarkResidual[] = marks.map((mark, i) => {
    const sensitivity = Math.sqrt(dW[i]!.reduce((s, v) => s + v * v, 0));
    const insensitive = sensitivity < insensitiveMarkFraction * depths[i]!;
    if (insensitive) warnings.push(say.insensitiveMark(mark.station, mark.flow, say.shownMultiplierChange * sensitivity, unit, whyInsensitive(flowOf(run, mark.flow), mark.station)));
    return {
      station: mark.station,
      flow: mark.flow,
      observed: mark.elevation,
      weight: weights[i]!,
      before: before[i]!,
      computed: computed[i]!,
      residual: residuals[i]!,
      sensitivity,
      insensitive,
      depth: sampleProfile(flowOf(run, mark.flow), mark.station)!.depth,
      ...(mark.where === undefined ? {} : { where: mark.where }),
    };
  });

  const multipliers: FittedMultiplier[] = params.map((p, j) => {
    const value = m[j]!;
    const atBound = responds.includes(j) ? (value <= lower ? 'lower' : value >= upper ? 'upper' : null) : null;
    if (atBound !== null) warnings.push(say.parameterAtBound(p.id, value, atBound));
    return {
      id: p.id,
      reaches: p.reaches,
      multiplier: value,
      lower,
      upper,
      fitted: responds.includes(j),
      atBound,
      standardError: errors[j] ?? null,
      roughness: roughnessOf(model, run, p.reaches, value),
    };
  });

  return {
    method: calibrationMethod,
    scope: options.perReach === true ? 'per reach' : 'whole model',
    multipliers,
    marks: markRows,
    rmseBefore: rms(before.map((b, i) => b - observed[i]!)),
    rmse: rms(residuals),
    weightedRmse: rms(residuals, weights),
    iterations,
    evaluations,
    stop,
    warnings,
    run,
  };
}
