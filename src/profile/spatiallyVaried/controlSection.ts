/**
 * The control (critical) section of spatially varied flow with increasing discharge.
 *
 * Where the flow passes from subcritical to supercritical, the numerator N = S0 − Sf − 2βQq* /(gA²) and the
 * denominator D = 1 − βQ²T/(gA³) of the momentum equation vanish together: a singular point. Method
 * implemented (after Chow, Open-Channel Hydraulics, 1959, §12-3, from memory for the section number): at
 * each station x take the depth yc(x) at which D vanishes (critical depth for Q(x)) and evaluate the
 * numerator there, r(x) = N(x, yc(x)); the control is the first station, going downstream, where r changes
 * from negative to positive, found by a bracketed root on x. For a rectangular channel with Chézy friction
 * and Q0 = 0 this is the closed form x = 8q*²/(g·b²·(S0 − gP/(C²b))³) (Novak, Moffat, Nalluri & Narayanan,
 * Hydraulic Structures, eq. 4.27, seen in a reproduction), which the tests check.
 * - r < 0 over the whole reach: subcritical throughout, the control is the downstream end.
 * - r > 0 already at the upstream end: supercritical throughout, the control is the upstream end.
 * - r jumps from − to + at a change of q*: the control sits at that break (N is discontinuous there).
 * The direction of the profile through the singular point comes from L'Hôpital's rule (see singularPointSlope).
 */
import { HydraulicError, NumericalError } from '../../core/errors.js';
import { brentRoot, expandUpward, scanSignChanges } from '../../core/roots.js';
import { depthAbsoluteTolerance, depthRelativeTolerance } from '../../core/tolerances.js';
import { lateralCriticalDepth, momentumFunction, spatiallyVariedTerms } from './equation.js';
import type { SpatiallyVariedReach } from './context.js';
import type { Branch } from './branch.js';
import { svfControlScanSamples, svfControlStationTolerance, svfDepthDifferenceStep } from './tolerances.js';

/** r(x) = N(x, yc(x)) with q* = `inflow`; −Infinity where no water flows (still water cannot be supercritical). */
export function criticalConditionResidual(reach: SpatiallyVariedReach, x: number, inflow: number): number {
  const discharge = reach.layout.discharge(x);
  if (!(discharge > 0)) return -Infinity;
  const yc = lateralCriticalDepth(reach.hs, discharge, reach.beta);
  return spatiallyVariedTerms(reach.hs, yc, discharge, inflow, reach.slope, reach.beta).numerator;
}

export const ControlKind = {
  'singular-point': 'singular-point',
  'inflow-break': 'inflow-break',
  'upstream-end': 'upstream-end',
  'downstream-end': 'downstream-end',
} as const;
export type ControlKind = keyof typeof ControlKind;

export interface ControlLocation {
  kind: ControlKind;
  station: number;
  /** r(x) just upstream and downstream of the control (upstream undefined at the upstream end) */
  residualUpstream?: number;
  residualDownstream?: number;
}

/** Find where the flow passes through critical depth (see the module comment). */
export function locateControl(reach: SpatiallyVariedReach): ControlLocation {
  const { breaks, length } = reach.layout;
  for (let i = 0; i + 1 < breaks.length; i++) {
    const a = breaks[i]!;
    const b = breaks[i + 1]!;
    const q = reach.layout.inflowAt(0.5 * (a + b));
    const r = (x: number) => criticalConditionResidual(reach, x, q);
    const atStart = r(a);
    if (i === 0 && atStart > 0) return { kind: 'upstream-end', station: 0, residualDownstream: atStart };
    if (i > 0) {
      const before = criticalConditionResidual(reach, a, reach.layout.inflowAt(a, 'upstream'));
      if (before <= 0 && atStart > 0) return { kind: 'inflow-break', station: a, residualUpstream: before, residualDownstream: atStart };
    }
    for (const [x0, x1] of scanSignChanges(r, a, b, svfControlScanSamples)) {
      const r0 = r(x0);
      if (r0 > 0) continue; // a + → − change: supercritical flow may go on; only − → + is a control
      if (x0 === x1) return { kind: 'downstream-end', station: b };
      const xc = brentRoot(r, x0, x1, { xTolerance: svfControlStationTolerance * length, what: 'control section station' });
      if (xc >= length) return { kind: 'downstream-end', station: length };
      return { kind: 'singular-point', station: xc, residualUpstream: r0, residualDownstream: r(x1) };
    }
  }
  return { kind: 'downstream-end', station: length };
}

export interface SingularPointSlope {
  /** dy/dx through the singular point (the branch from subcritical upstream to supercritical downstream) */
  slope: number;
  /** the other root of the quadratic */
  otherSlope: number;
  /** eigenvalues of the linearised system dx/dτ = D, dy/dτ = N along the two directions */
  eigenvalues: [number, number];
  kind: 'saddle' | 'node';
}

/**
 * L'Hôpital's rule at a point where N = D = 0: along the profile dy/dx = s = (Nx + Ny·s)/(Dx + Dy·s), so
 * Dy·s² + (Dx − Ny)·s − Nx = 0. The physical root is the one along which D falls from + (subcritical,
 * upstream) to − (supercritical, downstream): Dx + Dy·s < 0. That quantity is an eigenvalue of the
 * linearised system; a saddle has exactly one such root, a node two (then the slower direction, which the
 * neighbouring profiles share, is taken), a focus none (no smooth transition: HydraulicError).
 * ∂/∂x is q*·∂/∂Q at fixed depth; the partial derivatives are central differences.
 */
