/**
 * computeChannelProfile: a whole channel whose discharge changes along it — steps at stations (tributaries,
 * inlets, withdrawals) and stretches of lateral inflow — on top of the constant-discharge engine.
 *
 * The engine (engine.ts) computes one discharge. Here the channel is split at every station where the
 * discharge changes; each segment of constant discharge is computed by the engine, each stretch of lateral
 * inflow by spatially varied flow (spatiallyVaried/, momentum form, odex), and the segments are joined with
 * the water surface continuous at each junction (equal depth on both sides: the usual simplification of a
 * junction whose momentum exchange is not modelled; common practice for screening).
 *
 * Joining respects the direction each regime is controlled from (Chow 1959 §9-3; Henderson 1966 §4.3):
 *   1. downstream → upstream: each segment is computed with its downstream end set by the segment below —
 *      the subcritical depth there (the tailwater), or critical depth where the segment below cannot carry
 *      subcritical flow at its entrance — and with no upstream control of its own (the first segment takes the
 *      channel's upstream boundary). The depth its subcritical profile reaches at its entrance is the tailwater
 *      of the segment above. Tailwaters depend only on what lies downstream, so one sweep settles them.
 *   2. upstream → downstream: where a segment delivers supercritical flow at its outlet, the segment below is
 *      computed again with that depth as its (supercritical) upstream control; the engine places the jump by
 *      specific force there, or finds it drowned up to the junction. Outflows depend only on what lies
 *      upstream, so one sweep settles them.
 * Stations, jumps, controls and messages are reported in the channel's own stationing.
 */
import { InputError, type Problem } from '../core/errors.js';
import { criticalDepth } from '../hydraulics/criticalDepth.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import { normalDepth } from '../hydraulics/normalDepth.js';
import type { ControlRecord, FlowResult, JumpResult, ReachResult, StationResult } from '../results/types.js';
import { classifyReach } from './classify.js';
import { computeProfile, type EngineOptions } from './engine.js';
import { jumpAt } from './jump.js';
import { spatiallyVariedFlow } from './spatiallyVaried/spatiallyVariedFlow.js';
import type { SpatiallyVariedDownstream, SpatiallyVariedUpstream } from './spatiallyVaried/types.js';
import type { Boundary, InternalControl, PrismaticReachInput, ProfileInput, ReachInput, SurveyNode } from './types.js';

/** A discharge added at a station (negative: withdrawn); it applies downstream of the station. */
export interface DischargeChange {
  readonly station: number;
  readonly added: number;
  /** a name for messages (e.g. the tributary) */
  readonly id?: string;
}

/** Lateral inflow q* (discharge per unit length) entering between two stations of one prismatic reach. */
export interface LateralInflowInput {
  readonly from: number;
  readonly to: number;
  readonly inflowPerLength: number;
  readonly id?: string;
}

export interface ChannelInput extends ProfileInput {
  /** `discharge` is the discharge entering at the upstream end; these change it downstream */
  readonly dischargeChanges?: readonly DischargeChange[];
  readonly lateralInflow?: readonly LateralInflowInput[];
}

/** A relative band for comparing a depth with critical depth (a depth this close counts as critical). */
const criticalBand = 1e-9;
/** Fraction of the channel length within which two stations are the same. */
const mergeFraction = 1e-9;

interface Segment {
  readonly index: number;
  readonly from: number;
  readonly to: number;
  /** discharge entering the segment */
  readonly discharge: number;
  readonly lateral?: { readonly inflowPerLength: number; readonly reach: PrismaticReachInput; readonly id: string };
  readonly reaches: ReachInput[];
  readonly controls: InternalControl[];
  /** station shift: engine stations + shift = channel stations */
  readonly shift: number;
  readonly bedAtEnd: number;
  /** sections at the two ends, for critical depth checks */
  readonly upstreamSection: HydraulicSection;
  readonly downstreamSection: HydraulicSection;
  /** the discharge leaving the segment */
  readonly outflow: number;
  /** flow changes inside the segment (between its reaches) */
  readonly changes: ReadonlyArray<{ readonly station: number; readonly before: number; readonly after: number }>;
}

