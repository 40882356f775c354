/**
 * The result of a run: the structure `--json` prints and result.json holds (one entry per flow).
 * Stations are distances from the upstream end, increasing downstream, unless the model says otherwise
 * (then `stationing` tells how the user's numbers map). Every length is in `units`.
 */
import type { UnitSystem } from '../core/units.js';

export type Regime = 'subcritical' | 'supercritical' | 'critical';
export type SlopeClass = 'mild' | 'steep' | 'critical' | 'horizontal' | 'adverse';
/** Profile types in the usual notation (Chow 1959 ch. 9). */
export type ProfileType =
  | 'M1' | 'M2' | 'M3'
  | 'S1' | 'S2' | 'S3'
  | 'C1' | 'C2' | 'C3'
  | 'H2' | 'H3'
  | 'A2' | 'A3'
  | 'uniform';

export interface StationResult {
  station: number;
  bedElevation: number;
  depth: number;
  wsel: number;
  energyElevation: number;
  velocity: number;
  froude: number;
  regime: Regime;
  /** the reach this station belongs to (the downstream one at a break) */
  reach?: string;
  /** true where the station was interpolated between surveyed sections */
  interpolated?: boolean;
  /** critical depth at this station (for charts) */
  criticalDepth?: number;
  /** normal depth at this station, null where none exists */
  normalDepth?: number | null;
  /** bank or lining tops where known */
  leftBank?: number;
  rightBank?: number;
  /** the discharge at this station, present where it changes along the channel (flow changes, lateral inflow) */
  discharge?: number;
}

export interface ProfileStretch {
  type: ProfileType;
  from: number;
  to: number;
}

/**
 * A part of a surveyed reach: consecutive intervals between surveyed sections with one slope class (each interval's
 * own bed slope against the critical slope of its sections for the discharge). Added by the profile engine.
 */
export interface ReachPart {
  from: number;
  to: number;
  slopeClass: SlopeClass;
  /** the part's mean bed slope: bed fall over flow length */
  slope: number;
}

export interface ReachResult {
  id: string;
  from: number;
  to: number;
  /**
   * A prismatic reach's class. A surveyed reach's is that of its longest part (see `parts`), with normal and
   * critical depth at that part's upstream section on the part's mean slope.
   */
  slopeClass: SlopeClass;
  normalDepth: number | null;
  criticalDepth: number;
  /** each stretch's type from the zone of its depths where it lies (on a surveyed reach, with that place's class) */
  profiles: ProfileStretch[];
  /** a surveyed reach's parts of one slope class, upstream first (absent on a prismatic reach) */
  parts?: ReachPart[];
  /** the reach's own discharge where it differs from the flow's (a flow change); added by the profile engine */
  discharge?: number;
}

/** Jump classification by upstream Froude number (Chow 1959 §15-3, after USBR tests). */
export type JumpType = 'undular' | 'weak' | 'oscillating' | 'steady' | 'strong';

export interface JumpResult {
  /** toe station: where the specific force of the supercritical and subcritical profiles is equal */
  station: number;
  upstreamDepth: number;
  downstreamDepth: number;
  froude: number;
  type: JumpType;
  /** roller length from a published correlation (see the engine's jump module); reported, not used to move the toe */
  length: number;
  energyLoss: number;
  /** the correlation `length` comes from (added by the profile engine; optional for older readers) */
  lengthMethod?: string;
  /** true when the toe lies at a control or channel end (jump drowned up to it, or held there), or where its two depths
   *  cannot balance in specific force (a warning says by how much): no free momentum balance holds there */
  atControl?: boolean;
}

/** A control the profile engine used (or ignored), with why. Added by the profile engine. */
export interface ControlRecord {
  station: number;
  /** 'upstream boundary', 'downstream boundary', 'critical depth at a break', a structure kind... */
  kind: string;
  depth: number | null;
  regime: Regime | null;
  /** 'used' when it controls the profile, 'ignored' when the regime does not need it, 'replaced' when it cannot hold */
  status: 'used' | 'ignored' | 'replaced';
  reason: string;
}

/** Where a computed profile ran into critical depth (or a conduit crown) and stopped. Added by the profile engine. */
export interface ProfileStop {
  station: number;
  depth: number;
  reason: 'critical' | 'full';
  /** the direction the profile was being computed in */
  direction: 'upstream' | 'downstream';
  /** true when a jump or control downstream/upstream resolved it; false means the result needs attention */
  resolved: boolean;
  message: string;
}

export interface FreeboardRow {
  station: number;
  wsel: number;
  energyElevation: number;
  leftBank?: number;
  rightBank?: number;
  freeboardLeft?: number;
  freeboardRight?: number;
  /** the freeboard required here: fixed + velocityHeadFraction × αV²/2g (0 where the model gives no requirement) */
  required: number;
  /** every known bank's freeboard is at least the required one */
  pass: boolean;
  /** the water surface lies above a bank (or lining) top */
  overtopped: boolean;
  /** the energy grade line lies above a bank (or lining) top (a surge or a blocked flow could overtop) */
  energyOvertopped?: boolean;
  /** αV²/2g at the station */
  velocityHead?: number;
}

export interface StructureResult {
  id: string;
  type: string;
  station: number;
  /** the intermediate values an engineer checks by hand, with words */
  values: Record<string, number | string | boolean | null>;
  notes: string[];
  /** a culvert's computed barrel profile (outlet-control run of the profile engine), distance from the outlet upstream */
  barrelProfile?: Array<{ distanceFromOutlet: number; depth: number }>;
}

export interface FlowResult {
  id: string;
  discharge: number;
  stations: StationResult[];
  reaches: ReachResult[];
  jumps: JumpResult[];
  structures?: StructureResult[];
  freeboard?: FreeboardRow[];
  warnings: string[];
  /** informational notes (boundaries ignored, controls assumed); added by the profile engine */
  notes?: string[];
  /** the controls used or ignored; added by the profile engine */
  controls?: ControlRecord[];
  /** where computed profiles stopped at critical depth; added by the profile engine */
  stops?: ProfileStop[];
  /** the method, averaging and accuracy goal this flow was computed with; added by the profile engine */
  computation?: { method: string; frictionAveraging: string; accuracyGoal: string; internalSteps: number };
}

export interface RunResult {
  title?: string;
  units: UnitSystem;
  method: string;
  /** how station numbers read when the model's survey sets them (absent: distance from the upstream end) */
  stationing?: { direction: 'increasing-downstream' | 'increasing-upstream'; note: string };
  flows: FlowResult[];
  /** cautions that go with any result that sizes or checks works protecting people or property */
  cautions: string[];
}
