/**
 * computeProfile: the water-surface profile of one flow along a channel of reaches, with mixed flow.
 *
 * Stages (each returns plain data; see the functions below):
 *   1. layout     reaches → pieces (a prismatic stretch between breaks and internal controls), stations, beds
 *   2. classify   normal depth, critical depth, slope class of each reach
 *   3. subcritical sweep, downstream → upstream: from the downstream control, through breaks (critical depth
 *      at a break into a steep reach unless drowned) and internal controls (headwater for the tailwater);
 *      a profile that runs into critical depth stops there
 *   4. supercritical sweep, upstream → downstream: from the upstream control (and below breaks into steep reaches
 *      and gates), each supercritical profile runs until its specific force falls to that of the subcritical
 *      profile, where the jump toe is located (Chow 1959 §10-7 and §15-1; Henderson 1966 §4.3 and §3.4)
 *   5. assemble   stations with their elements, profile types by zone, jumps, controls, warnings
 */
import { InputError, type Problem } from '../core/errors.js';
import { accuracyFor, jumpToeTolerance } from '../core/tolerances.js';
import { flowState } from '../hydraulics/state.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type {
  ControlRecord,
  FlowResult,
  JumpResult,
  ProfileStop,
  Regime,
  ReachResult,
  StationResult,
  StructureResult,
} from '../results/types.js';
import { classifyReach, profileStretches, type ReachClass } from './classify.js';
import { breakStart, downstreamStart, type EndInfo, upstreamStart } from './controls.js';
import { pointState } from './energy.js';
import { jumpAt, locateToe } from './jump.js';
import { integrators, referenceIntegrator } from './methods.js';
import type { FlowRegime, ProfileIntegrator, StretchProfile, StretchSpec } from './stretch.js';
import type { ControlResponse, InternalControl, PrismaticReachInput, ProfileInput } from './types.js';

/** A prismatic stretch of one reach between junctions (reach breaks or internal controls). */
interface Piece {
  readonly index: number;
  readonly reachIndex: number;
  readonly reach: PrismaticReachInput;
  readonly cls: ReachClass;
  readonly from: number;
  readonly to: number;
  /** ascending, from … to */
  readonly stations: number[];
  /** bed elevation at `to` */
  readonly bedAtEnd: number;
  /** the control at the downstream end of this piece, if any */
  readonly control?: InternalControl;
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
    if (reach.kind === 'surveyed') {
      problems.push({ where: `reaches[${i}]`, message: 'surveyed reaches are not handled by this engine version; describe the reach as prismatic', value: reach.id });
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

function layout(input: ProfileInput, classes: ReachClass[]): Piece[] {
  const reaches = input.reaches as PrismaticReachInput[];
  const total = reaches.reduce((sum, r) => sum + r.length, 0);
  const spacing = input.outputSpacing ?? total / defaultOutputIntervals;
  const merge = total * 1e-9;
  const controls = [...(input.controls ?? [])].sort((a, b) => a.station - b.station);
  controls.forEach((c, i) => {
    if (!(Number.isFinite(c.station) && c.station > merge && c.station < total - merge)) {
      throw new InputError({ where: `controls[${i}].station`, message: `an internal control must lie inside the channel (0 to ${show(total)})`, value: c.station });
    }
  });
  const extra = (input.extraStations ?? []).filter((s) => Number.isFinite(s) && s >= 0 && s <= total);

  // reach extents and beds (from the downstream end up)
  const starts: number[] = [];
  let x = 0;
  for (const r of reaches) {
    starts.push(x);
    x += r.length;
  }

  const pieces: Piece[] = [];
  let bedBelow = input.downstreamBedElevation ?? 0;
  const reversed: Array<Omit<Piece, 'index'>> = [];
  for (let k = reaches.length - 1; k >= 0; k--) {
    const reach = reaches[k]!;
    const from = starts[k]!;
    const to = from + reach.length;
    const n = Math.max(1, Math.ceil(reach.length / spacing - 1e-9));
    const grid: number[] = [];
    for (let i = 0; i <= n; i++) grid.push(i === n ? to : from + (reach.length * i) / n);
    for (const s of extra) if (s > from && s < to) grid.push(s);
    const inside = controls.filter((c) => c.station > from + merge && c.station < to - merge);
    for (const c of inside) grid.push(c.station);
    grid.sort((a, b) => a - b);
    const stations: number[] = [];
    for (const s of grid) if (stations.length === 0 || s - stations[stations.length - 1]! > merge) stations.push(s);
    stations[stations.length - 1] = to;
    // split at controls inside the reach, walking down from the reach's downstream end
    const cuts = [from, ...inside.map((c) => c.station), to];
    const atEnd = controls.find((c) => Math.abs(c.station - to) <= merge);
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
        bedAtEnd,
        ...(control ? { control } : {}),
      });
      bedBelow = bedAtEnd + reach.slope * (b - a);
    }
  }
  reversed.reverse().forEach((p, index) => pieces.push({ ...p, index }));
  // the last piece's downstream end is the channel end: no control there
  return pieces;
}

