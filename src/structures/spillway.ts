/**
 * Overflow spillway with an apron below it.
 *
 * Crest: Q = C·L·He^1.5, He the energy head above the crest, C a user value or the USBR curve of C at the
 * design head against P/Hd for a vertical upstream face (USBR, Design of Small Dams, 3rd ed. 1987, ch. 9,
 * fig. "coefficient of discharge for ogee-shaped crests with vertical upstream faces"; the curve here is from
 * memory: C rises from about 3.1 ft^½/s for a very low crest to 3.95 ft^½/s for P/Hd ≥ 3). It is applied at
 * He = Hd, without the head-ratio correction for other heads.
 *
 * Toe: energy from the pool to the toe on the apron floor, with an optional loss k·V²/2g,
 *   y + (1 + k)·q²/(2g·y²) = E0 = (energy grade upstream) − (apron floor),
 * solved for the supercritical root by a bracketed root below the depth of least energy.
 *
 * Apron check, as a stilling-basin check does: the sequent depth y2 of the toe depth (Bélanger, Chow 1959
 * eq. 3-21) against the tailwater depth on the apron (positive margin: drowned jump; negative: the jump is
 * swept downstream), jump type by F1 (Chow 1959 §15-3, after USBR tests), and the jump length
 * L ≈ 6·y2 for F1 between about 4.5 and 13 (Peterka, USBR Engineering Monograph 25, 1958; the constant from
 * memory), compared with the apron length.
 */
import { HydraulicError, requireInput } from '../core/errors.js';
import { brentRoot } from '../core/roots.js';
import { depthAbsoluteTolerance, rootMaxIterations } from '../core/tolerances.js';
import type { Units } from '../core/units.js';
import type { JumpType } from '../results/types.js';
import { approachStage } from './approach.js';
import { structureCaution } from './cautions.js';
import { rectangularSequentDepth, rectangularSpecificForce } from './gate.js';
import { invertRising, structureTolerance } from './invert.js';
import type { ApproachArea, HandValues, StructureOutcome } from './types.js';
import { interpolate } from './weirs/table.js';

/** USBR C at the design head against P/Hd, vertical upstream face, ft^½/s (from memory). */
export const usbrOgeeCoefficient = {
  ratio: [0, 0.1, 0.2, 0.4, 0.6, 1.0, 1.5, 2.0, 3.0],
  coefficientUS: [3.08, 3.45, 3.6, 3.75, 3.82, 3.88, 3.92, 3.94, 3.95],
} as const;

/** Jump length over sequent depth (Peterka 1958, F1 ≈ 4.5–13; from memory). */
export const jumpLengthRatio = 6;
export const jumpLengthFroudeRange = [4.5, 13] as const;

/** The USBR ogee coefficient in the unit system (C/√g is dimensionless). */
export function usbrOgeeCoefficientAt(ratioToDesignHead: number, units: Units): number {
  const us = interpolate(usbrOgeeCoefficient.ratio, usbrOgeeCoefficient.coefficientUS, Math.max(ratioToDesignHead, 0));
  return units.system === 'US' ? us : us * Math.sqrt(units.g / 32.174);
}

/** Jump type by upstream Froude number (Chow 1959 §15-3). */
export function jumpType(froude: number): JumpType {
  if (froude < 1.7) return 'undular';
  if (froude < 2.5) return 'weak';
  if (froude < 4.5) return 'oscillating';
  if (froude < 9) return 'steady';
  return 'strong';
}

export interface ApronCheck {
  readonly toeDepth: number;
  readonly toeFroude: number;
  readonly sequentDepth: number;
  readonly tailwaterDepth: number | null;
  /** tailwater minus sequent depth: positive drowned, negative swept out */
  readonly margin: number | null;
  readonly jumpType: JumpType;
  readonly jumpLength: number;
  readonly energyLoss: number;
  /** null when no apron length or no tailwater was given */
  readonly fitsOnApron: boolean | null;
  /** when swept out: the supercritical depth at which the jump will form (the sequent of the tailwater) */
  readonly jumpFormsAtDepth: number | null;
  /** specific-force residual of the jump at the toe (per unit width), for checking */
  readonly momentumResidual: number;
}

