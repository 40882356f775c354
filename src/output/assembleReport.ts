/**
 * A computed run → what the report shows: the ReportInput of report/html.ts (run, echoed inputs, controls,
 * method and accuracy) and the chart specs, each with a file name and a caption.
 *
 *   ModelRun ─1─▶ inputs echoed ─2─▶ controls and notes ─3─▶ method and accuracy
 *            ─4─▶ chart plan: profile · cross-sections · energy–force diagram · rating curve
 *
 * Charts drawn:
 * - one longitudinal profile of every flow (guide lines for every flow when there are at most three,
 *   otherwise for the largest discharge only, so the key stays readable);
 * - a cross-section at each station the user picks (`options.sections`, else the model's `sectionChartsAt`) and
 *   at every structure; with neither, one at the middle of each reach (at most four);
 * - a specific-energy and specific-force diagram at the station and flow the user picks; otherwise at the
 *   toe of a hydraulic jump (largest discharge first), otherwise at the downstream end of the first flow;
 * - a rating curve (stage against discharge) when two or more discharges run, at the upstream end, at each
 *   structure and at the picked stations.
 * With a sensitivity run, the profile also shows each flow's range of water surface as a band, and the report
 * gets a short table of the widest range in each reach, with its station.
 * Pure and deterministic: no clock, no randomness; chart names come from stations and ids.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Sensitivity } from '../analysis/sensitivity.js';
import { HydraulicError } from '../core/errors.js';
import { programName, programVersion } from '../core/version.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type { ReachInput } from '../profile/types.js';
import type { FlowResult, RunResult, StationResult } from '../results/types.js';
import type { ModelRun } from '../run.js';
import { energyForceChart } from './charts/energyForceChart.js';
import { profileChart, type ProfileStructureMark } from './charts/profileChart.js';
import { ratingChart, type RatingSeries } from './charts/ratingChart.js';
import { sectionChart } from './charts/sectionChart.js';
import { lengthUnit } from './charts/style.js';
import { energyForceSamples } from './assemble/energyForceCurves.js';
import { reportInputsOf, reportSettingsHeading, sectionChartsItem } from './assemble/inputsEcho.js';
import { sectionGround } from './assemble/sectionGround.js';
import type { ReportControl, ReportInput, ReportRange, ReportSensitivity, ReportValue } from './report/html.js';

export interface ReportOptions {
  /** stations (in the user's stationing) to draw cross-sections at, besides every structure (default: the model's sectionChartsAt) */
  sections?: readonly number[];
  /** where to draw the specific-energy and specific-force diagram */
  energyAt?: { station: number; flow?: string };
  /** the model file as the user named it (shown in the report header) */
  modelFile?: string;
  /** a sensitivity run over this run (`gvf run --sensitivity`): its range is drawn on the profile and tabled */
  sensitivity?: Sensitivity;
}

export interface PlannedChart {
  /** file name without extension, e.g. "profile" or "section-at-250" */
  name: string;
  caption: string;
  spec: TopLevelSpec;
}

export interface AssembledReport {
  /** everything the report page needs except the rendered charts */
  report: Omit<ReportInput, 'charts'>;
  charts: PlannedChart[];
  /** charts that could not be drawn, with why (printed by the CLI, listed in the report's warnings) */
  notes: string[];
}

/** Most cross-sections drawn by default (one per reach) and most rating curves in one chart. */
const defaultSectionLimit = 4;
const ratingSeriesLimit = 5;
/** Flows that each get their own guide lines on the profile before only the largest keeps them. */
const guideFlowLimit = 3;
/** Prismatic outlines are drawn this much deeper than the highest water surface at the station. */
const outlineHeadroom = 1.25;
/** Stations this close are one station (round-off of summed reach lengths). */
const stationMatch = 1e-9;
/** Two water levels at one station closer than this are drawn as one. */
const levelMatch = 1e-6;

/** Reaches listed per flow in the report's sensitivity table (the widest ranges). */
const widestReaches = 6;

/** Characters of a chart title that fit across the profile chart at the title font. */
const profileTitleLimit = 72;

