/**
 * computeProfile: the water-surface profile of one flow along a channel of reaches, with mixed flow.
 *
 * Stages (each returns plain data; see the functions below):
 *   1. layout     reaches → pieces (a prismatic stretch between breaks and internal controls, a surveyed reach split
 *                 where a steep interval follows one that is not: the flow passes through critical depth there), stations, beds
 *   2. classify   normal depth, critical depth, slope class of each reach; a surveyed reach interval by interval
 *                 (surveyedClass.ts), its profile types from the class and zone at each place
 *   3. subcritical sweep, downstream → upstream: from the downstream control, through breaks (critical depth
 *      at a break into a steep reach unless drowned) and internal controls (headwater for the tailwater);
 *      a profile that runs into critical depth stops there
 *   4. supercritical sweep, upstream → downstream: from the upstream control (and below breaks into steep reaches
 *      and gates), each supercritical profile runs until its specific force falls to that of the subcritical
 *      profile, where the jump toe is located (Chow 1959 §10-7 and §15-1; Henderson 1966 §4.3 and §3.4)
 *   5. assemble   stations with their elements, profile types by zone, jumps, controls, warnings
 */
import { InputError, NumericalError, type Problem } from '../core/errors.js';
import { accuracyFor, jumpBalanceFraction, jumpToeSubdivisions, jumpToeTolerance, nearCriticalBand } from '../core/tolerances.js';
import { flowState } from '../hydraulics/state.js';
import { requireDepth } from '../hydraulics/depthSearch.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type {
  ControlRecord,
  FlowResult,
  JumpResult,
  ProfileStop,
  ProfileStretch,
  ProfileType,
  Regime,
  ReachPart,
  ReachResult,
  SlopeClass,
  StationResult,
  StructureResult,
} from '../results/types.js';
import { classifyReach, profileStretches, profileStretchesBy, profileType, type ReachClass } from './classify.js';
import { breakStart, downstreamStart, type EndInfo, upstreamStart } from './controls.js';
import { pointState, type PointState } from './energy.js';
import { jumpAt, locateToe } from './jump.js';
import { integrators, referenceIntegrator } from './methods.js';
import type { FlowRegime, ProfileIntegrator, StretchProfile, StretchSpec } from './stretch.js';
import type { ControlResponse, InternalControl, ProfileInput, ReachInput, SurveyNode } from './types.js';
import { flowLength, surveyedStretch } from './surveyed.js';
import { type ConveyanceGrowth, controlBreaks, conveyanceGrowth, distanceFromNormal, intervalClasses, intervalSlope, surveyParts, type SurveyPart } from './surveyedClass.js';
import { normalDepth as normalDepthOf } from '../hydraulics/normalDepth.js';
import { criticalDepth as criticalDepthOf } from '../hydraulics/criticalDepth.js';

/** A stretch of one reach between junctions (reach breaks or internal controls): prismatic, or a surveyed reach. */
interface Piece {
  readonly index: number;
  readonly reachIndex: number;
  readonly reach: ReachInput;
  readonly cls: ReachClass;
  readonly from: number;
  readonly to: number;
  /** ascending, from … to (the nodes of a surveyed reach) */
  readonly stations: number[];
  /** prismatic: the section and slope; surveyed: the piece's first node's section and its mean bed slope */
  readonly section: HydraulicSection;
  readonly slope: number;
  /** bed elevation at `to` */
  readonly bedAtEnd: number;
  /** surveyed reaches: the nodes (one per station); a part of the reach's nodes where it is split at a break */
  readonly nodes?: readonly SurveyNode[];
  /** surveyed reaches: node j's critical depth, worked out on first use and kept (most nodes never need it) */
  readonly critical?: (node: number) => number;
  /** surveyed reaches: the slope class of interval j (nodes j, j + 1) of this piece */
  readonly intervals?: readonly SlopeClass[];
  /** the control at the downstream end of this piece, if any */
  readonly control?: InternalControl;
  readonly discharge: number;
}

interface Entry {
  station: number;
  depth: number;
  piece: number;
  /** true where no profile reached and critical depth was filled in (with a warning) */
  filled?: boolean;
}

export interface EngineOptions {
  /** use the tight-tolerance ODE for every stretch (the reference of compareMethods) */
  readonly reference?: boolean;
}

const defaultOutputIntervals = 100;

