/**
 * Standard step method (Chow 1959, §10-3 "standard-step method"; Henderson 1966, §4.4): the energy
 * equation between two stations,
 *   z2 + y2 + α2V2²/2g = z1 + y1 + α1V1²/2g − S̄f·(x2 − x1),
 * solved for the unknown depth y2 at each step by Brent's method on the energy residual, bracketed on the
 * branch of the flow (subcritical: [yc, top], supercritical: (0, yc]). On that branch the residual is
 * monotone in y2, so the bracket holds at most one root; when it holds none the flow reaches critical
 * depth within the step, and the step is shortened to end exactly there.
 *
 * Accuracy: the method is second order (it is the trapezoidal rule applied to dH/dx = −Sf). The local
 * depth error of a step of length h is about h³·|Sf''|/(12·|dE/dy|); the step length is chosen from that
 * estimate (with Sf'' from the last three stations) so the accumulated error stays within a fraction
 * (profileAccuracySafety) of the stretch's tolerance, and a step whose estimate exceeds twice its share is
 * redone at half length. Near critical depth every output station is a computed station; elsewhere one
 * step may span several output stations, filled by cubic Hermite interpolation (dy/dx from the equation).
 */
import { NumericalError } from '../core/errors.js';
import { brentMinimum, brentRoot } from '../core/roots.js';
import {
  criticalStartStepFraction,
  stopApproachFraction,
  stopApproachLimit,
  stopRefinements,
  energyStepDepthFraction,
  errorGrowthLimit,
  errorGrowthTrigger,
  firstStepFraction,
  guessExpansions,
  lazyBracketFloor,
  newtonBracketMargin,
  nearCriticalBand,
  nearCriticalFloor,
  profileAccuracySafety,
  profileMaxSteps,
  stepGrowthLimit,
} from '../core/tolerances.js';
import { pointState, type PointState, TrialState } from './energy.js';
import { meanFrictionSlope } from './frictionMean.js';
import {
  type StretchProfile,
  type StretchSpec,
  type StretchStop,
  branchSign,
  ceilingDepth,
  depthTrend,
  directionOf,
  floorDepth,
  stateAt,
  uniformStretch,
} from './stretch.js';

interface StepOutcome {
  state?: PointState;
  stop?: StretchStop;
}

/** A root bracket [a, b] with the function's values at its ends. */
interface Bracket {
  readonly a: number;
  readonly b: number;
  readonly fa: number;
  readonly fb: number;
}

/**
 * A bracket of a root of f near `guess`: [guess − w, guess + w] inside [lo, hi], widened towards the root (f rising
 * with depth when `rising` is +1, falling when −1, as the energy residual does on each branch) at most
 * guessExpansions times, w growing fourfold each time; undefined when none is found that way.
 */
function bracketNear(f: (y: number) => number, guess: number, width: number, lo: number, hi: number, rising: number): Bracket | undefined {
  let w = width;
  let a = Math.max(lo, guess - w);
  let b = Math.min(hi, guess + w);
  let fa = f(a);
  let fb = f(b);
  for (let k = 0; ; k++) {
    if (fa * fb <= 0) return { a, b, fa, fb };
    if (k >= guessExpansions) return undefined;
    w *= 4;
    if (rising * fb < 0) {
      // still below the root's level at b on a rising curve (above it on a falling one): the root lies above b
      if (b >= hi) return undefined;
      a = b;
      fa = fb;
      b = Math.min(hi, guess + w);
      fb = f(b);
    } else {
      if (a <= lo) return undefined;
      b = a;
      fb = fa;
      a = Math.max(lo, guess - w);
      fa = f(a);
    }
  }
}

/**
 * A bracket of a root of f starting at `guess` itself: f there tells the side the root lies on (f rising with depth
 * when `rising` is +1), and the other end is put a little beyond where a Newton step with `slope` (an estimate of
 * |df/dy|, ≤ 0 or not finite when unknown) would land, or `width` away without one; widened towards the root as
 * bracketNear does. A good guess and slope give a bracket only a few times wider than the guess's error, which
 * Brent's method closes in one or two evaluations.
 */