export function singularPointSlope(reach: SpatiallyVariedReach, x: number, y: number): SingularPointSlope {
  const { hs, slope, beta } = reach;
  const q = reach.layout.inflowAt(x);
  const discharge = reach.layout.discharge(x);
  const terms = (depth: number, flow: number) => spatiallyVariedTerms(hs, depth, flow, q, slope, beta);
  const hy = svfDepthDifferenceStep * y;
  const hq = svfDepthDifferenceStep * discharge;
  const yUp = terms(y + hy, discharge);
  const yDown = terms(y - hy, discharge);
  const qUp = terms(y, discharge + hq);
  const qDown = terms(y, discharge - hq);
  const ny = (yUp.numerator - yDown.numerator) / (2 * hy);
  const dy = (yUp.denominator - yDown.denominator) / (2 * hy);
  const nx = (q * (qUp.numerator - qDown.numerator)) / (2 * hq);
  const dx = (q * (qUp.denominator - qDown.denominator)) / (2 * hq);
  const b = dx - ny;
  const discriminant = b * b + 4 * dy * nx;
  if (!(discriminant >= 0) || dy === 0) {
    throw new HydraulicError(
      `the critical section at station ${x} is not a saddle or node (a focus): the profile cannot pass smoothly through critical depth there`,
    );
  }
  const root = Math.sqrt(discriminant);
  // numerically stable roots of dy·s² + b·s − nx = 0
  const qq = -0.5 * (b + (b >= 0 ? root : -root));
  const s1 = qq / dy;
  const s2 = qq !== 0 ? -nx / qq : s1;
  const l1 = dx + dy * s1;
  const l2 = dx + dy * s2;
  if (l1 < 0 && l2 >= 0) return { slope: s1, otherSlope: s2, eigenvalues: [l1, l2], kind: 'saddle' };
  if (l2 < 0 && l1 >= 0) return { slope: s2, otherSlope: s1, eigenvalues: [l2, l1], kind: 'saddle' };
  if (l1 < 0 && l2 < 0) {
    return Math.abs(l1) <= Math.abs(l2)
      ? { slope: s1, otherSlope: s2, eigenvalues: [l1, l2], kind: 'node' }
      : { slope: s2, otherSlope: s1, eigenvalues: [l2, l1], kind: 'node' };
  }
  throw new HydraulicError(`at the critical section at station ${x} no profile passes from subcritical to supercritical flow`);
}

/** The depth on a branch with a given specific force at discharge Q (bracketed on the branch's side of yc). */
export function depthForMomentum(reach: SpatiallyVariedReach, discharge: number, target: number, branch: Branch): number {
  const { hs, beta } = reach;
  const yc = lateralCriticalDepth(hs, discharge, beta);
  const f = (y: number) => momentumFunction(hs, y, discharge, beta) - target;
  const atCritical = f(yc);
  if (atCritical > 0) {
    throw new NumericalError(
      `specific force ${target} is below its least value ${target + atCritical} for the discharge ${discharge}: no ${branch} depth`,
    );
  }
  const tolerance = Math.max(depthAbsoluteTolerance * hs.section.lengthScale, depthRelativeTolerance * yc);
  if (atCritical === 0) return yc;
  if (branch === 'supercritical') {
    return brentRoot(f, reach.minDepth, yc, { xTolerance: tolerance, what: 'supercritical depth from specific force' });
  }
  const ceiling = Number.isFinite(hs.section.maxDepth) ? hs.section.maxDepth : Infinity;
  const bracket = expandUpward(f, yc, Math.min(2 * yc, ceiling), 200, ceiling);
  if (bracket === undefined) {
    throw new HydraulicError(`no subcritical depth below the section's top carries the specific force ${target}`);
  }
  return brentRoot(f, bracket[0], bracket[1], { xTolerance: tolerance, what: 'subcritical depth from specific force' });
}

/**
 * Step off critical depth at a station where N ≠ 0 (a free outfall, the upstream end on a steep reach, or a
 * break of q*): there dy/dx is infinite and y − yc grows like √|x − xe|. The start point at xs = xe ± δ is
 * placed from the exact integral dM/dx = A(S0 − Sf), with the quadrature δ·(f(xe)/3 + 2f(xs)/3), which is
 * exact for an integrand f = a + b·√|x − xe| (three fixed-point passes).
 */
export function stepOffCriticalEnd(
  reach: SpatiallyVariedReach,
  xe: number,
  ye: number,
  xs: number,
  branch: Branch,
): number {
  const { hs, slope, beta } = reach;
  const force = (x: number, y: number) => {
    const t = spatiallyVariedTerms(hs, y, reach.layout.discharge(x), 0, slope, beta);
    return t.area * (slope - t.frictionSlope);
  };
  const me = momentumFunction(hs, ye, reach.layout.discharge(xe), beta);
  const fe = force(xe, ye);
  const qs = reach.layout.discharge(xs);
  let fs = fe;
  let ys = ye;
  for (let pass = 0; pass < 3; pass++) {
    const target = me + (xs - xe) * (fe / 3 + (2 * fs) / 3);
    ys = depthForMomentum(reach, qs, target, branch);
    fs = force(xs, ys);
  }
  return ys;
}
