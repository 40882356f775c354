/**
 * Broad-crested weir: critical flow on a level crest. With H the energy head above the crest, critical
 * depth there is (2/3)·H and q = √g·((2/3)·H)^1.5, so the ideal law is
 *   Q = (2/3)^1.5·√g·b·H^1.5   (1.705·b·H^1.5 in SI, 3.088·b·H^1.5 in US; Henderson 1966 §6.6, Chow 1959 §14-5).
 * Real crests pass less: a discharge coefficient Cd of about 0.85 to 1.0 of ideal depending on crest length,
 * nose rounding and head (Bos 1989, Discharge Measurement Structures, ch. 4; range from memory).
 * The default Cd = 0.85 is the low end: it gives the higher headwater, the safe side for backwater.
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { ApproachArea, StructureOutcome } from '../types.js';
import { type WeirLaw, weirControl } from './weirControl.js';

/** Default ratio of actual to ideal discharge (the conservative end of the 0.85–1.0 range). */
export const broadCrestedDefaultCoefficient = 0.85;
/** The range of the coefficient this module accepts without comment (Bos 1989; from memory). */
export const broadCrestedCoefficientRange = [0.85, 1.0] as const;

export interface BroadCrestedSpec {
  /** crest width b across the flow */
  readonly crestWidth: number;
  readonly crestElevation: number;
  /** Cd, the ratio of actual to ideal discharge (default 0.85) */
  readonly coefficient?: number;
  readonly approachArea?: ApproachArea;
  readonly where?: string;
}

/** (2/3)^1.5·√g: the ideal coefficient in Q = C·b·H^1.5. */
export function idealBroadCrestedCoefficient(units: Units): number {
  return Math.pow(2 / 3, 1.5) * Math.sqrt(units.g);
}

export function broadCrestedLaw(spec: BroadCrestedSpec, units: Units): WeirLaw {
  const where = spec.where ?? 'structure';
  requireInput(spec.crestWidth > 0 && Number.isFinite(spec.crestWidth), `${where}.crestWidth`, 'the crest width must be a positive number', spec.crestWidth);
  const cd = spec.coefficient ?? broadCrestedDefaultCoefficient;
  requireInput(cd > 0 && cd <= 1.1, `${where}.coefficient`, 'the broad-crested coefficient (ratio to ideal) must lie in (0, 1.1]; 0.85–1.0 is usual', cd);
  const ideal = idealBroadCrestedCoefficient(units);
  const b = spec.crestWidth;
  const notes: string[] = [];
  if (cd < broadCrestedCoefficientRange[0] || cd > broadCrestedCoefficientRange[1]) {
    notes.push(`coefficient ${cd} lies outside the usual 0.85–1.0 of ideal (Bos 1989; from memory)`);
  }
  if (spec.coefficient === undefined) notes.push('default coefficient 0.85 of ideal: the low end of the usual range, giving the higher headwater');
  return {
    kind: 'broad-crested',
    method: 'broad-crested weir, critical depth on the crest: Q = Cd·(2/3)^1.5·√g·b·H^1.5',
    discharge: (h) => (h <= 0 ? 0 : cd * ideal * b * Math.pow(h, 1.5)),
    headExponent: 1.5,
    headIs: 'energy',
    values: (h) => ({ idealCoefficient: ideal, dischargeCoefficient: cd, weirCoefficient: cd * ideal, criticalDepthOnCrest: (2 / 3) * h }),
    notes,
    scale: b / 4,
  };
}

export function broadCrestedDischarge(spec: BroadCrestedSpec, energyHead: number, units: Units): number {
  return broadCrestedLaw(spec, units).discharge(energyHead);
}

export function broadCrested(spec: BroadCrestedSpec, discharge: number, tailwaterStage: number | null, units: Units): StructureOutcome {
  const law = broadCrestedLaw(spec, units);
  requireInput(discharge >= 0 && Number.isFinite(discharge), `${spec.where ?? 'structure'}.discharge`, 'the discharge must be a number ≥ 0', discharge);
  return weirControl(law, spec.approachArea ? { crestElevation: spec.crestElevation, approachArea: spec.approachArea } : { crestElevation: spec.crestElevation }, discharge, tailwaterStage, units);
}
