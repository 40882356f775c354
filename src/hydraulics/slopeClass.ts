/**
 * Slope classification of a channel for a discharge (Chow 1959, ch. 9; chapter from memory): mild where normal depth is above
 * critical depth, steep where it is below, critical where they coincide, horizontal (S0 = 0) and adverse
 * (S0 < 0) where there is no normal depth.
 *
 * "Critical" uses the band criticalSlopeRelativeBand of core/tolerances.ts: on the slope itself when the
 * critical slope is given (|S0 − Sc| ≤ band·Sc), otherwise on the depths (|yn − yc| ≤ band·yc).
 *
 * A closed conduit whose discharge exceeds its part-full maximum has no part-full normal depth (normal
 * depth null on a falling bed): it is classed mild, because the uniform state it tends to is the full
 * conduit, above critical depth (which always lies below the crown), so the profiles it carries are
 * those of a mild slope (a surcharged conduit backs water up).
 */
import { HydraulicError } from '../core/errors.js';
import { criticalSlopeRelativeBand, horizontalSlope } from '../core/tolerances.js';
import { criticalDepth } from './criticalDepth.js';
import { conveyance, type HydraulicSection } from './hydraulicSection.js';
import { requireDischarge } from './depthSearch.js';

export const SlopeClass = { mild: 'mild', steep: 'steep', critical: 'critical', horizontal: 'horizontal', adverse: 'adverse' } as const;
export type SlopeClass = keyof typeof SlopeClass;

export function classifySlope(
  slope: number,
  normalDepth: number | null,
  criticalDepth: number,
  criticalSlope?: number,
): SlopeClass {
  if (!Number.isFinite(slope)) throw new HydraulicError(`slope class: the bed slope must be a finite number, got ${slope}`);
  if (!(criticalDepth > 0) || !Number.isFinite(criticalDepth)) {
    throw new HydraulicError(`slope class: the critical depth must be a finite number > 0, got ${criticalDepth}`);
  }
  if (Math.abs(slope) <= horizontalSlope) return 'horizontal';
  if (slope < 0) return 'adverse';
  // a falling bed without a normal depth: a closed conduit flowing full (see above)
  if (normalDepth === null) return 'mild';
  if (!(normalDepth > 0) || !Number.isFinite(normalDepth)) {
    throw new HydraulicError(`slope class: the normal depth must be a finite number > 0 or null, got ${normalDepth}`);
  }
  if (criticalSlope !== undefined && Number.isFinite(criticalSlope) && criticalSlope > 0) {
    if (Math.abs(slope - criticalSlope) <= criticalSlopeRelativeBand * criticalSlope) return 'critical';
  } else if (Math.abs(normalDepth - criticalDepth) <= criticalSlopeRelativeBand * criticalDepth) {
    return 'critical';
  }
  return normalDepth > criticalDepth ? 'mild' : 'steep';
}

/**
 * The critical slope for a discharge: the bed slope whose normal depth is the critical depth,
 * Sc = (Q/K(yc))² (Chow 1959, ch. 6; chapter from memory), with yc the critical depth of least specific energy.
 */
export function criticalSlope(hs: HydraulicSection, discharge: number): number {
  requireDischarge(discharge, 'critical slope');
  const yc = criticalDepth(hs, discharge);
  const k = conveyance(hs, yc, discharge);
  return (discharge / k) ** 2;
}
