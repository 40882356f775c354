/**
 * Structures of a model as controls of the profile engine: one adapter per kind (a Record, so a kind without
 * an adapter does not compile), each building an InternalControl that calls the pure functions of
 * src/structures and returns the structure's full result (intermediate values, notes, the caution).
 * A free overfall at the downstream end is not an internal control: it is the downstream boundary (critical
 * depth at the brink), reported by endOverfallResult after the run.
 */
import type { Units } from '../../core/units.js';
import type { StructureSpec, StructureType } from '../../input/model/types.js';
import type { InternalControl } from '../../profile/types.js';
import { culvertControl } from './culvert.js';
import { freeOverfallControl } from './freeOverfall.js';
import { sluiceGateControl } from './sluiceGate.js';
import { spillwayControl } from './spillway.js';
import { broadCrestedWeirControl, roadOverflowControl, sharpCrestedWeirControl, vNotchWeirControl } from './weirs.js';

type Builder<T extends StructureType> = (spec: Extract<StructureSpec, { type: T }>, where: string, units: Units) => InternalControl;

const builders: { readonly [T in StructureType]: Builder<T> } = {
  'sharp-crested-weir': sharpCrestedWeirControl,
  'v-notch-weir': vNotchWeirControl,
  'broad-crested-weir': broadCrestedWeirControl,
  'road-overflow': roadOverflowControl,
  'sluice-gate': sluiceGateControl,
  culvert: culvertControl,
  'free-overfall': freeOverfallControl,
  spillway: spillwayControl,
};

/** The internal control of a model structure; `where` is its JSON path (e.g. `structures[2]`). */
export function structureControl(spec: StructureSpec, where: string, units: Units): InternalControl {
  return (builders[spec.type] as Builder<StructureType>)(spec as never, where, units);
}

export { engineBarrelProfile, culvertControl } from './culvert.js';
export { endOverfallResult, freeOverfallControl } from './freeOverfall.js';
export { sluiceGateControl } from './sluiceGate.js';
export { spillwayControl } from './spillway.js';
export { broadCrestedWeirControl, roadOverflowControl, sharpCrestedWeirControl, vNotchWeirControl } from './weirs.js';
export { withJumpPositions } from './apron.js';
export { supercriticalDepthForEnergy, jetDepth } from './context.js';
export { computeStructuredFlow, type StructuredFlowInput } from './flow.js';
