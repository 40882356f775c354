/**
 * The model file, as types: what `gvf run MODEL.json` reads once it is validated.
 *
 * Plain interfaces (no runtime code), so the light commands (`gvf section`) can use them without loading
 * the schema library. schema.ts builds the zod schema that checks a file against these types, and
 * schema/gvf-model.schema.json is generated from it for editors. Every length is in the model's units.
 */
import type { UnitSystem } from '../../core/units.js';
import type { FreeboardSpec, SurveyReachSpec } from './survey.js';

export const FrictionName = { manning: 'manning', chezy: 'chezy', 'darcy-weisbach': 'darcy-weisbach' } as const;
export type FrictionName = keyof typeof FrictionName;

/** The key that carries the roughness value of each friction law in a section. */
export const roughnessKey = { manning: 'n', chezy: 'chezy', 'darcy-weisbach': 'ks' } as const satisfies Record<
  FrictionName,
  RoughnessKey
>;
export type RoughnessKey = 'n' | 'chezy' | 'ks';

/** A roughness that changes across an irregular section: [[fromStation, value], ...], stations ascending. */
export type RoughnessTable = Array<[number, number]>;

interface SectionCommon {
  /** the friction law; when absent it follows from the roughness key given (n → manning, chezy, ks) */
  friction?: FrictionName;
  /** Manning's n */
  n?: number;
  /** Chézy C, in the unit system's own units (m^½/s or ft^½/s) */
  chezy?: number;
  /** equivalent sand roughness ks (Darcy–Weisbach with Colebrook–White), a length */
  ks?: number;
  /** a fixed kinetic-energy coefficient α; by default it comes from the roughness subsections (1 for one roughness) */
  alpha?: number;
}

export interface RectangularSectionSpec extends SectionCommon {
  shape: 'rectangular';
  bottomWidth: number;
}

export interface TrapezoidalSectionSpec extends SectionCommon {
  shape: 'trapezoidal';
  bottomWidth: number;
  /** horizontal : 1 vertical; both sides unless sideSlopeRight is given */
  sideSlope: number;
  sideSlopeRight?: number;
}

export interface TriangularSectionSpec extends SectionCommon {
  shape: 'triangular';
  sideSlope: number;
  sideSlopeRight?: number;
}

export interface CircularSectionSpec extends SectionCommon {
  shape: 'circular';
  diameter: number;
}

export interface PointsSectionSpec extends Omit<SectionCommon, 'n' | 'chezy' | 'ks'> {
  shape: 'points';
  /** [station across the section, elevation], stations non-decreasing, at least three points */
  points: Array<[number, number]>;
  n?: number | RoughnessTable;
  chezy?: number | RoughnessTable;
  ks?: number | RoughnessTable;
}

export type SectionSpec =
  | RectangularSectionSpec
  | TrapezoidalSectionSpec
  | TriangularSectionSpec
  | CircularSectionSpec
  | PointsSectionSpec;

export type SectionShapeName = SectionSpec['shape'];

export interface ReachSpec {
  id: string;
  /** a key of `sections` */
  section: string;
  length: number;
  /** bed slope S0 as a fraction (rise over run, positive falling downstream; 0 horizontal, negative adverse) */
  slope: number;
  /** height of the bank (or lining) tops above the bed, both sides, for the freeboard check */
  bankHeight?: number;
}

export interface FlowSpec {
  id: string;
  /** required, except where the upstream boundary is a reservoir (the discharge is then found) */
  discharge?: number;
  /** with a reservoir upstream: this flow's pool elevation (default the boundary's) */
  poolElevation?: number;
}

export type BoundarySpec =
  | { type: 'depth'; depth: number }
  | { type: 'stage'; elevation: number }
  | { type: 'normal' }
  | { type: 'critical' };
export type BoundaryType = BoundarySpec['type'];

/** A downstream stage–discharge rating curve: inline [[stage, discharge], ...] or a CSV file beside the model. */
export interface RatingBoundarySpec {
  type: 'rating';
  /** exactly one of table and file (checked by validation) */
  table?: Array<[number, number]>;
  file?: string;
}

/** A reservoir or pond upstream: the discharge is found from the pool elevation (flows then give no discharge). */
export interface ReservoirBoundarySpec {
  type: 'reservoir';
  poolElevation: number;
  /** entrance loss coefficient ke, a multiple of the entrance velocity head (default 0) */
  entranceLoss?: number;
}

export type UpstreamBoundarySpec = BoundarySpec | ReservoirBoundarySpec;
export type DownstreamBoundarySpec = BoundarySpec | RatingBoundarySpec;

/** A missing end is left to the engine, which assumes what the physics suggests and says so in a note. */
export interface BoundariesSpec {
  upstream?: UpstreamBoundarySpec;
  downstream?: DownstreamBoundarySpec;
}

/** A discharge that joins (or, negative, leaves) the channel at a station: a tributary, an inlet, a diversion. */
export interface FlowChangeSpec {
  /** a name for the inflow, for messages */
  id?: string;
  station: number;
  /** the discharge added there: one number for every flow, or one per flow id */
  addedDischarge: number | Record<string, number>;
}

/** Lateral inflow along a stretch (side-channel spillway, gutter, collector channel), per unit length of channel. */
export interface LateralInflowSpec {
  id?: string;
  from: number;
  to: number;
  /** discharge entering per unit length: one number for every flow, or one per flow id */
  inflowPerLength: number | Record<string, number>;
}

interface StructureCommon {
  id: string;
  /** station of the structure along the channel (inside it; a free overfall may sit at the downstream end) */
  station: number;
  /** free text for the report */
  description?: string;
  /** the channel bed falls by this much across the structure (default 0; a culvert: barrel length × slope) */
  bedDrop?: number;
}

