/**
 * The gradually varied flow equation integrated as an ODE,
 *   dy/dx = (S0 − Sf) / (dE/dy)     (Chow 1959, eq. 9-8 and §10-5; Henderson 1966, eq. 4-5),
 * with the Gragg–Bulirsch–Stoer extrapolation integrator of the odex package (Hairer & Wanner's ODEX,
 * adaptive step and order, dense output), which gives the depth at every output station.
 *
 * The equation is singular at critical depth (dE/dy = 0). Inside a band around it (|dE/dy| < nearCriticalBand)
 * the independent variable is switched to the depth: dx/dy = (dE/dy)/(S0 − Sf) is regular there, so a
 * profile that runs into critical depth is integrated up to it exactly and stops, and a profile that starts
 * at critical depth (a brink, a break into a steep reach) leaves it cleanly. On a critical slope (yn ≈ yc)
 * the ratio stays finite and y(x) is integrated throughout.
 */
import { Solver } from '../core/odex.js';
import { NumericalError } from '../core/errors.js';
import { brentRoot } from '../core/roots.js';
import {
  nearCriticalBand,
  nearCriticalFloor,
  odeReferenceFraction,
  odeReferenceRelativeTolerance,
  odeRelativeTolerance,
  odeMaxPhases as maxPhases,
  odeMaxSteps,
  odeToleranceFraction,
  stationRoundoffFraction,
} from '../core/tolerances.js';
import { depthGradient } from './energy.js';
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

interface OdeSettings {
  readonly absolute: number;
  readonly relative: number;
}

/** Dense output: the stations it has passed are filled in order. */
class Output {
  readonly depths: number[] = [];
  next = 1;
  steps = 0;
  /** round-off of a station: odex ends an integration up to about ten rounding units short of its end */
  readonly slack: number;
  constructor(readonly spec: StretchSpec, readonly direction: number) {
    const s = spec.stations;
    this.slack = stationRoundoffFraction * Math.max(Math.abs(s[0]!), Math.abs(s[s.length - 1]!), Math.abs(s[s.length - 1]! - s[0]!));
  }
  /** the next station still to fill, or undefined */
  get pending(): number | undefined {
    return this.spec.stations[this.next];
  }
  /** true when x is at or beyond station s in the direction of integration (to within round-off) */
  reached(s: number, x: number): boolean {
    return this.direction * (x - s) >= -this.slack;
  }
}


function solverFor(settings: OdeSettings, span: number): Solver {
  const solver = new Solver(1);
  solver.denseOutput = true;
  solver.absoluteTolerance = settings.absolute;
  solver.relativeTolerance = settings.relative;
  solver.maxSteps = odeMaxSteps;
  solver.initialStepSize = Math.abs(span) * 1e-4 || 1e-6;
  return solver;
}

/** The depth where |dE/dy| leaves the band, moving from y in the direction `trend` on the branch. */
function bandExit(spec: StretchSpec, y: number, trend: number): number {
  const band = (d: number) => Math.abs(stateAt(spec, d).dEdy) - nearCriticalBand;
  if (band(y) >= 0) return y; // already at the edge (round-off)
  let step = Math.max(Math.abs(y - spec.criticalDepth), spec.criticalDepth * 1e-3);
  let b = y;
  for (let i = 0; i < 80; i++) {
    b = y + trend * step;
    if (b <= floorDepth(spec)) b = floorDepth(spec);
    if (b >= ceilingDepth(spec)) b = ceilingDepth(spec);
    if (band(b) >= 0 || b === floorDepth(spec) || b === ceilingDepth(spec)) break;
    step *= 1.5;
  }
  if (band(b) < 0) return b;
  return brentRoot(band, Math.min(y, b), Math.max(y, b), { xTolerance: spec.tolerance * 1e-6, what: 'near-critical band edge' });
}

/**
 * Integrate x(y) with odex from depth y0 (at x0) to depth y1, filling the output stations passed.
 * Returns the station reached at y1.
 */
