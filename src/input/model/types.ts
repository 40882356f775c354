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
  discharge: number;
}

export type BoundarySpec =
  | { type: 'depth'; depth: number }
  | { type: 'stage'; elevation: number }
  | { type: 'normal' }
  | { type: 'critical' };
export type BoundaryType = BoundarySpec['type'];

/** A missing end is left to the engine, which assumes what the physics suggests and says so in a note. */
export interface BoundariesSpec {
  upstream?: BoundarySpec;
  downstream?: BoundarySpec;
}

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
  /** friction-slope averaging of the standard step (default conveyance) */
  frictionAveraging: FrictionAveragingName;
  /** output spacing along the channel; default: at most 1/100 of the total length */
  outputSpacing?: number;
}

/** Defaults filled in by validation; named here so README, schema and code agree. */
export const modelDefaults = {
  downstreamBedElevation: 0,
  boundaries: {},
  method: 'standard-step',
  frictionAveraging: 'conveyance',
} as const satisfies Partial<Model>;
  /** the freeboard each station needs above the water surface to its bank (or lining) tops */
  freeboard?: FreeboardSpec;