function show(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

function reachLength(reach: ReachInput): number {
  return reach.kind === 'surveyed' ? reach.nodes[reach.nodes.length - 1]!.station - reach.nodes[0]!.station : reach.length;
}

/** The discharge changes of a channel input laid out along it, checked; null when the discharge is constant. */
export function hasVaryingDischarge(input: ChannelInput): boolean {
  return (input.dischargeChanges?.length ?? 0) > 0 || (input.lateralInflow?.length ?? 0) > 0;
}

/**
 * Rewrite the station numbers the engine wrote in a message (local to a segment) into channel stations.
 * The engine writes "station X", "stations X to Y" and "stations X and Y".
 */
export function shiftStationsInText(text: string, shift: number): string {
  if (shift === 0) return text;
  const number = String.raw`-?\d+(?:\.\d+)?(?:e[+-]?\d+)?`;
  const re = new RegExp(String.raw`\b(stations?) (${number})(?:( (?:to|and) )(${number}))?`, 'g');
  return text.replace(re, (_m, word: string, a: string, joint: string | undefined, b: string | undefined) => {
    const first = `${word} ${show(Number(a) + shift)}`;
    return joint !== undefined && b !== undefined ? `${first}${joint}${show(Number(b) + shift)}` : first;
  });
}

/** Bed elevation at every reach end (the engine's convention: prismatic beds hang from the one below). */
function reachBeds(input: ProfileInput): { starts: number[]; origin: number; end: number; bedUp: number[]; bedDown: number[] } {
  const reaches = input.reaches;
  const starts: number[] = [];
  let x = reaches[0]!.kind === 'surveyed' ? reaches[0]!.nodes[0]!.station : 0;
  const origin = x;
  for (const r of reaches) {
    starts.push(x);
    x += reachLength(r);
  }
  const bedUp: number[] = [];
  const bedDown: number[] = [];
  let below = input.downstreamBedElevation ?? 0;
  const controls = input.controls ?? [];
  const merge = (x - origin) * mergeFraction;
  for (let k = reaches.length - 1; k >= 0; k--) {
    const r = reaches[k]!;
    if (r.kind === 'surveyed') {
      bedUp[k] = r.nodes[0]!.bedElevation;
      bedDown[k] = r.nodes[r.nodes.length - 1]!.bedElevation;
      below = bedUp[k]!;
      continue;
    }
    const from = starts[k]!;
    const to = from + r.length;
    let bed = below + controls.filter((c) => Math.abs(c.station - to) <= merge).reduce((s, c) => s + (c.bedDrop ?? 0), 0);
    bedDown[k] = bed;
    bed += r.slope * r.length;
    bed += controls.filter((c) => c.station > from + merge && c.station < to - merge).reduce((s, c) => s + (c.bedDrop ?? 0), 0);
    bedUp[k] = bed;
    below = bed;
  }
  return { starts, origin, end: x, bedUp, bedDown };
}

/** Bed elevation at a channel station (prismatic: from the reach's downstream end; surveyed: between nodes). */
function bedAt(input: ProfileInput, beds: ReturnType<typeof reachBeds>, station: number): number {
  const reaches = input.reaches;
  const controls = input.controls ?? [];
  const merge = (beds.end - beds.origin) * mergeFraction;
  for (let k = 0; k < reaches.length; k++) {
    const r = reaches[k]!;
    const from = beds.starts[k]!;
    const to = from + reachLength(r);
    if (station < from - merge || station > to + merge) continue;
    if (r.kind === 'surveyed') {
      const nodes = r.nodes;
      let j = 0;
      while (j < nodes.length - 2 && nodes[j + 1]!.station < station) j++;
      const a = nodes[j]!;
      const b = nodes[j + 1]!;
      return a.bedElevation + ((b.bedElevation - a.bedElevation) * (station - a.station)) / (b.station - a.station);
    }
    const drops = controls.filter((c) => c.station > station + merge && c.station < to - merge).reduce((s, c) => s + (c.bedDrop ?? 0), 0);
    return beds.bedDown[k]! + r.slope * (to - station) + drops;
  }
  return beds.bedDown[reaches.length - 1]!;
}

function sectionAt(input: ProfileInput, beds: ReturnType<typeof reachBeds>, station: number, side: 'upstream' | 'downstream'): HydraulicSection {
  const reaches = input.reaches;
  const merge = (beds.end - beds.origin) * mergeFraction;
  for (let k = 0; k < reaches.length; k++) {
    const r = reaches[k]!;
    const from = beds.starts[k]!;
    const to = from + reachLength(r);
    const inside = side === 'downstream' ? station >= from - merge && station < to - merge : station > from + merge && station <= to + merge;
    if (!inside) continue;
    if (r.kind !== 'surveyed') return r.section;
    let best = r.nodes[0]!;
    for (const n of r.nodes) if (Math.abs(n.station - station) < Math.abs(best.station - station)) best = n;
    return best.section;
  }
  const last = reaches[side === 'downstream' ? reaches.length - 1 : 0]!;
  return last.kind === 'surveyed' ? last.nodes[side === 'downstream' ? last.nodes.length - 1 : 0]!.section : last.section;
}

/** The upstream end of a channel: its station, bed elevation and section (for an entrance from a pool). */
export function channelEntrance(input: ProfileInput): { station: number; bedElevation: number; section: HydraulicSection } {
  const beds = reachBeds(input);
  return { station: beds.origin, bedElevation: bedAt(input, beds, beds.origin), section: sectionAt(input, beds, beds.origin, 'downstream') };
}

/** The downstream end of a channel: its station, bed elevation and section. */
export function channelEnd(input: ProfileInput): { station: number; bedElevation: number; section: HydraulicSection } {
  const beds = reachBeds(input);
  return { station: beds.end, bedElevation: bedAt(input, beds, beds.end), section: sectionAt(input, beds, beds.end, 'upstream') };
}

/** The discharge leaving the channel: the entering discharge, the flow changes and all lateral inflow. */
export function outflowDischarge(input: ChannelInput): number {
  let q = input.discharge;
  for (const c of input.dischargeChanges ?? []) q += c.added;
  for (const l of input.lateralInflow ?? []) q += l.inflowPerLength * (l.to - l.from);
  return q;
}

/** Split the channel at the stations where its discharge changes. */
function segmentsOf(input: ChannelInput): Segment[] {
  const beds = reachBeds(input);
  const { origin, end, starts } = beds;
  const merge = (end - origin) * mergeFraction;
  const problems: Problem[] = [];
  const controls = input.controls ?? [];
  const near = (a: number, b: number) => Math.abs(a - b) <= merge;
  const changes = input.dischargeChanges ?? [];
  const lateral = [...(input.lateralInflow ?? [])].sort((a, b) => a.from - b.from);
  changes.forEach((c, i) => {
    if (!(Number.isFinite(c.station) && c.station > origin + merge && c.station < end - merge)) {
      problems.push({ where: `flowChanges[${i}].station`, message: `a flow change must lie inside the channel (${show(origin)} to ${show(end)}); at the upstream end, add it to the flow's discharge`, value: c.station });
    }
    if (!Number.isFinite(c.added) || c.added === 0) problems.push({ where: `flowChanges[${i}].addedDischarge`, message: 'the added discharge must be a number other than 0 (negative withdraws)', value: c.added });
    if (controls.some((s) => near(s.station, c.station))) {
      problems.push({ where: `flowChanges[${i}].station`, message: 'a flow change cannot sit at a structure; move it just upstream or downstream', value: c.station });
    }
  });
  lateral.forEach((l, i) => {
    const where = `lateralInflow[${i}]`;
    if (!(Number.isFinite(l.from) && Number.isFinite(l.to) && l.to > l.from && l.from >= origin - merge && l.to <= end + merge)) {
      problems.push({ where, message: `a lateral-inflow stretch needs from < to, inside the channel (${show(origin)} to ${show(end)})`, value: [l.from, l.to] });
      return;
    }
    if (!(Number.isFinite(l.inflowPerLength) && l.inflowPerLength >= 0)) {
      problems.push({ where: `${where}.inflowPerLength`, message: 'the inflow per unit length must be a number ≥ 0', value: l.inflowPerLength });
    }
    const k = input.reaches.findIndex((r, j) => l.from >= starts[j]! - merge && l.to <= starts[j]! + reachLength(r) + merge);
    if (k < 0 || input.reaches[k]!.kind === 'surveyed') {
      problems.push({ where, message: 'a lateral-inflow stretch must lie within one prismatic reach (split it at reach ends)', value: [l.from, l.to] });
    }
    if (controls.some((s) => s.station > l.from - merge && s.station < l.to + merge)) {
      problems.push({ where, message: 'a lateral-inflow stretch cannot contain a structure; end it upstream of the structure', value: [l.from, l.to] });
    }
    const previous = lateral[i - 1];
    if (previous && l.from < previous.to - merge) problems.push({ where: `${where}.from`, message: `lateral-inflow stretches must not overlap (the one before ends at ${show(previous.to)})`, value: l.from });
    if (changes.some((c) => c.station > l.from + merge && c.station < l.to - merge)) {
      problems.push({ where, message: 'a flow change cannot lie inside a lateral-inflow stretch', value: [l.from, l.to] });
    }
  });
  if (problems.length > 0) throw new InputError(problems);

  // intervals between every station where the discharge changes; reaches are cut there too
  const cuts = [...new Set([origin, end, ...changes.map((c) => c.station), ...lateral.flatMap((l) => [l.from, l.to])])].sort((a, b) => a - b);
  const bounds: number[] = [];
  for (const c of cuts) if (bounds.length === 0 || c - bounds[bounds.length - 1]! > merge) bounds.push(c);
  bounds[0] = origin;
  bounds[bounds.length - 1] = end;
  interface Interval {
    a: number;
    b: number;
    q: number;
    lat?: LateralInflowInput;
    reaches: ReachInput[];
  }
  const intervals: Interval[] = [];
  let q = input.discharge;
  for (let s = 0; s + 1 < bounds.length; s++) {
    const a = bounds[s]!;
    const b = bounds[s + 1]!;
    changes.forEach((c, i) => {
      if (!near(c.station, a)) return;
      q += c.added;
      if (!(q > 0)) {
        throw new InputError({ where: `flowChanges[${i}].addedDischarge`, message: `the discharge below station ${show(a)} would be ${show(q)}; it must stay above 0`, value: c.added });
      }
    });
    const lat = lateral.find((l) => l.from <= a + merge && l.to >= b - merge);
    intervals.push({ a, b, q, ...(lat ? { lat } : {}), reaches: sliceReaches(input.reaches, starts, a, b, merge).map((r) => ({ ...r, discharge: q })) });
    if (lat) q += lat.inflowPerLength * (b - a);
  }

  // segments: each lateral stretch alone; the intervals between them together (the engine takes a discharge per reach)
  const groups: Interval[][] = [];
  for (const iv of intervals) {
    const previous = groups[groups.length - 1];
    if (previous && !iv.lat && !previous[0]!.lat) previous.push(iv);
    else groups.push([iv]);
  }
  return groups.map((group, index): Segment => {
    const a = group[0]!.a;
    const b = group[group.length - 1]!.b;
    const reaches = group.flatMap((iv) => iv.reaches);
    const first = reaches[0]!;
    const shift = first.kind === 'surveyed' ? 0 : a;
    const local = shift === 0 ? reaches : reaches.map((r) => (r.kind === 'surveyed' ? { ...r, nodes: r.nodes.map((n) => ({ ...n, station: n.station - shift })) } : r));
    const lat = group[0]!.lat;
    const lastQ = group[group.length - 1]!.q;
    return {
      index,
      from: a,
      to: b,
      discharge: group[0]!.q,
      ...(lat ? { lateral: { inflowPerLength: lat.inflowPerLength, reach: first as PrismaticReachInput, id: lat.id ?? `lateral inflow ${show(lat.from)}–${show(lat.to)}` } } : {}),
      reaches: local,
      controls: controls.filter((c) => c.station > a + merge && c.station < b - merge).map((c) => shiftControl(c, shift)),
      shift,
      bedAtEnd: bedAt(input, beds, b),
      upstreamSection: sectionAt(input, beds, a, 'downstream'),
      downstreamSection: sectionAt(input, beds, b, 'upstream'),
      outflow: lat ? lastQ + lat.inflowPerLength * (b - a) : lastQ,
      changes: group.slice(1).map((iv) => ({ station: iv.a, before: intervals[intervals.indexOf(iv) - 1]!.q, after: iv.q })),
    };
  });
}

function shiftControl(control: InternalControl, shift: number): InternalControl {
  if (shift === 0) return control;
  return {
    id: control.id,
    kind: control.kind,
    station: control.station - shift,
    ...(control.bedDrop === undefined ? {} : { bedDrop: control.bedDrop }),
    respond: (ctx) => {
      const response = control.respond({ ...ctx, station: ctx.station + shift });
      return response;
    },
  };
}

/** The reaches (or their parts) between stations a and b; a surveyed reach is cut only at its nodes. */
function sliceReaches(reaches: readonly ReachInput[], starts: readonly number[], a: number, b: number, merge: number): ReachInput[] {
  const out: ReachInput[] = [];
  reaches.forEach((r, k) => {
    const from = starts[k]!;
    const to = from + reachLength(r);
    const lo = Math.max(a, from);
    const hi = Math.min(b, to);
    if (hi - lo <= merge) return;
    if (r.kind === 'surveyed') {
      const nodes: SurveyNode[] = r.nodes.filter((n) => n.station >= lo - merge && n.station <= hi + merge);
      const ok = nodes.length >= 2 && Math.abs(nodes[0]!.station - lo) <= merge && Math.abs(nodes[nodes.length - 1]!.station - hi) <= merge;
      if (!ok) {
        throw new InputError({
          where: 'flowChanges',
          message: `surveyed reach '${r.id}' can be split only at a surveyed section: put the flow change or lateral-inflow end at one of its stations (${show(lo)} or ${show(hi)} is none)`,
          value: [lo, hi],
        });
      }
      out.push({ ...r, nodes });
      return;
    }
    out.push({ kind: 'prismatic', id: r.id, section: r.section, length: hi - lo, slope: r.slope });
  });
  return out;
}

/** The discharge at a channel station of an engine segment (at a flow change: the one below, as the engine reports it). */
function dischargeAt(seg: Segment, station: number): number {
  let x = seg.from;
  let q = seg.discharge;
  for (const r of seg.reaches) {
    q = r.discharge ?? q;
    x += reachLength(r);
    if (station < x - (seg.to - seg.from) * mergeFraction) return q;
  }
  return q;
}

/** What one segment's computation gives the joining. */
interface SegmentRun {
  readonly result: FlowResult;
  /** depth at the entrance and at the outlet */
  readonly first: number;
  readonly last: number;
}

function isBelowCritical(depth: number, yc: number): boolean {
  return depth < yc * (1 - criticalBand);
}

function runEngineSegment(input: ChannelInput, seg: Segment, upstream: Boundary | undefined, downstream: Boundary | undefined, options: EngineOptions): SegmentRun {
  const { dischargeChanges: _c, lateralInflow: _l, ...base } = input;
  const extra = (input.extraStations ?? []).filter((s) => s > seg.from && s < seg.to).map((s) => s - seg.shift);
  const profileInput: ProfileInput = {
    ...base,
    reaches: seg.reaches,
    discharge: seg.discharge,
    boundaries: { ...(upstream ? { upstream } : {}), ...(downstream ? { downstream } : {}) },
    controls: seg.controls,
    downstreamBedElevation: seg.bedAtEnd,
    ...(extra.length > 0 ? { extraStations: extra } : {}),
  };
  const raw = computeProfile(profileInput, options);
  const shifted = shiftResult(raw, seg.shift);
  const result = { ...shifted, stations: shifted.stations.map((st) => ({ ...st, discharge: dischargeAt(seg, st.station) })) };
  const stations = result.stations;
  return { result, first: stations[0]!.depth, last: stations[stations.length - 1]!.depth };
}

function shiftResult(result: FlowResult, shift: number): FlowResult {
  if (shift === 0) return result;
  const text = (t: string) => shiftStationsInText(t, shift);
  return {
    ...result,
    stations: result.stations.map((s) => ({ ...s, station: s.station + shift })),
    reaches: result.reaches.map((r) => ({
      ...r,
      from: r.from + shift,
      to: r.to + shift,
      profiles: r.profiles.map((p) => ({ ...p, from: p.from + shift, to: p.to + shift })),
      ...(r.parts ? { parts: r.parts.map((p) => ({ ...p, from: p.from + shift, to: p.to + shift })) } : {}),
    })),
    jumps: result.jumps.map((j) => ({ ...j, station: j.station + shift })),
    ...(result.structures ? { structures: result.structures.map((s) => ({ ...s, station: s.station + shift, notes: s.notes.map(text) })) } : {}),
    warnings: result.warnings.map(text),
    ...(result.notes ? { notes: result.notes.map(text) } : {}),
    ...(result.controls ? { controls: result.controls.map((c) => ({ ...c, station: c.station + shift, reason: text(c.reason) })) } : {}),
    ...(result.stops ? { stops: result.stops.map((s) => ({ ...s, station: s.station + shift, message: text(s.message) })) } : {}),
  };
}

/** A boundary of the engine's kinds at the downstream end of a lateral stretch, as spatially varied flow takes it. */
function lateralDownstream(seg: Segment, boundary: Boundary | undefined, hs: HydraulicSection): SpatiallyVariedDownstream {
  if (boundary === undefined || boundary.type === 'critical') return { kind: 'critical' };
  if (boundary.type === 'depth') return { kind: 'depth', depth: boundary.depth };
  if (boundary.type === 'stage') return { kind: 'depth', depth: boundary.elevation - seg.bedAtEnd };
  const yn = seg.lateral!.reach.slope > 0 ? normalDepth(hs, seg.outflow, seg.lateral!.reach.slope) : null;
  if (yn === null) {
    throw new InputError({ where: 'boundaries.downstream', message: 'normal depth does not exist at the end of this lateral-inflow stretch; give a depth, a stage or critical depth', value: 'normal' });
  }
  return { kind: 'depth', depth: yn };
}

function runLateralSegment(input: ChannelInput, seg: Segment, upstream: Boundary | undefined, downstream: Boundary | undefined): SegmentRun {
  const lat = seg.lateral!;
  const hs = lat.reach.section;
  const length = seg.to - seg.from;
  const spacing = input.outputSpacing ?? length / 100;
  const count = Math.max(2, Math.ceil(length / spacing - 1e-9));
  const local = Array.from({ length: count + 1 }, (_, i) => (i === count ? length : (length * i) / count));
  for (const s of input.extraStations ?? []) if (s > seg.from && s < seg.to) local.push(s - seg.from);
  local.sort((a, b) => a - b);
  let up: SpatiallyVariedUpstream | undefined;
  if (upstream?.type === 'depth') up = { kind: 'depth', depth: upstream.depth };
  else if (upstream?.type === 'critical') up = { kind: 'critical' };
  const svf = spatiallyVariedFlow({
    section: hs,
    length,
    slope: lat.reach.slope,
    upstreamDischarge: seg.discharge,
    inflow: lat.inflowPerLength,
    downstream: lateralDownstream(seg, downstream, hs),
    ...(up ? { upstream: up } : {}),
    stations: local,
    downstreamBedElevation: seg.bedAtEnd,
  });
  const text = (t: string) => shiftStationsInText(t, seg.from);
  const stations: StationResult[] = svf.stations.map((s) => ({
    station: s.station + seg.from,
    bedElevation: s.bedElevation,
    depth: s.depth,
    wsel: s.wsel,
    energyElevation: s.energyElevation,
    velocity: s.velocity,
    froude: s.froude,
    regime: s.regime,
    reach: lat.reach.id,
    criticalDepth: s.criticalDepth,
    normalDepth: lat.reach.slope > 0 ? normalDepth(hs, s.discharge, lat.reach.slope) : null,
    discharge: s.discharge,
  }));
  if (stations.length === 0) throw new InputError({ where: 'lateralInflow', message: `no spatially varied profile could be computed between stations ${show(seg.from)} and ${show(seg.to)}`, value: [seg.from, seg.to] });
  const jumps: JumpResult[] = [];
  if (svf.jump) {
    const qj = seg.discharge + lat.inflowPerLength * svf.jump.station;
    jumps.push(jumpAt(hs, hs, qj, svf.jump.station + seg.from, svf.jump.upstreamDepth, svf.jump.downstreamDepth));
  }
  const cls = classifyReach(hs, seg.outflow, lat.reach.slope);
  const reach: ReachResult = {
    id: lat.reach.id,
    from: seg.from,
    to: seg.to,
    slopeClass: cls.slopeClass,
    normalDepth: cls.normalDepth,
    criticalDepth: cls.criticalDepth,
    profiles: [],
  };
  const c = svf.control;
  const control: ControlRecord = {
    station: c.station + seg.from,
    kind: `spatially varied flow: ${c.kind}`,
    depth: c.depth,
    regime: c.kind === 'downstream-depth' ? 'subcritical' : c.kind === 'upstream-depth' ? 'supercritical' : 'critical',
    status: 'used',
    reason: text(c.reason),
  };
  const result: FlowResult = {
    id: input.flowId,
    discharge: seg.discharge,
    stations,
    reaches: [reach],
    jumps,
    warnings: svf.warnings.map((w) => `lateral inflow '${lat.id}': ${text(w)}`),
    notes: [
      `Stations ${show(seg.from)} to ${show(seg.to)} receive lateral inflow ${show(lat.inflowPerLength)} per unit length ('${lat.id}'): ${svf.method}; ` +
        `the discharge rises from ${show(seg.discharge)} to ${show(seg.outflow)}. Normal and critical depth given for the reach are at the outflow; profile types are not classified under lateral inflow.`,
      ...svf.cautions.slice(1),
    ],
    controls: [control],
    stops: [],
  };
  return { result, first: stations[0]!.depth, last: stations[stations.length - 1]!.depth };
}

/**
 * The profile of one flow along a channel whose discharge changes at stations and along lateral-inflow
 * stretches (see the module comment). Without changes this is computeProfile itself.
 */
export function computeChannelProfile(input: ChannelInput, options: EngineOptions = {}): FlowResult {
  if (!hasVaryingDischarge(input)) return computeProfile(input, options);
  const segments = segmentsOf(input);
  const last = segments.length - 1;
  const run = (seg: Segment, up: Boundary | undefined, down: Boundary | undefined): SegmentRun =>
    seg.lateral ? runLateralSegment(input, seg, up, down) : runEngineSegment(input, seg, up, down, options);
  const ycAt = (seg: Segment, end: 'upstream' | 'downstream'): number =>
    criticalDepth(end === 'upstream' ? seg.upstreamSection : seg.downstreamSection, end === 'upstream' ? seg.discharge : seg.outflow);

  // 1. downstream → upstream: tailwaters
  const downs: Array<Boundary | undefined> = [];
  const tailRuns: SegmentRun[] = [];
  for (let k = last; k >= 0; k--) {
    const seg = segments[k]!;
    let down: Boundary | undefined;
    if (k === last) down = input.boundaries.downstream;
    else {
      const below = tailRuns[k + 1]!;
      const belowStart = below.result.stations[0]!;
      const yc = ycAt(seg, 'downstream');
      const subcritical = belowStart.regime === 'subcritical' && belowStart.depth > yc * (1 + criticalBand);
      down = subcritical ? { type: 'depth', depth: belowStart.depth } : { type: 'critical' };
    }
    downs[k] = down;
    tailRuns[k] = run(seg, k === 0 ? input.boundaries.upstream : undefined, down);
  }

  // 2. upstream → downstream: supercritical outflows carried into the segment below
  const finals: SegmentRun[] = [tailRuns[0]!];
  const arrivals: Array<'subcritical' | 'supercritical'> = ['subcritical'];
  for (let k = 1; k <= last; k++) {
    const seg = segments[k]!;
    const out = finals[k - 1]!.last;
    if (isBelowCritical(out, ycAt(seg, 'upstream')) && finals[k - 1]!.result.stations[finals[k - 1]!.result.stations.length - 1]!.regime === 'supercritical') {
      finals.push(run(seg, { type: 'depth', depth: out }, downs[k]));
      arrivals.push('supercritical');
    } else {
      finals.push(tailRuns[k]!);
      arrivals.push('subcritical');
    }
  }
  return merge(input, segments, finals, arrivals);
}

function changeNote(input: ChannelInput, at: number, before: number, after: number, arriving: string, why: string): string {
  const change = (input.dischargeChanges ?? []).find((c) => Math.abs(c.station - at) <= Math.abs(at) * mergeFraction + 1e-9);
  const reason = change ? `flow change${change.id ? ` '${change.id}'` : ''} adds ${show(change.added)}${why ? `; ${why}` : ''}` : why;
  return before === after
    ? `At station ${show(at)} ${reason}.`
    : `At station ${show(at)} the discharge changes from ${show(before)} to ${show(after)} (${reason}): the water surface is taken continuous across the change (equal depth), the flow arriving ${arriving} there.`;
}

function merge(input: ChannelInput, segments: readonly Segment[], runs: readonly SegmentRun[], arrivals: readonly string[]): FlowResult {
  const last = segments.length - 1;
  const stations: StationResult[] = [];
  const reaches: ReachResult[] = [];
  const jumps: JumpResult[] = [];
  const warnings: string[] = [];
  const notes: string[] = [];
  const controls: ControlRecord[] = [];
  const stops: NonNullable<FlowResult['stops']> = [];
  const structures: NonNullable<FlowResult['structures']> = [];
  let steps = 0;
  runs.forEach((r, k) => {
    const seg = segments[k]!;
    const res = r.result;
    for (const s of res.stations) {
      const previous = stations[stations.length - 1];
      // a junction with the same depth and discharge on both sides is one station (the downstream segment's)
      if (previous && previous.station === s.station && Math.abs(previous.depth - s.depth) <= criticalBand * s.depth && previous.discharge === (s.discharge ?? seg.discharge)) stations.pop();
      stations.push({ ...s, discharge: s.discharge ?? seg.discharge });
    }
    reaches.push(...res.reaches);
    jumps.push(...res.jumps);
    if (res.structures) structures.push(...res.structures);
    stops.push(...(res.stops ?? []));
    steps += res.computation?.internalSteps ?? 0;
    for (const c of res.controls ?? []) {
      const joint = (c.kind === 'upstream boundary' && k > 0) || (c.kind === 'downstream boundary' && k < last);
      if (joint && c.status === 'ignored') continue;
      controls.push(joint ? { ...c, kind: 'flow change (segment end)', reason: `${c.reason}; set by the neighbouring segment (water surface continuous at the change)` } : c);
    }
    // messages that describe a segment end as if it were a channel end are replaced by the junction note below
    notes.push(...(res.notes ?? []).filter((n) => !(k > 0 && n.startsWith('No upstream boundary')) && !(k < last && n.startsWith('No downstream boundary'))));
    warnings.push(...res.warnings.filter((w) => !(k < last && w.startsWith('The tailwater at the downstream end'))));
    for (const change of seg.changes) {
      const above = res.stations.filter((st) => st.station < change.station);
      notes.push(changeNote(input, change.station, change.before, change.after, above[above.length - 1]?.regime ?? 'subcritical', ''));
    }
    if (k > 0) {
      const previous = segments[k - 1]!;
      const at = seg.from;
      const why = seg.lateral ? `lateral inflow '${seg.lateral.id}' begins` : `lateral inflow '${previous.lateral?.id ?? ''}' ends`;
      notes.push(changeNote(input, at, previous.outflow, seg.discharge, arrivals[k]!, why));
    }
  });
  const first = runs[0]!.result;
  const result: FlowResult = {
    id: input.flowId,
    discharge: input.discharge,
    stations,
    reaches,
    jumps,
    warnings,
    notes,
    controls,
    stops,
    ...(first.computation ? { computation: { ...first.computation, internalSteps: steps } } : {}),
  };
  if (structures.length > 0) result.structures = structures;
  return result;
}