function bracketFrom(
  f: (y: number) => number,
  guess: number,
  width: number,
  lo: number,
  hi: number,
  rising: number,
  slope: number,
): Bracket | undefined {
  let x = guess;
  let fx = f(x);
  if (fx === 0) return { a: x, b: x, fa: 0, fb: 0 };
  const down = rising * fx > 0;
  let w = slope > 0 && Number.isFinite(slope) ? Math.min(width, Math.abs(fx / slope) * newtonBracketMargin) : width;
  for (let k = 0; ; k++) {
    const y = down ? Math.max(lo, x - w) : Math.min(hi, x + w);
    if (y === x) return undefined;
    const fy = f(y);
    if (fx * fy <= 0) return down ? { a: y, b: x, fa: fy, fb: fx } : { a: x, b: y, fa: fx, fb: fy };
    if (k >= guessExpansions) return undefined;
    x = y;
    fx = fy;
    w *= 4;
  }
}

/**
 * The root in a bracket with known end values: first one secant step, accepted where the residual left there,
 * divided by the bracket's own slope (fb − fa)/(b − a), puts the root within xTolerance of it (the Newton error
 * estimate; on the smooth, monotone residual of a step the bracket's chord slope is within a small factor of the
 * local one, and xTolerance is 1e-5 of the accuracy goal); otherwise Brent's method on the part of the bracket that
 * holds the root.
 */
function closeBracket(f: (y: number) => number, bracket: Bracket, xTolerance: number, what: string): number {
  const { a, b, fa, fb } = bracket;
  if (fa === 0) return a;
  if (fb === 0 || a === b) return b;
  const chord = (fb - fa) / (b - a);
  const y = a - fa / chord;
  if (!(y > a && y < b)) return rootIn(f, bracket, xTolerance, what);
  const fy = f(y);
  if (Math.abs(fy / chord) <= xTolerance) return y;
  return rootIn(f, fy * fa < 0 ? { a, b: y, fa, fb: fy } : { a: y, b, fa: fy, fb }, xTolerance, what);
}

/** Brent's method on a bracket whose end values are known (they are not evaluated again). */
function rootIn(f: (y: number) => number, bracket: Bracket, xTolerance: number, what: string): number {
  const { a, b, fa, fb } = bracket;
  return brentRoot((y) => (y === a ? fa : y === b ? fb : f(y)), a, b, { xTolerance, what });
}

/**
 * Solve the energy equation from (x1, s1) to station x2. Exported for the surveyed-reach step and tests.
 *
 * With a guess, the root is first sought in a bracket around it (residuals at its ends, widened a few times
 * towards the root; Brent only once the residual changes sign). Where spec.criticalDepth is worked out on first
 * read (spec.lazyCritical, a surveyed section), that bracket is not bounded by critical depth, and its root is
 * taken when the flow there is clearly on the branch: dE/dy with the branch's sign and at least nearCriticalBand
 * (F well away from 1). In a section with one critical depth that puts the root on the branch, where the residual
 * is monotone and the root unique: the same root the whole-branch search gives. Otherwise critical depth is read
 * and the step solved on the branch as below.
 */
