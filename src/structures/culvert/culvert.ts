/**
 * A culvert: the headwater is the larger of inlet control and outlet control (FHWA HDS-5, 3rd ed. 2012,
 * ch. 3: the culvert works under whichever control needs the higher headwater).
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import { structureCaution } from '../cautions.js';
import type { StructureOutcome } from '../types.js';
import { type BarrelShape, barrel, barrelCriticalDepth, barrelNormalDepth } from './barrel.js';
import { type InletType, inletCoefficients, inletControl } from './inletControl.js';
import { type BarrelProfile, type BarrelProfileResult, outletControl } from './outletControl.js';

export interface CulvertSpec {
  readonly barrel: BarrelShape;
  /** barrel length L */
  readonly length: number;
  /** barrel slope S (fall per length, positive downhill) */
  readonly slope: number;
  /** Manning's n of the barrel */
  readonly roughness: number;
  readonly inlet: InletType;
  /** entrance loss ke (default: the HDS-5 value for the inlet type) */
  readonly entranceLoss?: number;
  readonly inletInvert: number;
  /** identical barrels side by side sharing the flow (default 1) */
  readonly barrels?: number;
  readonly where?: string;
}

export interface CulvertOptions {
  /** the engine's part-full barrel profile (see outletControl.ts) */
  readonly barrelProfile?: BarrelProfile;
}

export interface CulvertOutcome extends StructureOutcome {
  readonly controlling: 'inlet' | 'outlet';
  readonly inletControlHeadwater: number;
  readonly outletControlHeadwater: number;
  readonly outletDepth: number;
  readonly outletVelocity: number;
  readonly barrelStations?: BarrelProfileResult['stations'];
}

export function culvert(spec: CulvertSpec, discharge: number, tailwaterStage: number | null, units: Units, options: CulvertOptions = {}): CulvertOutcome {
  const where = spec.where ?? 'structure';
  requireInput(spec.length > 0 && Number.isFinite(spec.length), `${where}.length`, 'the barrel length must be a positive number', spec.length);
  requireInput(Number.isFinite(spec.slope) && Math.abs(spec.slope) < 1, `${where}.slope`, 'the barrel slope must be a number between −1 and 1', spec.slope);
  requireInput(spec.roughness >= 0.005 && spec.roughness <= 0.2, `${where}.roughness`, "Manning's n of the barrel must lie between 0.005 and 0.2", spec.roughness);
  requireInput(spec.inlet in inletCoefficients, `${where}.inlet`, `unknown inlet type; accepted: ${Object.keys(inletCoefficients).join(', ')}`, spec.inlet);
  const count = spec.barrels ?? 1;
  requireInput(Number.isInteger(count) && count >= 1, `${where}.barrels`, 'the number of barrels must be a whole number ≥ 1', count);
  requireInput(discharge > 0 && Number.isFinite(discharge), `${where}.discharge`, 'the discharge must be a positive number', discharge);
  const b = barrel(spec.barrel, `${where}.barrel`);
  const co = inletCoefficients[spec.inlet];
  requireInput(co.barrel === spec.barrel.shape, `${where}.inlet`, `inlet type ${spec.inlet} is for a ${co.barrel} barrel, not a ${spec.barrel.shape} one`, spec.inlet);
  const ke = spec.entranceLoss ?? co.ke;
  requireInput(ke >= 0 && ke <= 1.5, `${where}.entranceLoss`, 'the entrance loss coefficient must lie between 0 and 1.5', ke);
  const q = discharge / count;
  const D = b.rise;
  const outletInvert = spec.inletInvert - spec.length * spec.slope;
  const tailwaterDepth = tailwaterStage === null ? 0 : Math.max(tailwaterStage - outletInvert, 0);

  const inlet = inletControl(b, co, q, spec.slope, units);
  const outlet = outletControl({
    barrel: b, length: spec.length, slope: spec.slope, roughness: spec.roughness, entranceLoss: ke, discharge: q, tailwaterDepth, units,
    ...(options.barrelProfile ? { barrelProfile: options.barrelProfile } : {}),
  });
  const controlling = inlet.headwaterDepth >= outlet.headwaterDepth ? 'inlet' : 'outlet';
  const headwaterDepth = Math.max(inlet.headwaterDepth, outlet.headwaterDepth);

  // Outlet depth: outlet control from the outlet-control computation; inlet control from normal depth in the
  // barrel (HDS-5's approximation for the outlet velocity under inlet control), or full where none exists.
  const dc = barrelCriticalDepth(b, q, units);
  let outletDepth: number;
  let outletVelocity: number;
  const notes = [...outlet.notes];
  if (controlling === 'outlet') {
    outletDepth = outlet.outletDepth;
    outletVelocity = outlet.outletVelocity;
  } else {
    const yn = barrelNormalDepth(b, q, spec.slope, spec.roughness, units);
    outletDepth = yn === null ? D : Math.min(yn, D);
    if (tailwaterDepth > outletDepth && tailwaterDepth < D) outletDepth = tailwaterDepth;
    outletVelocity = q / b.elements(outletDepth).area;
    notes.push('inlet control: outlet depth taken as normal depth in the barrel (HDS-5 approximation), or the tailwater where higher');
  }
  const supercriticalOut = controlling === 'inlet' && outletDepth < dc && tailwaterDepth < outletDepth;
  notes.push(`controlling: ${controlling} control (the larger of the two headwaters)`);
  return {
    kind: 'culvert',
    method: 'FHWA HDS-5 (2012): inlet-control equations and outlet-control energy balance, larger headwater governs',
    units: units.system,
    discharge,
    condition: controlling === 'inlet' ? 'inlet-control' : 'outlet-control',
    headwaterStage: spec.inletInvert + headwaterDepth,
    // The pool upstream of a culvert is taken as still water: the HDS-5 headwater is an energy level.
    headwaterEnergy: spec.inletInvert + headwaterDepth,
    tailwaterStage,
    downstreamSupercriticalDepth: supercriticalOut ? outletDepth : null,
    controlling,
    inletControlHeadwater: inlet.headwaterDepth,
    outletControlHeadwater: outlet.headwaterDepth,
    outletDepth,
    outletVelocity,
    ...(outlet.stations ? { barrelStations: outlet.stations } : {}),
    values: {
      ...inlet.values,
      ...outlet.values,
      barrels: count,
      dischargePerBarrel: q,
      barrelRise: D,
      outletInvert,
      tailwaterDepthAtOutlet: tailwaterDepth,
      inletControlHeadwater: inlet.headwaterDepth,
      outletControlHeadwater: outlet.headwaterDepth,
      outletControlMethod: outlet.method,
      controlling,
      headwaterDepth,
      headwaterToRise: headwaterDepth / D,
      outletDepth,
      outletVelocity,
    },
    notes,
    caution: structureCaution,
  };
}
