/**
 * Inputs and results of a spatially varied flow computation (a reach receiving lateral inflow).
 * Stations are distances from the upstream end of the reach, increasing downstream, in the units of the
 * hydraulic section. Station rows extend the project's StationResult (src/results/types.ts).
 */
import type { UnitSystem } from '../../core/units.js';
import type { HydraulicSection } from '../../hydraulics/hydraulicSection.js';
import type { JumpType, StationResult } from '../../results/types.js';
import type { ControlKind } from './controlSection.js';
import type { LateralInflowStretch } from './lateralInflow.js';

/** Downstream boundary: a known depth (tailwater), or critical depth (free outfall). */
export type SpatiallyVariedDownstream = { kind: 'critical' } | { kind: 'depth'; depth: number };
/** Upstream boundary, used only when the flow enters supercritical: critical depth (default) or a known depth. */
export type SpatiallyVariedUpstream = { kind: 'critical' } | { kind: 'depth'; depth: number };

export interface SpatiallyVariedInput {
  /** the prismatic section of the whole reach, with its friction law and unit system */
  readonly section: HydraulicSection;
  readonly length: number;
  /** bed slope S0, positive falling downstream (0: horizontal) */
  readonly slope: number;
  /** discharge entering at the upstream end, ≥ 0 (0 for a collector that starts dry: handled exactly, since
   *  at Q = 0 the equation is regular, dy/dx = S0) */
  readonly upstreamDischarge: number;
  /** q* per unit length over the whole reach, or stretches of it */
  readonly inflow: number | readonly LateralInflowStretch[];
  readonly downstream: SpatiallyVariedDownstream;
  readonly upstream?: SpatiallyVariedUpstream;
  /** momentum coefficient β (default 1) */
  readonly beta?: number;
  /** output stations; default every 1/100 of the length. 0, the length and the control are always added. */
  readonly stations?: readonly number[];
  /** bed elevation at the downstream end (default 0); the bed rises upstream by S0 per unit length */
  readonly downstreamBedElevation?: number;
}

export interface SpatiallyVariedStation extends StationResult {
  /** discharge at the station, Q0 + ∫q* */
  discharge: number;
  /** q* at the station (the value just downstream at a break) */
  inflow: number;
  /** critical depth for the local discharge (momentum form, with β) */
  criticalDepth: number;
  /** specific force βQ²/(gA) + Aȳ */
  specificForce: number;
}

export interface SpatiallyVariedControl {
  kind: ControlKind | 'downstream-depth' | 'upstream-depth';
  station: number;
  depth: number;
  /** why the control sits there, in words */
  reason: string;
  /** at a singular point: N and D of the equation at the control (both ≈ 0) and the slope through it */
  numerator?: number;
  denominator?: number;
  slope?: number;
}

export interface SpatiallyVariedJump {
  /** where the supercritical and subcritical profiles have equal specific force */
  station: number;
  upstreamDepth: number;
  downstreamDepth: number;
  froude: number;
  type: JumpType;
}

export interface SpatiallyVariedResult {
  units: UnitSystem;
  method: string;
  length: number;
  slope: number;
  beta: number;
  stations: SpatiallyVariedStation[];
  control: SpatiallyVariedControl;
  jump?: SpatiallyVariedJump;
  warnings: string[];
  cautions: string[];
}