/** The stilling-basin check of a rectangular apron for a supercritical toe depth. */
export function apronCheck(toeDepth: number, unitDischarge: number, tailwaterDepth: number | null, apronLength: number | undefined, units: Units): ApronCheck {
  const q = unitDischarge;
  const y1 = toeDepth;
  const y2 = rectangularSequentDepth(y1, q, units);
  const froude = q / Math.sqrt(units.g * y1 * y1 * y1);
  const length = jumpLengthRatio * y2;
  const margin = tailwaterDepth === null ? null : tailwaterDepth - y2;
  const fits = margin === null || apronLength === undefined ? null : margin >= 0 && length <= apronLength;
  return {
    toeDepth: y1,
    toeFroude: froude,
    sequentDepth: y2,
    tailwaterDepth,
    margin,
    jumpType: jumpType(froude),
    jumpLength: length,
    energyLoss: ((y2 - y1) ** 3) / (4 * y1 * y2),
    fitsOnApron: fits,
    jumpFormsAtDepth: margin !== null && margin < 0 && tailwaterDepth !== null && tailwaterDepth > 0 ? rectangularSequentDepth(tailwaterDepth, q, units) : null,
    momentumResidual: rectangularSpecificForce(y1, q, units) - rectangularSpecificForce(y2, q, units),
  };
}

/** Supercritical depth with y + (1 + k)·q²/(2g·y²) = E0. */
export function toeDepth(unitDischarge: number, availableEnergy: number, lossCoefficient: number, units: Units): number {
  const c = ((1 + lossCoefficient) * unitDischarge * unitDischarge) / (2 * units.g);
  const f = (y: number) => y + c / (y * y) - availableEnergy;
  const yMin = Math.cbrt(2 * c);
  if (f(yMin) >= 0) {
    throw new HydraulicError(`spillway toe: the available energy ${availableEnergy} is below the least energy ${1.5 * yMin} for this unit discharge`);
  }
  // f → +∞ as y → 0; bracket the supercritical root on (ε, yMin).
  let lo = yMin / 2;
  for (let i = 0; i < rootMaxIterations && f(lo) <= 0; i++) lo /= 2;
  if (f(lo) <= 0) throw new HydraulicError(`spillway toe: no supercritical depth found below ${lo}`);
  return brentRoot(f, lo, yMin, { xTolerance: Math.max(structureTolerance(lo), depthAbsoluteTolerance * yMin), what: 'spillway toe depth' });
}

export interface SpillwaySpec {
  readonly crestElevation: number;
  readonly crestLength: number;
  /** approach bed elevation upstream (crest height P = crest − approach bed) */
  readonly approachBedElevation: number;
  /** C in Q = C·L·He^1.5 (length^½/s); default: the USBR curve at the design head */
  readonly coefficient?: number;
  readonly apronElevation: number;
  /** apron width (default the crest length) */
  readonly apronWidth?: number;
  readonly apronLength?: number;
  /** loss on the chute as a multiple of the toe velocity head (default 0) */
  readonly toeLossCoefficient?: number;
  readonly approachArea?: ApproachArea;
  readonly where?: string;
}

export interface SpillwayOutcome extends StructureOutcome {
  readonly apron: ApronCheck;
}