function depthLeg(spec: StretchSpec, settings: OdeSettings, out: Output, x0: number, y0: number, y1: number): number {
  const slope = spec.slope;
  const lo = Math.min(y0, y1);
  const hi = Math.max(y0, y1);
  const dxdy = (_y: number, x: number[]): number[] => {
    void x;
    const yy = _y < lo ? lo : _y > hi ? hi : _y;
    const s = stateAt(spec, yy);
    const drive = slope - s.frictionSlope;
    return [drive !== 0 ? s.dEdy / drive : 0];
  };
  const solver = solverFor({ absolute: settings.absolute * 10, relative: settings.relative }, y1 - y0);
  let xEnd = x0;
  const result = solver.solve(dxdy, y0, [x0], y1, (n, yOld, y, xv, dense) => {
    const xNow = xv[0]!;
    xEnd = xNow;
    if (n === 1 || !dense) return;
    // stations passed in this step: invert the dense x(y) by Brent
    for (let s = out.pending; s !== undefined && out.reached(s, xNow); s = out.pending) {
      const f = (d: number) => dense(0, d) - s;
      const a = Math.min(yOld, y);
      const b = Math.max(yOld, y);
      const fa = f(a);
      const fb = f(b);
      out.depths.push(
        fa * fb <= 0
          ? brentRoot(f, a, b, { xTolerance: spec.tolerance * 1e-6, what: `depth at station ${s}` })
          : Math.abs(fa) < Math.abs(fb) ? a : b,
      );
      out.next++;
    }
  });
  out.steps += result.nStep;
  if (result.outcome === 1) throw new NumericalError(`ODE method: too many steps integrating x(y) from depth ${y0} to ${y1}`);
  return xEnd;
}

/** Integrate y(x) with odex from (x0, y0) towards the last station; stops on entering the near-critical band. */
function stationLeg(
  spec: StretchSpec,
  settings: OdeSettings,
  out: Output,
  x0: number,
  y0: number,
  watchBand: boolean,
  gradientFloor = nearCriticalFloor,
): { x: number; y: number; entered: boolean; full: boolean; reachedCritical: boolean } {
  const slope = spec.slope;
  const floor = floorDepth(spec);
  const top = ceilingDepth(spec);
  const branch = branchSign(spec.regime);
  const yc = spec.criticalDepth;
  const f = (_x: number, y: number[]): number[] => {
    let yy = y[0]!;
    // keep evaluations on the branch and inside the section (trial stages may stray; the step is then rejected)
    if (branch > 0 && yy < yc) yy = yc;
    if (branch < 0 && yy > yc) yy = yc;
    if (yy < floor) yy = floor;
    if (yy > top) yy = top;
    if (!spec.criticalSlope) return [depthGradient(stateAt(spec, yy), slope, gradientFloor)];
    // critical slope: the ratio is finite through critical depth; at it (0/0) take it just on the branch side
    let s = stateAt(spec, yy);
    if (Math.abs(s.dEdy) < 1e-9) s = stateAt(spec, yc * (1 + branch * 1e-6));
    return [depthGradient(s, slope)];
  };
  const xLast = spec.stations[spec.stations.length - 1]!;
  const solver = solverFor(settings, xLast - x0);
  let xStop = x0;
  let yStop = y0;
  let entered = false;
  let full = false;
  let reachedCritical = false;
  const result = solver.solve(f, x0, [y0], xLast, (n, xOld, x, yv, dense) => {
    xStop = x;
    yStop = yv[0]!;
    if (n === 1 || !dense) return;
    let limit = x;
    const inBand = (d: number) => Math.abs(stateAt(spec, Math.min(Math.max(d, floor), top)).dEdy) < nearCriticalBand;
    if (spec.criticalSlope && branch * (yStop - yc) <= 0) {
      // reached critical (= normal) depth on a critical slope: stop there (settleOnCriticalSlope continues it uniform)
      const g = (xx: number) => dense(0, xx) - yc;
      limit = g(xOld) * g(x) <= 0 ? brentRoot(g, Math.min(xOld, x), Math.max(xOld, x), { xTolerance: spec.tolerance * 1e-3, what: 'critical depth reached' }) : xOld;
      reachedCritical = true;
    } else if (watchBand && inBand(yStop)) {
      // where the band is entered within this step
      const g = (xx: number) => Math.abs(stateAt(spec, Math.min(Math.max(dense(0, xx), floor), top)).dEdy) - nearCriticalBand;
      limit = g(xOld) <= 0 ? xOld : brentRoot(g, Math.min(xOld, x), Math.max(xOld, x), { xTolerance: spec.tolerance * 1e-3, what: 'near-critical band entry' });
      entered = true;
    } else if (Number.isFinite(top) && yStop >= top) {
      const g = (xx: number) => dense(0, xx) - top;
      limit = brentRoot(g, Math.min(xOld, x), Math.max(xOld, x), { xTolerance: spec.tolerance * 1e-3, what: 'crown reached' });
      full = true;
    }
    for (let s = out.pending; s !== undefined && out.reached(s, limit); s = out.pending) {
      out.depths.push(dense(0, s));
      out.next++;
    }
    if (entered || full || reachedCritical) {
      xStop = limit;
      yStop = dense(0, limit);
      return false;
    }
  });
  out.steps += result.nStep;
  if (result.outcome === 1) throw new NumericalError(`ODE method: too many steps from station ${x0}`);
  return { x: xStop, y: reachedCritical ? yc : yStop, entered, full, reachedCritical };
}

