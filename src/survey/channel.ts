/**
 * A channel with surveyed reaches: the survey files read and turned into nodes once per run, then each flow
 * computed through them (with interpolated sections where the accuracy goal needs them), its stations given
 * bank elevations and freeboard, and reported in the user's stationing.
 *
 *   Model ─loadChannelSurvey─▶ sites per surveyed reach + station map
 *   ProfileInput ─computeChannelFlow─▶ refineSurvey (interpolation) ─▶ banks ─▶ freeboard ─▶ user's stations
 */
import { HydraulicError, InputError, type Problem } from '../core/errors.js';
import { type Units, unitsOf } from '../core/units.js';
import { criticalDepth } from '../hydraulics/criticalDepth.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import { isSurveyReach } from '../input/model/survey.js';
import type { Model } from '../input/model/types.js';
import { computeProfile } from '../profile/engine.js';
import { SectionTopReached } from '../profile/surveyed.js';
import type { ProfileInput, SurveyedReachInput } from '../profile/types.js';
import { freeboardRows, freeboardWarnings } from '../results/freeboard.js';
import type { FlowResult, StationResult } from '../results/types.js';
import { readSurveyFiles, type SurveyFileOptions } from './files.js';
import { refineSurvey } from './interpolate.js';
import { type SurveySite, surveySites } from './sites.js';
import { type StationMap, identityStations, isIdentity, mapFlowStations, stationingNote, toUserStation } from './stationing.js';

export interface SurveyOptions extends Partial<SurveyFileOptions> {
  /** insert interpolated sections where the accuracy goal needs them (default true; the CLI's --no-interpolate) */
  readonly interpolate?: boolean;
  /**
   * Each reach's roughness multiplier (calibration, sensitivity; 1 when absent): applied to the survey's
   * section specs before the sections are built, so interpolated sections, blended from them, carry it too.
   */
  readonly roughnessMultiplier?: (reachId: string) => number;
}

export interface ChannelSurvey {
  /** reach index → the surveyed reach as the engine takes it (surveyed nodes only) */
  readonly reaches: ReadonlyMap<number, SurveyedReachInput>;
  /** reach index → its surveyed sites, upstream first */
  readonly sites: ReadonlyMap<number, readonly SurveySite[]>;
  /** the user's stationing against the engine's */
  readonly stations: StationMap;
}

const stationMatch = 1e-9;

