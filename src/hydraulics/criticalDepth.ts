/**
 * Critical depth: the depth of minimum specific energy E(y) = y + α(y)·Q²/(2gA²) for a discharge.
 *
 * - Shapes whose section factor A³/T rises with depth and whose α is constant (rectangular, trapezoidal,
 *   triangular, circular; one roughness): E has one minimum, where dE/dy = 0, i.e. the Froude condition
 *   α·Q²·T = g·A³ (Chow, Open-Channel Hydraulics, 1959, ch. 3–4; chapters from memory). Solved by Brent's method on g·A³ − α·Q²·T, which is
 *   negative at small depth and positive above critical depth.
 * - Irregular and compound sections: A³/T may fall where the water spills onto a floodplain, and α changes
 *   with depth, so E may have several local minima (Blalock & Sturm 1981, "Minimum specific energy in
 *   compound open channel", J. Hydraulics Division ASCE 107(HY6); from memory). E is scanned over the
 *   section's depth range (core/tolerances.ts scanSamples intervals) and each sampled minimum is refined by
 *   Brent's minimiser. A minimum narrower than one scan interval could be missed.
 *
 * Circular conduit near the crown: T → 0 as y → D, so A³/T → ∞ and the Froude condition has a root below
 * the crown for every discharge; critical depth approaches the crown only as Q grows without bound.
 * The result is always inside the conduit (at most D; a value equal to D means the root lies within the
 * depth tolerance of the crown). Near the crown it is very sensitive to discharge: from the segment
 * formulas, Q/√(gD⁵) = 0.618 at yc/D = 0.8, 0.829 at 0.9, 1.025 at 0.95, 1.306 at 0.98 and 1.556 at 0.99,
 * so above about 0.9·D a few percent of discharge moves critical depth by several percent of D.
 */
import { HydraulicError, NumericalError } from '../core/errors.js';
import { brentRoot, expandUpward } from '../core/roots.js';
import { indexedExtrema } from './extremaIndex.js';
import type { Section } from '../geometry/section.js';
import { conveyanceAndAlpha, conveyanceSlopesInto, type HydraulicSection, SlopeSlot } from './hydraulicSection.js';
import {
  depthTolerance,
  extendSectionError,
  type Extrema,
  requireDischarge,
  slopeRootBeside,
  weightedExtrema,
  smallestDepth,
  unboundedTop,
} from './depthSearch.js';
import { energyCurve } from './energyCurve.js';

/** Shapes with one critical depth for any discharge (A³/T increasing in depth). */
const singleCriticalShapes: ReadonlySet<string> = new Set(['rectangular', 'trapezoidal', 'triangular', 'circular']);

/** True when this section has exactly one critical depth (and one minimum of specific force) for any discharge. */
export function hasSingleCriticalDepth(section: Section): boolean {
  return !section.compound && singleCriticalShapes.has(section.shape);
}

/** α where it does not depend on depth: the user's value, or 1 for one roughness. */
function constantAlpha(hs: HydraulicSection): number {
  return hs.alpha ?? 1;
}

/**
 * The depth where coefficient·Q²·T = g·A³ in a single-critical-depth shape (coefficient α for critical depth,
 * 1 for the minimum of specific force).
 */
export function froudeConditionDepth(hs: HydraulicSection, discharge: number, coefficient: number, what: string): number {
  const section = hs.section;
  const g = hs.units.g;
  const q2 = coefficient * discharge * discharge;
  const residual = (y: number): number => {
    const e = section.elements(y);
    return g * e.area * e.area * e.area - q2 * e.topWidth;
  };
  const lo = smallestDepth(section);
  let a = lo;
  let b: number;
  if (Number.isFinite(section.maxDepth)) {
    b = section.maxDepth;
    // a closed conduit has T = 0 at the crown, so the residual is positive there: always bracketed
    if (residual(b) < 0) throw extendSectionError(section, what);
  } else {
    const bracket = expandUpward(residual, lo, section.lengthScale);
    if (!bracket) throw new NumericalError(`${what}: no bracket found doubling the depth up from ${section.lengthScale}`);
    [a, b] = bracket;
  }
  return brentRoot(residual, a, b, { xTolerance: depthTolerance(section, a), what });
}

/** Specific energy y + αQ²/(2gA²) without argument checks (the solvers' inner function). */
export function energyAt(hs: HydraulicSection, y: number, discharge: number): number {
  const e = hs.section.elements(y);
  const alpha = hasSingleCriticalDepth(hs.section) ? constantAlpha(hs) : conveyanceAndAlpha(hs, y, discharge).alpha;
  return y + (alpha * discharge * discharge) / (2 * hs.units.g * e.area * e.area);
}

/** scratch for conveyanceSlopesInto (energySlopeAt runs inside the extrema searches) */
const slopeScratch = new Float64Array(6);

/**
 * dE/dy = 1 − αQ²T/(gA³) + (Q²/2gA²)·dα/dy at depth y, with dα/dy from the subsections' perimeter rates; NaN where
 * that has no analytic form (the extrema search then minimises E itself).
 */
export function energySlopeAt(hs: HydraulicSection, y: number, discharge: number): number {
  const q2 = discharge * discharge;
  const g = hs.units.g;
  let area: number;
  let topWidth: number;
  let alpha = constantAlpha(hs);
  let alphaSlope = 0;
  if (!hasSingleCriticalDepth(hs.section) && hs.alpha === undefined && hs.section.compound) {
    // one look-up: the subsections give the area and top width as well
    if (!conveyanceSlopesInto(hs, y, slopeScratch)) return NaN;
    area = slopeScratch[SlopeSlot.area]!;
    topWidth = slopeScratch[SlopeSlot.topWidth]!;
    alpha = slopeScratch[SlopeSlot.alpha]!;
    alphaSlope = slopeScratch[SlopeSlot.alphaSlope]!;
  } else ({ area, topWidth } = hs.section.elements(y));
  const a2 = area * area;
  return 1 - (alpha * q2 * topWidth) / (g * a2 * area) + (q2 * alphaSlope) / (2 * g * a2);
}

