/**
 * runSection: one cross-section, one discharge and slope → normal and critical depth, slope class, and the
 * flow at normal depth and at a depth the user asks for. What `gvf section` prints.
 *
 *   SectionSpec ──hydraulicSectionOf──▶ HydraulicSection ──normalDepths, criticalDepths──▶ depths
 *        ──classifySlope──▶ slope class ──flowState──▶ the flow at normal depth and at the depth asked for
 *
 * Values that do not exist are null, with a note saying why (no normal depth on a horizontal bed, a conduit
 * flowing full); Infinity (hydraulic depth at a conduit's crown) is reported as null, never as a number.
 */
import { screeningCaution } from './core/cautions.js';
import { HydraulicError, InputError } from './core/errors.js';
import { type UnitSystem, unitsOf } from './core/units.js';
import { hydraulicSectionOf } from './assembleSection.js';
import { criticalDepths as findCriticalDepths, criticalDepth as leastEnergyCriticalDepth } from './hydraulics/criticalDepth.js';
import { depthTolerance } from './hydraulics/depthSearch.js';
import { normalDepths as findNormalDepths } from './hydraulics/normalDepth.js';
import { type SlopeClass, classifySlope, criticalSlope as findCriticalSlope } from './hydraulics/slopeClass.js';
import { type FlowState, flowState } from './hydraulics/state.js';
import type { WhereOf } from './input/model/rules.js';
import { resolveRoughness } from './input/model/rules.js';
import type { FrictionName, SectionSpec } from './input/model/types.js';
import * as msg from './input/model/messages.js';
import type { Regime } from './results/types.js';

export interface SectionRunInput {
  readonly section: SectionSpec;
  readonly units: UnitSystem;
  readonly discharge: number;
  readonly slope: number;
  /** a depth at which to report every element */
  readonly depth?: number;
  /** names the place of a section key in problems (default: the key itself) */
  readonly whereOf?: WhereOf;
  /** names the place of the depth in problems (default "depth") */
  readonly depthWhere?: string;
}

/** The flow at one depth: every geometric and hydraulic element. Infinite values are null. */
export interface SectionState {
  depth: number;
  area: number;
  wettedPerimeter: number;
  topWidth: number;
  hydraulicRadius: number;
  /** A/T; null at the crown of a full conduit, where T = 0 */
  hydraulicDepth: number | null;
  conveyance: number;
  alpha: number;
  velocity: number;
  velocityHead: number;
  specificEnergy: number;
  specificForce: number;
  froude: number;
  frictionSlope: number;
  regime: Regime;
  /** a closed conduit flowing full at this depth */
  full: boolean;
}

export interface UnitLabels {
  length: string;
  area: string;
  discharge: string;
  velocity: string;
  /** specific force Q²/(gA) + Aȳ is a volume */
  force: string;
  conveyance: string;
}

export interface SectionRunResult {
  units: UnitSystem;
  unitLabels: UnitLabels;
  section: Record<string, number | string>;
  friction: FrictionName;
  discharge: number;
  slope: number;
  /** the normal depth (the lower of two in a closed conduit); null where none exists */
  normalDepth: number | null;
  normalDepths: number[];
  /** the discharge exceeds a closed conduit's part-full capacity: it flows full */
  fullFlow: boolean;
  /** the critical depth of least specific energy */
  criticalDepth: number;
  /** every local minimum of specific energy (several in some compound sections) */
  criticalDepths: number[];
  /** the bed slope whose normal depth is the critical depth */
  criticalSlope: number | null;
  slopeClass: SlopeClass;
  atNormalDepth: SectionState | null;
  atCriticalDepth: SectionState;
  atDepth: SectionState | null;
  notes: string[];
  cautions: string[];
}

export { screeningCaution };

export function unitLabelsOf(system: UnitSystem): UnitLabels {
  const u = unitsOf(system);
  return {
    length: u.length,
    area: u.area,
    discharge: u.discharge,
    velocity: u.velocity,
    force: system === 'US' ? 'ft³' : 'm³',
    conveyance: u.discharge,
  };
}

