/**
 * Specific force (the momentum function) M = Q²/(gA) + A·ȳ, ȳ the depth of the centroid of the flow area
 * below the surface (Chow 1959, ch. 3; chapter from memory), with momentum coefficient β = 1: gvf takes the velocity
 * as uniform over the section for the momentum balance of a jump, as the classical jump equations do.
 *
 * dM/dy = A − Q²·T/(gA²), so M is least where Q²·T = g·A³: the critical depth for α = 1. Sequent
 * (conjugate) depths are the two depths with equal M (Chow 1959, ch. 3 and 15); for a rectangle they obey
 * Bélanger's equation y2/y1 = ½(√(1 + 8F1²) − 1) (Chow 1959, eq. 3-21). This module finds them for any
 * section by bracketed search on M itself, so no shape-specific formula is needed.
 */
import { HydraulicError } from '../core/errors.js';
import type { HydraulicSection } from './hydraulicSection.js';
import { froudeConditionDepth, hasSingleCriticalDepth } from './criticalDepth.js';
import {
  conjugateDepth,
  depthTolerance,
  extendSectionError,
  type Extrema,
  requireDepth,
  requireDischarge,
  weightedExtrema,
  unboundedTop,
} from './depthSearch.js';
import { depthTable } from './depthTable.js';

/** M = Q²/(gA) + Aȳ without argument checks. */
export function forceAt(hs: HydraulicSection, y: number, discharge: number): number {
  const e = hs.section.elements(y);
  return (discharge * discharge) / (hs.units.g * e.area) + e.firstMoment;
}

/** The local extrema of specific force over the section's depth range. */
export function specificForceExtrema(hs: HydraulicSection, discharge: number): Extrema {
  const section = hs.section;
  const what = `minimum specific force (Q = ${discharge})`;
  if (hasSingleCriticalDepth(section)) {
    const y = froudeConditionDepth(hs, discharge, 1, what);
    return { minima: [y], maxima: [], tolerance: (d) => depthTolerance(section, d), top: section.maxDepth, fallingAtTop: false };
  }
  const g = hs.units.g;
  const q2 = discharge * discharge;
  const top = Number.isFinite(section.maxDepth)
    ? section.maxDepth
    : unboundedTop(
        section,
        (y) => {
          const e = section.elements(y);
          return g * e.area ** 3 - q2 * e.topWidth;
        },
        what,
        4,
      );
  const table = depthTable(hs, top, discharge);
  // dM/dy = A − Q²T/(gA²) at the samples and exactly (the slope locates each extremum as its root)
  const slope = {
    base: table.area,
    weight: table.forceSlopeWeight,
    at: (y: number) => {
      const e = section.elements(y);
      return e.area - (q2 * e.topWidth) / (g * e.area * e.area);
    },
  };
  const extrema = weightedExtrema(
    section,
    (y) => forceAt(hs, y, discharge),
    table.depth,
    table.firstMoment,
    table.forceWeight,
    q2,
    () => what,
    slope,
    table.forceIndex,
  );
  if (extrema.minima.length === 0) {
    if (Number.isFinite(section.maxDepth)) throw extendSectionError(section, what);
    throw new HydraulicError(`${what}: specific force has no minimum below depth ${top}`);
  }
  return extrema;
}

/** M = Q²/(gA) + Aȳ at a depth inside the section (β = 1). */
export function specificForce(hs: HydraulicSection, depth: number, discharge: number): number {
  requireDischarge(discharge, 'specific force');
  const y = requireDepth(hs.section, depth, 'specific force');
  return forceAt(hs, y, discharge);
}

/**
 * The sequent depth of `depth` (the other depth with the same specific force); the depth itself at the
 * minimum of M; null when the sequent would lie above a closed conduit's crown. An irregular section too
 * low to hold it is a HydraulicError saying the section must be extended.
 */
export function sequentDepth(hs: HydraulicSection, depth: number, discharge: number): number | null {
  requireDischarge(discharge, 'sequent depth');
  const y = requireDepth(hs.section, depth, 'sequent depth');
  const extrema = specificForceExtrema(hs, discharge);
  const found = conjugateDepth(hs.section, (d) => forceAt(hs, d, discharge), extrema, y, 'sequent depth');
  if (found.depth !== undefined) return found.depth;
  if (found.beyond && !hs.section.closed) throw extendSectionError(hs.section, 'the sequent depth');
  return null;
}