/** Read and map every surveyed reach of a model (undefined when it has none). Problems name file:line:column. */
export function loadChannelSurvey(model: Model, sections: ReadonlyMap<string, HydraulicSection>, options: SurveyOptions): ChannelSurvey | undefined {
  const indices = model.reaches.map((r, i) => (isSurveyReach(r) ? i : -1)).filter((i) => i >= 0);
  if (indices.length === 0) return undefined;
  if (options.modelFile === undefined) {
    throw new InputError({ where: `reaches[${indices[0]}].survey`, message: 'a surveyed reach reads files relative to the model file: give the model file (runModel option modelFile)' });
  }
  const units = unitsOf(model.units);
  const fileOptions: SurveyFileOptions = { modelFile: options.modelFile, allowOutside: options.allowOutside === true, force: options.force === true };
  const problems: Problem[] = [];
  const reaches = new Map<number, SurveyedReachInput>();
  const sitesOf = new Map<number, SurveySite[]>();
  let engineAt = 0;
  let map: StationMap | undefined;
  let lastSurveyEnd: { index: number; bed: number } | undefined;
  for (let i = 0; i < model.reaches.length; i++) {
    const reach = model.reaches[i]!;
    if (!isSurveyReach(reach)) {
      engineAt += reach.length;
      continue;
    }
    try {
      const files = readSurveyFiles(reach.survey, `reaches[${i}]`, units, Object.keys(model.sections), fileOptions);
      const first = files.stations[0]!;
      // the first surveyed reach anchors the stationing; increasing downstream from the top, the engine keeps the survey's numbers
      if (map === undefined) {
        if (i === 0 && reach.survey.stationing === 'increasing-downstream') engineAt = first.station;
        map = { direction: reach.survey.stationing, anchorUser: first.station, anchorEngine: engineAt };
      } else {
        const expected = toUserStation(map, engineAt);
        if (reach.survey.stationing !== map.direction || Math.abs(expected - first.station) > stationMatch * Math.max(1, Math.abs(expected))) {
          problems.push({
            where: `${files.stationsFile}:${first.line}:${files.columnOf.station}`,
            message:
              `station ${first.station} does not continue the channel's stationing: the reaches above end at station ${round(expected)} (${map.direction}); ` +
              'number every surveyed reach of one channel in one stationing',
            value: first.station,
          });
          continue;
        }
      }
      const sites = surveySites(files, reach.survey, units, model.sections, sections, engineAt, options.roughnessMultiplier?.(reach.id) ?? 1);
      sitesOf.set(i, sites);
      reaches.set(i, { kind: 'surveyed', id: reach.id, nodes: sites.map((s) => s.node) });
      engineAt = sites[sites.length - 1]!.node.station;
      lastSurveyEnd = { index: i, bed: sites[sites.length - 1]!.node.bedElevation };
    } catch (error) {
      if (error instanceof InputError) problems.push(...error.problems);
      else throw error;
    }
  }
  // prismatic reaches below the last survey: their beds run up from downstreamBedElevation and must meet it
  if (problems.length === 0 && lastSurveyEnd !== undefined && lastSurveyEnd.index < model.reaches.length - 1) {
    let bed = model.downstreamBedElevation;
    for (let i = model.reaches.length - 1; i > lastSurveyEnd.index; i--) {
      const r = model.reaches[i]!;
      if (!isSurveyReach(r)) bed += r.slope * r.length;
    }
    if (Math.abs(bed - lastSurveyEnd.bed) > 1e-6 * Math.max(1, Math.abs(bed))) {
      problems.push({
        where: 'downstreamBedElevation',
        message:
          `the reaches below surveyed reach ${JSON.stringify(model.reaches[lastSurveyEnd.index]!.id)} put the bed at its downstream end at ${round(bed)}, ` +
          `but its last surveyed station has bed ${lastSurveyEnd.bed}: set downstreamBedElevation so the beds meet`,
        value: model.downstreamBedElevation,
      });
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  return { reaches, sites: sitesOf, stations: map ?? identityStations };
}

export interface ChannelFlow {
  /** the engine input as computed (with interpolated nodes) */
  readonly input: ProfileInput;
  readonly result: FlowResult;
}

/** Every station's bank elevations: from the sites of surveyed reaches, from bankHeight on prismatic ones. */
function withBanks(model: Model, result: FlowResult, sites: ReadonlyMap<number, readonly SurveySite[]>): StationResult[] {
  const index = new Map(model.reaches.map((r, i) => [r.id, i]));
  return result.stations.map((s) => {
    const k = s.reach === undefined ? undefined : index.get(s.reach);
    if (k === undefined) return s;
    const reach = model.reaches[k]!;
    if (!isSurveyReach(reach)) {
      return reach.bankHeight === undefined ? s : { ...s, leftBank: s.bedElevation + reach.bankHeight, rightBank: s.bedElevation + reach.bankHeight };
    }
    const list = sites.get(k);
    if (list === undefined || list.length === 0) return s;
    const bank = (side: 'leftBank' | 'rightBank'): number | undefined => {
      let j = 0;
      while (j < list.length - 2 && list[j + 1]!.node.station <= s.station) j++;
      const a = list[j]!;
      const b = list[Math.min(j + 1, list.length - 1)]!;
      if (Math.abs(a.node.station - s.station) <= stationMatch) return a[side];
      if (Math.abs(b.node.station - s.station) <= stationMatch) return b[side];
      const va = a[side];
      const vb = b[side];
      if (va === undefined || vb === undefined || b.node.station === a.node.station) return undefined;
      return va + ((vb - va) * (s.station - a.node.station)) / (b.node.station - a.node.station);
    };
    const left = bank('leftBank');
    const right = bank('rightBank');
    return { ...s, ...(left === undefined ? {} : { leftBank: left }), ...(right === undefined ? {} : { rightBank: right }) };
  });
}

/** Where a station of the engine lies in the survey, in the user's words. */
function placeOf(survey: ChannelSurvey, station: number): { where: string; text: string } {
  for (const list of survey.sites.values()) {
    if (list.length === 0 || station < list[0]!.node.station - stationMatch || station > list[list.length - 1]!.node.station + stationMatch) continue;
    const exact = list.find((s) => Math.abs(s.node.station - station) <= stationMatch);
    const user = round(toUserStation(survey.stations, station));
    if (exact !== undefined) {
      return { where: exact.sectionWhere, text: `cross-section ${JSON.stringify(exact.sectionId)} (${exact.sectionWhere}) at station ${user} (${exact.row})` };
    }
    let j = 0;
    while (j < list.length - 2 && list[j + 1]!.node.station < station) j++;
    const a = list[j]!;
    const b = list[j + 1]!;
    return {
      where: a.sectionWhere,
      text:
        `the section interpolated at station ${user} between cross-sections ${JSON.stringify(a.sectionId)} (${a.sectionWhere}, station ${a.userStation}) ` +
        `and ${JSON.stringify(b.sectionId)} (${b.sectionWhere}, station ${b.userStation})`,
    };
  }
  return { where: 'reaches', text: `station ${round(toUserStation(survey.stations, station))}` };
}

/** Critical depth must lie inside every surveyed section: checked first, so the message can name the station. */
function checkCriticalDepths(survey: ChannelSurvey, input: ProfileInput, units: Units): void {
  const problems: Problem[] = [];
  for (const [k, list] of survey.sites) {
    const q = input.reaches[k]?.discharge ?? input.discharge;
    for (const site of list) {
      try {
        criticalDepth(site.node.section, q);
      } catch (error) {
        if (!(error instanceof HydraulicError)) throw error;
        const top = site.node.section.section.maxDepth;
        problems.push({
          where: site.sectionWhere,
          message:
            `for flow ${JSON.stringify(input.flowId)} (${input.discharge} ${units.discharge}) critical depth at station ${site.userStation} (${site.row}) lies above ` +
            `the lower end point of cross-section ${JSON.stringify(site.sectionId)} (${round(top)} ${units.length} above its lowest point): extend the section`,
        });
      }
    }
  }
  if (problems.length > 0) throw new InputError(problems);
}

/**
 * One flow through the channel: interpolation on surveyed reaches, bank elevations, freeboard (when the model
 * gives banks), and every station in the user's numbers.
 */
export function computeChannelFlow(model: Model, input: ProfileInput, survey: ChannelSurvey | undefined, options: SurveyOptions = {}): ChannelFlow {
  const units = input.units;
  let computed: { input: ProfileInput; result: FlowResult; sites: ReadonlyMap<number, readonly SurveySite[]> };
  const notes: string[] = [];
  const warnings: string[] = [];
  if (survey === undefined) {
    computed = { input, result: computeProfile(input), sites: new Map() };
  } else {
    checkCriticalDepths(survey, input, units);
    const interpolate = options.interpolate !== false;
    let refined;
    try {
      refined = refineSurvey(input, survey.sites, interpolate);
    } catch (error) {
      if (error instanceof SectionTopReached) {
        const place = placeOf(survey, error.station);
        throw new InputError({
          where: place.where,
          message:
            `for flow ${JSON.stringify(input.flowId)} (${input.discharge} ${units.discharge}) the water surface would rise above the lower end point of ${place.text}: ` +
            `extend the section (its lower end lies ${round(error.maxDepth)} ${units.length} above its lowest point); gvf does not extrapolate a surveyed section`,
        });
      }
      throw error;
    }
    computed = refined;
    const added: string[] = [];
    for (const [k, divisions] of refined.divisions) {
      const list = survey.sites.get(k)!;
      divisions.forEach((m, i) => {
        if (m > 1) added.push(`${m - 1} between stations ${list[i]!.userStation} and ${list[i + 1]!.userStation}`);
      });
    }
    if (!interpolate) {
      notes.push('Interpolation between surveyed sections is off (--no-interpolate): the standard step runs from one surveyed section to the next, and the accuracy goal is not checked.');
    } else if (added.length > 0) {
      notes.push(
        `Interpolated sections (geometry blended between the surveyed neighbours, bed linear) were inserted where halving the step changed a depth by more than half the accuracy goal: ${added.join('; ')}. ` +
          'They are marked "interpolated" in the station table.',
      );
    } else {
      notes.push('The surveyed sections are close enough for the accuracy goal: halving every step changed no depth by more than half of it, so no section was interpolated.');
    }
    if (!refined.settled) {
      warnings.push(
        `The step-halving check on the surveyed reaches did not settle within its bounds: the last halving still changed a depth by ${round(refined.largestChange)} times the accuracy goal; ` +
          'depths there may be less accurate than the goal (a survey with closer sections would help).',
      );
    }
  }
  const result = computed.result;
  const stations = withBanks(model, result, computed.sites);
  const engineFlow: FlowResult = { ...result, stations };
  let flow = mapFlowStations(survey?.stations ?? identityStations, engineFlow);
  if (stations.some((s) => s.leftBank !== undefined || s.rightBank !== undefined)) {
    const rows = freeboardRows(flow.stations, model.freeboard);
    flow = { ...flow, freeboard: rows, warnings: [...flow.warnings, ...warnings, ...freeboardWarnings(rows, units.length, model.freeboard)] };
  } else {
    flow = { ...flow, warnings: [...flow.warnings, ...warnings] };
  }
  if (survey !== undefined && !isIdentity(survey.stations)) notes.push(stationingNote(survey.stations));
  if (notes.length > 0) flow = { ...flow, notes: [...(flow.notes ?? []), ...notes] };
  return { input: computed.input, result: flow };
}

function round(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}