export function energyStep(
  spec: StretchSpec,
  x1: number,
  s1: PointState,
  x2: number,
  guess?: number,
  /** a head loss besides friction between the known state and a trial one (eddy losses of a non-prismatic step), ≥ 0 */
  extraLoss?: (known: PointState, trial: PointState) => number,
): StepOutcome {
  const q = spec.discharge;
  const delta = x2 - x1;
  const lossSign = delta > 0 ? 1 : -1;
  const residualOf = extraLoss
    ? (s: PointState) =>
        s.energy - s1.energy - spec.slope * delta + meanFrictionSlope(spec.averaging, s1, s, q) * delta + lossSign * extraLoss(s1, s)
    : (s: PointState) => s.energy - s1.energy - spec.slope * delta + meanFrictionSlope(spec.averaging, s1, s, q) * delta;
  const xTolerance = spec.tolerance * energyStepDepthFraction;
  const what = 'standard step depth';
  const subcritical = spec.regime === 'subcritical';
  const rising = branchSign(spec.regime);
  const top = ceilingDepth(spec);
  const width = guess !== undefined ? Math.max(0.25 * Math.abs(guess - s1.depth), xTolerance * 100) : 0;

  if (spec.lazyCritical && guess !== undefined && guess > 0 && guess <= top) {
    // inside the section only (no critical-depth floor: that would need critical depth); the trials are evaluated in
    // one reused state, and the depth found is kept as its own state
    const trial = new TrialState(spec.hs, q);
    const inside = (y: number) => residualOf(trial.at(y > top ? top : y));
    // the residual's slope is about dE/dy of the known state (friction adds a little): a Newton-sized bracket
    const bracket = bracketFrom(inside, guess, width, guess * lazyBracketFloor, top, rising, Math.abs(s1.dEdy));
    if (bracket) {
      const y = closeBracket(inside, bracket, xTolerance, what);
      const state = trial.depth === y ? trial.fixed() : pointState(spec.hs, y, q);
      if (rising * state.dEdy >= nearCriticalBand) return { state };
    }
  }

  // (made only past the surveyed path above, which returns on most steps of a survey) the last state evaluated is
  // kept: Brent ends on it, which saves one evaluation per step
  let last: PointState | undefined;
  const residual = (y: number) => {
    last = stateAt(spec, y);
    return residualOf(last);
  };
  const solved = (y: number): StepOutcome => ({ state: last !== undefined && last.depth === y ? last : stateAt(spec, y) });
  const yc = spec.criticalDepth;
  const branchLow = subcritical ? yc : floorDepth(spec);
  const branchHigh = subcritical ? top : yc;

  // Where the bracket at the branch's critical end fails, the profile reaches the limit within the step:
  // with the end depth fixed there, the residual is linear in the step length, so solve for it.
  const limitStop = (limit: PointState, reason: 'critical' | 'full'): StepOutcome => {
    const sf = meanFrictionSlope(spec.averaging, s1, limit, q);
    const denominator = sf - spec.slope;
    let d = denominator !== 0 ? (s1.energy - limit.energy) / denominator : 0;
    if (!(d / delta >= 0)) d = 0;
    if (d / delta > 1) d = delta;
    return { stop: { station: x1 + d, depth: limit.depth, reason } };
  };

  // A bracket around the predicted depth saves iterations; fall back to the whole branch.
  if (guess !== undefined && guess > branchLow && guess < branchHigh) {
    const bracket = bracketNear(residual, guess, width, branchLow, branchHigh, rising);
    if (bracket) return solved(rootIn(residual, bracket, xTolerance, `${what} at station ${x2}`));
  }
  const critical = stateAt(spec, yc);
  const rc = residualOf(critical);
  if (rc > 0) {
    // With an eddy loss the residual is not monotone on the branch: the loss C·|Δ(αV²/2g)| changes with the trial
    // depth at a rate C·|d(αV²/2g)/dy| that outweighs |dE/dy| next to critical depth, so the residual turns back up
    // towards critical depth, and a positive residual there need not mean that no depth balances the step (it was
    // read so, and a step whose guessed bracket was just too narrow ran into critical depth: the profile then moved
    // by jumps as the roughness changed). Away from critical depth the residual keeps the branch's sign of slope;
    // its least value on the branch tells: below zero, the step's root lies between it and the branch's far end.
    const dip = extraLoss ? branchDip(residual, spec, s1, yc, xTolerance) : undefined;
    if (dip === undefined) return limitStop(critical, 'critical');
    return solved(brentRoot(residual, dip.a, dip.b, { xTolerance, what: `standard step depth at station ${x2}` }));
  }
  if (rc === 0) return { state: critical };

  let lo: number;
  let hi: number;
  if (spec.regime === 'subcritical') {
    lo = yc;
    const top = ceilingDepth(spec);
    if (Number.isFinite(top)) {
      const ceiling = stateAt(spec, top);
      if (residualOf(ceiling) < 0) return limitStop(ceiling, 'full');
      hi = top;
    } else {
      hi = Math.max(s1.depth, yc) * 1.25;
      let expansions = 0;
      while (residual(hi) < 0) {
        hi *= 2;
        if (++expansions > 60) throw new NumericalError(`standard step: no subcritical depth found up to ${hi} at station ${x2}`);
      }
    }
  } else {
    lo = floorDepth(spec);
    hi = yc;
  }

  const y = brentRoot(residual, lo, hi, { xTolerance, what: `standard step depth at station ${x2}` });
  return solved(y);
}

