/**
 * Culvert outlet control (FHWA HDS-5, 3rd ed. 2012, ch. 3 "outlet control"; the full-flow energy equation).
 *
 * Full barrel: HW = ho + H − L·S, measured above the inlet invert, with
 *   H = (1 + ke + 2g·n²·L/(k²·R^(4/3)))·V²/2g,  V = Q/A_full,
 * where Manning's hf = L·(n·V/(k·R^(2/3)))² has been written as a multiple of V²/2g (k = 1 SI, 1.486 US).
 * In US units 2g/k² = 2·32.174/1.486² = 29.1 and in SI 2g = 19.6: the 29 and 19.63 of the HDS-5 formula.
 * ho = max(TW, (dc + D)/2) with dc ≤ D, the HDS-5 approximation of the outlet pressure line when the tailwater
 * lies below the crown. HDS-5 calls it reliable where the barrel flows full over part of its length; for a
 * barrel part full throughout it asks for a backwater computation — which the profile engine supplies through
 * the `barrelProfile` callback below (dependency injection: structures does not import the engine).
 */
import type { Units } from '../../core/units.js';
import type { HandValues } from '../types.js';
import { type Barrel, barrelCriticalDepth } from './barrel.js';

/** The friction term's factor 2g/k², so H = (1 + ke + factor·n²·L/R^(4/3))·V²/2g. */
export function fullFlowFrictionFactor(units: Units): number {
  return (2 * units.g) / (units.manningFactor * units.manningFactor);
}

/** HDS-5's own below-0.75·D caution for the ho approximation (from memory). */
export const hoApproximationLimit = 0.75;

/** What the engine gets to compute the part-full barrel profile. */
export interface BarrelProfileInputs {
  readonly barrel: Barrel;
  readonly length: number;
  readonly slope: number;
  /** Manning's n of the barrel */
  readonly roughness: number;
  readonly discharge: number;
  /** depth above the outlet invert where the subcritical barrel profile starts: max(TW, dc), at most D */
  readonly outletControlDepth: number;
  readonly tailwaterDepth: number;
  readonly criticalDepth: number;
  readonly units: Units;
}

/** What the engine returns: depths at both ends (at most D; D means the barrel runs full there). */
export interface BarrelProfileResult {
  readonly inletDepth: number;
  readonly outletDepth: number;
  /** the computed profile, distance from the outlet upstream, for reports */
  readonly stations?: ReadonlyArray<{ readonly distanceFromOutlet: number; readonly depth: number }>;
  /** distance from the outlet over which the barrel runs full (0: free surface throughout) */
  readonly fullLength?: number;
  /**
   * Where the barrel runs full from the inlet down to the point where the free-surface profile reaches the
   * crown: the pressure head at the inlet above its invert, D + (Sf,full − S)·(full length), from full-flow
   * friction over the full part. With it the headwater is this head plus (1 + ke)·V²/2g of full flow.
   */
  readonly inletPressureHead?: number;
}

/** The engine's gradually varied flow through the barrel. */
export type BarrelProfile = (inputs: BarrelProfileInputs) => BarrelProfileResult;

export interface OutletControlInputs {
  readonly barrel: Barrel;
  readonly length: number;
  readonly slope: number;
  readonly roughness: number;
  /** entrance loss coefficient ke */
  readonly entranceLoss: number;
  /** discharge in one barrel */
  readonly discharge: number;
  /** tailwater depth above the outlet invert (0 or more) */
  readonly tailwaterDepth: number;
  readonly units: Units;
  readonly barrelProfile?: BarrelProfile;
}

export interface OutletControlResult {
  /** headwater depth above the inlet invert */
  readonly headwaterDepth: number;
  readonly method: 'full-flow' | 'full-flow-ho' | 'barrel-profile';
  readonly outletDepth: number;
  readonly outletVelocity: number;
  readonly stations?: BarrelProfileResult['stations'];
  readonly values: HandValues;
  readonly notes: string[];
}

/** Full-flow head loss H = (1 + ke + 2g·n²·L/(k²·R^(4/3)))·V²/2g and its parts. */
export function fullFlowHeadLoss(b: Barrel, length: number, roughness: number, entranceLoss: number, discharge: number, units: Units) {
  const v = discharge / b.fullArea;
  const velocityHead = (v * v) / (2 * units.g);
  const frictionCoefficient = (fullFlowFrictionFactor(units) * roughness * roughness * length) / Math.pow(b.fullHydraulicRadius, 4 / 3);
  return { velocity: v, velocityHead, frictionCoefficient, headLoss: (1 + entranceLoss + frictionCoefficient) * velocityHead };
}

