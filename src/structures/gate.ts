/**
 * Vertical sluice gate in a rectangular channel of width b, horizontal floor through the gate
 * (Henderson, Open Channel Flow, 1966, §6.3 [ch. 6 "Flow under gates"]; reproduced in Novak et al.,
 * Hydraulic Structures).
 *
 * Free flow: energy is conserved from the upstream depth y1 to the vena contracta of depth y2 = Cc·a,
 *   q = Cd·a·√(2g·y1),  Cd = Cc / √(1 + Cc·a/y1),  Cc = 0.61 by default.
 * Given q this is a quadratic in y1: 2g·y2²·y1² − q²·y1 − q²·y2 = 0, solved in closed form.
 * The vena contracta depth is the upstream control of the supercritical profile below the gate.
 *
 * Submerged flow, when the tailwater y3 exceeds the sequent depth of y2 (Bélanger): the jet at the vena
 * contracta runs under a roller of depth yv. Momentum from the vena contracta to the tailwater,
 *   yv²/2 + q²/(g·y2) = y3²/2 + q²/(g·y3),
 * gives yv in closed form; energy from upstream to the vena contracta (the jet carries velocity q/y2 under
 * the depth yv), y1 + q²/(2g·y1²) = yv + q²/(2g·y2²), gives y1 by a bracketed root on its subcritical branch.
 */
import { HydraulicError, requireInput } from '../core/errors.js';
import { brentRoot } from '../core/roots.js';
import type { Units } from '../core/units.js';
import { structureCaution } from './cautions.js';
import { structureTolerance } from './invert.js';
import type { StructureOutcome } from './types.js';

/** Contraction coefficient of a sharp-edged vertical gate (Henderson 1966). */
export const defaultContractionCoefficient = 0.61;
/** Below this y1/a the jet does not contract fully and Cc = 0.61 is doubtful (common practice, about 1.5–2). */
export const gateMinimumHeadRatio = 1.5;

export interface SluiceGateSpec {
  /** gate opening a above the floor */
  readonly opening: number;
  /** channel width b at the gate */
  readonly width: number;
  /** floor (sill) elevation at the gate, also the floor just below it */
  readonly floorElevation: number;
  /** contraction coefficient Cc (default 0.61) */
  readonly contractionCoefficient?: number;
  readonly where?: string;
}

/** Henderson's discharge coefficient Cd = Cc/√(1 + Cc·a/y1). */
export function gateDischargeCoefficient(contraction: number, opening: number, upstreamDepth: number): number {
  return contraction / Math.sqrt(1 + (contraction * opening) / upstreamDepth);
}

/** Unit discharge under a freely flowing gate for an upstream depth y1. */
export function freeGateUnitDischarge(contraction: number, opening: number, upstreamDepth: number, units: Units): number {
  return gateDischargeCoefficient(contraction, opening, upstreamDepth) * opening * Math.sqrt(2 * units.g * upstreamDepth);
}

/** Upstream depth of a freely flowing gate for a unit discharge: the positive root of the quadratic above. */
export function freeGateUpstreamDepth(unitDischarge: number, venaContracta: number, units: Units): number {
  const q2 = unitDischarge * unitDischarge;
  const a = 2 * units.g * venaContracta * venaContracta;
  return (q2 + Math.sqrt(q2 * q2 + 4 * a * q2 * venaContracta)) / (2 * a);
}

/** Bélanger's sequent depth in a rectangular channel (Chow 1959 eq. 3-21). */
export function rectangularSequentDepth(depth: number, unitDischarge: number, units: Units): number {
  const f2 = (unitDischarge * unitDischarge) / (units.g * depth * depth * depth);
  return (depth / 2) * (Math.sqrt(1 + 8 * f2) - 1);
}

/** Specific force per unit width in a rectangular channel, y²/2 + q²/(g·y). */
export function rectangularSpecificForce(depth: number, unitDischarge: number, units: Units): number {
  return (depth * depth) / 2 + (unitDischarge * unitDischarge) / (units.g * depth);
}

export interface SubmergedGateState {
  readonly upstreamDepth: number;
  /** depth over the jet at the vena contracta */
  readonly rollerDepth: number;
  /** momentum residual vena contracta → tailwater per unit width (zero up to round-off) */
  readonly momentumResidual: number;
  /** energy residual upstream → vena contracta (zero to solver tolerance) */
  readonly energyResidual: number;
}

