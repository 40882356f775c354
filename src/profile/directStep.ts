/**
 * Direct step method (Chow 1959, §10-2 and Example 10-1; Henderson 1966, §4.4): on a prismatic reach the
 * depth is stepped and the distance computed,
 *   Δx = (E2 − E1) / (S0 − S̄f),
 * with S̄f the chosen mean of the friction slope at the two depths. Depths are stepped from the start
 * towards the depth the profile tends to: geometrically towards normal depth (which is approached
 * asymptotically), evenly towards critical depth or a crown (reached at a finite distance, where the
 * stretch stops), geometrically upward where the depth grows without bound (H2, A2).
 *
 * Accuracy: the method is second order in the depth increment. It is run with increments r and r/2 and
 * the depths at the output stations compared; r is halved until the difference (about three times the
 * error of the finer run) is within the tolerance. Depths at output stations come from cubic Hermite
 * interpolation between computed depths, using dy/dx (or dx/dy near critical depth) from the equation,
 * so interpolation adds a fourth-order error only.
 */
import { NumericalError } from '../core/errors.js';
import { brentRoot } from '../core/roots.js';
import {
  directStepHalvings,
  directStepIncrement,
  normalStartFraction,
  profileAccuracySafety,
  profileMaxSteps,
} from '../core/tolerances.js';
import type { PointState } from './energy.js';
import { meanFrictionSlope } from './frictionMean.js';
import {
  type StretchProfile,
  type StretchSpec,
  type StretchStop,
  atCritical,
  branchSign,
  ceilingDepth,
  depthTrend,
  directionOf,
  floorDepth,
  stateAt,
  uniformStretch,
} from './stretch.js';

type Target = 'normal' | 'critical' | 'full' | 'none';

interface Path {
  readonly x: number[];
  readonly y: number[];
  /** the end reached: a stop, or the last station passed */
  readonly stop?: StretchStop;
  /** the depth a run tends to past its last node (normal depth), when the profile reaches it within round-off */
  readonly settled?: number;
}

/** The depth the profile tends to from y0, and which kind of end that is. */
function targetOf(spec: StretchSpec, y0: number, trend: number): { depth: number; kind: Target } {
  const yn = spec.normalDepth;
  const yc = spec.criticalDepth;
  const between = (v: number) => (trend > 0 ? v > y0 : v < y0);
  const candidates: Array<{ depth: number; kind: Target }> = [];
  if (yn !== null && between(yn)) candidates.push({ depth: yn, kind: 'normal' });
  // critical depth bounds the branch: moving towards it (even from it) ends there
  const towardCritical = trend > 0 ? spec.regime === 'supercritical' : spec.regime === 'subcritical';
  if (towardCritical && (between(yc) || y0 === yc || atCritical(spec, y0))) candidates.push({ depth: yc, kind: 'critical' });
  const top = ceilingDepth(spec);
  if (trend > 0 && Number.isFinite(top)) candidates.push({ depth: top, kind: 'full' });
  if (candidates.length === 0) return { depth: trend > 0 ? Infinity : 0, kind: 'none' };
  candidates.sort((a, b) => Math.abs(a.depth - y0) - Math.abs(b.depth - y0));
  return candidates[0]!;
}

/** One run of the direct step with increment ratio r, until the station span is covered or the end reached. */
function run(spec: StretchSpec, r: number): Path {
  const direction = directionOf(spec);
  const stations = spec.stations;
  const x0 = stations[0]!;
  const span = Math.abs(stations[stations.length - 1]! - x0);
  const q = spec.discharge;
  let state = stateAt(spec, spec.startDepth);
  const trend = depthTrend(spec, state);
  const xs = [x0];
  const ys = [state.depth];
  if (trend === 0) return { x: xs, y: ys, settled: state.depth };
  const target = targetOf(spec, state.depth, trend);
  if (target.kind === 'critical' && atCritical(spec, state.depth)) {
    // at critical depth and heading out of the branch: there is no profile on this branch
    return { x: xs, y: ys, stop: { station: x0, depth: spec.criticalDepth, reason: 'critical' } };
  }
  const evenIncrement = r * Math.abs(target.depth - state.depth);
  let x = x0;
  for (let i = 0; i < profileMaxSteps; i++) {
    const y = state.depth;
    let dy: number;
    switch (target.kind) {
      case 'normal':
        dy = r * Math.abs(y - target.depth);
        if (Math.abs(y - target.depth) <= normalStartFraction * target.depth * 10) {
          return { x: xs, y: ys, settled: target.depth };
        }
        break;
      case 'critical':
      case 'full':
        dy = Math.min(evenIncrement, Math.abs(target.depth - y));
        break;
      case 'none':
        dy = r * Math.max(y, spec.criticalDepth);
        break;
    }
    let y2 = y + trend * dy;
    if (target.kind !== 'normal' && target.kind !== 'none' && Math.abs(target.depth - y2) < 1e-9 * target.depth) y2 = target.depth;
    if (y2 <= floorDepth(spec)) y2 = floorDepth(spec);
    const next: PointState = stateAt(spec, y2);
    const drive = spec.slope - meanFrictionSlope(spec.averaging, state, next, q);
    const dx = drive !== 0 ? (next.energy - state.energy) / drive : Infinity;
    if (!(dx * direction > 0) || !Number.isFinite(dx)) {
      // round-off at the asymptote: the profile has settled
      return { x: xs, y: ys, settled: y };
    }
    x += dx;
    xs.push(x);
    ys.push(y2);
    state = next;
    if (Math.abs(x - x0) >= span) return { x: xs, y: ys };
    if ((target.kind === 'critical' || target.kind === 'full') && y2 === target.depth) {
      return { x: xs, y: ys, stop: { station: x, depth: y2, reason: target.kind } };
    }
  }
  throw new NumericalError(`direct step: more than ${profileMaxSteps} depth increments from station ${x0}`);
}

