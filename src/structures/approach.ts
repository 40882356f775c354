/**
 * Water surface and energy grade in the approach section just upstream of a structure, by the energy
 * equation E = z + Q²/(2g·A²) (α = 1, the convention of the weir and culvert equations used here).
 * The water surface under a given energy grade is the subcritical (upper) root.
 */
import { HydraulicError } from '../core/errors.js';
import { brentRoot, scanSignChanges } from '../core/roots.js';
import { minimumDepthFraction } from '../core/tolerances.js';
import type { Units } from '../core/units.js';
import { structureTolerance } from './invert.js';
import type { ApproachArea } from './types.js';

/** Energy grade above a water-surface stage in the approach section. */
export function approachEnergy(stage: number, discharge: number, area: ApproachArea | undefined, units: Units): number {
  if (!area) return stage;
  const a = area(stage);
  if (!(a > 0)) throw new HydraulicError(`approach section: no flow area at stage ${stage}`);
  return stage + (discharge * discharge) / (2 * units.g * a * a);
}

/**
 * The subcritical water-surface stage under the energy grade `energy`, not below `floor` (the crest: the
 * approach water surface cannot lie below it while water flows over).
 */
export function approachStage(
  energy: number,
  floor: number,
  discharge: number,
  area: ApproachArea | undefined,
  units: Units,
): number {
  if (!area || discharge === 0) return energy;
  const f = (stage: number) => approachEnergy(stage, discharge, area, units) - energy;
  const span = energy - floor;
  if (!(span > 0)) return energy;
  const brackets = scanSignChanges(f, floor + span * minimumDepthFraction, energy);
  const last = brackets[brackets.length - 1];
  if (!last) {
    throw new HydraulicError(
      `approach section: no water surface between the crest ${floor} and the energy grade ${energy} carries ${discharge}; ` +
        'the approach flow would be supercritical there',
    );
  }
  return brentRoot(f, last[0], last[1], { xTolerance: structureTolerance(span), what: 'approach water surface' });
}
