/**
 * The quantities the integrators evaluate at every depth, computed once per depth and lean (no
 * allocation beyond one object): specific energy with α, friction slope, specific force, and the
 * slope of the specific-energy curve dE/dy, which is the denominator of the gradually varied flow equation.
 *
 * The equation in its energy form dE/dx = S0 − Sf (Chow 1959, §9-1, eq. 9-8; Henderson 1966, §4.2) gives
 *   dy/dx = (S0 − Sf) / (dE/dy),   dE/dy = 1 − αQ²T/(gA³) + (Q²/2gA²)·dα/dy.
 * With α constant the last term vanishes and dE/dy = 1 − F². Where α varies with depth (a compound
 * section whose α comes from its subsection conveyances, Chow 1959 §6-4), dα/dy is kept: the standard
 * and direct steps balance E including α(y), so the ODE must use the same E.
 */
import { alphaDerivativeStep } from '../core/tolerances.js';
import { conveyanceAndAlpha, type HydraulicSection } from '../hydraulics/hydraulicSection.js';

export interface PointState {
  readonly depth: number;
  readonly area: number;
  readonly topWidth: number;
  readonly conveyance: number;
  readonly alpha: number;
  /** αV²/2g */
  readonly velocityHead: number;
  /** y + αV²/2g */
  readonly energy: number;
  /** (Q/K)² */
  readonly frictionSlope: number;
  /** Q²/(gA) + Aȳ */
  readonly force: number;
  /** dE/dy: positive on the subcritical branch, negative on the supercritical branch, 0 at critical depth */
  readonly dEdy: number;
}

/** True when α varies with depth in this section (compound section, α from subsections). */
export function alphaVaries(hs: HydraulicSection): boolean {
  return hs.alpha === undefined && hs.section.compound;
}

function alphaAt(hs: HydraulicSection, y: number, discharge: number): number {
  return conveyanceAndAlpha(hs, y, discharge).alpha;
}

/** The state at depth y (0 < y ≤ maxDepth; the caller keeps y inside the section). */
export function pointState(hs: HydraulicSection, y: number, discharge: number): PointState {
  const e = hs.section.elements(y);
  const { conveyance, alpha } = conveyanceAndAlpha(hs, y, discharge);
  const g = hs.units.g;
  const q2 = discharge * discharge;
  const a = e.area;
  const velocityHead = (alpha * q2) / (2 * g * a * a);
  let dEdy = 1 - (alpha * q2 * e.topWidth) / (g * a * a * a);
  if (alphaVaries(hs)) {
    // central difference, kept inside the section
    const h = alphaDerivativeStep * Math.max(y, hs.section.lengthScale);
    const up = Math.min(y + h, hs.section.maxDepth);
    const down = Math.max(y - h, 0.5 * y);
    const dAlpha = (alphaAt(hs, up, discharge) - alphaAt(hs, down, discharge)) / (up - down);
    dEdy += (q2 / (2 * g * a * a)) * dAlpha;
  }
  return {
    depth: y,
    area: a,
    topWidth: e.topWidth,
    conveyance,
    alpha,
    velocityHead,
    energy: y + velocityHead,
    frictionSlope: conveyance > 0 ? q2 / (conveyance * conveyance) : Infinity,
    force: q2 / (g * a) + e.firstMoment,
    dEdy,
  };
}

/** dy/dx of the gradually varied flow equation at a state, with dE/dy floored in magnitude (keeps it finite). */
export function depthGradient(state: PointState, slope: number, floor = 0): number {
  let d = state.dEdy;
  if (Math.abs(d) < floor) d = d < 0 ? -floor : floor;
  return (slope - state.frictionSlope) / d;
}