function show(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

/* ---------- 1. validation and layout ---------- */

function validate(input: ProfileInput): void {
  const problems: Problem[] = [];
  if (!(Number.isFinite(input.discharge) && input.discharge > 0)) {
    problems.push({ where: 'discharge', message: 'the discharge must be a number > 0', value: input.discharge });
  }
  if (!(input.method in integrators)) {
    problems.push({ where: 'method', message: `unknown method; use one of ${Object.keys(integrators).join(', ')}`, value: input.method });
  }
  if (input.reaches.length === 0) problems.push({ where: 'reaches', message: 'at least one reach is needed', value: input.reaches });
  input.reaches.forEach((reach, i) => {
    if (reach.discharge !== undefined && !(Number.isFinite(reach.discharge) && reach.discharge > 0)) {
      problems.push({ where: `reaches[${i}].discharge`, message: 'the discharge must be a number > 0', value: reach.discharge });
    }
    if (reach.kind === 'surveyed') {
      const nodes = reach.nodes;
      if (nodes.length < 2) problems.push({ where: `reaches[${i}].nodes`, message: 'a surveyed reach needs at least two sections', value: nodes.length });
      nodes.forEach((n, j) => {
        if (!Number.isFinite(n.station) || (j > 0 && !(n.station > nodes[j - 1]!.station))) {
          problems.push({ where: `reaches[${i}].nodes[${j}].station`, message: 'stations must be finite and increase downstream', value: n.station });
        }
        if (!Number.isFinite(n.bedElevation)) problems.push({ where: `reaches[${i}].nodes[${j}].bedElevation`, message: 'the bed elevation must be a finite number', value: n.bedElevation });
        if (n.reachLength !== undefined && !(Number.isFinite(n.reachLength) && n.reachLength > 0)) {
          problems.push({ where: `reaches[${i}].nodes[${j}].reachLength`, message: 'the flow length must be a number > 0', value: n.reachLength });
        }
      });
      return;
    }
    if (!(Number.isFinite(reach.length) && reach.length > 0)) {
      problems.push({ where: `reaches[${i}].length`, message: 'the reach length must be a number > 0', value: reach.length });
    }
    if (!Number.isFinite(reach.slope)) problems.push({ where: `reaches[${i}].slope`, message: 'the bed slope must be a finite number', value: reach.slope });
  });
  if (input.outputSpacing !== undefined && !(Number.isFinite(input.outputSpacing) && input.outputSpacing > 0)) {
    problems.push({ where: 'outputSpacing', message: 'the output spacing must be a number > 0', value: input.outputSpacing });
  }
  if (input.refinement !== undefined && !(Number.isFinite(input.refinement) && input.refinement >= 1)) {
    problems.push({ where: 'refinement', message: 'the refinement factor must be a number ≥ 1', value: input.refinement });
  }
  if (problems.length > 0) throw new InputError(problems);
}

function reachLength(reach: ReachInput): number {
  return reach.kind === 'surveyed' ? reach.nodes[reach.nodes.length - 1]!.station - reach.nodes[0]!.station : reach.length;
}

/**
 * A surveyed reach classed for one discharge: critical depth per node (on first use), each interval's class, its
 * parts of one class and the nodes where a steep interval follows one that is not (internal controls).
 */
interface SurveyInfo {
  readonly nodes: readonly SurveyNode[];
  readonly critical: (node: number) => number;
  readonly classes: readonly SlopeClass[];
  readonly parts: readonly SurveyPart[];
  readonly breaks: readonly number[];
}

function surveyInfo(nodes: readonly SurveyNode[], discharge: number): SurveyInfo {
  const critical = lazyCriticals(nodes, discharge);
  const classes = intervalClasses(nodes, critical, discharge);
  return { nodes, critical, classes, parts: surveyParts(classes), breaks: controlBreaks(classes) };
}

/** The mean bed slope from node a to node b (bed fall over flow length). */
function meanSlope(nodes: readonly SurveyNode[], a: number, b: number): number {
  let length = 0;
  for (let j = a; j < b; j++) length += flowLength(nodes, j);
  return (nodes[a]!.bedElevation - nodes[b]!.bedElevation) / length;
}

/**
 * A surveyed reach's class for its result: its longest part's (by flow length), with normal and critical depth at
 * the part's upstream section on the part's mean slope (one part: the reach's first section and mean slope).
 */
function surveyedReachClass(info: SurveyInfo, discharge: number): ReachClass {
  const nodes = info.nodes;
  let best = info.parts[0]!;
  let longest = -1;
  for (const part of info.parts) {
    let length = 0;
    for (let j = part.first; j < part.last; j++) length += flowLength(nodes, j);
    if (length > longest) {
      longest = length;
      best = part;
    }
  }
  const slope = meanSlope(nodes, best.first, best.last);
  const hs = nodes[best.first]!.section;
  const yc = info.critical(best.first);
  const yn = slope > 0 ? normalDepthOf(hs, discharge, slope) : null;
  return { normalDepth: yn, criticalDepth: yc, slopeClass: best.slopeClass };
}

function layout(input: ProfileInput, classes: ReachClass[], surveys: ReadonlyArray<SurveyInfo | undefined>): Piece[] {
  const reaches = input.reaches;
  // reach extents: surveyed reaches keep their own stations, and must join the reach above
  const starts: number[] = [];
  let x = reaches[0]!.kind === 'surveyed' ? reaches[0]!.nodes[0]!.station : 0;
  const origin = x;
  reaches.forEach((r, k) => {
    if (r.kind === 'surveyed' && Math.abs(r.nodes[0]!.station - x) > 1e-9 * Math.max(1, Math.abs(x))) {
      throw new InputError({
        where: `reaches[${k}].nodes[0].station`,
        message: `a surveyed reach must start where the reach above ends (station ${show(x)})`,
        value: r.nodes[0]!.station,
      });
    }
    starts.push(x);
    x += reachLength(r);
  });
  const end = x;
  const total = end - origin;
  const spacing = input.outputSpacing ?? total / defaultOutputIntervals;
  const merge = total * 1e-9;
  const controls = [...(input.controls ?? [])].sort((a, b) => a.station - b.station);
  controls.forEach((c, i) => {
    if (!(Number.isFinite(c.station) && c.station > origin + merge && c.station < end - merge)) {
      throw new InputError({ where: `controls[${i}].station`, message: `an internal control must lie inside the channel (${show(origin)} to ${show(end)})`, value: c.station });
    }
    const k = starts.findIndex((s0, j) => c.station > s0 + merge && c.station < s0 + reachLength(reaches[j]!) - merge);
    if (k >= 0 && reaches[k]!.kind === 'surveyed') {
      throw new InputError({ where: `controls[${i}].station`, message: 'an internal control inside a surveyed reach must sit at a reach end; split the reach there', value: c.station });
    }
  });
  const extra = (input.extraStations ?? []).filter((s) => Number.isFinite(s) && s >= origin && s <= end);

  const pieces: Piece[] = [];
  let bedBelow = input.downstreamBedElevation ?? 0;
  const reversed: Array<Omit<Piece, 'index'>> = [];
  for (let k = reaches.length - 1; k >= 0; k--) {
    const reach = reaches[k]!;
    const from = starts[k]!;
    const length = reachLength(reach);
    const to = from + length;
    const atEnd = controls.find((c) => Math.abs(c.station - to) <= merge);
    const q = reach.discharge ?? input.discharge;
    if (reach.kind === 'surveyed') {
      // one piece per stretch between internal controls (a steep interval after one that is not), downstream first;
      // neighbouring pieces share the node at the break
      const info = surveys[k]!;
      const nodes = reach.nodes;
      const cuts = [0, ...info.breaks, nodes.length - 1];
      for (let c = cuts.length - 2; c >= 0; c--) {
        const a = cuts[c]!;
        const b = cuts[c + 1]!;
        const own = nodes.slice(a, b + 1);
        reversed.push({
          reachIndex: k,
          reach,
          cls: classes[k]!,
          from: own[0]!.station,
          to: own[own.length - 1]!.station,
          stations: own.map((n) => n.station),
          section: own[0]!.section,
          slope: meanSlope(nodes, a, b),
          bedAtEnd: own[own.length - 1]!.bedElevation,
          nodes: own,
          critical: a === 0 ? info.critical : (j) => info.critical(a + j),
          intervals: info.classes.slice(a, b),
          ...(atEnd && b === nodes.length - 1 ? { control: atEnd } : {}),
          discharge: q,
        });
      }
      bedBelow = nodes[0]!.bedElevation;
      continue;
    }
    const n = Math.max(1, Math.ceil(length / spacing - 1e-9));
    const grid: number[] = [];
    for (let i = 0; i <= n; i++) grid.push(i === n ? to : from + (length * i) / n);
    for (const s of extra) if (s > from && s < to) grid.push(s);
    const inside = controls.filter((c) => c.station > from + merge && c.station < to - merge);
    for (const c of inside) grid.push(c.station);
    grid.sort((a, b) => a - b);
    const stations: number[] = [];
    for (const s of grid) if (stations.length === 0 || s - stations[stations.length - 1]! > merge) stations.push(s);
    stations[stations.length - 1] = to;
    // split at controls inside the reach, walking down from the reach's downstream end
    const cuts = [from, ...inside.map((c) => c.station), to];
    for (let j = cuts.length - 2; j >= 0; j--) {
      const a = cuts[j]!;
      const b = cuts[j + 1]!;
      const control = j === cuts.length - 2 ? atEnd : inside[j];
      const bedAtEnd = bedBelow + (control?.bedDrop ?? 0);
      reversed.push({
        reachIndex: k,
        reach,
        cls: classes[k]!,
        from: a,
        to: b,
        stations: stations.filter((s) => s >= a - merge && s <= b + merge),
        section: reach.section,
        slope: reach.slope,
        bedAtEnd,
        ...(control ? { control } : {}),
        discharge: q,
      });
      bedBelow = bedAtEnd + reach.slope * (b - a);
    }
  }
  reversed.reverse().forEach((p, index) => pieces.push({ ...p, index }));
  return pieces;
}

/** The station where the piece's reach starts. */
function reachStart(piece: Piece): number {
  return piece.reach.kind === 'surveyed' ? piece.reach.nodes[0]!.station : piece.from;
}

/** Critical depth per node for one discharge, each computed on first use. */
function lazyCriticals(nodes: readonly SurveyNode[], discharge: number): (node: number) => number {
  const kept = new Float64Array(nodes.length).fill(NaN);
  return (j) => {
    let yc = kept[j]!;
    if (Number.isNaN(yc)) kept[j] = yc = criticalDepthOf(nodes[j]!.section, discharge);
    return yc;
  };
}

/** The index of the last node at or upstream of `station` (0 … n − 2, so that j + 1 exists); binary search. */
function intervalOf(nodes: readonly SurveyNode[], station: number): number {
  let lo = 0;
  let hi = nodes.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (nodes[mid]!.station < station) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** The index of the node nearest `station` (the upstream one of two equally near). */
function nearestNode(nodes: readonly SurveyNode[], station: number): number {
  if (nodes.length === 1) return 0;
  const j = intervalOf(nodes, station);
  return Math.abs(nodes[j + 1]!.station - station) < Math.abs(nodes[j]!.station - station) ? j + 1 : j;
}

function bedAt(piece: Piece, station: number): number {
  if (piece.nodes) {
    const nodes = piece.nodes;
    const j = intervalOf(nodes, station);
    const a = nodes[j]!;
    const b = nodes[j + 1]!;
    return a.bedElevation + ((b.bedElevation - a.bedElevation) * (station - a.station)) / (b.station - a.station);
  }
  return piece.bedAtEnd + piece.slope * (piece.to - station);
}

/** The section at a station of a piece (a surveyed reach: the nearest node's). */
function sectionAt(piece: Piece, station: number): HydraulicSection {
  if (!piece.nodes) return piece.section;
  return piece.nodes[nearestNode(piece.nodes, station)]!.section;
}

function criticalAt(piece: Piece, station: number): number {
  if (!piece.critical) return piece.cls.criticalDepth;
  return piece.critical(nearestNode(piece.nodes!, station));
}

/**
 * True when `depth` at a station lies below critical depth there. On a surveyed reach the sign of dE/dy at the depth
 * tells it where the flow is clearly away from critical (|dE/dy| ≥ nearCriticalBand), without critical depth.
 */
function belowCritical(piece: Piece, station: number, depth: number, discharge: number, margin = 1): boolean {
  if (piece.critical) {
    const dEdy = pointState(sectionAt(piece, station), depth, discharge).dEdy;
    if (Math.abs(dEdy) >= nearCriticalBand) return dEdy < 0;
  }
  return depth < criticalAt(piece, station) * margin;
}

/**
 * The class at one end of a piece: a surveyed reach uses the end section with the slope of the end interval, and
 * that interval's class (the one its pieces were split by, so a break's two sides agree with the split).
 */
function endClass(piece: Piece, end: 'upstream' | 'downstream'): ReachClass {
  if (!piece.nodes) return piece.cls;
  const discharge = piece.discharge;
  const nodes = piece.nodes;
  const j = end === 'upstream' ? 0 : nodes.length - 2;
  const slope = intervalSlope(nodes, j);
  const node = end === 'upstream' ? nodes[0]! : nodes[nodes.length - 1]!;
  const yc = piece.critical!(end === 'upstream' ? 0 : nodes.length - 1);
  const yn = slope > 0 ? normalDepthOf(node.section, discharge, slope) : null;
  return { normalDepth: yn, criticalDepth: yc, slopeClass: piece.intervals![j]! };
}

/* ---------- the integrations ---------- */

interface Context {
  readonly input: ProfileInput;
  /** per piece and node, the states the surveyed steps balanced there (a sweep each way: at most a few), for the station results */
  readonly states: Array<Array<PointState[] | undefined> | undefined>;
  readonly warnings: string[];
  readonly integrate: ProfileIntegrator;
  readonly refinement: number;
  readonly totalLength: number;
  steps: number;
}

function stretchSpec(ctx: Context, piece: Piece, stations: number[], startDepth: number, regime: FlowRegime): StretchSpec {
  const cls = piece.cls;
  const tolerance = accuracyFor(ctx.input.units.system, Math.min(startDepth, cls.criticalDepth)) / (ctx.refinement * ctx.refinement);
  return {
    hs: piece.section,
    slope: piece.slope,
    discharge: piece.discharge,
    stations,
    startDepth,
    regime,
    criticalDepth: cls.criticalDepth,
    normalDepth: cls.normalDepth,
    criticalSlope: cls.slopeClass === 'critical',
    averaging: ctx.input.frictionAveraging ?? 'conveyance',
    tolerance,
  };
}

function run(ctx: Context, spec: StretchSpec): StretchProfile {
  const result = ctx.integrate(spec);
  ctx.steps += result.steps;
  // a stretch that ends early must say why: a missing depth read as "no profile here" would put a wrong control in
  if (result.depths.length < spec.stations.length && !result.stop) {
    throw new NumericalError(
      `${ctx.input.method} method: the ${spec.regime} profile from station ${show(spec.stations[0]!)} gave depths at ${result.depths.length} of ` +
        `${spec.stations.length} stations without reaching critical depth or a crown`,
    );
  }
  // interpolated output may overshoot a crown by round-off: keep depths inside the section
  const top = spec.hs.section.maxDepth;
  if (Number.isFinite(top)) for (let i = 0; i < result.depths.length; i++) if (result.depths[i]! > top) result.depths[i] = top;
  return result;
}

/**
 * One profile through a piece: the chosen method on a prismatic piece, the node-to-node standard step on a
 * surveyed one (stations set to critical depth there are reported in `ctx.warnings`).
 */
function integratePiece(ctx: Context, piece: Piece, stations: number[], startDepth: number, regime: FlowRegime): StretchProfile {
  if (!piece.nodes) return run(ctx, stretchSpec(ctx, piece, stations, startDepth, regime));
  // the stations are the piece's nodes, upstream to downstream or the reverse
  const n = piece.stations.length;
  const reversed = stations.length > 1 && stations[0]! > stations[1]!;
  const order = stations.map((_, k) => (reversed ? n - 1 - k : k));
  const system = ctx.input.units.system;
  const refinement = ctx.refinement;
  const result = surveyedStretch(
    piece.nodes,
    piece.critical!,
    order,
    startDepth,
    regime,
    piece.discharge,
    ctx.input.frictionAveraging ?? 'conveyance',
    // the accuracy goal's floor: never looser than the goal at the node's critical depth, and it needs no critical depth
    () => accuracyFor(system, 0) / (refinement * refinement),
  );
  ctx.steps += result.steps;
  for (let k = 0; k < result.states.length; k++) rememberState(ctx, piece, order[k]!, result.states[k]!);
  if (result.setToCritical === undefined) return { depths: result.depths, steps: result.steps };
  const j = result.setToCritical;
  return { depths: result.depths, steps: result.steps, stop: { station: piece.stations[j]!, depth: piece.critical!(j), reason: 'critical' } };
}

function rememberState(ctx: Context, piece: Piece, node: number, state: PointState): void {
  const byNode = (ctx.states[piece.index] ??= new Array<PointState[] | undefined>(piece.nodes!.length));
  const list = byNode[node];
  if (list === undefined) byNode[node] = [state];
  else list.push(state);
}

/** A state a surveyed step of this piece balanced at node `node` at exactly this depth, if any. */
function rememberedState(ctx: Context, piece: Piece, node: number, depth: number): PointState | undefined {
  const list = ctx.states[piece.index]?.[node];
  if (list === undefined) return undefined;
  for (const state of list) if (state.depth === depth) return state;
  return undefined;
}

/** A profile over one output interval as a function continuous in x (for the jump toe search). */
interface Curve {
  /** the depth at x between the interval's ends */
  at(x: number): number;
  /** where the profile ran into critical depth (or a crown) inside the interval; beyond it the depth stays there */
  readonly stop?: number;
}

function hermite(t: number, y0: number, y1: number, m0: number, m1: number, h: number): number {
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * h * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * h * m1;
}

/**
 * The profile from (x0, y0) towards x1 as one integration through jumpToeSubdivisions equal sub-intervals, joined by
 * cubic Hermite interpolation with dy/dx from the equation (linear where dy/dx is steep near critical depth), and
 * by y − yc ∝ √(distance) into a critical stop (the form of the profile next to its singular point, Henderson 1966 §4.3).
 * One integration gives a continuous function of x: re-integrating a short stretch for each trial x would not (an
 * adaptive integrator's steps, and so its round-off and truncation errors, change with the end point), and the
 * root finder on the specific-force difference could settle on such a discontinuity instead of the balance.
 */
function profileCurve(ctx: Context, piece: Piece, x0: number, y0: number, x1: number, regime: FlowRegime): Curve {
  const n = jumpToeSubdivisions;
  const xs = Array.from({ length: n + 1 }, (_, k) => (k === n ? x1 : x0 + ((x1 - x0) * k) / n));
  const result = run(ctx, stretchSpec(ctx, piece, xs, y0, regime));
  const ys = result.depths;
  const m = ys.length;
  const q = piece.discharge;
  const gradients = ys.map((y) => {
    const st = pointState(piece.section, y, q);
    return (piece.slope - st.frictionSlope) / st.dEdy;
  });
  const stop = result.stop;
  const span = x1 - x0;
  const at = (x: number): number => {
    const t = (x - x0) / span;
    if (!(t > 0)) return ys[0]!;
    const k = Math.min(n - 1, Math.floor(t * n));
    if (k + 1 < m) {
      const xa = xs[k]!;
      const h = xs[k + 1]! - xa;
      const ya = ys[k]!;
      const yb = ys[k + 1]!;
      const dy = Math.abs(yb - ya);
      const ga = gradients[k]!;
      const gb = gradients[k + 1]!;
      const u = Math.min(1, Math.max(0, (x - xa) / h));
      const smooth = Number.isFinite(ga) && Number.isFinite(gb) && Math.abs(ga * h) <= 3 * dy && Math.abs(gb * h) <= 3 * dy;
      if (!smooth) return ya + u * (yb - ya);
      // a profile on a prismatic reach is monotone (dy/dx keeps its sign within a zone): no overshoot past either end
      return Math.min(Math.max(hermite(u, ya, yb, ga, gb, h), Math.min(ya, yb)), Math.max(ya, yb));
    }
    const yl = ys[m - 1]!;
    if (!stop) return yl;
    const xl = xs[m - 1]!;
    const remaining = (stop.station - x) / (stop.station - xl);
    if (!(remaining > 0)) return stop.depth;
    if (!(remaining < 1)) return yl;
    return stop.depth + (yl - stop.depth) * (stop.reason === 'critical' ? Math.sqrt(remaining) : remaining);
  };
  // a stop at a crown may report its depth a rounding unit above it
  const top = piece.section.section.maxDepth;
  const inside = (x: number) => Math.min(at(x), top);
  return stop ? { at: inside, stop: stop.station } : { at: inside };
}

function force(hs: HydraulicSection, depth: number, discharge: number): number {
  return pointState(hs, depth, discharge).force;
}

/* ---------- computeProfile ---------- */

export function computeProfile(input: ProfileInput, options: EngineOptions = {}): FlowResult {
  validate(input);
  const q = input.discharge;
  const reaches = input.reaches;
  const surveys = reaches.map((r) => (r.kind === 'surveyed' ? surveyInfo(r.nodes, r.discharge ?? q) : undefined));
  const classes = reaches.map((r, k) =>
    r.kind === 'surveyed' ? surveyedReachClass(surveys[k]!, r.discharge ?? q) : classifyReach(r.section, r.discharge ?? q, r.slope),
  );
  const warnings: string[] = [];
  const pieces = layout(input, classes, surveys);
  const ctx: Context = {
    input,
    warnings,
    integrate: options.reference ? referenceIntegrator : integrators[input.method],
    refinement: input.refinement ?? 1,
    totalLength: reaches.reduce((s, r) => s + reachLength(r), 0),
    steps: 0,
    states: [],
  };
  const notes: string[] = [];
  const controls: ControlRecord[] = [];
  const stops: ProfileStop[] = [];
  const structures: StructureResult[] = [];
  const jumps: JumpResult[] = [];
  const last = pieces.length - 1;
  const endInfo = (p: Piece, station: number): EndInfo => ({
    reach: endClass(p, station === p.from ? 'upstream' : 'downstream'),
    bedElevation: bedAt(p, station),
    station,
    maxDepth: sectionAt(p, station).section.maxDepth,
    show,
  });
  pieces.forEach((p) => {
    if (p.nodes && input.method !== 'standard-step' && !options.reference && p.from === reachStart(p)) {
      notes.push(`Surveyed reach '${p.reach.id}' is computed by the standard step node to node (the ${input.method} method needs prismatic reaches).`);
    }
  });

  /* 3. subcritical sweep */
  const sub: Array<Array<number | null>> = pieces.map((p) => p.stations.map(() => null));
  const criticalBelow: boolean[] = pieces.map(() => false);
  const responses: Array<ControlResponse | undefined> = pieces.map(() => undefined);
  let downstreamHeld = false;
  for (let p = last; p >= 0; p--) {
    const piece = pieces[p]!;
    let start: number | null;
    if (p === last) {
      const ds = downstreamStart(input.boundaries.downstream, endInfo(piece, piece.to));
      controls.push(ds.record);
      notes.push(...ds.notes);
      warnings.push(...ds.warnings);
      start = ds.depth;
      downstreamHeld = ds.depth !== null && ds.depth > criticalAt(piece, piece.to);
    } else if (piece.control) {
      const below = pieces[p + 1]!;
      const tail = sub[p + 1]![0] ?? null;
      const response = piece.control.respond({
        discharge: piece.discharge,
        units: input.units,
        station: piece.to,
        upstreamSection: sectionAt(piece, piece.to),
        downstreamSection: sectionAt(below, below.from),
        upstreamBedElevation: bedAt(piece, piece.to),
        downstreamBedElevation: bedAt(below, below.from),
        tailwaterDepth: tail,
      });
      responses[p] = response;
      if (response.result) structures.push(response.result);
      if (response.notes) notes.push(...response.notes);
      let y = response.upstreamDepth;
      const yc = criticalAt(piece, piece.to);
      if (!(Number.isFinite(y) && y > 0)) {
        warnings.push(`The ${piece.control.kind} '${piece.control.id}' at station ${show(piece.to)} gave no usable headwater (${y}); critical depth used.`);
        y = yc;
      } else if (y < yc) {
        // below critical by more than round-off is a structure's mistake: say so
        if (y < yc * (1 - 1e-9)) {
          warnings.push(
            `The ${piece.control.kind} '${piece.control.id}' at station ${show(piece.to)} gave a headwater depth ${show(y)} below critical depth ${show(yc)}; critical depth used.`,
          );
        }
        y = yc;
      }
      controls.push({
        station: piece.to,
        kind: piece.control.kind,
        depth: y,
        regime: y > yc ? 'subcritical' : 'critical',
        status: 'used',
        reason: `headwater of ${piece.control.kind} '${piece.control.id}' for tailwater ${tail === null ? 'none (free outflow)' : show(tail)}`,
      });
      start = y;
    } else {
      const b = breakStart(endClass(piece, 'downstream'), sub[p + 1]![0] ?? null);
      start = b.depth;
      criticalBelow[p] = b.critical;
    }
    if (start === null) continue;
    const order = [...piece.stations].reverse();
    const result = integratePiece(ctx, piece, order, start, 'subcritical');
    const n = piece.stations.length;
    result.depths.forEach((d, k) => (sub[p]![n - 1 - k] = d));
    if (result.stop) {
      stops.push({
        station: result.stop.station,
        depth: result.stop.depth,
        reason: result.stop.reason,
        direction: 'upstream',
        resolved: false,
        message:
          result.stop.reason === 'critical'
            ? `The subcritical profile computed upstream from station ${show(piece.to)} runs into critical depth at station ${show(result.stop.station)}: ` +
              'upstream of it the flow cannot be subcritical; it needs a supercritical profile from an upstream control and a jump, or a control there.'
            : `The subcritical profile computed upstream from station ${show(piece.to)} reaches the top of the section at station ${show(result.stop.station)} (the conduit flows full; pressure flow is not computed here).`,
      });
    }
  }

  /* 4. supercritical sweep with jumps */
  const final: Entry[][] = pieces.map(() => []);
  let regime: 'sub' | 'super' = 'sub';
  let carry = NaN;
  /** the supercritical flow leaving the piece above runs under a subcritical profile that refused it a jump */
  let blockedAbove = false;
  /** where a subcritical profile first refused a jump (reported once) */
  /** jumps held where the subcritical profile begins at critical depth (see toeIn) */
  const held: { station: number; depth: number; critical: number }[] = [];
  for (let p = 0; p <= last; p++) {
    const piece = pieces[p]!;
    const subs = sub[p]!;
    const stations = piece.stations;
    const yc = criticalAt(piece, piece.from);
    const q = piece.discharge;
    let ys: number | null = null;
    let startKind = '';
    if (p === 0) {
      const up = upstreamStart(input.boundaries.upstream, endInfo(piece, piece.from), subs[0] ?? null);
      controls.push(up.record);
      notes.push(...up.notes);
      warnings.push(...up.warnings);
      ys = up.depth;
      startKind = 'the upstream control';
    } else {
      const above = pieces[p - 1]!;
      const response = responses[p - 1];
      if (above.control) {
        if (regime === 'super') {
          warnings.push(
            `Supercritical flow reaches the ${above.control.kind} '${above.control.id}' at station ${show(above.to)} without a jump: ` +
              'its headwater is drowned by the approaching jet; check the structure (the headwater reported assumes subcritical approach).',
          );
        }
        ys = response?.downstreamDepth ?? null;
        startKind = `the ${above.control.kind} '${above.control.id}'`;
      } else if (regime === 'super') {
        ys = carry;
        startKind = '';
      } else if (criticalBelow[p - 1]) {
        ys = Math.min(sub[p - 1]![sub[p - 1]!.length - 1] ?? yc, yc);
        startKind = 'critical depth at the break';
        controls.push({
          station: piece.from,
          kind: 'critical depth at a break',
          depth: ys,
          regime: 'critical',
          status: 'used',
          reason:
            above.reachIndex === piece.reachIndex
              ? `the ${endClass(above, 'downstream').slopeClass} part of surveyed reach '${piece.reach.id}' passes into its ${endClass(piece, 'upstream').slopeClass} part through critical depth`
              : `the ${endClass(above, 'downstream').slopeClass} reach '${above.reach.id}' passes into the ${endClass(piece, 'upstream').slopeClass} reach '${piece.reach.id}' through critical depth`,
        });
      }
    }
    if (ys !== null && ys > yc) ys = null; // not a supercritical start in this section
    if (ys === null) {
      regime = 'sub';
      fillSubcritical(p);
      continue;
    }
    const result = integratePiece(ctx, piece, [...stations], ys, 'supercritical');
    const sup = result.depths;
    const wins = (i: number): boolean => {
      const s = subs[i];
      if (s === null || s === undefined) return false;
      if (i >= sup.length) return true;
      // strictly greater: two profiles meeting at critical depth (a critical slope) join without a jump
      const hsi = sectionAt(piece, stations[i]!);
      return force(hsi, s, q) > force(hsi, sup[i]!, q) * (1 + 1e-9);
    };
    interface Toe {
      readonly toe: number;
      readonly y1: number;
      readonly y2: number;
      readonly hs: HydraulicSection;
      /** held where the subcritical profile begins at critical depth, without a free momentum balance */
      readonly held?: boolean;
    }
    /**
     * The jump in (stations[i−1], stations[i]], where the subcritical profile has overtaken the supercritical one in
     * specific force; null where the subcritical profile begins inside the interval (computed upstream, it runs
     * into critical depth there) already with more force than the supercritical flow: no depth on it is sequent
     * to the supercritical depth, so no jump forms there (with α > 1 the least specific force lies below critical
     * depth, and a supercritical depth can have a sequent depth below critical).
     */
    const toeIn = (i: number): Toe | null => {
      const xa = stations[i - 1]!;
      const xb = stations[i]!;
      const ya = sup[i - 1]!;
      const yb = subs[i]!;
      const before = subs[i - 1] ?? null;
      if (piece.nodes) {
        // between surveyed sections: where the linearly interpolated specific-force difference vanishes
        const hsA = sectionAt(piece, xa);
        const da = force(hsA, ya, q) - force(hsA, before ?? criticalAt(piece, xa), q);
        if (before === null && !(da > 0)) {
          // held where the subcritical profile begins: at xb, the node it was set to critical depth at (placing it
          // at xa, a node no subcritical profile reaches, moved the toe by a whole interval as the resolution or the
          // roughness changed); at xa only where the supercritical profile does not reach xb
          if (i < sup.length) {
            const hsB = sectionAt(piece, xb);
            held.push({ station: xb, depth: sup[i]!, critical: yb });
            return { toe: xb, hs: hsB, y1: sup[i]!, y2: yb, held: true };
          }
          held.push({ station: xa, depth: ya, critical: criticalAt(piece, xa) });
          return { toe: xa, hs: hsA, y1: ya, y2: criticalAt(piece, xa), held: true };
        }
        const supB = i < sup.length ? sup[i]! : criticalAt(piece, xb);
        const db = force(sectionAt(piece, xb), supB, q) - force(sectionAt(piece, xb), yb, q);
        const t = da > 0 && db <= 0 ? da / (da - db) : 1;
        const toe = xa + t * (xb - xa);
        const subA = before ?? criticalAt(piece, xa);
        return { toe, hs: sectionAt(piece, toe), y1: ya + t * (supB - ya), y2: subA + t * (yb - subA) };
      }
      const hs = piece.section;
      const supCurve = profileCurve(ctx, piece, xa, ya, xb, 'supercritical');
      const subCurve = profileCurve(ctx, piece, xb, yb, xa, 'subcritical');
      const difference = (x: number) => force(hs, supCurve.at(x), q) - force(hs, subCurve.at(x), q);
      const start = before === null && subCurve.stop !== undefined ? subCurve.stop : xa;
      if (before === null && !(difference(start) > 0)) {
        held.push({ station: start, depth: supCurve.at(start), critical: subCurve.at(start) });
        return { toe: start, hs, y1: supCurve.at(start), y2: subCurve.at(start), held: true };
      }
      const toe = locateToe(difference, start, xb, jumpToeTolerance * ctx.totalLength);
      return { toe, hs, y1: supCurve.at(toe), y2: subCurve.at(toe) };
    };
    // Search downstream for the first such interval. Under a subcritical profile that refused a jump the flow stays
    // supercritical until its own specific force is the larger again (a jump needs the supercritical flow to have
    // the larger force just upstream of the toe), so `blocked` skips the stations where the subcritical one wins.
    let blocked: boolean = p > 0 && regime === 'super' && !pieces[p - 1]!.control && blockedAbove;
    let i0 = -1;
    let found: Toe | null = null;
    for (let i = 0; i < stations.length; i++) {
      if (!wins(i)) {
        if (blocked && i < sup.length && subs[i] !== null && subs[i] !== undefined) blocked = false;
        continue;
      }
      if (blocked) continue;
      if (i === 0 || i > sup.length) {
        i0 = i;
        break;
      }
      found = toeIn(i);
      if (found) {
        i0 = i;
        break;
      }
      blocked = true;
    }
    blockedAbove = false;
    if (i0 === -1) {
      // supercritical throughout this piece
      for (let i = 0; i < stations.length; i++) {
        if (i < sup.length) final[p]!.push({ station: stations[i]!, depth: sup[i]!, piece: p });
        else final[p]!.push({ station: stations[i]!, depth: criticalAt(piece, stations[i]!), piece: p, filled: true });
      }
      if (result.stop) {
        stops.push({
          station: result.stop.station,
          depth: result.stop.depth,
          reason: result.stop.reason,
          direction: 'downstream',
          resolved: false,
          message: blocked
            ? `The supercritical profile from station ${show(stations[0]!)} runs into critical depth at station ${show(result.stop.station)} under the subcritical ` +
              'profile from downstream, which has the larger specific force there but no depth sequent to it: no jump joins them; ' +
              'a control is needed; depths below it are set to critical depth.'
            : `The supercritical profile from station ${show(stations[0]!)} runs into critical depth at station ${show(result.stop.station)} and no subcritical profile ` +
              'is there to jump to: a downstream control is needed; depths below it are set to critical depth.',
        });
      }
      regime = 'super';
      carry = sup.length === stations.length ? sup[sup.length - 1]! : yc;
      blockedAbove = blocked;
      continue;
    }
    if (i0 > sup.length) {
      // the supercritical profile stopped before reaching the subcritical one: no profile covers the gap
      for (let i = 0; i < stations.length; i++) {
        const gap = i >= sup.length && i < i0;
        const depth = i < sup.length ? sup[i]! : gap ? criticalAt(piece, stations[i]!) : subs[i]!;
        final[p]!.push(gap ? { station: stations[i]!, depth, piece: p, filled: true } : { station: stations[i]!, depth, piece: p });
      }
      warnings.push(
        `Between stations ${show(result.stop?.station ?? stations[sup.length - 1]!)} and ${show(stations[i0]!)} of reach '${piece.reach.id}' ` +
          'neither the supercritical profile from upstream (it runs into critical depth) nor the subcritical one from downstream exists: ' +
          'a control is needed there; depths set to critical depth in the gap.',
      );
      if (result.stop) {
        stops.push({
          station: result.stop.station,
          depth: result.stop.depth,
          reason: result.stop.reason,
          direction: 'downstream',
          resolved: false,
          message: `The supercritical profile from station ${show(stations[0]!)} runs into critical depth at station ${show(result.stop.station)}.`,
        });
      }
      regime = 'sub';
      continue;
    }
    if (result.stop && result.stop.station <= stations[i0]!) {
      stops.push({
        station: result.stop.station,
        depth: result.stop.depth,
        reason: result.stop.reason,
        direction: 'downstream',
        resolved: true,
        message: `The supercritical profile from station ${show(stations[0]!)} would reach critical depth at station ${show(result.stop.station)}; a jump forms before it.`,
      });
    }
    if (i0 === 0) {
      const atStart = stations[0]!;
      if (p === 0 || pieces[p - 1]!.control) {
        notes.push(
          `The jump is drowned up to ${startKind} at station ${show(atStart)}: the tailwater is high enough that the flow is subcritical from there on ` +
            `(supercritical depth ${show(ys)} cannot hold).`,
        );
        if (p === 0) {
          const rec = controls.find((c) => c.kind === 'upstream boundary');
          if (rec && rec.status === 'used') {
            rec.status = 'replaced';
            rec.reason += '; drowned by the tailwater (subcritical flow from downstream)';
          }
        }
        regime = 'sub';
        fillSubcritical(p);
        continue;
      }
      // a jump exactly at the break
      const y2 = subs[0]!;
      jumps.push({ ...jumpAt(sectionAt(piece, atStart), sectionAt(piece, atStart), q, atStart, ys, y2), atControl: true });
      final[p]!.push({ station: atStart, depth: ys, piece: p });
      regime = 'sub';
      fillSubcritical(p);
      continue;
    }
    // the toe lies in (stations[i0−1], stations[i0]]
    const { toe, y1, y2, hs } = found!;
    if (found!.held) jumps.push({ ...jumpAt(hs, hs, q, toe, y1, y2), atControl: true });
    else {
      const jump = jumpAt(hs, hs, q, toe, y1, y2);
      // a toe found where the supercritical profile ends at critical depth need not balance: in a section whose α
      // varies with depth the least specific force lies below critical depth, and the two curves can cross there
      // without a momentum balance (the depths' forces differ, or energy would be gained). Said, not hidden: the jump
      // is marked as held (no free balance) and a warning gives the mismatch.
      const m1 = force(hs, y1, q);
      const m2 = force(hs, y2, q);
      // (on a prismatic piece, where the toe is located on the force difference itself; a surveyed toe lies between
      // two sections, its depths interpolated between them, and balances only to that interpolation)
      if (!piece.nodes && (Math.abs(m1 - m2) > jumpBalanceFraction * Math.max(m1, m2) || jump.energyLoss < 0)) {
        jumps.push({ ...jump, atControl: true });
        warnings.push(
          `The jump at station ${show(toe)} joins the supercritical depth ${show(y1)} to the subcritical depth ${show(y2)}, ` +
            `but the two do not balance: their specific forces differ by ${((100 * Math.abs(m1 - m2)) / Math.max(m1, m2)).toPrecision(2)} % and the energy would ` +
            `${jump.energyLoss < 0 ? `rise by ${show(-jump.energyLoss)}` : `fall by ${show(jump.energyLoss)}`} (possible where α varies with depth, as in a compound section): ` +
            'the jump lies about there, but its place and depths are uncertain; a check of the section\'s roughness subdivision is advised.',
        );
      } else jumps.push(jump);
    }
    for (let i = 0; i < i0; i++) final[p]!.push({ station: stations[i]!, depth: sup[i]!, piece: p });
    final[p]!.push({ station: toe, depth: y1, piece: p }, { station: toe, depth: y2, piece: p });
    for (let i = i0; i < stations.length; i++) {
      if (stations[i] === toe) continue;
      final[p]!.push({ station: stations[i]!, depth: subs[i]!, piece: p });
    }
    regime = 'sub';
  }
  for (const r of held) {
    warnings.push(
      `At station ${show(r.station)} the subcritical profile from downstream begins at critical depth ${show(r.critical)} (computed upstream, it runs into critical depth there) ` +
        `with more specific force than the supercritical flow arriving at depth ${show(r.depth)} (possible where α varies with depth): ` +
        'the tailwater would push the jump further upstream, where no subcritical profile exists, so the jump is placed where the subcritical profile begins ' +
        'and its two depths do not balance in specific force; a closer survey or a check of the section\'s roughness subdivision is advised there.',
    );
  }
  // a sweep that ends supercritical while a tailwater was given: the jump is swept out
  if (regime === 'super' && downstreamHeld && blockedAbove) {
    warnings.push(
      `The flow reaches the downstream end (station ${show(pieces[last]!.to)}) supercritical under the subcritical profile of the tailwater, which has the larger ` +
        'specific force but no depth sequent to the supercritical flow: no jump joins them in the channel; a control is needed.',
    );
  } else if (regime === 'super' && downstreamHeld) {
    warnings.push(
      `The tailwater at the downstream end (station ${show(pieces[last]!.to)}) is too low to hold a jump in the channel: the jump is swept out ` +
        'and the flow leaves supercritical.',
    );
  } else if (regime === 'super' && input.boundaries.downstream !== undefined && endClass(pieces[last]!, 'downstream').slopeClass !== 'steep') {
    notes.push(
      `The flow reaches the downstream end (station ${show(pieces[last]!.to)}) still supercritical: the downstream control does not act and any jump forms beyond the channel.`,
    );
  }

  function fillSubcritical(p: number): void {
    const piece = pieces[p]!;
    const subs = sub[p]!;
    let missing = false;
    piece.stations.forEach((s, i) => {
      const d = subs[i];
      if (d === null || d === undefined) {
        missing = true;
        final[p]!.push({ station: s, depth: criticalAt(piece, s), piece: p, filled: true });
      } else final[p]!.push({ station: s, depth: d, piece: p });
    });
    if (missing) {
      warnings.push(
        `No subcritical or supercritical profile reaches part of reach '${piece.reach.id}' (stations ${show(piece.from)} to ${show(piece.to)}): ` +
          'a control is needed there; depths set to critical depth where no profile exists.',
      );
    }
  }

  /* stops: resolved where another profile (or a jump) covers the stations beyond the stop */
  for (const stop of stops) {
    if (stop.direction === 'upstream') {
      const beyond = final.flat().filter((e) => e.station < stop.station && e.station >= stop.station - ctx.totalLength);
      const pieceIndex = pieces.findIndex((pc) => stop.station >= pc.from && stop.station <= pc.to);
      const own = beyond.filter((e) => e.piece === pieceIndex);
      stop.resolved = own.every((e) => !e.filled && belowCritical(pieces[e.piece]!, e.station, e.depth, pieces[e.piece]!.discharge, 1 + 1e-9));
    }
    if (!stop.resolved) warnings.push(stop.message);
    else notes.push(resolvedStopNote(stop, jumps));
  }

  /* 5. assemble */
  const entries: Entry[] = [];
  for (let p = 0; p <= last; p++) {
    for (const e of final[p]!) {
      const previous = entries[entries.length - 1];
      if (previous && previous.piece !== e.piece && previous.station === e.station && !pieces[previous.piece]!.control) {
        // a reach break: one station, belonging to the downstream reach (depth is continuous there)
        if (Math.abs(previous.depth - e.depth) <= 1e-9 * e.depth) entries.pop();
      }
      entries.push(e);
    }
  }
  const stationsOut: StationResult[] = entries.map((e) => stationResult(ctx, pieces[e.piece]!, e, pieces[e.piece]!.discharge));
  const reachResults: ReachResult[] = reaches.map((reach, k) => {
    const cls = classes[k]!;
    // every piece's own entries, ends included (the break station is shared with the neighbour)
    const own = final.filter((_, p) => pieces[p]!.reachIndex === k).flat();
    const from = pieces.find((p) => p.reachIndex === k)!.from;
    const to = from + reachLength(reach);
    const band = (d: number) => accuracyFor(input.units.system, d);
    const info = surveys[k];
    const stationsOwn = own.map((e) => e.station);
    return {
      id: reach.id,
      from,
      to,
      slopeClass: cls.slopeClass,
      normalDepth: cls.normalDepth,
      criticalDepth: cls.criticalDepth,
      ...(reach.discharge !== undefined ? { discharge: reach.discharge } : {}),
      profiles: info
        ? surveyedStretches(info, own, reach.discharge ?? q, band, (e, node) => rememberedState(ctx, pieces[e.piece]!, node, e.depth))
        : profileStretches(cls, stationsOwn, own.map((e) => e.depth), band),
      ...(info ? { parts: reachParts(info) } : {}),
    };
  });
  const result: FlowResult = {
    id: input.flowId,
    discharge: q,
    stations: stationsOut,
    reaches: reachResults,
    jumps,
    warnings,
    notes,
    controls,
    stops,
    computation: {
      method: options.reference ? 'ode (reference tolerance)' : input.method,
      frictionAveraging: input.frictionAveraging ?? 'conveyance',
      accuracyGoal:
        input.units.system === 'SI' ? '1 mm or 0.1 % of depth, whichever is larger' : '0.003 ft or 0.1 % of depth, whichever is larger',
      internalSteps: ctx.steps,
    },
  };
  if (structures.length > 0) result.structures = structures;
  return result;
}

/**
 * The stretches of a surveyed reach's profile (its entries in order): each takes the type from the class of the
 * interval it lies in and the zone of its depths there. An entry's K and d(ln K)/dy are worked out once; its distance
 * from normal depth on the slope of each interval beside it follows from them.
 */
function surveyedStretches(
  info: SurveyInfo,
  own: readonly Entry[],
  discharge: number,
  band: (depth: number) => number,
  /** the state a step balanced at an entry's node and depth, if any (its K and dK/dy are then known) */
  stateOf: (entry: Entry, node: number) => PointState | undefined,
): ProfileStretch[] {
  const nodes = info.nodes;
  const intervals = own.map((e, i) => (i + 1 < own.length ? intervalOf(nodes, 0.5 * (e.station + own[i + 1]!.station)) : -1));
  const near = own.map((e) => nearestNode(nodes, e.station));
  // per entry, K and d(ln K)/dy at its depth, worked out once (the distance from normal depth on each interval's
  // slope then costs two logarithms)
  const growth = new Array<ConveyanceGrowth | undefined>(own.length);
  const growthAt = (i: number): ConveyanceGrowth => {
    const state = stateOf(own[i]!, near[i]!);
    const slope = state?.conveyanceSlope ?? NaN;
    if (state !== undefined && Number.isFinite(slope) && state.conveyance > 0) return { conveyance: state.conveyance, logSlope: slope / state.conveyance };
    return conveyanceGrowth(nodes[near[i]!]!.section, own[i]!.depth, discharge);
  };
  const distance = (i: number, j: number): number | null => {
    const slope = intervalSlope(nodes, j);
    if (!(slope > 0)) return null;
    const g = (growth[i] ??= growthAt(i));
    return distanceFromNormal(g, discharge, slope);
  };
  return profileStretchesBy(
    own.map((e) => e.station),
    (i) => surveyedStretchType(info, own[i]!, own[i + 1]!, near[i]!, near[i + 1]!, intervals[i]!, band, (k) => distance(k === 0 ? i : i + 1, intervals[i]!)),
  );
}

/**
 * The profile type of the stretch between two entries of a surveyed reach, from the class of the interval j it lies
 * in and the zone of its depths there: the mean depth against the mean of the ends' critical depths, and against
 * normal depth on the interval's slope by the mean of the ends' estimated distances from it (surveyedClass.ts).
 */
function surveyedStretchType(
  info: SurveyInfo,
  a: Entry,
  b: Entry,
  ja: number,
  jb: number,
  j: number,
  band: (depth: number) => number,
  /** y − yn at end 0 (a) or 1 (b) on interval j's slope; null without a normal depth */
  distance: (end: 0 | 1) => number | null,
): ProfileType {
  const mean = 0.5 * (a.depth + b.depth);
  const yc = 0.5 * (info.critical(ja) + info.critical(jb));
  const da = distance(0);
  const db = distance(1);
  const yn = da === null || db === null ? null : mean - 0.5 * (da + db);
  const cls: ReachClass = { normalDepth: yn !== null && Number.isFinite(yn) ? yn : null, criticalDepth: yc, slopeClass: info.classes[j]! };
  // a depth infinitely far from normal depth (conveyance not rising with depth): only its side matters
  // (yn = +∞: the depth lies far below normal depth, so normal depth is taken as the largest number; −∞: far above, 0)
  if (yn !== null && !Number.isFinite(yn)) return profileType({ ...cls, normalDepth: yn > 0 ? Number.MAX_VALUE : 0 }, mean, band(mean));
  return profileType(cls, mean, band(mean));
}

/** A surveyed reach's parts of one slope class, upstream first. */
function reachParts(info: SurveyInfo): ReachPart[] {
  const nodes = info.nodes;
  return info.parts.map((part) => ({
    from: nodes[part.first]!.station,
    to: nodes[part.last]!.station,
    slopeClass: part.slopeClass,
    slope: meanSlope(nodes, part.first, part.last),
  }));
}

function regimeOf(depth: number, yc: number): Regime {
  if (Math.abs(depth - yc) <= 1e-6 * yc) return 'critical';
  return depth > yc ? 'subcritical' : 'supercritical';
}

function stationResult(ctx: Context, piece: Piece, e: Entry, discharge: number): StationResult {
  const hs = sectionAt(piece, e.station);
  const bed = bedAt(piece, e.station);
  if (!piece.nodes) {
    const state = flowState(hs, e.depth, discharge);
    const yc = piece.cls.criticalDepth;
    return {
      station: e.station,
      bedElevation: bed,
      depth: e.depth,
      wsel: bed + e.depth,
      energyElevation: bed + state.specificEnergy,
      velocity: state.velocity,
      froude: state.froude,
      regime: regimeOf(e.depth, yc),
      reach: piece.reach.id,
      criticalDepth: yc,
      normalDepth: piece.cls.normalDepth,
    };
  }
  // a surveyed node: the state its step balanced (else evaluated here, inside the section); the regime from dE/dy
  // where the flow is clearly away from critical. Critical depth is reported at every node: it is worked out here
  // (once per node and discharge, kept by piece.critical), as a plain value: results are copied and serialised,
  // which would read any deferred value anyway, and an object with accessors costs far more to make than a plain one
  const j = nearestNode(piece.nodes, e.station);
  const yc = piece.critical!(j);
  const state = rememberedState(ctx, piece, j, e.depth) ?? pointState(hs, requireDepth(hs.section, e.depth, 'flow state'), discharge);
  const g = hs.units.g;
  const dEdy = state.dEdy;
  const regime: Regime = Math.abs(dEdy) >= nearCriticalBand ? (dEdy > 0 ? 'subcritical' : 'supercritical') : regimeOf(e.depth, yc);
  const result: StationResult = {
    station: e.station,
    bedElevation: bed,
    depth: e.depth,
    wsel: bed + e.depth,
    energyElevation: bed + state.energy,
    velocity: discharge / state.area,
    // F = √(αQ²T/(gA³)), as flowState gives it
    froude: Math.sqrt((state.alpha * discharge * discharge * state.topWidth) / (g * state.area * state.area * state.area)),
    regime,
    reach: piece.reach.id,
    criticalDepth: yc,
    normalDepth: null,
  };
  if (piece.nodes[j]!.station === e.station && piece.nodes[j]!.interpolated) result.interpolated = true;
  return result;
}

/** A stop that another profile covers, told as what happened rather than as what is missing. */
function resolvedStopNote(stop: ProfileStop, jumps: readonly JumpResult[]): string {
  if (stop.direction !== 'upstream' || stop.reason !== 'critical') return stop.message;
  const jump = jumps.find((j) => j.station >= stop.station);
  const joined = jump
    ? `the supercritical profile from upstream carries the flow there and a hydraulic jump at station ${show(jump.station)} joins it to the subcritical one.`
    : 'the supercritical profile from upstream carries the flow there.';
  return `The subcritical profile computed upstream reaches critical depth at station ${show(stop.station)}; ${joined}`;
}
