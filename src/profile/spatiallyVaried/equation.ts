/**
 * The momentum form of the spatially varied flow equation for increasing discharge, the inflow entering
 * with no velocity component in the direction of flow (Chow, Open-Channel Hydraulics, 1959, ch. 12;
 * Henderson, Open Channel Flow, 1966, §7; the same form as eq. 4.25 of Novak, Moffat, Nalluri & Narayanan,
 * Hydraulic Structures, for side-channel spillways):
 *
 *     dy/dx = [S0 − Sf − 2βQq* /(gA²)] / [1 − βQ²T/(gA³)],   dQ/dx = q*.
 *
 * Why: in a prismatic channel the x-momentum balance of a slice is d/dx(βQ²/A) + gA·dy/dx = gA(S0 − Sf),
 * since the inflow brings mass but no x-momentum. Expanding d(βQ²/A)/dx with dQ/dx = q* gives the form above.
 * Equivalently the specific force M = βQ²/(gA) + Aȳ obeys dM/dx = A(S0 − Sf), which the tests use as an
 * independent check. With q* = 0 (and β = α) it is the gradually varied flow equation (S0 − Sf)/(1 − F²).
 */
import { HydraulicError } from '../../core/errors.js';
import { expandUpward, brentRoot } from '../../core/roots.js';
import { depthAbsoluteTolerance, depthRelativeTolerance, minimumDepthFraction } from '../../core/tolerances.js';
import { conveyanceAndAlpha, type HydraulicSection } from '../../hydraulics/hydraulicSection.js';

/** Every term of the equation at one depth and discharge. */
export interface SpatiallyVariedTerms {
  area: number;
  topWidth: number;
  conveyance: number;
  /** kinetic-energy coefficient α of the section (for the energy line) */
  alpha: number;
  /** Sf = (Q/K)² */
  frictionSlope: number;
  /** 2βQq* /(gA²): the slope spent accelerating the inflow to the stream velocity */
  inflowTerm: number;
  /** N = S0 − Sf − 2βQq* /(gA²) */
  numerator: number;
  /** D = 1 − βQ²T/(gA³) */
  denominator: number;
  /** √(βQ²T/(gA³)): the Froude number of the momentum form (equals the usual one when β = α) */
  froude: number;
}

/** The smallest depth the solver uses: thinner flow is dry (core tolerance × the section's length scale). */
export function minimumDepth(hs: HydraulicSection): number {
  return minimumDepthFraction * hs.section.lengthScale;
}

export function spatiallyVariedTerms(
  hs: HydraulicSection,
  depth: number,
  discharge: number,
  inflow: number,
  slope: number,
  beta: number,
): SpatiallyVariedTerms {
  const e = hs.section.elements(depth);
  const { conveyance, alpha } = conveyanceAndAlpha(hs, depth, discharge);
  if (!(e.area > 0) || !(conveyance > 0)) {
    throw new HydraulicError(`spatially varied flow: the section is dry at depth ${depth}`);
  }
  const g = hs.units.g;
  const ratio = discharge / conveyance;
  const frictionSlope = ratio * ratio;
  const inflowTerm = (2 * beta * discharge * inflow) / (g * e.area * e.area);
  const froude2 = (beta * discharge * discharge * e.topWidth) / (g * e.area * e.area * e.area);
  return {
    area: e.area,
    topWidth: e.topWidth,
    conveyance,
    alpha,
    frictionSlope,
    inflowTerm,
    numerator: slope - frictionSlope - inflowTerm,
    denominator: 1 - froude2,
    froude: Math.sqrt(froude2),
  };
}

/** dy/dx of the momentum form (see the module comment). Infinite only exactly at critical depth. */
export function spatiallyVariedSlope(
  hs: HydraulicSection,
  depth: number,
  discharge: number,
  inflow: number,
  slope: number,
  beta = 1,
): number {
  const t = spatiallyVariedTerms(hs, depth, discharge, inflow, slope, beta);
  return t.numerator / t.denominator;
}

/** Specific force (momentum function) with the momentum coefficient: M = βQ²/(gA) + Aȳ (Chow 1959 §3-6). */
export function momentumFunction(hs: HydraulicSection, depth: number, discharge: number, beta = 1): number {
  const e = hs.section.elements(depth);
  return (beta * discharge * discharge) / (hs.units.g * e.area) + e.firstMoment;
}

/**
 * The depth where the denominator vanishes, βQ²T/(gA³) = 1: critical depth of the momentum form, for the
 * discharge Q (> 0). Bracketed by doubling from the section's length scale, then Brent's method.
 */
export function lateralCriticalDepth(hs: HydraulicSection, discharge: number, beta = 1): number {
  if (!(discharge > 0)) throw new HydraulicError(`critical depth needs a discharge > 0, got ${discharge}`);
  const section = hs.section;
  const g = hs.units.g;
  const lo = minimumDepth(hs);
  // 1 − F² rises from −∞ at a dry bed; for a closed conduit it returns to 1 at the crown (T = 0).
  const f = (y: number): number => {
    const e = section.elements(y);
    return 1 - (beta * discharge * discharge * e.topWidth) / (g * e.area * e.area * e.area);
  };
  const ceiling = Number.isFinite(section.maxDepth) ? section.maxDepth : Infinity;
  const bracket = expandUpward(f, lo, Math.min(section.lengthScale, ceiling), 200, ceiling);
  if (bracket === undefined) {
    throw new HydraulicError(`no critical depth for the discharge ${discharge} below the section's top ${section.maxDepth}`);
  }
  const tolerance = Math.max(depthAbsoluteTolerance * section.lengthScale, depthRelativeTolerance * bracket[1]);
  return brentRoot(f, bracket[0], bracket[1], { xTolerance: tolerance, what: 'critical depth (spatially varied flow)' });
}