/** Submerged gate by momentum and energy (Henderson 1966 §6.3). */
export function submergedGateState(unitDischarge: number, venaContracta: number, tailwaterDepth: number, units: Units): SubmergedGateState {
  const q = unitDischarge;
  const g = units.g;
  const y2 = venaContracta;
  const y3 = tailwaterDepth;
  const rollerSquared = y3 * y3 + ((2 * q * q) / g) * (1 / y3 - 1 / y2);
  if (!(rollerSquared > y2 * y2)) {
    throw new HydraulicError(`sluice gate: the tailwater depth ${y3} does not drown the vena contracta (depth ${y2})`);
  }
  const yv = Math.sqrt(rollerSquared);
  const jetEnergy = yv + (q * q) / (2 * g * y2 * y2);
  const residual = (y1: number) => y1 + (q * q) / (2 * g * y1 * y1) - jetEnergy;
  const yc = Math.cbrt((q * q) / g);
  // On [max(yc, yv), jetEnergy] the specific energy rises (subcritical branch): residual ≤ 0 at the low end, > 0 at the top.
  const lo = Math.max(yc, yv);
  const y1 = residual(lo) >= 0 ? lo : brentRoot(residual, lo, jetEnergy, { xTolerance: structureTolerance(jetEnergy), what: 'submerged gate upstream depth' });
  const momentumResidual = rectangularSpecificForce(y2, q, units) + (yv * yv - y2 * y2) / 2 - rectangularSpecificForce(y3, q, units);
  return { upstreamDepth: y1, rollerDepth: yv, momentumResidual, energyResidual: residual(y1) };
}

/** Upstream depth (headwater) of a sluice gate for a discharge and the tailwater stage below it. */
export function sluiceGate(spec: SluiceGateSpec, discharge: number, tailwaterStage: number | null, units: Units): StructureOutcome {
  const where = spec.where ?? 'structure';
  requireInput(spec.opening > 0 && Number.isFinite(spec.opening), `${where}.opening`, 'the gate opening must be a positive number', spec.opening);
  requireInput(spec.width > 0 && Number.isFinite(spec.width), `${where}.width`, 'the width at the gate must be a positive number', spec.width);
  requireInput(Number.isFinite(spec.floorElevation), `${where}.floorElevation`, 'the floor elevation must be a number', spec.floorElevation);
  const cc = spec.contractionCoefficient ?? defaultContractionCoefficient;
  requireInput(cc > 0.5 && cc < 1, `${where}.contractionCoefficient`, 'the contraction coefficient must lie between 0.5 and 1 (0.61 for a sharp vertical gate)', cc);
  requireInput(discharge > 0 && Number.isFinite(discharge), `${where}.discharge`, 'the discharge must be a positive number', discharge);
  const a = spec.opening;
  const q = discharge / spec.width;
  const y2 = cc * a;
  const freeY1 = freeGateUpstreamDepth(q, y2, units);
  const sequent = rectangularSequentDepth(y2, q, units);
  const tailwaterDepth = tailwaterStage === null ? null : tailwaterStage - spec.floorElevation;
  const submerged = tailwaterDepth !== null && tailwaterDepth > sequent;
  const notes: string[] = [];
  let y1 = freeY1;
  let roller: number | null = null;
  let momentumResidual: number | null = null;
  if (submerged) {
    const state = submergedGateState(q, y2, tailwaterDepth, units);
    y1 = state.upstreamDepth;
    roller = state.rollerDepth;
    momentumResidual = state.momentumResidual;
    notes.push('submerged: tailwater above the sequent depth of the vena contracta; momentum from the vena contracta to the tailwater (Henderson 1966)');
  } else {
    notes.push('free flow: the vena contracta depth Cc·a starts the supercritical profile below the gate; the jump is placed by the profile engine');
  }
  if (!(y1 > a)) {
    throw new HydraulicError(
      `sluice gate: the upstream depth ${y1} would not reach the gate lip (opening ${a}); the gate does not touch the flow at this discharge — model the opening as open channel`,
    );
  }
  if (y1 / a < gateMinimumHeadRatio) notes.push(`y1/a = ${(y1 / a).toFixed(2)} is below about ${gateMinimumHeadRatio}: Cc = ${cc} is doubtful so close to the lip (common practice)`);
  const upstreamVelocityHead = (q * q) / (2 * units.g * y1 * y1);
  return {
    kind: 'sluice-gate',
    method: 'sluice gate, Henderson (1966): energy to the vena contracta; momentum below it when drowned',
    units: units.system,
    discharge,
    condition: submerged ? 'submerged' : 'free',
    headwaterStage: spec.floorElevation + y1,
    headwaterEnergy: spec.floorElevation + y1 + upstreamVelocityHead,
    tailwaterStage,
    downstreamSupercriticalDepth: submerged ? null : y2,
    values: {
      unitDischarge: q,
      contractionCoefficient: cc,
      dischargeCoefficient: gateDischargeCoefficient(cc, a, y1),
      freeFlowCoefficient: gateDischargeCoefficient(cc, a, freeY1),
      upstreamDepth: y1,
      freeFlowUpstreamDepth: freeY1,
      venaContractaDepth: y2,
      venaContractaFroude: q / Math.sqrt(units.g * y2 * y2 * y2),
      sequentDepthOfVenaContracta: sequent,
      tailwaterDepth,
      rollerDepthAtVenaContracta: roller,
      momentumResidual,
      headRatio: y1 / a,
    },
    notes,
    caution: structureCaution,
  };
}
