/**
 * Specific energy E = y + α·V²/(2g) = y + α·Q²/(2gA²), measured from the lowest point of the section
 * (Bakhmeteff 1912; Chow 1959, ch. 3), and the alternate depth: the other depth carrying the same
 * discharge with the same specific energy (chapter from memory).
 *
 * In a section with several critical depths (compound sections) the alternate of a supercritical depth
 * (E falling with depth) is the first depth above the next critical depth with the same E, and the
 * alternate of a subcritical depth (E rising) the last one below the previous critical depth: the depth
 * reached by passing through critical depth once.
 */
import { HydraulicError } from '../core/errors.js';
import type { HydraulicSection } from './hydraulicSection.js';
import { energyAt, specificEnergyExtrema } from './criticalDepth.js';
import { conjugateDepth, extendSectionError, levelCrossings, requireDepth, requireDischarge, smallestDepth } from './depthSearch.js';

/** E = y + αQ²/(2gA²) at a depth inside the section. */
export function specificEnergy(hs: HydraulicSection, depth: number, discharge: number): number {
  requireDischarge(discharge, 'specific energy');
  const y = requireDepth(hs.section, depth, 'specific energy');
  return energyAt(hs, y, discharge);
}

/**
 * The alternate depth of `depth` for this discharge; the depth itself at critical depth; null when the
 * alternate would lie above a closed conduit's crown (specific energy there exceeds the full-conduit value).
 * An irregular section too low to hold it is a HydraulicError saying the section must be extended.
 */
export function alternateDepth(hs: HydraulicSection, depth: number, discharge: number): number | null {
  requireDischarge(discharge, 'alternate depth');
  const y = requireDepth(hs.section, depth, 'alternate depth');
  const extrema = specificEnergyExtrema(hs, discharge);
  const found = conjugateDepth(hs.section, (d) => energyAt(hs, d, discharge), extrema, y, 'alternate depth');
  if (found.depth !== undefined) return found.depth;
  if (found.beyond && !hs.section.closed) throw extendSectionError(hs.section, 'the alternate depth');
  return null;
}

/**
 * Every depth inside the section where the specific energy equals `energy`, ascending: none when `energy` is
 * below the minimum (then the discharge cannot pass with that energy), two in a simple open channel.
 */
export function depthsForSpecificEnergy(hs: HydraulicSection, energy: number, discharge: number): number[] {
  requireDischarge(discharge, 'depths for a specific energy');
  if (!Number.isFinite(energy) || energy <= 0) {
    throw new HydraulicError(`depths for a specific energy: the energy must be a finite number > 0, got ${energy}`);
  }
  const extrema = specificEnergyExtrema(hs, discharge);
  const f = (d: number) => energyAt(hs, d, discharge);
  return levelCrossings(hs.section, f, energy, extrema, smallestDepth(hs.section), 'depths for a specific energy').depths;
}
