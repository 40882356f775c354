/**
 * What every structure returns: one shape of result, so the profile engine can use any structure as an
 * internal or end control without knowing which one it is.
 *
 * Elevations (stages) are in the model's datum; depths and heads in the unit system's length.
 * - headwaterStage: the water surface just upstream (where the upstream profile starts);
 * - headwaterEnergy: the energy grade there (equal to the stage when no approach section was given);
 * - downstreamSupercriticalDepth: where the flow leaves the structure supercritical (free gate flow, spillway
 *   toe, culvert outlet under inlet control on a steep barrel), the depth that starts the supercritical
 *   profile downstream; null where the flow leaves subcritical (drowned gate, weir into a pool).
 * - values: the intermediate figures an engineer checks by hand (coefficients, heads, ratios), by name.
 */
import type { UnitSystem } from '../core/units.js';
import type { StructureResult } from '../results/types.js';

export const StructureKind = {
  'sharp-crested-rectangular': 'sharp-crested-rectangular',
  'triangular-notch': 'triangular-notch',
  'broad-crested': 'broad-crested',
  'road-overflow': 'road-overflow',
  'sluice-gate': 'sluice-gate',
  culvert: 'culvert',
  'free-overfall': 'free-overfall',
  spillway: 'spillway',
} as const;
export type StructureKind = keyof typeof StructureKind;

/** How the structure passes the flow at this discharge and tailwater. */
export type FlowCondition = 'free' | 'submerged' | 'inlet-control' | 'outlet-control' | 'critical-at-brink';

export type HandValues = Record<string, number | string | boolean | null>;

export interface StructureOutcome {
  readonly kind: StructureKind;
  /** the published method used, as cited in the code */
  readonly method: string;
  readonly units: UnitSystem;
  readonly discharge: number;
  readonly condition: FlowCondition;
  readonly headwaterStage: number;
  readonly headwaterEnergy: number;
  /** the tailwater stage the result was computed for (null: none given, free flow assumed) */
  readonly tailwaterStage: number | null;
  readonly downstreamSupercriticalDepth: number | null;
  readonly values: HandValues;
  readonly notes: readonly string[];
  readonly caution: string;
}

/**
 * The upstream approach section, for converting between the water surface and the energy grade:
 * its flow area at a water-surface stage. The engine passes its own section, e.g.
 * `stage => hs.section.elements(stage - bedElevation).area`.
 */
export type ApproachArea = (stage: number) => number;

/** The result as the results layer stores it (values and notes carried over, caution as a note). */
export function toStructureResult(id: string, station: number, outcome: StructureOutcome): StructureResult {
  return {
    id,
    type: outcome.kind,
    station,
    values: {
      method: outcome.method,
      condition: outcome.condition,
      discharge: outcome.discharge,
      headwaterStage: outcome.headwaterStage,
      headwaterEnergy: outcome.headwaterEnergy,
      tailwaterStage: outcome.tailwaterStage,
      downstreamSupercriticalDepth: outcome.downstreamSupercriticalDepth,
      ...outcome.values,
    },
    notes: [...outcome.notes, outcome.caution],
  };
}