/**
 * The part of the branch beyond the residual's least value, where the residual keeps the branch's sign of slope
 * and changes sign once, or undefined where the residual stays above zero on the whole branch (the flow reaches
 * critical depth within the step). Supercritical: the least value on (floor, yc], the root below it; subcritical:
 * on [yc, far] with far the larger of twice the known depth and twice critical depth (inside the section), the
 * root above it. The residual is falling (supercritical) or rising (subcritical) away from critical depth, so
 * Brent's minimiser finds its one least value.
 */
function branchDip(
  residual: (y: number) => number,
  spec: StretchSpec,
  known: PointState,
  yc: number,
  xTolerance: number,
): { a: number; b: number } | undefined {
  const what = 'standard step: the least energy residual on the branch';
  if (spec.regime === 'supercritical') {
    const lo = floorDepth(spec);
    const y = brentMinimum(residual, lo, yc, { xTolerance, what });
    if (!(residual(y) < 0)) return undefined;
    return residual(lo) > 0 ? { a: lo, b: y } : undefined;
  }
  const far = Math.min(ceilingDepth(spec), 2 * Math.max(known.depth, yc));
  const y = brentMinimum(residual, yc, far, { xTolerance, what });
  if (!(residual(y) < 0)) return undefined;
  return residual(far) > 0 ? { a: y, b: far } : undefined;
}

function hermite(t: number, y0: number, y1: number, m0: number, m1: number, h: number): number {
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * h * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * h * m1;
}

/** Estimated local depth error of the step ending at (x3, s3), from Sf at three stations. */
function localError(x1: number, sf1: number, x2: number, sf2: number, x3: number, s3: PointState): number {
  const h = Math.abs(x3 - x2);
  const second = (2 * ((s3.frictionSlope - sf2) / (x3 - x2) - (sf2 - sf1) / (x2 - x1))) / (x3 - x1);
  const d = Math.max(Math.abs(s3.dEdy), nearCriticalFloor * 1e-3);
  return (h * h * h * Math.abs(second)) / (12 * d);
}

/** True when a break depth of the section (Section.breakDepths) lies strictly between two depths. */
function straddlesBreak(spec: StretchSpec, a: number, b: number): boolean {
  const breaks = spec.hs.section.breakDepths;
  if (breaks === undefined) return false;
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  for (const d of breaks) if (d > lo && d < hi) return true;
  return false;
}

/** A march's profile, with how much its energy errors grew on the way (see standardStep). */
interface March extends StretchProfile {
  /** the largest |dE/dy| met divided by |dE/dy| at the end (≥ 1) */
  readonly amplification: number;
}

