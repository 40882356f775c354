/**
 * validateModel: a parsed JSON value → a Model, or one InputError listing every problem found.
 *
 * Two passes: the schema (types, shapes, unknown keys) and then the rules that need the whole model
 * (a reach naming a missing section, duplicated ids, roughness plausibility, a stage below the bed).
 * The second pass also runs on the parts that passed the first, so one run reports as much as it can.
 */
import { InputError, type Problem } from '../../core/errors.js';
import { stationRoundoffFraction } from '../../core/tolerances.js';
import { largestMagnitude, maxOutputStations, slopeLimit, smallestDischarge } from './limits.js';
import * as msg from './messages.js';
import { formatPath, issueMessage, issuesToProblems } from './issues.js';
import { sectionProblems } from './rules.js';
import { modelSchema, sectionSchema } from './schema.js';
import type { BoundarySpec, Model, SectionSpec } from './types.js';

export interface ValidateOptions {
  /** lift the roughness plausibility limits (the CLI's --force) */
  readonly force?: boolean;
}

/** An InputError about one model file; `file` is the label the problems belong to. */
export class ModelFileError extends InputError {
  readonly file: string;
  constructor(file: string, problems: readonly Problem[]) {
    super(problems);
    this.file = file;
  }
}

const parseOptions = { reportInput: true, error: issueMessage } as const;

export function validateModel(json: unknown, fileLabel: string, options: ValidateOptions = {}): Model {
  if (json === null || typeof json !== 'object' || Array.isArray(json)) {
    throw new ModelFileError(fileLabel, [{ where: fileLabel, message: msg.notJsonObject(json), value: json }]);
  }
  const parsed = modelSchema.safeParse(json, parseOptions);
  const problems: Problem[] = parsed.success ? [] : issuesToProblems(parsed.error.issues, modelSchema, json);
  problems.push(...modelRules(json as Record<string, unknown>, options));
  problems.push(...tooLargeNumbers(json, new Set(problems.map((p) => p.where))));
  if (problems.length > 0 || !parsed.success) throw new ModelFileError(fileLabel, inDocumentOrder(dedupe(problems), json));
  return parsed.data;
}

/** Problems in the order their places appear in the file (a missing key sorts with the object that lacks it). */
function inDocumentOrder(problems: Problem[], json: unknown): Problem[] {
  const order = new Map<string, number>();
  const visit = (value: unknown, path: PropertyKey[]) => {
    order.set(formatPath(path), order.size);
    if (Array.isArray(value)) value.forEach((v, i) => visit(v, [...path, i]));
    else if (isRecord(value)) for (const [k, v] of Object.entries(value)) visit(v, [...path, k]);
  };
  visit(json, []);
  const rank = (where: string): number => {
    let place = where;
    for (let guard = 0; guard < 64; guard++) {
      const found = order.get(place);
      if (found !== undefined) return found;
      const cut = Math.max(place.lastIndexOf('.'), place.lastIndexOf('['));
      if (cut <= 0) return -1;
      place = place.slice(0, cut);
    }
    return -1;
  };
  return problems
    .map((problem, index) => ({ problem, index, rank: rank(problem.where) }))
    .sort((a, b) => a.rank - b.rank || a.index - b.index)
    .map((entry) => entry.problem);
}