function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

function stateOf(s: FlowState, regime: Regime, full: boolean): SectionState {
  return {
    depth: s.depth,
    area: s.area,
    wettedPerimeter: s.wettedPerimeter,
    topWidth: s.topWidth,
    hydraulicRadius: s.hydraulicRadius,
    hydraulicDepth: finiteOrNull(s.hydraulicDepth),
    conveyance: s.conveyance,
    alpha: s.alpha,
    velocity: s.velocity,
    velocityHead: s.velocityHead,
    specificEnergy: s.specificEnergy,
    specificForce: s.specificForce,
    froude: s.froude,
    frictionSlope: s.frictionSlope,
    regime,
    full,
  };
}

export function runSection(input: SectionRunInput): SectionRunResult {
  const whereOf = input.whereOf ?? ((key: string) => key);
  const units = unitsOf(input.units);
  const hs = hydraulicSectionOf(input.section, units, whereOf);
  const section = hs.section;
  const { discharge, slope } = input;

  // 1. the depth asked for must fit in the section (before any solving, so the message is about the input)
  if (input.depth !== undefined && input.depth > section.maxDepth) {
    const where = input.depthWhere ?? 'depth';
    const message = section.closed
      ? msg.depthAboveCrown(input.depth, section.maxDepth, units.length)
      : msg.depthAbovePoints(input.depth, section.maxDepth, units.length);
    throw new InputError({ where, message, value: input.depth });
  }

  // 2. critical and normal depths, slope class
  const criticalDepths = findCriticalDepths(hs, discharge);
  const criticalDepth = leastEnergyCriticalDepth(hs, discharge);
  const normal = findNormalDepths(hs, discharge, slope);
  const notes: string[] = [];
  if (normal.reason !== undefined) notes.push(normal.reason);
  if (criticalDepths.length > 1) {
    notes.push(`specific energy has ${criticalDepths.length} local minima (a compound section): every one is a critical depth`);
  }
  const sc = slope > 0 ? findCriticalSlope(hs, discharge) : null;
  const slopeClass = classifySlope(slope, normal.depth, criticalDepth, sc ?? undefined);

  // 3. the flow at normal depth, at critical depth, and at the depth asked for
  const regimeAt = (y: number, froude: number): Regime => {
    const nearest = criticalDepths.reduce((best, yc) => (Math.abs(yc - y) < Math.abs(best - y) ? yc : best), criticalDepth);
    if (Math.abs(nearest - y) <= depthTolerance(section, y) * 10) return 'critical';
    return froude < 1 ? 'subcritical' : 'supercritical';
  };
  const at = (y: number): SectionState => {
    const s = flowState(hs, y, discharge);
    return stateOf(s, regimeAt(y, s.froude), section.closed && y >= section.maxDepth);
  };
  const atNormalDepth = normal.depth === null ? null : at(normal.depth);
  let atDepth: SectionState | null = null;
  if (input.depth !== undefined) {
    try {
      atDepth = at(input.depth);
    } catch (error) {
      if (error instanceof HydraulicError) {
        throw new InputError({ where: input.depthWhere ?? 'depth', message: error.message, value: input.depth });
      }
      throw error;
    }
  }

  const roughness = resolveRoughness(input.section);
  return {
    units: input.units,
    unitLabels: unitLabelsOf(input.units),
    section: { ...section.describe() },
    friction: roughness?.friction ?? 'manning',
    discharge,
    slope,
    normalDepth: normal.depth,
    normalDepths: [...normal.depths],
    fullFlow: normal.fullFlow,
    criticalDepth,
    criticalDepths,
    criticalSlope: sc,
    slopeClass,
    atNormalDepth,
    atCriticalDepth: at(criticalDepth),
    atDepth,
    notes,
    cautions: [screeningCaution],
  };
}