function march(spec: StretchSpec): March {
  const uniform = uniformStretch(spec);
  if (uniform) return { ...uniform, amplification: 1 };
  const stations = spec.stations;
  const direction = directionOf(spec);
  const first = stations[0]!;
  const length = Math.abs(stations[stations.length - 1]! - first);
  let state = stateAt(spec, spec.startDepth);
  const depths = [state.depth];
  if (length === 0) return { depths: stations.map(() => state.depth), steps: 0, amplification: 1 };
  let steepest = Math.abs(state.dEdy);
  // next to critical depth an energy error δE moves the depth by about √(2δE/E''), not δE/|dE/dy|: the floor keeps
  // the growth to what the linear reading means
  const amplification = () => Math.max(1, steepest / Math.max(Math.abs(state.dEdy), nearCriticalFloor));

  const allowedPerLength = (spec.tolerance * profileAccuracySafety) / length;
  const smallest = length * 1e-12;
  let x = first;
  // the first step has no error estimate (that needs three stations): start short and let the estimate grow it
  let h = length * firstStepFraction;
  if (Math.abs(state.dEdy) < nearCriticalBand) h = Math.min(h, criticalStartStepFraction * spec.criticalDepth);
  // the previous accepted station (with the current one and the new one: Sf'') and the predictor's history
  let xb = NaN;
  let sfb = NaN;
  let yPrevious = NaN;
  let xPrevious = NaN;
  let steps = 0;

  const lastStation = stations[stations.length - 1]!;
  const gradient = (st: PointState) => (spec.slope - st.frictionSlope) / st.dEdy;
  let next = 1;
  // near critical depth every output station is a computed one; elsewhere a step may span several, which are
  // filled by cubic Hermite interpolation with dy/dx from the equation at both ends (fourth-order error)
  let landing = false;
  let approaches = 0;
  while (next < stations.length) {
    const nearCritical = landing || Math.abs(state.dEdy) < nearCriticalBand;
    const limit = nearCritical ? stations[next]! : lastStation;
    const remaining = direction * (limit - x);
    if (remaining <= 0) {
      depths.push(state.depth);
      next++;
      continue;
    }
    let dx = h;
    if (remaining <= dx * 1.05) dx = remaining;
    const x2 = remaining === dx ? limit : x + direction * dx;
    let guess: number;
    if (Number.isFinite(yPrevious)) guess = state.depth + ((state.depth - yPrevious) * (x2 - x)) / (x - xPrevious);
    else {
      const trend = depthTrend(spec, state);
      const g = Math.abs(state.dEdy) > nearCriticalBand ? gradient(state) : NaN;
      guess = Number.isFinite(g) ? state.depth + g * (x2 - x) : state.depth + trend * 1e-3 * spec.criticalDepth;
    }
    const outcome = energyStep(spec, x, state, x2, guess);
    const skips = direction * (x2 - stations[next]!) > 0;
    if (outcome.stop) {
      if (skips && direction * (outcome.stop.station - stations[next]!) > 0) {
        // stations lie before the stop: compute them one by one
        landing = true;
        continue;
      }
      // close in on the stop with steps of a quarter of the remaining distance: near critical depth the
      // depth varies like the square root of the distance, and one long last step would misplace the stop
      const remainingToStop = direction * (outcome.stop.station - x);
      if (remainingToStop > length * stopApproachFraction && approaches++ < stopApproachLimit) {
        h = remainingToStop / 4;
        landing = true;
        continue;
      }
      return { depths, stop: outcome.stop, steps: steps + 1, amplification: amplification() };
    }
    const after = outcome.state!;
    if (skips && Math.abs(after.dEdy) < nearCriticalBand) {
      landing = true;
      continue;
    }
    let factor = stepGrowthLimit;
    if (Number.isFinite(xb)) {
      const e = localError(xb, sfb, x, state.frictionSlope, x2, after);
      const allowed = allowedPerLength * dx;
      if (e > 2 * allowed && dx > smallest * 2) {
        h = dx / 2;
        continue;
      }
      factor = e > 0 ? Math.min(stepGrowthLimit, Math.max(0.2, 0.9 * Math.sqrt(allowed / e))) : stepGrowthLimit;
    }
    // fill the output stations this step reached: by cubic Hermite interpolation, except where the step's depths
    // straddle a break depth of the section (a bank top, a floodplain's edge), across which the profile has a kink
    // that no smooth curve follows: there each station is balanced from the step's start by the energy equation
    const span = x2 - x;
    const kinked = straddlesBreak(spec, state.depth, after.depth);
    for (; next < stations.length && direction * (stations[next]! - x2) <= 0; next++) {
      const t = (stations[next]! - x) / span;
      const smooth = t >= 1 ? after.depth : hermite(t, state.depth, after.depth, gradient(state), gradient(after), span);
      const balanced = kinked && t < 1 ? energyStep(spec, x, state, stations[next]!, smooth).state : undefined;
      depths.push(balanced !== undefined ? balanced.depth : smooth);
    }
    xb = x;
    sfb = state.frictionSlope;
    yPrevious = state.depth;
    xPrevious = x;
    x = x2;
    state = after;
    steepest = Math.max(steepest, Math.abs(after.dEdy));
    landing = false;
    // a step shortened to land on a station does not shrink the next one
    h = Math.max(smallest, (remaining === dx ? Math.max(h, dx) : dx) * factor);
    if (++steps > profileMaxSteps) {
      throw new NumericalError(`standard step: more than ${profileMaxSteps} steps from station ${first}`);
    }
  }
  return { depths, steps, amplification: amplification() };
}

