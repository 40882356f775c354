/** What every step of the spatially varied flow solver needs about the reach, in one value. */
import type { HydraulicSection } from '../../hydraulics/hydraulicSection.js';
import { minimumDepth, spatiallyVariedTerms, type SpatiallyVariedTerms } from './equation.js';
import type { InflowLayout } from './lateralInflow.js';

export interface SpatiallyVariedReach {
  readonly hs: HydraulicSection;
  readonly layout: InflowLayout;
  /** bed slope S0 (positive falling downstream) */
  readonly slope: number;
  /** momentum coefficient β */
  readonly beta: number;
  readonly minDepth: number;
}

export function spatiallyVariedReach(hs: HydraulicSection, layout: InflowLayout, slope: number, beta: number): SpatiallyVariedReach {
  return { hs, layout, slope, beta, minDepth: minimumDepth(hs) };
}

/** The terms at station x and depth y; `side` picks q* at a break. */
export function termsAt(reach: SpatiallyVariedReach, x: number, y: number, side: 'upstream' | 'downstream' = 'downstream'): SpatiallyVariedTerms {
  return spatiallyVariedTerms(reach.hs, y, reach.layout.discharge(x), reach.layout.inflowAt(x, side), reach.slope, reach.beta);
}
