/**
 * One stretch of profile on a prismatic reach: the common signature of the three integration methods
 * (standard step, direct step, ODE), and what they share.
 *
 * A stretch starts at stations[0] with a known depth and runs through the stations in order: upstream
 * (decreasing station) for a subcritical profile, downstream for a supercritical one (Chow 1959, §10-1:
 * compute in the direction in which the control acts). It ends at the last station, or earlier where the
 * profile runs into critical depth (the equation is singular there) or a conduit's crown.
 */
import { criticalReachFraction, normalStartFraction } from '../core/tolerances.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import { pointState, type PointState } from './energy.js';
import type { FrictionAveraging } from './types.js';

export type FlowRegime = 'subcritical' | 'supercritical';

export interface StretchSpec {
  readonly hs: HydraulicSection;
  /** bed slope S0 (positive falling downstream) */
  readonly slope: number;
  readonly discharge: number;
  /** output stations in the order of integration; stations[0] is the start (monotone, at least one) */
  readonly stations: readonly number[];
  readonly startDepth: number;
  readonly regime: FlowRegime;
  readonly criticalDepth: number;
  /**
   * true when criticalDepth is worked out on first read (a surveyed section, where most steps are clearly on their
   * branch and need no critical depth): the standard step then reads it only where it must (see energyStep)
   */
  readonly lazyCritical?: boolean;
  readonly normalDepth: number | null;
  /** true on a critical slope (yn ≈ yc): the equation's ratio stays finite near critical depth */
  readonly criticalSlope?: boolean;
  readonly averaging: FrictionAveraging;
  /** absolute depth accuracy the stretch aims at */
  readonly tolerance: number;
}

export interface StretchStop {
  readonly station: number;
  readonly depth: number;
  /** critical: the profile runs into critical depth; full: into the crown (or the top of the section) */
  readonly reason: 'critical' | 'full';
}

export interface StretchProfile {
  /** depths at stations[0 .. depths.length − 1] */
  readonly depths: number[];
  readonly stop?: StretchStop;
  /** internal steps taken (for reports and benchmarks) */
  readonly steps: number;
}

/** The family signature. */
export type ProfileIntegrator = (spec: StretchSpec) => StretchProfile;

/** +1 when the stretch runs downstream, −1 upstream. */
export function directionOf(spec: StretchSpec): 1 | -1 {
  const s = spec.stations;
  return s[s.length - 1]! >= s[0]! ? 1 : -1;
}

/** Sign of dE/dy on the stretch's branch. */
export function branchSign(regime: FlowRegime): 1 | -1 {
  return regime === 'subcritical' ? 1 : -1;
}

/** The shallowest depth an integrator evaluates (supercritical branch floor). */
export function floorDepth(spec: StretchSpec): number {
  return spec.criticalDepth * 1e-6;
}

/** The deepest depth an integrator may evaluate: the section's limit. */
export function ceilingDepth(spec: StretchSpec): number {
  return spec.hs.section.maxDepth;
}

/** True when y is at critical depth to within criticalReachFraction. */
export function atCritical(spec: StretchSpec, y: number): boolean {
  return Math.abs(y - spec.criticalDepth) <= criticalReachFraction * spec.criticalDepth;
}

/** The state at y, evaluated inside the section. */
export function stateAt(spec: StretchSpec, y: number): PointState {
  const top = ceilingDepth(spec);
  const yy = y > top ? top : y < floorDepth(spec) ? floorDepth(spec) : y;
  return pointState(spec.hs, yy, spec.discharge);
}

/**
 * A stretch that needs no integration: a start at normal depth stays there (uniform flow).
 * Returns the profile, or null when integration is needed.
 */
export function uniformStretch(spec: StretchSpec): StretchProfile | null {
  const yn = spec.normalDepth;
  if (yn === null) return null;
  if (Math.abs(spec.startDepth - yn) > normalStartFraction * yn) return null;
  return { depths: spec.stations.map(() => yn), steps: 0 };
}

/**
 * The sign of the depth change along the direction of integration (+1 deepening), read on the branch:
 * at critical depth itself dE/dy is 0, so the sign is taken from the branch side.
 */
export function depthTrend(spec: StretchSpec, state: PointState): number {
  const direction = directionOf(spec);
  // on the branch by definition: a round-off sign of dE/dy at critical depth is read as the branch's
  const d = Math.sign(state.dEdy) === branchSign(spec.regime) ? state.dEdy : branchSign(spec.regime);
  const drive = spec.slope - state.frictionSlope;
  if (drive === 0) return 0;
  return Math.sign(drive / d) * direction;
}

/**
 * On a critical slope normal and critical depth coincide (within the classification band): a profile that
 * reaches critical depth has reached the uniform state, and continues at it (Chow 1959 §9-2: the C1 and C3
 * curves end on the line y = yn = yc). The stop is replaced by uniform flow at the depth reached.
 */
export function settleOnCriticalSlope(spec: StretchSpec, profile: StretchProfile): StretchProfile {
  if (!spec.criticalSlope || !profile.stop || profile.stop.reason !== 'critical') return profile;
  const depths = [...profile.depths];
  while (depths.length < spec.stations.length) depths.push(profile.stop.depth);
  return { depths, steps: profile.steps };
}