export interface SharpCrestedWeirSpec extends StructureCommon {
  type: 'sharp-crested-weir';
  crestElevation: number;
  crestLength: number;
  /** width of the approach channel B (default the crest length: a full-width weir) */
  approachWidth?: number;
  /** coefficient equation (default kindsvater-carter) */
  coefficientMethod?: 'kindsvater-carter' | 'rehbock';
}

export interface VNotchWeirSpec extends StructureCommon {
  type: 'v-notch-weir';
  /** elevation of the notch's lowest point */
  vertexElevation: number;
  /** notch angle in degrees */
  notchAngle: number;
  /** effective coefficient Ce (default from the angle) */
  coefficient?: number;
  /** head correction kh, a length (default from the angle) */
  headCorrection?: number;
}

export interface BroadCrestedWeirSpec extends StructureCommon {
  type: 'broad-crested-weir';
  crestElevation: number;
  /** crest width across the flow */
  crestWidth: number;
  /** ratio of actual to ideal discharge (default 0.85) */
  coefficient?: number;
}

export interface RoadOverflowSpec extends StructureCommon {
  type: 'road-overflow';
  /** low point of the road crest */
  crestElevation: number;
  /** length of roadway overtopped, across the flow */
  overtoppedLength: number;
  /** width of the road crest in the direction of flow */
  roadWidth?: number;
  /** Cr in Q = Cr·L·H^1.5, length^½/s (default the paved-road value) */
  coefficient?: number;
}

export interface SluiceGateSpec extends StructureCommon {
  type: 'sluice-gate';
  /** gate opening above the floor */
  opening: number;
  /** width of the gate (default the bottom width of a rectangular channel there) */
  width?: number;
  /** contraction coefficient Cc (default 0.61) */
  contractionCoefficient?: number;
}

export type CulvertBarrelSpec = { shape: 'circular'; diameter: number } | { shape: 'box'; span: number; rise: number };

export interface CulvertSpec extends StructureCommon {
  type: 'culvert';
  barrel: CulvertBarrelSpec;
  /** barrel length */
  length: number;
  /** barrel slope, falling downstream */
  slope: number;
  /** Manning's n of the barrel */
  n: number;
  /** entrance type (inlet-control coefficients and default entrance loss) */
  inlet: string;
  /** entrance loss coefficient ke (default from the entrance type) */
  entranceLoss?: number;
  /** identical barrels side by side (default 1) */
  barrels?: number;
}

export interface FreeOverfallSpec extends StructureCommon {
  type: 'free-overfall';
}

export interface SpillwaySpec extends StructureCommon {
  type: 'spillway';
  crestElevation: number;
  crestLength: number;
  /** C in Q = C·L·He^1.5, length^½/s (default the curve against crest height over head) */
  coefficient?: number;
  /** length of the apron below the toe, for the jump check */
  apronLength?: number;
  /** apron width (default the crest length) */
  apronWidth?: number;
  /** chute loss as a multiple of the toe velocity head (default 0) */
  chuteLoss?: number;
}

export type StructureSpec =
  | SharpCrestedWeirSpec
  | VNotchWeirSpec
  | BroadCrestedWeirSpec
  | RoadOverflowSpec
  | SluiceGateSpec
  | CulvertSpec
  | FreeOverfallSpec
  | SpillwaySpec;
export type StructureType = StructureSpec['type'];

export const MethodName = { 'standard-step': 'standard-step', 'direct-step': 'direct-step', ode: 'ode' } as const;
export type MethodName = keyof typeof MethodName;

export const FrictionAveragingName = {
  conveyance: 'conveyance',
  arithmetic: 'arithmetic',
  geometric: 'geometric',
  harmonic: 'harmonic',
} as const;
export type FrictionAveragingName = keyof typeof FrictionAveragingName;

/** A validated model, with defaults filled in. */
export interface Model {
  /** a JSON Schema reference for editors; ignored by gvf */
  $schema?: string;
  title?: string;
  units: UnitSystem;
  sections: Record<string, SectionSpec>;
  /** listed from upstream to downstream: prismatic reaches, or reaches described by a survey (survey.ts) */
  reaches: Array<ReachSpec | SurveyReachSpec>;
  /** bed elevation at the downstream end of the last reach (default 0) */
  downstreamBedElevation: number;
  flows: FlowSpec[];
  /** default: none given (the engine assumes normal or critical depth as the reach demands, with a note) */
  boundaries: BoundariesSpec;
  /** default standard-step */
  method: MethodName;
  /** the freeboard each station needs above the water surface to its bank (or lining) tops */
  freeboard?: FreeboardSpec;
  /** friction-slope averaging of the standard step (default conveyance) */
  frictionAveraging: FrictionAveragingName;
  /** output spacing along the channel; default: at most 1/100 of the total length */
  outputSpacing?: number;
  /** free text: what the model is (say here when a scenario is invented) */
  description?: string;
  /** weirs, gates, culverts, drops, spillways along the channel */
  structures?: StructureSpec[];
  /** discharges joining or leaving at stations */
  flowChanges?: FlowChangeSpec[];
  /** lateral inflow along stretches */
  lateralInflow?: LateralInflowSpec[];
  /**
   * stations (in the model's stationing) where the report draws a cross-section chart, besides every
   * structure; the CLI's --sections replaces this list when given
   */
  sectionChartsAt?: number[];
}

/** Defaults filled in by validation; named here so README, schema and code agree. */
export const modelDefaults = {
  downstreamBedElevation: 0,
  boundaries: {},
  method: 'standard-step',
  frictionAveraging: 'conveyance',
} as const satisfies Partial<Model>;
