/**
 * Flow over a road embankment: a broad-crested weir along the overtopped length of roadway,
 *   Q = Cr·L·H^1.5,  H the head above the road crest,
 * with Cr ≈ 3.0 ft^½/s (1.66 m^½/s) for a paved road when H/Lr exceeds about 0.15, Lr the width of the
 * road crest in the direction of flow (Bradley, Hydraulics of Bridge Waterways, FHWA HDS-1, 1978, the
 * embankment-overflow curves, also used in FHWA HDS-5 2012 ch. on roadway overtopping; value from memory).
 * For smaller H/Lr and gravel surfaces the published curves give somewhat lower values: pass your own
 * coefficient there. Submergence here follows Villemonte (./submergence.ts), which reduces the flow sooner
 * than the road-overtopping submergence curve does, so headwaters are on the high side.
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { ApproachArea, StructureOutcome } from '../types.js';
import { type WeirLaw, weirControl } from './weirControl.js';

/** Cr for a paved road, ft^½/s (HDS-1 curves, from memory). */
export const pavedRoadCoefficientUS = 3.0;

export interface RoadOverflowSpec {
  /** overtopped length of roadway L (across the flow) */
  readonly length: number;
  /** road crest elevation */
  readonly crestElevation: number;
  /** road crest width Lr in the direction of flow (for the H/Lr check) */
  readonly crestWidth?: number;
  /** Cr in the unit system's units (length^½/s); default the paved-road value */
  readonly coefficient?: number;
  readonly approachArea?: ApproachArea;
  readonly where?: string;
}

/** The paved-road Cr in a unit system: Cr/√g is dimensionless, so Cr scales with √g. */
export function pavedRoadCoefficient(units: Units): number {
  return units.system === 'US' ? pavedRoadCoefficientUS : pavedRoadCoefficientUS * Math.sqrt(units.g / 32.174);
}

export function roadOverflowLaw(spec: RoadOverflowSpec, units: Units): WeirLaw {
  const where = spec.where ?? 'structure';
  requireInput(spec.length > 0 && Number.isFinite(spec.length), `${where}.length`, 'the overtopped road length must be a positive number', spec.length);
  if (spec.crestWidth !== undefined) {
    requireInput(spec.crestWidth > 0 && Number.isFinite(spec.crestWidth), `${where}.crestWidth`, 'the road crest width must be a positive number', spec.crestWidth);
  }
  const cr = spec.coefficient ?? pavedRoadCoefficient(units);
  const ideal = Math.pow(2 / 3, 1.5) * Math.sqrt(units.g);
  requireInput(cr > 0 && cr <= 1.1 * ideal, `${where}.coefficient`, `the road-overflow coefficient must lie in (0, ${(1.1 * ideal).toFixed(3)}] (the ideal broad-crested value is ${ideal.toFixed(3)})`, cr);
  const L = spec.length;
  const notes = spec.coefficient === undefined ? ['paved-road coefficient Cr = 3.0 ft^½/s (HDS-1 embankment-overflow curves; from memory)'] : [];
  const lr = spec.crestWidth;
  return {
    kind: 'road-overflow',
    method: 'road embankment overflow as a broad-crested weir, Q = Cr·L·H^1.5 (FHWA HDS-1 1978)',
    discharge: (h) => (h <= 0 ? 0 : cr * L * Math.pow(h, 1.5)),
    headExponent: 1.5,
    headIs: 'energy',
    values: (h) => ({
      roadCoefficient: cr,
      ratioToIdealBroadCrested: cr / ideal,
      headToCrestWidth: lr === undefined ? null : h / lr,
      coefficientCurveApplies: lr === undefined ? null : h / lr > 0.15,
    }),
    notes,
    scale: L / 20,
  };
}

export function roadOverflow(spec: RoadOverflowSpec, discharge: number, tailwaterStage: number | null, units: Units): StructureOutcome {
  const law = roadOverflowLaw(spec, units);
  requireInput(discharge >= 0 && Number.isFinite(discharge), `${spec.where ?? 'structure'}.discharge`, 'the discharge must be a number ≥ 0', discharge);
  const outcome = weirControl(law, spec.approachArea ? { crestElevation: spec.crestElevation, approachArea: spec.approachArea } : { crestElevation: spec.crestElevation }, discharge, tailwaterStage, units);
  if (spec.crestWidth !== undefined && spec.coefficient === undefined && Number(outcome.values['headOverCrest']) / spec.crestWidth <= 0.15) {
    return { ...outcome, notes: [...outcome.notes, 'H/Lr ≤ 0.15: the published curves give a head-dependent Cr somewhat below 3.0 ft^½/s; consider supplying it'] };
  }
  return outcome;
}