export function outletControl(inputs: OutletControlInputs): OutletControlResult {
  const { barrel: b, length, slope, roughness, entranceLoss, discharge, tailwaterDepth, units } = inputs;
  const D = b.rise;
  const full = fullFlowHeadLoss(b, length, roughness, entranceLoss, discharge, units);
  const dc = Math.min(barrelCriticalDepth(b, discharge, units), D);
  const tw = Math.max(tailwaterDepth, 0);
  const hoMean = (dc + D) / 2;
  const ho = Math.max(tw, hoMean);
  const fullFlowHeadwater = ho + full.headLoss - length * slope;
  const notes: string[] = [];
  const values: HandValues = {
    fullFlowVelocity: full.velocity,
    fullFlowVelocityHead: full.velocityHead,
    entranceLossCoefficient: entranceLoss,
    frictionLossCoefficient: full.frictionCoefficient,
    fullFlowHeadLoss: full.headLoss,
    barrelCriticalDepth: dc,
    outletPressureLine: ho,
    fallAlongBarrel: length * slope,
    fullFlowHeadwater,
  };
  const outletFull = tw >= D;
  if (outletFull) {
    return { headwaterDepth: fullFlowHeadwater, method: 'full-flow', outletDepth: D, outletVelocity: full.velocity, values, notes: ['outlet submerged: the barrel flows full (HDS-5 full-flow equation)'] };
  }
  const controlDepth = Math.min(Math.max(tw, dc), D);
  if (inputs.barrelProfile) {
    const profile = inputs.barrelProfile({ barrel: b, length, slope, roughness, discharge, outletControlDepth: controlDepth, tailwaterDepth: tw, criticalDepth: dc, units });
    const outletArea = b.elements(Math.min(profile.outletDepth, D)).area;
    const outletVelocity = discharge / outletArea;
    if (profile.inletDepth >= D && profile.inletPressureHead !== undefined) {
      const headwaterDepth = profile.inletPressureHead + (1 + entranceLoss) * full.velocityHead;
      notes.push(
        'the computed barrel profile reaches the crown: the barrel runs full from the inlet over that part (full-flow friction), ' +
          'headwater = inlet pressure head + (1 + ke)·V²/2g of full flow',
      );
      return {
        headwaterDepth,
        method: 'barrel-profile',
        outletDepth: profile.outletDepth,
        outletVelocity,
        ...(profile.stations ? { stations: profile.stations } : {}),
        values: { ...values, barrelInletDepth: D, barrelInletPressureHead: profile.inletPressureHead, barrelFullLength: profile.fullLength ?? 0 },
        notes,
      };
    }
    if (profile.inletDepth >= D) {
      notes.push('the computed barrel profile reaches the crown: the inlet end runs full, HDS-5 full-flow equation used');
      return { headwaterDepth: fullFlowHeadwater, method: 'full-flow-ho', outletDepth: profile.outletDepth, outletVelocity, ...(profile.stations ? { stations: profile.stations } : {}), values, notes };
    }
    const inlet = b.elements(profile.inletDepth);
    const vIn = discharge / inlet.area;
    const headwaterDepth = profile.inletDepth + ((1 + entranceLoss) * vIn * vIn) / (2 * units.g);
    notes.push('part-full barrel: headwater = inlet depth + (1 + ke)·V²/2g at the inlet, from the computed barrel profile');
    return {
      headwaterDepth,
      method: 'barrel-profile',
      outletDepth: profile.outletDepth,
      outletVelocity,
      ...(profile.stations ? { stations: profile.stations } : {}),
      values: { ...values, barrelInletDepth: profile.inletDepth, barrelInletVelocity: vIn, barrelFullLength: profile.fullLength ?? 0 },
      notes,
    };
  }
  // Without the engine: HDS-5's ho approximation; outlet velocity on the larger of dc and TW (HDS-5 practice).
  if (fullFlowHeadwater < hoApproximationLimit * D) {
    notes.push(`headwater below ${hoApproximationLimit}·D: HDS-5's ho approximation is rough here; a barrel backwater computation is needed (from memory of HDS-5)`);
  }
  notes.push('no barrel profile computed: HDS-5 full-flow equation with ho = max(TW, (dc + D)/2)');
  const outletVelocity = discharge / b.elements(controlDepth).area;
  return { headwaterDepth: fullFlowHeadwater, method: 'full-flow-ho', outletDepth: controlDepth, outletVelocity, values, notes };
}