function integrate(spec: StretchSpec, settings: OdeSettings): StretchProfile {
  const uniform = uniformStretch(spec);
  if (uniform) return uniform;
  const direction = directionOf(spec);
  const stations = spec.stations;
  const out = new Output(spec, direction);
  out.depths.push(spec.startDepth);
  const xLast = stations[stations.length - 1]!;
  const yc = spec.criticalDepth;
  let x = stations[0]!;
  let y = spec.startDepth;
  const done = (): StretchProfile => ({ depths: out.depths, steps: out.steps });
  const stopAt = (station: number, depth: number, reason: StretchStop['reason']): StretchProfile => ({
    depths: out.depths,
    stop: { station, depth, reason },
    steps: out.steps,
  });
  if (stations.length === 1) return done();

  let entered = false;
  for (let phase = 0; phase < maxPhases; phase++) {
    if (out.pending === undefined) return done();
    const state = stateAt(spec, y);
    // a leg that stopped on entering the band is in it, whatever round-off says at the edge
    const nearCritical = (entered || Math.abs(state.dEdy) < nearCriticalBand) && !spec.criticalSlope;
    entered = false;
    if (nearCritical) {
      const trend = depthTrend(spec, state);
      const yn = spec.normalDepth;
      const towards = trend > 0 ? Infinity : 0;
      const target = Math.sign(yc - y) === trend ? yc : Math.min(Math.max(bandExit(spec, y, trend), Math.min(y, towards)), Math.max(y, towards));
      if (yn !== null && trend !== 0 && (yn - y) * (yn - target) < 0) {
        // normal depth lies inside the band, between here and where the band would be left (a slope near the
        // critical one): the profile tends to it and never reaches critical depth. Leave the steepest part in
        // x(y), then integrate y(x) with a floor on dE/dy below any value met on the way.
        const mid = y + 0.5 * (yn - y);
        const xm = depthLeg(spec, settings, out, x, y, mid);
        if (direction * (xm - xLast) >= 0 || out.pending === undefined) return done();
        const floor = Math.max(1e-9, 0.5 * Math.min(Math.abs(stateAt(spec, mid).dEdy), Math.abs(stateAt(spec, yn).dEdy)));
        const leg = stationLeg(spec, settings, out, xm, mid, false, floor);
        if (leg.full) return stopAt(leg.x, leg.y, 'full');
        return done();
      }
      const towardCritical = trend !== 0 && Math.sign(yc - y) === trend;
      const leavingBranch = atCritical(spec, y) && trend !== branchSign(spec.regime);
      if (leavingBranch) return stopAt(x, yc, 'critical');
      if (towardCritical) {
        // no normal depth between y and yc (else the profile tends to it and never reaches critical)
        const driveHere = spec.slope - state.frictionSlope;
        const driveCritical = spec.slope - stateAt(spec, yc).frictionSlope;
        if (driveHere * driveCritical > 0) {
          const xc = depthLeg(spec, settings, out, x, y, yc);
          if (direction * (xc - xLast) >= 0) return done();
          return stopAt(xc, yc, 'critical');
        }
      } else if (trend !== 0) {
        const yb = bandExit(spec, y, trend);
        const xb = depthLeg(spec, settings, out, x, y, yb);
        if (direction * (xb - xLast) >= 0 || out.pending === undefined) return done();
        x = xb;
        y = yb;
        const leg = stationLeg(spec, settings, out, x, y, true);
        if (leg.full) return stopAt(leg.x, leg.y, 'full');
        if (!leg.entered) return done();
        x = leg.x;
        y = leg.y;
        entered = true;
        continue;
      }
    }
    const leg = stationLeg(spec, settings, out, x, y, !spec.criticalSlope);
    if (leg.full) return stopAt(leg.x, leg.y, 'full');
    if (leg.reachedCritical) return stopAt(leg.x, yc, 'critical');
    if (!leg.entered) return done();
    x = leg.x;
    y = leg.y;
    entered = true;
  }
  throw new NumericalError(`ODE method: the profile from station ${stations[0]} did not settle in ${maxPhases} phases`);
}

/** The ODE method at its default tolerance (a small fraction of the accuracy goal). */
export function odeProfile(spec: StretchSpec): StretchProfile {
  return integrate(spec, { absolute: spec.tolerance * odeToleranceFraction, relative: odeRelativeTolerance });
}

/** The ODE method at a tight tolerance: the reference the other methods are checked against. */
export function odeReference(spec: StretchSpec): StretchProfile {
  return integrate(spec, { absolute: spec.tolerance * odeReferenceFraction, relative: odeReferenceRelativeTolerance });
}