function dedupe(problems: Problem[]): Problem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const key = `${p.where}\u0000${p.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

/** The rules that look across the model, run on whatever parts are well typed. */
function modelRules(raw: Record<string, unknown>, options: ValidateOptions): Problem[] {
  const problems: Problem[] = [];
  const sections = new Map<string, SectionSpec>();
  const sectionNames = isRecord(raw.sections) ? Object.keys(raw.sections) : [];

  if (isRecord(raw.sections)) {
    // a model of surveyed reaches only may leave "sections" empty (its sections come from the survey files)
    const prismatic = !Array.isArray(raw.reaches) || raw.reaches.some((r) => !isRecord(r) || r.survey === undefined);
    if (sectionNames.length === 0 && prismatic) problems.push({ where: 'sections', message: msg.listTooShort(1, 'section', []) });
    for (const name of sectionNames) {
      const parsed = sectionSchema.safeParse(raw.sections[name], parseOptions);
      if (!parsed.success) continue;
      sections.set(name, parsed.data);
      const base = formatPath(['sections', name]);
      problems.push(...sectionProblems(parsed.data, (key) => `${base}.${key}`, { force: options.force, forceHint: msg.forceHintModel }));
    }
  }

  const reaches = Array.isArray(raw.reaches) ? raw.reaches : [];
  let fall = 0;
  let lengthsKnown = true;
  reaches.forEach((reach, i) => {
    if (!isRecord(reach)) {
      lengthsKnown = false;
      return;
    }
    if (typeof reach.section === 'string' && isRecord(raw.sections) && !sectionNames.includes(reach.section)) {
      problems.push({ where: `reaches[${i}].section`, message: msg.noSuchSection(reach.section, sectionNames), value: reach.section });
    }
    if (typeof reach.slope === 'number' && Math.abs(reach.slope) >= slopeLimit) {
      problems.push({ where: `reaches[${i}].slope`, message: msg.slopeTooLarge(reach.slope), value: reach.slope });
    }
    if (typeof reach.slope === 'number' && typeof reach.length === 'number') fall += reach.slope * reach.length;
    else lengthsKnown = false;
  });
  problems.push(...duplicateIds(reaches, 'reaches', 'reach'));
  const spacing = raw.outputSpacing;
  const prismatic = reaches.every((r) => isRecord(r) && typeof r.length === 'number' && r.length > 0);
  const total = prismatic ? reaches.reduce((sum: number, r) => sum + (r as { length: number }).length, 0) : 0;
  if (typeof spacing === 'number' && spacing > 0 && total > 0 && total / spacing > maxOutputStations) {
    problems.push({ where: 'outputSpacing', message: msg.tooManyStations(spacing, total, raw.units === 'US' ? 'ft' : 'm', 'outputSpacing'), value: spacing });
  }
  problems.push(...duplicateIds(Array.isArray(raw.flows) ? raw.flows : [], 'flows', 'flow'));
  problems.push(...duplicateIds(Array.isArray(raw.structures) ? raw.structures : [], 'structures', 'structure'));
  problems.push(...flowRules(raw));
  problems.push(...chartStationRules(raw.sectionChartsAt, prismatic && reaches.length > 0 ? total : undefined, raw.units === 'US' ? 'ft' : 'm'));

  // controls that cannot be: a stage at or below the bed, a depth above a conduit's crown
  const downstreamBed = typeof raw.downstreamBedElevation === 'number' ? raw.downstreamBedElevation : 0;
  // (beds from implausibly large numbers are left to the bound on numbers, which names the number itself)
  const plausible = Math.abs(downstreamBed) <= largestMagnitude && Math.abs(fall) <= largestMagnitude;
  if (isRecord(raw.boundaries) && lengthsKnown && plausible && reaches.length > 0) {
    const ends = [
      { end: 'upstream', bed: downstreamBed + fall, reach: reaches[0] },
      { end: 'downstream', bed: downstreamBed, reach: reaches[reaches.length - 1] },
    ] as const;
    for (const { end, bed, reach } of ends) {
      const boundary = raw.boundaries[end] as BoundarySpec | undefined;
      if (!isRecord(boundary)) continue;
      const section = isRecord(reach) && typeof reach.section === 'string' ? sections.get(reach.section) : undefined;
      const depth =
        boundary.type === 'stage' && typeof boundary.elevation === 'number'
          ? boundary.elevation - bed
          : boundary.type === 'depth' && typeof boundary.depth === 'number'
            ? boundary.depth
            : undefined;
      if (depth === undefined) continue;
      const key = boundary.type === 'stage' ? 'elevation' : 'depth';
      if (boundary.type === 'stage' && depth <= 0) {
        problems.push({ where: `boundaries.${end}.elevation`, message: msg.stageBelowBed(boundary.elevation, bed, end), value: boundary.elevation });
      } else if (section?.shape === 'circular' && depth > section.diameter) {
        const unit = raw.units === 'US' ? 'ft' : 'm';
        problems.push({
          where: `boundaries.${end}.${key}`,
          message: msg.depthAboveCrown(round(depth), section.diameter, unit),
          value: key === 'depth' ? depth : (boundary as { elevation: number }).elevation,
        });
      }
    }
  }
  return problems;
}

/** Flows against the boundaries (a reservoir finds the discharge), rating curves, per-flow values keyed by flow id. */
function flowRules(raw: Record<string, unknown>): Problem[] {
  const problems: Problem[] = [];
  const boundaries = isRecord(raw.boundaries) ? raw.boundaries : {};
  const upstream = isRecord(boundaries.upstream) ? boundaries.upstream : undefined;
  const reservoir = upstream?.type === 'reservoir';
  const flows = Array.isArray(raw.flows) ? raw.flows : [];
  const ids: string[] = [];
  flows.forEach((flow, i) => {
    if (!isRecord(flow)) return;
    if (typeof flow.id === 'string') ids.push(flow.id);
    if (reservoir && flow.discharge !== undefined) problems.push({ where: `flows[${i}].discharge`, message: msg.dischargeWithReservoir(), value: flow.discharge });
    if (!reservoir && flow.discharge === undefined) problems.push({ where: `flows[${i}].discharge`, message: msg.dischargeRequired() });
    if (typeof flow.discharge === 'number' && flow.discharge > 0 && flow.discharge < smallestDischarge) {
      problems.push({ where: `flows[${i}].discharge`, message: msg.dischargeTooSmall(flow.discharge), value: flow.discharge });
    }
    if (!reservoir && flow.poolElevation !== undefined) problems.push({ where: `flows[${i}].poolElevation`, message: msg.poolWithoutReservoir(), value: flow.poolElevation });
  });
  const downstream = isRecord(boundaries.downstream) ? boundaries.downstream : undefined;
  if (downstream?.type === 'rating' && (downstream.table === undefined) === (downstream.file === undefined)) {
    problems.push({ where: 'boundaries.downstream', message: msg.ratingNeedsOne() });
  }
  const perFlow = (list: unknown, key: string, path: string) => {
    if (!Array.isArray(list)) return;
    list.forEach((item, i) => {
      if (!isRecord(item) || !isRecord(item[key])) return;
      const values = item[key] as Record<string, unknown>;
      for (const id of Object.keys(values)) {
        if (!ids.includes(id)) problems.push({ where: formatPath([path, i, key, id]), message: msg.unknownFlowId(id, ids), value: values[id] });
      }
      for (const id of ids) if (!(id in values)) problems.push({ where: `${path}[${i}].${key}`, message: msg.missingFlowValue(id) });
    });
  };
  perFlow(raw.flowChanges, 'addedDischarge', 'flowChanges');
  perFlow(raw.lateralInflow, 'inflowPerLength', 'lateralInflow');
  return problems;
}

/**
 * The stations of `sectionChartsAt`: each listed once and, where every reach is prismatic (stations run from 0
 * at the upstream end to the total length), on the channel. Surveyed reaches number their own stations, so
 * those are checked once the survey is read (the run command, against the computed stations).
 */
function chartStationRules(list: unknown, length: number | undefined, unit: string): Problem[] {
  if (!Array.isArray(list)) return [];
  const problems: Problem[] = [];
  const first = new Map<number, number>();
  list.forEach((x, i) => {
    if (typeof x !== 'number' || !Number.isFinite(x)) return;
    const where = `sectionChartsAt[${i}]`;
    const earlier = first.get(x);
    if (earlier !== undefined) problems.push({ where, message: msg.chartStationRepeated(x, earlier), value: x });
    else first.set(x, i);
    // round-off of summed reach lengths is not "off the channel"
    const slack = length === undefined ? 0 : stationRoundoffFraction * Math.max(1, length);
    if (length !== undefined && Math.abs(x) <= largestMagnitude && (x < -slack || x > length + slack)) {
      problems.push({ where, message: msg.chartStationOutside(x, 0, length, unit), value: x });
    }
  });
  return problems;
}

/** Every number beyond the plausibility bound, at its path (places with a problem already are left alone). */
function tooLargeNumbers(json: unknown, placed: ReadonlySet<string>): Problem[] {
  const problems: Problem[] = [];
  // an explicit stack: a deeply nested file must not overflow the call stack
  const stack: Array<{ value: unknown; path: PropertyKey[] }> = [{ value: json, path: [] }];
  while (stack.length > 0) {
    const { value, path } = stack.pop()!;
    if (typeof value === 'number' && Math.abs(value) > largestMagnitude) {
      const where = formatPath(path);
      if (!placed.has(where)) problems.push({ where, message: msg.tooLarge(value), value });
    } else if (Array.isArray(value)) {
      value.forEach((v, i) => stack.push({ value: v, path: [...path, i] }));
    } else if (isRecord(value)) {
      for (const [k, v] of Object.entries(value)) stack.push({ value: v, path: [...path, k] });
    }
  }
  return problems;
}

function duplicateIds(list: unknown[], path: string, what: string): Problem[] {
  const first = new Map<string, number>();
  const problems: Problem[] = [];
  list.forEach((item, i) => {
    if (!isRecord(item) || typeof item.id !== 'string') return;
    const earlier = first.get(item.id);
    if (earlier === undefined) first.set(item.id, i);
    else problems.push({ where: `${path}[${i}].id`, message: msg.duplicateId(what, item.id, earlier), value: item.id });
  });
  return problems;
}

function round(value: number): number {
  return Math.round(value * 1e6) / 1e6;
}