/**
 * The standard step with two checks where its errors grow after they are made.
 *
 * - The step control keeps each step's local error in depth within its share of the tolerance, with dE/dy where
 *   the step is. The error made is one of energy (the method integrates dH/dx = −Sf), and a depth error is that
 *   energy error divided by dE/dy where it is read: a profile heading towards critical depth (M3, H3, A3, S2 from
 *   a steep start) carries energy errors made where |dE/dy| was large to where it is small. Such a stretch is run
 *   again with the tolerance divided by that growth (the largest |dE/dy| met over |dE/dy| at the end, at most
 *   errorGrowthLimit; not on a critical slope, where the ratio stays finite through critical depth), so the errors
 *   read at its end stay within the share.
 * - A profile that runs into critical depth carries its errors into a region where they grow without bound (the
 *   depth varies like the square root of the distance to the stop), so such a stretch is recomputed at a
 *   tolerance 16 times tighter (steps 4 times shorter) and, while the two differ by more than the accuracy share,
 *   tightened again (at most stopRefinements times): a Richardson check.
 */
export function standardStep(spec: StretchSpec): StretchProfile {
  let result: March = march(spec);
  let steps = result.steps;
  // on a critical slope the equation's ratio stays finite through critical depth: no growth to correct
  if (!spec.criticalSlope && result.stop?.reason !== 'critical' && result.amplification > errorGrowthTrigger && result.depths.length >= 2) {
    const tighter = march({ ...spec, tolerance: spec.tolerance / Math.min(result.amplification, errorGrowthLimit) });
    steps += tighter.steps;
    result = tighter;
  }
  if (result.stop?.reason !== 'critical' || result.depths.length < 2) return { depths: result.depths, ...(result.stop ? { stop: result.stop } : {}), steps };
  let tolerance = spec.tolerance;
  for (let k = 0; k < stopRefinements; k++) {
    tolerance /= 16;
    const finer = march({ ...spec, tolerance });
    steps += finer.steps;
    const m = Math.min(finer.depths.length, result.depths.length);
    let difference = 0;
    for (let i = 0; i < m; i++) difference = Math.max(difference, Math.abs(finer.depths[i]! - result.depths[i]!));
    const settled = difference <= spec.tolerance * profileAccuracySafety && finer.depths.length === result.depths.length;
    result = finer;
    if (settled) break;
  }
  return { depths: result.depths, ...(result.stop ? { stop: result.stop } : {}), steps };
}