/** The local extrema of specific energy over the section's depth range (minima are the critical depths). */
export function specificEnergyExtrema(hs: HydraulicSection, discharge: number): Extrema {
  const section = hs.section;
  const label = () => `critical depth (Q = ${discharge})`;
  if (hasSingleCriticalDepth(section)) {
    const yc = froudeConditionDepth(hs, discharge, constantAlpha(hs), label());
    return {
      minima: [yc],
      maxima: [],
      tolerance: (y) => depthTolerance(section, y),
      top: section.maxDepth,
      fallingAtTop: false,
    };
  }
  const g = hs.units.g;
  const q2 = discharge * discharge;
  // an unbounded compound section: scan to well above the depth where the local Froude condition is met
  const top = Number.isFinite(section.maxDepth)
    ? section.maxDepth
    : unboundedTop(
        section,
        (y) => {
          const e = section.elements(y);
          return g * e.area ** 3 - conveyanceAndAlpha(hs, y, discharge).alpha * q2 * e.topWidth;
        },
        label(),
        4,
      );
  const curve = energyCurve(hs, top, discharge);
  const slope = { base: 1, weight: curve.slopeWeight, at: (y: number) => energySlopeAt(hs, y, discharge) };
  const extrema = weightedExtrema(section, (y) => energyAt(hs, y, discharge), curve.depth, curve.depth, curve.weight, q2, label, slope, curve.index);
  if (extrema.minima.length === 0) {
    if (Number.isFinite(section.maxDepth)) throw extendSectionError(section, label());
    throw new HydraulicError(`${label()}: specific energy has no minimum below depth ${top}`);
  }
  return extrema;
}

/** Every depth where specific energy has a local minimum, ascending (one for simple shapes, several possible in compound sections). */
export function criticalDepths(hs: HydraulicSection, discharge: number): number[] {
  requireDischarge(discharge, 'critical depth');
  return [...specificEnergyExtrema(hs, discharge).minima];
}

/** The sampled minima of the last indexedCriticalDepth call (sample indices), and how many. */
let sampledMinima = new Int32Array(8);
let sampledCount = 0;
const collectMinimum = (sample: number, minimum: boolean): void => {
  if (!minimum) return;
  if (sampledCount === sampledMinima.length) {
    const grown = new Int32Array(2 * sampledMinima.length);
    grown.set(sampledMinima);
    sampledMinima = grown;
  }
  sampledMinima[sampledCount++] = sample;
};

/**
 * The usual case of an irregular or compound section, without the general search's bookkeeping: its kept energy
 * curve has an index, specific energy rises at the top, and at each sampled minimum dE/dy changes sign in a sample
 * interval beside it; each minimum is then the root of dE/dy there (Brent), the depths specificEnergyExtrema gives,
 * and the one of least energy is returned. Undefined otherwise (the general search then runs: a curve falling at the
 * top, a minimum at a jump of E, a range that depends on the discharge).
 */
function indexedCriticalDepth(hs: HydraulicSection, discharge: number): number | undefined {
  const section = hs.section;
  if (hasSingleCriticalDepth(section) || !Number.isFinite(section.maxDepth)) return undefined;
  const curve = energyCurve(hs, section.maxDepth, discharge);
  if (curve.index === undefined) return undefined;
  const q2 = discharge * discharge;
  sampledCount = 0;
  if (indexedExtrema(curve.index, q2, collectMinimum) || sampledCount === 0) return undefined;
  const w = curve.slopeWeight;
  const slopeAt = (j: number) => 1 + q2 * w[j]!;
  const at = (y: number) => energySlopeAt(hs, y, discharge);
  const options = (a: number) => ({ xTolerance: depthTolerance(section, a), what: 'critical depth' });
  let best = NaN;
  let least = Infinity;
  const count = sampledCount;
  for (let k = 0; k < count; k++) {
    const y = slopeRootBeside(curve.depth, sampledMinima[k]!, true, slopeAt, at, options);
    if (y === undefined) return undefined;
    if (count === 1) return y;
    // several minima: the least energy (the first of equals, as criticalDepth compares them)
    const e = energyAt(hs, y, discharge);
    if (e < least) {
      least = e;
      best = y;
    }
  }
  return best;
}

/**
 * The critical depth of least specific energy. In an irregular section whose specific energy is still
 * falling at its end points (a further minimum lies above them) and is there below every minimum inside,
 * the least-energy critical depth lies above the section: a HydraulicError asks for the section to be extended.
 */
export function criticalDepth(hs: HydraulicSection, discharge: number): number {
  requireDischarge(discharge, 'critical depth');
  const indexed = indexedCriticalDepth(hs, discharge);
  if (indexed !== undefined) return indexed;
  const extrema = specificEnergyExtrema(hs, discharge);
  const depths = extrema.minima;
  let best = depths[0]!;
  // one minimum with the curve rising at the top (the usual case): no energies to compare
  if (depths.length === 1 && !extrema.fallingAtTop) return best;
  let least = energyAt(hs, best, discharge);
  for (let k = 1; k < depths.length; k++) {
    const e = energyAt(hs, depths[k]!, discharge);
    if (e < least) {
      least = e;
      best = depths[k]!;
    }
  }
  if (extrema.fallingAtTop && energyAt(hs, extrema.top, discharge) < least) {
    throw extendSectionError(hs.section, `the critical depth of least specific energy (Q = ${discharge})`);
  }
  return best;
}