/** dy/dx at a node, and dx/dy (for intervals near critical depth). */
function slopes(spec: StretchSpec, y: number): { dydx: number; dxdy: number } {
  const s = stateAt(spec, y);
  const drive = spec.slope - s.frictionSlope;
  const d = Math.sign(s.dEdy) === branchSign(spec.regime) ? s.dEdy : 0;
  return { dydx: d !== 0 ? drive / d : Infinity * Math.sign(drive || 1), dxdy: drive !== 0 ? d / drive : Infinity };
}

function hermite(t: number, p0: number, p1: number, m0: number, m1: number, h: number): number {
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * p0 + (t3 - 2 * t2 + t) * h * m0 + (-2 * t3 + 3 * t2) * p1 + (t3 - t2) * h * m1;
}

/** Depths at the stations from a run (cubic Hermite in y(x), or in x(y) where dy/dx is steep). */
function sample(spec: StretchSpec, path: Path): { depths: number[]; stop?: StretchStop } {
  const direction = directionOf(spec);
  const stations = spec.stations;
  const depths = [path.y[0]!];
  const n = path.x.length;
  const cache = new Map<number, { dydx: number; dxdy: number }>();
  const slopesAt = (k: number) => {
    let v = cache.get(k);
    if (!v) cache.set(k, (v = slopes(spec, path.y[k]!)));
    return v;
  };
  let k = 0;
  for (let i = 1; i < stations.length; i++) {
    const s = stations[i]!;
    while (k < n - 1 && direction * (path.x[k + 1]! - s) < 0) k++;
    if (k >= n - 1) {
      // beyond the last node: settled at normal depth, or stopped
      if (path.settled !== undefined) {
        depths.push(path.settled);
        continue;
      }
      if (path.stop) return { depths, stop: path.stop };
      depths.push(path.y[n - 1]!);
      continue;
    }
    const xa = path.x[k]!;
    const xb = path.x[k + 1]!;
    const ya = path.y[k]!;
    const yb = path.y[k + 1]!;
    const a = slopesAt(k);
    const b = slopesAt(k + 1);
    const hx = xb - xa;
    const hy = yb - ya;
    const smooth =
      Number.isFinite(a.dydx) && Number.isFinite(b.dydx) && Math.abs(a.dydx * hx) <= 3 * Math.abs(hy) && Math.abs(b.dydx * hx) <= 3 * Math.abs(hy);
    if (smooth || hy === 0) {
      depths.push(hermite((s - xa) / hx, ya, yb, a.dydx, b.dydx, hx));
    } else if (Number.isFinite(a.dxdy) && Number.isFinite(b.dxdy)) {
      const f = (y: number) => hermite((y - ya) / hy, xa, xb, a.dxdy, b.dxdy, hy) - s;
      const lo = Math.min(ya, yb);
      const hi = Math.max(ya, yb);
      depths.push(f(lo) * f(hi) <= 0 ? brentRoot(f, lo, hi, { xTolerance: spec.tolerance * 1e-6, what: `depth at station ${s}` }) : ya + (hy * (s - xa)) / hx);
    } else {
      depths.push(ya + (hy * (s - xa)) / hx);
    }
  }
  return path.stop && direction * (path.stop.station - stations[stations.length - 1]!) < 0 ? { depths, stop: path.stop } : { depths };
}

export function directStep(spec: StretchSpec): StretchProfile {
  const uniform = uniformStretch(spec);
  if (uniform) return uniform;
  if (spec.stations.length === 1) return { depths: [spec.startDepth], steps: 0 };
  let r = directStepIncrement;
  let coarsePath = run(spec, r);
  let coarse = sample(spec, coarsePath);
  let steps = coarsePath.x.length;
  for (let halving = 0; halving < directStepHalvings; halving++) {
    r /= 2;
    const finePath = run(spec, r);
    const fine = sample(spec, finePath);
    steps += finePath.x.length;
    let difference = 0;
    const m = Math.min(fine.depths.length, coarse.depths.length);
    for (let i = 0; i < m; i++) difference = Math.max(difference, Math.abs(fine.depths[i]! - coarse.depths[i]!));
    const sameReach = fine.depths.length === coarse.depths.length;
    // the finer run's error is about a third of the difference (second order)
    if (sameReach && difference <= 3 * profileAccuracySafety * spec.tolerance) {
      return fine.stop ? { depths: fine.depths, stop: fine.stop, steps } : { depths: fine.depths, steps };
    }
    coarsePath = finePath;
    coarse = fine;
  }
  throw new NumericalError(
    `direct step: the depths did not settle to ${spec.tolerance} after ${directStepHalvings} halvings of the depth increment (from station ${spec.stations[0]})`,
  );
}