export function spillway(spec: SpillwaySpec, discharge: number, tailwaterStage: number | null, units: Units): SpillwayOutcome {
  const where = spec.where ?? 'structure';
  requireInput(spec.crestLength > 0 && Number.isFinite(spec.crestLength), `${where}.crestLength`, 'the crest length must be a positive number', spec.crestLength);
  const p = spec.crestElevation - spec.approachBedElevation;
  requireInput(p >= 0 && Number.isFinite(p), `${where}.approachBedElevation`, 'the approach bed must lie at or below the crest', spec.approachBedElevation);
  requireInput(spec.apronElevation < spec.crestElevation, `${where}.apronElevation`, 'the apron must lie below the crest', spec.apronElevation);
  const width = spec.apronWidth ?? spec.crestLength;
  requireInput(width > 0 && Number.isFinite(width), `${where}.apronWidth`, 'the apron width must be a positive number', width);
  if (spec.apronLength !== undefined) requireInput(spec.apronLength > 0, `${where}.apronLength`, 'the apron length must be a positive number', spec.apronLength);
  const k = spec.toeLossCoefficient ?? 0;
  requireInput(k >= 0 && k < 10, `${where}.toeLossCoefficient`, 'the chute loss coefficient must lie between 0 and 10', k);
  if (spec.coefficient !== undefined) requireInput(spec.coefficient > 0, `${where}.coefficient`, 'the crest coefficient must be a positive number', spec.coefficient);
  requireInput(discharge > 0 && Number.isFinite(discharge), `${where}.discharge`, 'the discharge must be a positive number', discharge);

  const L = spec.crestLength;
  const coefficientAt = (h: number) => spec.coefficient ?? usbrOgeeCoefficientAt(h > 0 ? p / h : Infinity, units);
  const q = (h: number) => (h <= 0 ? 0 : coefficientAt(h) * L * Math.pow(h, 1.5));
  const guess = Math.pow(discharge / (3 * L), 2 / 3);
  const head = invertRising(q, discharge, { lo: 0, guess, scale: Math.max(guess, p), what: 'spillway head' });
  const energy = spec.crestElevation + head;
  const stage = approachStage(energy, spec.crestElevation, discharge, spec.approachArea, units);
  const unit = discharge / width;
  const e0 = energy - spec.apronElevation;
  const y1 = toeDepth(unit, e0, k, units);
  const tailwaterDepth = tailwaterStage === null ? null : tailwaterStage - spec.apronElevation;
  const apron = apronCheck(y1, unit, tailwaterDepth, spec.apronLength, units);

  const notes: string[] = [];
  if (spec.coefficient === undefined) notes.push('crest coefficient from the USBR curve against P/Hd at the design head (curve from memory)');
  if (!spec.approachArea) notes.push('no approach section given: approach velocity head neglected');
  if (apron.toeFroude < jumpLengthFroudeRange[0] || apron.toeFroude > jumpLengthFroudeRange[1]) {
    notes.push(`F1 = ${apron.toeFroude.toFixed(2)} lies outside ${jumpLengthFroudeRange[0]}–${jumpLengthFroudeRange[1]}, where L ≈ 6·y2 was established`);
  }
  if (apron.margin !== null) {
    notes.push(apron.margin >= 0
      ? 'tailwater at or above the sequent depth: the jump forms at the toe (drowned when the margin is positive)'
      : 'tailwater below the sequent depth: the jump is swept downstream of the toe; its position comes from the profile engine');
  }
  if (tailwaterStage !== null && tailwaterStage > spec.crestElevation) notes.push('tailwater above the crest: crest submergence is not modelled here');
  const values: HandValues = {
    crestCoefficient: coefficientAt(head),
    crestHeight: p,
    energyHeadOverCrest: head,
    headToCrestHeight: p > 0 ? p / head : null,
    unitDischargeOnApron: unit,
    energyAboveApron: e0,
    toeLossCoefficient: k,
    toeDepth: y1,
    toeVelocity: unit / y1,
    toeFroude: apron.toeFroude,
    sequentDepth: apron.sequentDepth,
    tailwaterDepthOnApron: tailwaterDepth,
    tailwaterMinusSequent: apron.margin,
    jumpType: apron.jumpType,
    jumpLength: apron.jumpLength,
    jumpEnergyLoss: apron.energyLoss,
    apronLength: spec.apronLength ?? null,
    jumpFitsOnApron: apron.fitsOnApron,
    jumpFormsAtSupercriticalDepth: apron.jumpFormsAtDepth,
  };
  return {
    kind: 'spillway',
    method: 'overflow crest Q = C·L·He^1.5; toe by energy; apron check by Bélanger and Peterka (1958)',
    units: units.system,
    discharge,
    condition: 'free',
    headwaterStage: stage,
    headwaterEnergy: energy,
    tailwaterStage,
    downstreamSupercriticalDepth: y1,
    values,
    notes,
    caution: structureCaution,
    apron,
  };
}