/** "Job title: longitudinal profile"; a title too long for one line is wrapped at spaces (at most three lines). */
export function profileTitle(run: RunResult): string | string[] {
  const job = run.title?.trim();
  if (!job) return 'Longitudinal profile';
  const both = `${job}: longitudinal profile`;
  if (both.length <= profileTitleLimit) return both;
  if (job.length <= profileTitleLimit) return job;
  const lines: string[] = [];
  let line = '';
  for (const word of job.split(/\s+/)) {
    if (line && `${line} ${word}`.length > profileTitleLimit) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines.length <= 3 ? lines : [...lines.slice(0, 2), lines.slice(2).join(' ')];
}

/** A station for words and file names: at most three decimals, no trailing zeros. */
export function stationText(x: number): string {
  return String(Number(x.toFixed(3)));
}

/** A file-name part: letters, digits, dot, dash and underscore only. */
export function slug(text: string): string {
  const s = text.trim().replace(/[^A-Za-z0-9._-]+/g, '-').replace(/\.{2,}/g, '.').replace(/^[-.]+|[-.]+$/g, '');
  return s === '' ? 'x' : s;
}

/** A station as a file-name part: "250", "54.906", "minus-20". */
export function stationSlug(x: number): string {
  return x < 0 ? `minus-${stationText(-x)}` : stationText(x);
}

/** The station entries of a flow at `station`: the upstream side is the first of a repeated station. */
function entriesAt(flow: FlowResult, station: number): StationResult[] {
  return flow.stations.filter((s) => s.station === station);
}

/** A value along the flow's station table by straight-line interpolation (upstream side at a repeated station). */
function valueAt(flow: FlowResult, station: number, pick: (s: StationResult) => number, side: 'upstream' | 'downstream' = 'upstream'): number | null {
  const exact = entriesAt(flow, station);
  if (exact.length > 0) {
    const e = side === 'upstream' ? exact[0]! : exact[exact.length - 1]!;
    const v = pick(e);
    return Number.isFinite(v) ? v : null;
  }
  const st = flow.stations;
  for (let i = 1; i < st.length; i++) {
    const a = st[i - 1]!;
    const b = st[i]!;
    const lo = Math.min(a.station, b.station);
    const hi = Math.max(a.station, b.station);
    if (station >= lo && station <= hi && b.station !== a.station) {
      const t = (station - a.station) / (b.station - a.station);
      const v = pick(a) + t * (pick(b) - pick(a));
      return Number.isFinite(v) ? v : null;
    }
  }
  return null;
}

/** The discharge at a station: the station's own where the flow changes along the channel, else the flow's. */
function localDischarge(flow: FlowResult, station: number): number {
  const q = valueAt(flow, station, (s) => s.discharge ?? flow.discharge, 'upstream');
  return q !== null && q > 0 ? q : flow.discharge;
}

function stationRange(run: RunResult): [number, number] | null {
  const all = run.flows.flatMap((f) => f.stations.map((s) => s.station)).filter(Number.isFinite);
  return all.length ? [Math.min(...all), Math.max(...all)] : null;
}

/** The section in force at a station (the reach's, or the nearest surveyed node's), with its reach id. */
function sectionAt(run: ModelRun, station: number): { hs: HydraulicSection; reach: string; section?: string; nodeStation?: number } | null {
  const flow = run.result.flows[0];
  const inputs = run.stages.inputs[0];
  if (!flow || !inputs) return null;
  // the downstream reach at a break, as the station table does
  const reaches = flow.reaches;
  let found = -1;
  for (let i = 0; i < reaches.length; i++) {
    const r = reaches[i]!;
    if (station >= Math.min(r.from, r.to) - stationMatch && station <= Math.max(r.from, r.to) + stationMatch) found = i;
  }
  if (found < 0) return null;
  const result = reaches[found]!;
  const reach: ReachInput | undefined = inputs.reaches.find((r) => r.id === result.id) ?? inputs.reaches[found];
  if (!reach) return null;
  if (reach.kind !== 'surveyed') {
    const named = run.stages.model.reaches.find((r) => r.id === reach.id)?.section;
    return { hs: reach.section, reach: reach.id, ...(named === undefined ? {} : { section: named }) };
  }
  // surveyed: the same fraction along the reach in the engine's stationing, then the nearest node
  const nodes = reach.nodes.filter((n) => !n.interpolated);
  const list = nodes.length ? nodes : reach.nodes;
  if (list.length === 0) return null;
  const f = result.to === result.from ? 0 : (station - result.from) / (result.to - result.from);
  const first = reach.nodes[0]!.station;
  const last = reach.nodes[reach.nodes.length - 1]!.station;
  const target = first + f * (last - first);
  let best = list[0]!;
  for (const n of list) if (Math.abs(n.station - target) < Math.abs(best.station - target)) best = n;
  const nodeStation = result.from + ((best.station - first) / (last - first || 1)) * (result.to - result.from);
  return { hs: best.section, reach: reach.id, nodeStation };
}

/** Every structure, from the flows' results and the model (deduplicated by id), in station order. */
function structuresOf(run: ModelRun): ProfileStructureMark[] {
  const out: ProfileStructureMark[] = [];
  const add = (id: unknown, type: unknown, station: unknown) => {
    if (typeof station !== 'number' || !Number.isFinite(station)) return;
    const name = typeof id === 'string' && id !== '' ? id : `${String(type)} at ${stationText(station)}`;
    if (!out.some((s) => s.id === name)) out.push({ id: name, type: typeof type === 'string' ? type : 'structure', station });
  };
  for (const f of run.result.flows) for (const s of f.structures ?? []) add(s.id, s.type, s.station);
  const model = run.stages.model as unknown as { structures?: unknown };
  if (Array.isArray(model.structures)) {
    for (const s of model.structures as Record<string, unknown>[]) if (s && typeof s === 'object') add(s.id, s.type, s.station);
  }
  return out.sort((a, b) => a.station - b.station || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

function uniqueName(name: string, taken: Set<string>): string {
  let n = name;
  for (let k = 2; taken.has(n); k++) n = `${name}-${k}`;
  taken.add(n);
  return n;
}

function sectionPlan(run: ModelRun, station: number, name: string, why: string, notes: string[]): PlannedChart | null {
  const result = run.result;
  const u = lengthUnit(result.units);
  const found = sectionAt(run, station);
  if (!found) {
    notes.push(`no cross-section drawn at station ${stationText(station)} ${u}: it is outside the channel`);
    return null;
  }
  const at = found.nodeStation ?? station;
  const first = result.flows[0]!;
  const bed = valueAt(first, at, (s) => s.bedElevation);
  if (bed === null) {
    notes.push(`no cross-section drawn at station ${stationText(station)} ${u}: no bed elevation there`);
    return null;
  }
  const waterLevels: { flow: string; wsel: number }[] = [];
  let highest = bed;
  for (const flow of result.flows) {
    const up = valueAt(flow, at, (s) => s.wsel, 'upstream');
    const down = valueAt(flow, at, (s) => s.wsel, 'downstream');
    if (up !== null && down !== null && Math.abs(up - down) > levelMatch) {
      waterLevels.push({ flow: `${flow.id} upstream`, wsel: up }, { flow: `${flow.id} downstream`, wsel: down });
    } else if (up !== null) waterLevels.push({ flow: flow.id, wsel: up });
    for (const w of [up, down]) if (w !== null) highest = Math.max(highest, w);
    for (const e of entriesAt(flow, at)) for (const b of [e.leftBank, e.rightBank]) if (typeof b === 'number' && Number.isFinite(b)) highest = Math.max(highest, b);
  }
  const maxDepth = Math.max(highest - bed, found.hs.section.lengthScale * 0.5);
  const ground = sectionGround(found.hs.section, found.hs.law, bed, outlineHeadroom * maxDepth);
  const where = found.nodeStation !== undefined && Math.abs(found.nodeStation - station) > stationMatch
    ? `surveyed section nearest to station ${stationText(station)} ${u}, at ${stationText(found.nodeStation)} ${u}`
    : `station ${stationText(at)} ${u}`;
  const spec = sectionChart({
    units: result.units,
    ground: ground.ground,
    waterLevels,
    zones: ground.zones,
    station: Number(at.toFixed(3)),
    sectionId: found.section ?? found.reach,
  });
  const caption = `Cross-section of reach ${found.reach} at ${where} (${why}): ground, water surface of each flow, roughness${ground.closedNote ? `; ${ground.closedNote}` : ''}.`;
  return { name, caption, spec };
}

function energyPlan(run: ModelRun, options: ReportOptions, notes: string[]): PlannedChart | null {
  const result = run.result;
  const u = lengthUnit(result.units);
  let flow: FlowResult | undefined;
  let station: number;
  let why: string;
  if (options.energyAt) {
    station = options.energyAt.station;
    flow = options.energyAt.flow === undefined ? result.flows[0] : result.flows.find((f) => f.id === options.energyAt!.flow);
    if (!flow) {
      notes.push(`no energy–force diagram drawn: no flow named ${JSON.stringify(options.energyAt.flow)}`);
      return null;
    }
    why = 'station picked';
  } else {
    const byDischarge = [...result.flows].sort((a, b) => b.discharge - a.discharge);
    flow = byDischarge.find((f) => f.jumps.length > 0);
    if (flow) {
      station = flow.jumps[0]!.station;
      why = 'toe of the hydraulic jump';
    } else {
      flow = result.flows[0];
      const range = stationRange(result);
      if (!flow || !range) return null;
      station = range[1];
      why = 'downstream end';
    }
  }
  const found = sectionAt(run, station);
  const depth = valueAt(flow, station, (s) => s.depth, 'upstream');
  if (!found || depth === null || !(depth > 0)) {
    notes.push(`no energy–force diagram drawn at station ${stationText(station)} ${u}: it is outside the computed profile of flow ${flow.id}`);
    return null;
  }
  // the discharge at the station itself where it changes along the channel (flow changes, lateral inflow)
  const discharge = localDischarge(flow, station);
  try {
    const input = energyForceSamples({ hs: found.hs, discharge, depth, flow: flow.id, station: Number(station.toFixed(3)) });
    input.title = `Specific energy and force at ${stationText(station)} ${u}, flow ${flow.id}`;
    return {
      name: `energy-force-${slug(flow.id)}-at-${stationSlug(station)}`,
      caption: `Specific energy and specific force for flow ${flow.id} (${Number(discharge.toPrecision(6))} ${result.units === 'US' ? 'ft³/s' : 'm³/s'}) at station ${stationText(station)} ${u} (${why}): the flow depth with its alternate depth (equal energy) and sequent depth (equal force), and critical depth.`,
      spec: energyForceChart(input),
    };
  } catch (error) {
    if (!(error instanceof HydraulicError)) throw error;
    notes.push(`no energy–force diagram drawn at station ${stationText(station)} ${u}: ${error.message}`);
    return null;
  }
}

function ratingPlan(run: ModelRun, stations: readonly { station: number; label: string }[]): PlannedChart | null {
  const result = run.result;
  if (new Set(result.flows.map((f) => f.discharge)).size < 2) return null;
  const u = lengthUnit(result.units);
  const series: RatingSeries[] = stations.slice(0, ratingSeriesLimit).map(({ station, label }) => ({
    label,
    points: result.flows
      .map((f) => ({ discharge: localDischarge(f, station), stage: valueAt(f, station, (s) => s.wsel, 'upstream'), flow: f.id }))
      .filter((p): p is { discharge: number; stage: number; flow: string } => p.stage !== null)
      .sort((a, b) => a.discharge - b.discharge),
  }));
  if (!series.some((s) => s.points.length >= 2)) return null;
  return {
    name: 'rating',
    caption: `Rating curves: water-surface elevation (${u}) against discharge, one point per flow run, with the discharge at each station: ${stations.slice(0, ratingSeriesLimit).map((s) => s.label).join('; ')}.`,
    spec: ratingChart({ units: result.units, series }),
  };
}

function controlsOf(run: RunResult): ReportControl[] {
  const out: ReportControl[] = [];
  for (const flow of run.flows) {
    for (const c of flow.controls ?? []) {
      const depth = typeof c.depth === 'number' && Number.isFinite(c.depth) ? `, depth ${c.depth.toFixed(3)} ${lengthUnit(run.units)}` : '';
      out.push({ flow: flow.id, station: c.station, description: `${c.kind} (${c.status}${depth}): ${c.reason}` });
    }
    for (const s of flow.stops ?? []) if (!s.resolved) out.push({ flow: flow.id, station: s.station, description: `unresolved stop: ${s.message}` });
    for (const n of flow.notes ?? []) out.push({ flow: flow.id, description: `note: ${n}` });
  }
  return out;
}

function methodOf(run: ModelRun): NonNullable<ReportInput['method']> {
  const model = run.stages.model;
  const first = run.result.flows[0];
  const u = lengthUnit(run.result.units);
  const settings: ReportValue[] = [
    { label: 'Method', value: run.result.method },
    { label: 'Friction-slope averaging', value: first?.computation?.frictionAveraging ?? model.frictionAveraging },
    { label: 'Output spacing', value: run.stages.inputs[0]?.outputSpacing ?? model.outputSpacing ?? 'at most 1/100 of the channel length', ...(typeof (run.stages.inputs[0]?.outputSpacing ?? model.outputSpacing) === 'number' ? { unit: u } : {}) },
  ];
  if (first?.computation) {
    settings.push({ label: 'Accuracy goal', value: first.computation.accuracyGoal });
    for (const f of run.result.flows) if (f.computation) settings.push({ label: `Internal steps, flow ${f.id}`, value: f.computation.internalSteps });
  }
  const method: NonNullable<ReportInput['method']> = { settings };
  if (run.comparison) {
    const worst = run.comparison.flows.reduce((m, f) => Math.max(m, f.largestDifference), 0);
    const all = run.comparison.flows.every((f) => f.withinGoal);
    settings.push({ label: `Largest depth difference between the methods and ${run.comparison.reference}`, value: Number(worst.toPrecision(3)), unit: u });
    settings.push({ label: 'Every method within the accuracy goal', value: all });
  }
  return method;
}

/** "n ±20 %, Q ±10 %": what a sensitivity run varied. */
function variedText(s: Sensitivity): string {
  return s.variations.map((v) => `${v.parameter} ±${v.percent} %`).join(', ');
}

/**
 * The sensitivity as the report shows it: per flow, the widest range of water surface in each reach and where
 * it occurs (a station already listed for the reach upstream is not listed again; at most `limit` reaches, the
 * widest, in station order), where the jump toe wanders, and what changes between cases.
 */
export function reportSensitivity(s: Sensitivity, flows: readonly FlowResult[], limit = widestReaches): ReportSensitivity {
  const out: ReportSensitivity['flows'] = [];
  for (const f of s.flows) {
    const flow = flows.find((x) => x.id === f.id);
    if (!flow) continue;
    const entries = f.stations.filter((e) => Number.isFinite(e.range) && Number.isFinite(e.station));
    const picked: ReportRange[] = [];
    for (const reach of flow.reaches) {
      const lo = Math.min(reach.from, reach.to) - stationMatch;
      const hi = Math.max(reach.from, reach.to) + stationMatch;
      const inside = entries
        .filter((e) => e.station >= lo && e.station <= hi && !picked.some((p) => Math.abs(p.station - e.station) <= stationMatch))
        .sort((a, b) => b.range - a.range || a.station - b.station);
      const e = inside[0];
      if (e) picked.push({ reach: reach.id, station: e.station, base: e.base, low: e.low, high: e.high, range: e.range, lowCase: e.lowCase, highCase: e.highCase });
    }
    const kept = [...picked].sort((a, b) => b.range - a.range || a.station - b.station).slice(0, limit);
    out.push({
      id: f.id,
      widest: picked.filter((p) => kept.includes(p)),
      reaches: flow.reaches.length,
      jumpToeRange: f.jumpToeRange,
      notes: [...f.notes],
    });
  }
  return { varied: variedText(s), computed: s.cases.filter((c) => c.computed).length, cases: s.cases.length, flows: out, warnings: [...s.warnings] };
}

/** The report of a run: inputs, controls, method, and the charts to draw. */
export function assembleReport(run: ModelRun, options: ReportOptions = {}): AssembledReport {
  const result = run.result;
  const u = lengthUnit(result.units);
  const notes: string[] = [];
  const charts: PlannedChart[] = [];
  const taken = new Set<string>();
  const flowsDrawn = result.flows;
  if (flowsDrawn.some((f) => f.stations.length > 0)) {
    const largest = [...flowsDrawn].sort((a, b) => b.discharge - a.discharge)[0]!;
    const guideFlows = flowsDrawn.length <= guideFlowLimit ? flowsDrawn.map((f) => f.id) : [largest.id];
    const structures = structuresOf(run);
    const sensitivity = options.sensitivity;
    const bands = (sensitivity?.flows ?? [])
      .filter((f) => flowsDrawn.some((d) => d.id === f.id))
      .map((f) => ({ flow: f.id, label: `Range of water surface, ${f.id}`, rows: f.stations.map((e) => ({ station: e.station, low: e.low, high: e.high })) }));
    const profileSpec = profileChart(result, { guideFlows, structures, title: profileTitle(result), ...(bands.length ? { bands } : {}) });
    const unlabelled = ((profileSpec as { datasets?: { unlabelled?: unknown[] } }).datasets?.unlabelled ?? []).length;
    const bandWords = bands.length && sensitivity
      ? ` The pale band along each flow's water surface spans the lowest to the highest water surface met when ${variedText(sensitivity)} are varied; the stations where it is widest are tabled under Sensitivity of the water surface.`
      : '';
    const labelWords = unlabelled
      ? ` ${unlabelled === 1 ? 'One stretch is' : `${unlabelled} stretches are`} too short or too crowded to carry a label on the chart; every profile type is listed in the reach table of its flow.`
      : '';
    charts.push({
      name: uniqueName('profile', taken),
      caption: `Longitudinal profile: channel bed, water surface of each flow, ${guideFlows.length === flowsDrawn.length ? '' : `for flow ${largest.id} `}the energy line and the critical-depth and normal-depth lines of each reach, ${structures.length ? 'structures, ' : ''}hydraulic jumps (toe and roller length) and the profile type of each stretch. Stations in ${u}.${bandWords}${labelWords}`,
      spec: profileSpec,
    });

    // the caller's stations (the CLI's --sections) replace the model file's sectionChartsAt
    const picked = [...new Set((options.sections ?? run.stages.model.sectionChartsAt ?? []).filter(Number.isFinite))];
    const range = stationRange(result);
    const sectionStations: { station: number; label: string; why: string; name: string }[] = [];
    for (const x of picked) sectionStations.push({ station: x, label: `Station ${stationText(x)} ${u}`, why: 'station picked', name: `section-at-${stationSlug(x)}` });
    for (const s of structuresOf(run)) {
      sectionStations.push({ station: s.station, label: `${s.id} (${s.type}), station ${stationText(s.station)} ${u}`, why: `at structure ${s.id}, ${s.type}`, name: `section-${slug(s.id)}` });
    }
    if (sectionStations.length === 0 && result.flows[0]) {
      for (const r of result.flows[0].reaches.slice(0, defaultSectionLimit)) {
        const mid = Number(((r.from + r.to) / 2).toFixed(3));
        sectionStations.push({ station: mid, label: `Station ${stationText(mid)} ${u}`, why: `middle of reach ${r.id}`, name: `section-at-${stationSlug(mid)}` });
      }
    }
    for (const s of sectionStations) {
      const plan = sectionPlan(run, s.station, uniqueName(s.name, taken), s.why, notes);
      if (plan) charts.push(plan);
    }

    const energy = energyPlan(run, options, notes);
    if (energy) charts.push({ ...energy, name: uniqueName(energy.name, taken) });

    const ratingStations: { station: number; label: string }[] = [];
    const addRating = (station: number, label: string) => {
      if (!ratingStations.some((r) => r.station === station)) ratingStations.push({ station, label });
    };
    if (range) addRating(range[0], `Upstream end (${stationText(range[0])} ${u})`);
    for (const s of structuresOf(run)) addRating(s.station, `Above ${s.id} (${stationText(s.station)} ${u})`);
    for (const x of picked) addRating(x, `Station ${stationText(x)} ${u}`);
    if (range) addRating(range[1], `Downstream end (${stationText(range[1])} ${u})`);
    const rating = ratingPlan(run, ratingStations);
    if (rating) charts.push({ ...rating, name: uniqueName(rating.name, taken) });
  } else {
    notes.push('no chart drawn: no flow has computed stations');
  }

  const inputs = reportInputsOf(run.stages.model, result);
  // stations given by the caller replace the model's list for this report: say so beside the echoed list
  const listed = inputs.other?.find((g) => g.heading === reportSettingsHeading)?.items.find((i) => i.id === sectionChartsItem);
  if (listed && options.sections !== undefined) {
    listed.rows.push({ label: 'Replaced for this report by stations', value: options.sections.map((x) => stationText(x)).join(', ') || 'none', unit: u });
  }
  const report: Omit<ReportInput, 'charts'> = {
    run: result,
    inputs,
    program: { name: programName, version: programVersion },
    controls: controlsOf(result),
    method: methodOf(run),
    ...(options.modelFile === undefined ? {} : { modelFile: options.modelFile }),
    ...(options.sensitivity === undefined ? {} : { sensitivity: reportSensitivity(options.sensitivity, result.flows) }),
  };
  return { report, charts, notes };
}