function bedAt(piece: Piece, station: number): number {
  return piece.bedAtEnd + piece.reach.slope * (piece.to - station);
}

/* ---------- the integrations ---------- */

interface Context {
  readonly input: ProfileInput;
  readonly integrate: ProfileIntegrator;
  readonly refinement: number;
  readonly totalLength: number;
  steps: number;
}

function stretchSpec(ctx: Context, piece: Piece, stations: number[], startDepth: number, regime: FlowRegime): StretchSpec {
  const cls = piece.cls;
  const tolerance = accuracyFor(ctx.input.units.system, Math.min(startDepth, cls.criticalDepth)) / (ctx.refinement * ctx.refinement);
  return {
    hs: piece.reach.section,
    slope: piece.reach.slope,
    discharge: ctx.input.discharge,
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
  return result;
}

/** The depth at station x, integrating from (x0, y0) over one short stretch; critical depth where the profile stops first. */
function depthAt(ctx: Context, piece: Piece, x0: number, y0: number, x: number, regime: FlowRegime): number {
  if (x === x0) return y0;
  const result = run(ctx, stretchSpec(ctx, piece, [x0, x], y0, regime));
  return result.depths.length === 2 ? result.depths[1]! : piece.cls.criticalDepth;
}

function force(hs: HydraulicSection, depth: number, discharge: number): number {
  return pointState(hs, depth, discharge).force;
}

/* ---------- computeProfile ---------- */

export function computeProfile(input: ProfileInput, options: EngineOptions = {}): FlowResult {
  validate(input);
  const q = input.discharge;
  const reaches = input.reaches as PrismaticReachInput[];
  const classes = reaches.map((r) => classifyReach(r.section, q, r.slope));
  const pieces = layout(input, classes);
  const ctx: Context = {
    input,
    integrate: options.reference ? referenceIntegrator : integrators[input.method],
    refinement: input.refinement ?? 1,
    totalLength: reaches.reduce((s, r) => s + r.length, 0),
    steps: 0,
  };
  const warnings: string[] = [];
  const notes: string[] = [];
  const controls: ControlRecord[] = [];
  const stops: ProfileStop[] = [];
  const structures: StructureResult[] = [];
  const jumps: JumpResult[] = [];
  const last = pieces.length - 1;
  const endInfo = (p: Piece, station: number): EndInfo => ({
    reach: p.cls,
    bedElevation: bedAt(p, station),
    station,
    maxDepth: p.reach.section.section.maxDepth,
    show,
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
      downstreamHeld = ds.depth !== null && ds.depth > piece.cls.criticalDepth;
    } else if (piece.control) {
      const below = pieces[p + 1]!;
      const tail = sub[p + 1]![0] ?? null;
      const response = piece.control.respond({
        discharge: q,
        units: input.units,
        station: piece.to,
        upstreamSection: piece.reach.section,
        downstreamSection: below.reach.section,
        upstreamBedElevation: bedAt(piece, piece.to),
        downstreamBedElevation: bedAt(below, below.from),
        tailwaterDepth: tail,
      });
      responses[p] = response;
      if (response.result) structures.push(response.result);
      if (response.notes) notes.push(...response.notes);
      let y = response.upstreamDepth;
      const yc = piece.cls.criticalDepth;
      if (!(Number.isFinite(y) && y > 0)) {
        warnings.push(`The ${piece.control.kind} '${piece.control.id}' at station ${show(piece.to)} gave no usable headwater (${y}); critical depth used.`);
        y = yc;
      } else if (y < yc) {
        warnings.push(
          `The ${piece.control.kind} '${piece.control.id}' at station ${show(piece.to)} gave a headwater depth ${show(y)} below critical depth ${show(yc)}; critical depth used.`,
        );
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
      const b = breakStart(piece.cls, sub[p + 1]![0] ?? null);
      start = b.depth;
      criticalBelow[p] = b.critical;
    }
    if (start === null) continue;
    const order = [...piece.stations].reverse();
    const result = run(ctx, stretchSpec(ctx, piece, order, start, 'subcritical'));
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
  for (let p = 0; p <= last; p++) {
    const piece = pieces[p]!;
    const subs = sub[p]!;
    const stations = piece.stations;
    const yc = piece.cls.criticalDepth;
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
          reason: `the ${above.cls.slopeClass} reach '${above.reach.id}' passes into the ${piece.cls.slopeClass} reach '${piece.reach.id}' through critical depth`,
        });
      }
    }
    if (ys !== null && ys > yc) ys = null; // not a supercritical start in this section
    if (ys === null) {
      regime = 'sub';
      fillSubcritical(p);
      continue;
    }
    const result = run(ctx, stretchSpec(ctx, piece, [...stations], ys, 'supercritical'));
    const sup = result.depths;
    const wins = (i: number): boolean => {
      const s = subs[i];
      if (s === null || s === undefined) return false;
      if (i >= sup.length) return true;
      // strictly greater: two profiles meeting at critical depth (a critical slope) join without a jump
      return force(piece.reach.section, s, q) > force(piece.reach.section, sup[i]!, q) * (1 + 1e-9);
    };
    let i0 = -1;
    for (let i = 0; i < stations.length; i++) {
      if (wins(i)) {
        i0 = i;
        break;
      }
    }
    if (i0 === -1) {
      // supercritical throughout this piece
      for (let i = 0; i < stations.length; i++) {
        if (i < sup.length) final[p]!.push({ station: stations[i]!, depth: sup[i]!, piece: p });
        else final[p]!.push({ station: stations[i]!, depth: yc, piece: p, filled: true });
      }
      if (result.stop) {
        stops.push({
          station: result.stop.station,
          depth: result.stop.depth,
          reason: result.stop.reason,
          direction: 'downstream',
          resolved: false,
          message:
            `The supercritical profile from station ${show(stations[0]!)} runs into critical depth at station ${show(result.stop.station)} and no subcritical profile ` +
            'is there to jump to: a downstream control is needed; depths below it are set to critical depth.',
        });
      }
      regime = 'super';
      carry = sup.length === stations.length ? sup[sup.length - 1]! : yc;
      continue;
    }
    if (i0 > sup.length) {
      // the supercritical profile stopped before reaching the subcritical one: no profile covers the gap
      for (let i = 0; i < stations.length; i++) {
        const gap = i >= sup.length && i < i0;
        const depth = i < sup.length ? sup[i]! : gap ? yc : subs[i]!;
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
      jumps.push({ ...jumpAt(piece.reach.section, piece.reach.section, q, atStart, ys, y2), atControl: true });
      final[p]!.push({ station: atStart, depth: ys, piece: p });
      regime = 'sub';
      fillSubcritical(p);
      continue;
    }
    // the toe lies in (stations[i0−1], stations[i0]]
    const xa = stations[i0 - 1]!;
    const xb = stations[i0]!;
    const ya = sup[i0 - 1]!;
    const yb = subs[i0]!;
    const hs = piece.reach.section;
    const difference = (x: number) =>
      force(hs, depthAt(ctx, piece, xa, ya, x, 'supercritical'), q) - force(hs, depthAt(ctx, piece, xb, yb, x, 'subcritical'), q);
    const toe = locateToe(difference, xa, xb, jumpToeTolerance * ctx.totalLength);
    const y1 = depthAt(ctx, piece, xa, ya, toe, 'supercritical');
    const y2 = depthAt(ctx, piece, xb, yb, toe, 'subcritical');
    jumps.push(jumpAt(hs, hs, q, toe, y1, y2));
    for (let i = 0; i < i0; i++) final[p]!.push({ station: stations[i]!, depth: sup[i]!, piece: p });
    final[p]!.push({ station: toe, depth: y1, piece: p }, { station: toe, depth: y2, piece: p });
    for (let i = i0; i < stations.length; i++) {
      if (stations[i] === toe) continue;
      final[p]!.push({ station: stations[i]!, depth: subs[i]!, piece: p });
    }
    regime = 'sub';
  }
  // a sweep that ends supercritical while a tailwater was given: the jump is swept out
  if (regime === 'super' && downstreamHeld) {
    warnings.push(
      `The tailwater at the downstream end (station ${show(pieces[last]!.to)}) is too low to hold a jump in the channel: the jump is swept out ` +
        'and the flow leaves supercritical.',
    );
  } else if (regime === 'super' && input.boundaries.downstream !== undefined && pieces[last]!.cls.slopeClass !== 'steep') {
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
        final[p]!.push({ station: s, depth: piece.cls.criticalDepth, piece: p, filled: true });
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
      stop.resolved = own.every((e) => !e.filled && e.depth < pieces[e.piece]!.cls.criticalDepth * (1 + 1e-9));
    }
    (stop.resolved ? notes : warnings).push(stop.message);
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
  const stationsOut: StationResult[] = entries.map((e) => stationResult(pieces[e.piece]!, e, q));
  const reachResults: ReachResult[] = reaches.map((reach, k) => {
    const cls = classes[k]!;
    // every piece's own entries, ends included (the break station is shared with the neighbour)
    const own = final.filter((_, p) => pieces[p]!.reachIndex === k).flat();
    const from = pieces.find((p) => p.reachIndex === k)!.from;
    const to = from + reach.length;
    return {
      id: reach.id,
      from,
      to,
      slopeClass: cls.slopeClass,
      normalDepth: cls.normalDepth,
      criticalDepth: cls.criticalDepth,
      profiles: profileStretches(
        cls,
        own.map((e) => e.station),
        own.map((e) => e.depth),
        (d) => accuracyFor(input.units.system, d),
      ),
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

function regimeOf(depth: number, yc: number): Regime {
  if (Math.abs(depth - yc) <= 1e-6 * yc) return 'critical';
  return depth > yc ? 'subcritical' : 'supercritical';
}

function stationResult(piece: Piece, e: Entry, discharge: number): StationResult {
  const hs = piece.reach.section;
  const state = flowState(hs, e.depth, discharge);
  const bed = bedAt(piece, e.station);
  return {
    station: e.station,
    bedElevation: bed,
    depth: e.depth,
    wsel: bed + e.depth,
    energyElevation: bed + state.specificEnergy,
    velocity: state.velocity,
    froude: state.froude,
    regime: regimeOf(e.depth, piece.cls.criticalDepth),
    reach: piece.reach.id,
    criticalDepth: piece.cls.criticalDepth,
    normalDepth: piece.cls.normalDepth,
  };
}
