/**
 * Froude number F = √(α·Q²·T/(g·A³)) = V/√(g·D/α), D = A/T the hydraulic depth (Chow 1959, ch. 3, with the
 * energy coefficient; chapter from memory): F = 1 is the Froude condition of critical flow in a section with
 * constant α. In a compound section, where α varies with depth, the minimum of specific energy need not
 * fall exactly at F = 1; criticalDepth.ts finds that minimum directly.
 * At the crown of a full conduit T = 0 and F = 0 (no free surface, no surface waves).
 */
import { conveyanceAndAlpha, type HydraulicSection } from './hydraulicSection.js';
import { requireDepth, requireDischarge } from './depthSearch.js';

export function froudeNumber(hs: HydraulicSection, depth: number, discharge: number): number {
  requireDischarge(discharge, 'Froude number');
  const y = requireDepth(hs.section, depth, 'Froude number');
  const e = hs.section.elements(y);
  const alpha = conveyanceAndAlpha(hs, y, discharge).alpha;
  return Math.sqrt((alpha * discharge * discharge * e.topWidth) / (hs.units.g * e.area * e.area * e.area));
}
