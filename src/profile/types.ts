/**
 * Input types of the profile engine: plain data, so the model reader (and the structures layer)
 * can build them without knowing how the profile is computed.
 *
 * Stations are distances from the upstream end of the channel, increasing downstream.
 * Depths are measured from the lowest point of the section; elevations are in the same length unit.
 */
import type { Units } from '../core/units.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type { StructureResult } from '../results/types.js';

/** The three integration methods (one signature each, see methods.ts). */
export const ProfileMethod = {
  'standard-step': 'standard-step',
  'direct-step': 'direct-step',
  ode: 'ode',
} as const;
export type ProfileMethod = keyof typeof ProfileMethod;

/** How the friction slope is averaged over a step (Chow 1959 §10-3; average conveyance is the default). */
export const FrictionAveraging = {
  conveyance: 'conveyance',
  arithmetic: 'arithmetic',
  geometric: 'geometric',
  harmonic: 'harmonic',
} as const;
export type FrictionAveraging = keyof typeof FrictionAveraging;

/** A boundary condition at one end of the channel. */
export type Boundary =
  | { readonly type: 'depth'; readonly depth: number }
  | { readonly type: 'stage'; readonly elevation: number }
  | { readonly type: 'normal' }
  | { readonly type: 'critical' };

/** A prismatic reach: one section, a constant bed slope (positive falling downstream). */
export interface PrismaticReachInput {
  readonly kind?: 'prismatic';
  readonly id: string;
  readonly section: HydraulicSection;
  readonly length: number;
  /** bed slope S0, positive when the bed falls downstream; 0 horizontal; negative adverse */
  readonly slope: number;
  /** the discharge in this reach when it differs from ProfileInput.discharge (a flow change at its upstream end) */
  readonly discharge?: number;
}

/**
 * One surveyed node of a non-prismatic reach (issue 4). Nodes run upstream to downstream.
 * The standard step works node to node; direct step and ODE need prismatic reaches.
 */
export interface SurveyNode {
  /** station along the channel (distance from the upstream end of the whole channel) */
  readonly station: number;
  readonly bedElevation: number;
  readonly section: HydraulicSection;
  /** contraction loss coefficient applied to the change of velocity head when it increases downstream */
  readonly contraction?: number;
  /** expansion loss coefficient applied when the velocity head decreases downstream */
  readonly expansion?: number;
  /** flow length to the next node downstream, when it differs from the station difference */
  readonly reachLength?: number;
  /** true for a section interpolated between surveyed ones */
  readonly interpolated?: boolean;
}

export interface SurveyedReachInput {
  readonly kind: 'surveyed';
  readonly id: string;
  readonly nodes: readonly SurveyNode[];
  /** the discharge in this reach when it differs from ProfileInput.discharge (a flow change at its upstream end) */
  readonly discharge?: number;
}

export type ReachInput = PrismaticReachInput | SurveyedReachInput;

/** What an internal control sees when it is asked for its response. */
export interface ControlContext {
  readonly discharge: number;
  readonly units: Units;
  readonly station: number;
  /** the channel just upstream and just downstream of the control */
  readonly upstreamSection: HydraulicSection;
  readonly downstreamSection: HydraulicSection;
  readonly upstreamBedElevation: number;
  readonly downstreamBedElevation: number;
  /**
   * The subcritical depth just downstream, from the profile computed up from the downstream control;
   * null where the flow below the control cannot be subcritical (no tailwater to drown it).
   */
  readonly tailwaterDepth: number | null;
}

/** An internal control's answer. */
export interface ControlResponse {
  /** the depth just upstream (headwater above the upstream bed); the subcritical profile upstream starts here */
  readonly upstreamDepth: number;
  /**
   * A supercritical depth issued just downstream (vena contracta below a free gate, the toe of a spillway),
   * which starts a supercritical profile downstream; absent when the outflow is drowned or subcritical.
   */
  readonly downstreamDepth?: number;
  /** the values and notes the structure wants reported */
  readonly result?: StructureResult;
  readonly notes?: readonly string[];
}

/**
 * An internal control supplied by the structures layer (weir, culvert, gate, spillway, drop).
 * A weir or culvert gives the headwater for a tailwater; a gate or spillway also issues a supercritical depth.
 */
export interface InternalControl {
  readonly id: string;
  /** e.g. 'weir', 'culvert', 'gate', 'spillway', 'drop' (for messages and results) */
  readonly kind: string;
  /** station of the control; it must not lie at either end of the channel */
  readonly station: number;
  /** the bed falls by this much across the control (a drop structure); default 0 */
  readonly bedDrop?: number;
  respond(context: ControlContext): ControlResponse;
}

export interface ProfileInput {
  readonly units: Units;
  /** reaches from upstream to downstream, joined end to end */
  readonly reaches: readonly ReachInput[];
  /** the discharge (of every reach that does not give its own) */
  readonly discharge: number;
  readonly flowId: string;
  readonly boundaries: { readonly upstream?: Boundary; readonly downstream?: Boundary };
  readonly method: ProfileMethod;
  /** default 'conveyance' */
  readonly frictionAveraging?: FrictionAveraging;
  /** spacing of output stations; default at most 1/100 of the channel length */
  readonly outputSpacing?: number;
  /** extra stations to report (besides reach ends, controls and jump toes) */
  readonly extraStations?: readonly number[];
  /** bed elevation at the downstream end of the last reach (prismatic reaches); default 0 */
  readonly downstreamBedElevation?: number;
  readonly controls?: readonly InternalControl[];
  /**
   * Internal resolution factor: 1 (default) meets the accuracy goal; 2 halves the internal steps and
   * tightens tolerances (for a self-check that the answer does not depend on the resolution).
   */
  readonly refinement?: number;
}
