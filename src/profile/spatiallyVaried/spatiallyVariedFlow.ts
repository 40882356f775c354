/**
 * Spatially varied flow along a reach receiving lateral inflow (side-channel spillway, roadside gutter,
 * collector channel), by the momentum form of the equation (see equation.ts) integrated with odex.
 *
 * Stages (each a function of its own module, so each can be tested alone):
 *   1. lay out q* and Q(x)                                   lateralInflow.ts
 *   2. find the control section                              controlSection.ts (locateControl)
 *   3. step off the control: L'Hôpital slope at a singular   controlSection.ts (singularPointSlope,
 *      point, or the specific-force series at a critical end   stepOffCriticalEnd)
 *   4. integrate the subcritical branch upstream and the     branch.ts (integrateBranch → odex)
 *      supercritical branch downstream
 *   5. against a subcritical tailwater, place the jump where the two branches' specific forces are equal,
 *      or find the control drowned
 *   6. tabulate the stations
 */
import { screeningCaution } from '../../core/cautions.js';
import { InputError, NumericalError, type Problem } from '../../core/errors.js';
import { brentRoot } from '../../core/roots.js';
import type { JumpType } from '../../results/types.js';
import { lateralCriticalDepth, momentumFunction, spatiallyVariedTerms } from './equation.js';
import { inflowLayout } from './lateralInflow.js';
import { spatiallyVariedReach, termsAt, type SpatiallyVariedReach } from './context.js';
import { integrateBranch, type Branch, type BranchPoint, type BranchResult } from './branch.js';
import { locateControl, singularPointSlope, stepOffCriticalEnd } from './controlSection.js';
import {
  svfControlStationTolerance,
  svfCriticalDenominatorBand,
  svfDefaultIntervals,
  svfOdeRelativeTolerance,
  svfSingularOffsetFraction,
  svfStationMergeFraction,
} from './tolerances.js';
import type {
  SpatiallyVariedControl,
  SpatiallyVariedInput,
  SpatiallyVariedJump,
  SpatiallyVariedResult,
  SpatiallyVariedStation,
} from './types.js';

export const spatiallyVariedCautions: readonly string[] = [
  screeningCaution,
  'The one-dimensional momentum equation assumes the inflow enters with no velocity component along the channel and that the flow stays gradually varied; strong transverse inflow, air entrainment and surface waves are not modelled.',
];

/** One computed branch and the stretch of the reach it owns in the result. */
interface OwnedBranch {
  lo: number;
  hi: number;
  depths: Map<number, number>;
}

function own(lo: number, hi: number, points: readonly BranchPoint[], extra: readonly BranchPoint[] = []): OwnedBranch {
  const depths = new Map<number, number>();
  for (const p of [...points, ...extra]) depths.set(p.x, p.y);
  return { lo, hi, depths };
}

/** Jump type by upstream Froude number (Chow 1959 §15-3, after USBR tests). */
function jumpType(froude: number): JumpType {
  if (froude < 1.7) return 'undular';
  if (froude < 2.5) return 'weak';
  if (froude < 4.5) return 'oscillating';
  if (froude < 9) return 'steady';
  return 'strong';
}

function validate(input: SpatiallyVariedInput): void {
  const problems: Problem[] = [];
  if (!Number.isFinite(input.slope)) problems.push({ where: 'slope', message: 'the bed slope must be a finite number', value: input.slope });
  const beta = input.beta ?? 1;
  if (!(Number.isFinite(beta) && beta >= 1 && beta < 2)) {
    problems.push({ where: 'beta', message: 'the momentum coefficient β must lie in [1, 2)', value: beta });
  }
  for (const [where, boundary] of [['downstream', input.downstream], ['upstream', input.upstream]] as const) {
    if (boundary?.kind === 'depth' && !(Number.isFinite(boundary.depth) && boundary.depth > 0)) {
      problems.push({ where: `${where}.depth`, message: 'a boundary depth must be a finite number > 0', value: boundary.depth });
    }
    if (boundary?.kind === 'depth' && boundary.depth > input.section.section.maxDepth) {
      problems.push({ where: `${where}.depth`, message: `the depth is above the section's top ${input.section.section.maxDepth}`, value: boundary.depth });
    }
  }
  input.stations?.forEach((x, i) => {
    if (!(Number.isFinite(x) && x >= 0 && x <= input.length)) {
      problems.push({ where: `stations[${i}]`, message: `an output station must lie in [0, ${input.length}]`, value: x });
    }
  });
  if (input.downstreamBedElevation !== undefined && !Number.isFinite(input.downstreamBedElevation)) {
    problems.push({ where: 'downstreamBedElevation', message: 'the bed elevation must be a finite number', value: input.downstreamBedElevation });
  }
  if (problems.length > 0) throw new InputError(problems);
}

function outputStations(input: SpatiallyVariedInput, extra: readonly number[]): number[] {
  const length = input.length;
  const base = input.stations ?? Array.from({ length: svfDefaultIntervals + 1 }, (_, i) => (length * i) / svfDefaultIntervals);
  const all = [...base, 0, length, ...extra].sort((a, b) => a - b);
  const merged: number[] = [];
  for (const x of all) {
    const last = merged[merged.length - 1];
    if (last === undefined || x - last > svfStationMergeFraction * length) merged.push(x);
  }
  return merged;
}

/** The step-off distance from a control at x, toward `direction`: small against the reach and the stretch. */
function offset(reach: SpatiallyVariedReach, x: number, direction: 1 | -1): number {
  const { breaks, length } = reach.layout;
  const next = direction > 0 ? breaks.find((b) => b > x) ?? length : [...breaks].reverse().find((b) => b < x) ?? 0;
  return Math.min(svfSingularOffsetFraction * length, 0.25 * Math.abs(next - x));
}

/** The depth of a computed branch at x, integrated from the nearest computed point on its upstream
 *  (supercritical) or downstream (subcritical) side. */
function depthOnBranch(reach: SpatiallyVariedReach, points: readonly BranchPoint[], x: number, branch: Branch): number {
  let from: BranchPoint | undefined;
  for (const p of points) {
    const usable = branch === 'supercritical' ? p.x <= x : p.x >= x;
    if (usable && (from === undefined || Math.abs(p.x - x) < Math.abs(from.x - x))) from = p;
  }
  if (from === undefined) throw new NumericalError(`no computed ${branch} point to start from near station ${x}`);
  if (from.x === x) return from.y;
  return integrateBranch(reach, from, x, branch, [x]).end.y;
}

export function spatiallyVariedFlow(input: SpatiallyVariedInput): SpatiallyVariedResult {
  validate(input);
  const hs = input.section;
  const beta = input.beta ?? 1;
  const length = input.length;
  const layout = inflowLayout(length, input.upstreamDischarge, input.inflow);
  const reach = spatiallyVariedReach(hs, layout, input.slope, beta);
  const warnings: string[] = [];
  const criticalAt = (x: number) => lateralCriticalDepth(hs, layout.discharge(x), beta);
  const found = locateControl(reach);
  let control: SpatiallyVariedControl;
  let jump: SpatiallyVariedJump | undefined;
  const owned: OwnedBranch[] = [];
  const stations = outputStations(input, found.kind === 'singular-point' || found.kind === 'inflow-break' ? [found.station] : []);

  // Subcritical branch from the downstream end up to `to`, starting at a depth or at critical depth.
  const subcriticalFromDownstream = (to: number): { result: BranchResult; extra: BranchPoint[]; depth: number; critical: boolean } => {
    const ycEnd = criticalAt(length);
    const given = input.downstream.kind === 'depth' ? input.downstream.depth : undefined;
    if (given !== undefined && given > ycEnd * (1 + svfOdeRelativeTolerance)) {
      return { result: integrateBranch(reach, { x: length, y: given }, to, 'subcritical', stations), extra: [], depth: given, critical: false };
    }
    const xs = length - offset(reach, length, -1);
    const ys = stepOffCriticalEnd(reach, length, ycEnd, xs, 'subcritical');
    return { result: integrateBranch(reach, { x: xs, y: ys }, to, 'subcritical', stations), extra: [{ x: length, y: ycEnd }], depth: ycEnd, critical: true };
  };

  let supercritical: { from: number; result: BranchResult; extra: BranchPoint[] } | undefined;
  let upstreamOwned: OwnedBranch | undefined;

  if (found.kind === 'downstream-end') {
    const sub = subcriticalFromDownstream(0);
    if (input.downstream.kind === 'depth' && sub.critical) {
      warnings.push(
        `the downstream depth ${input.downstream.depth} is not above critical depth ${sub.depth} at the end: the flow passes through critical depth there (a free outfall onto the lower tailwater)`,
      );
    }
    if (sub.result.stopped) warnings.push(`${sub.result.stopped.reason}; the profile is not continued upstream of it`);
    owned.push(own(sub.result.end.x, length, sub.result.points, sub.extra));
    control = sub.critical
      ? {
          kind: 'downstream-end',
          station: length,
          depth: sub.depth,
          reason:
            'N = S0 − Sf − 2βQq* /(gA²) stays negative at critical depth over the whole reach, so the flow is subcritical throughout and passes through critical depth at the downstream end (free outfall)',
        }
      : {
          kind: 'downstream-depth',
          station: length,
          depth: sub.depth,
          reason: 'the flow is subcritical throughout (N < 0 at critical depth everywhere) and the given downstream depth, above critical, controls it',
        };
  } else if (found.kind === 'singular-point') {
    const xc = found.station;
    const yc = criticalAt(xc);
    const through = singularPointSlope(reach, xc, yc);
    const t = termsAt(reach, xc, yc);
    if (through.kind === 'node') warnings.push(`the critical section at station ${xc} is a nodal point: the profile leaves it along the slower direction`);
    const du = offset(reach, xc, -1);
    const dd = offset(reach, xc, 1);
    const up = integrateBranch(reach, { x: xc - du, y: yc - through.slope * du }, 0, 'subcritical', stations);
    if (up.stopped) warnings.push(`${up.stopped.reason}; the profile is not continued upstream of it`);
    upstreamOwned = own(up.end.x, xc, up.points, [{ x: xc, y: yc }]);
    const down = integrateBranch(reach, { x: xc + dd, y: yc + through.slope * dd }, length, 'supercritical', stations);
    supercritical = { from: xc, result: down, extra: [{ x: xc, y: yc }] };
    control = {
      kind: 'singular-point',
      station: xc,
      depth: yc,
      numerator: t.numerator,
      denominator: t.denominator,
      slope: through.slope,
      reason: `N = S0 − Sf − 2βQq* /(gA²) at critical depth changes sign from − to + at station ${xc}: numerator and denominator vanish together there, the flow passes from subcritical upstream to supercritical downstream (the profile's slope through it, by L'Hôpital's rule, is ${through.slope})`,
    };
  } else if (found.kind === 'inflow-break') {
    const xb = found.station;
    const yc = criticalAt(xb);
    const xu = xb - offset(reach, xb, -1);
    const xd = xb + offset(reach, xb, 1);
    const up = integrateBranch(reach, { x: xu, y: stepOffCriticalEnd(reach, xb, yc, xu, 'subcritical') }, 0, 'subcritical', stations);
    if (up.stopped) warnings.push(`${up.stopped.reason}; the profile is not continued upstream of it`);
    upstreamOwned = own(up.end.x, xb, up.points, [{ x: xb, y: yc }]);
    const down = integrateBranch(reach, { x: xd, y: stepOffCriticalEnd(reach, xb, yc, xd, 'supercritical') }, length, 'supercritical', stations);
    supercritical = { from: xb, result: down, extra: [{ x: xb, y: yc }] };
    control = {
      kind: 'inflow-break',
      station: xb,
      depth: yc,
      reason: `at station ${xb} the inflow per unit length changes and N at critical depth jumps from ${found.residualUpstream} to ${found.residualDownstream}: the flow passes through critical depth at the change`,
    };
  } else {
    const yc0 = criticalAt(0);
    const given = input.upstream?.kind === 'depth' ? input.upstream.depth : undefined;
    let start: BranchPoint;
    if (given !== undefined && given < yc0 * (1 - svfOdeRelativeTolerance)) {
      start = { x: 0, y: given };
      control = { kind: 'upstream-depth', station: 0, depth: given, reason: 'N > 0 at critical depth from the upstream end on: the flow is supercritical throughout, set by the given upstream depth' };
    } else {
      if (given !== undefined) warnings.push(`the upstream depth ${given} is not below critical depth ${yc0}: on this reach the entrance is a control at critical depth`);
      start = { x: 0, y: yc0 };
      control = {
        kind: 'upstream-end',
        station: 0,
        depth: yc0,
        reason: 'N = S0 − Sf − 2βQq* /(gA²) is positive at critical depth already at the upstream end: the flow is supercritical throughout and enters at critical depth',
      };
    }
    let down: BranchResult;
    if (start.y === yc0) {
      const xs = offset(reach, 0, 1);
      down = integrateBranch(reach, { x: xs, y: stepOffCriticalEnd(reach, 0, yc0, xs, 'supercritical') }, length, 'supercritical', stations);
    } else {
      down = integrateBranch(reach, start, length, 'supercritical', stations);
    }
    supercritical = { from: 0, result: down, extra: [start] };
  }

  if (supercritical !== undefined) {
    const sup = supercritical;
    const supPoints = [...sup.extra, ...sup.result.points];
    const supEnd = sup.result.stopped ? sup.result.end.x : length;
    if (sup.result.stopped) {
      warnings.push(`${sup.result.stopped.reason}: a hydraulic jump and a further control would be needed; the profile is not continued downstream of it`);
    }
    const tail = input.downstream.kind === 'depth' ? input.downstream.depth : undefined;
    const ycEnd = criticalAt(length);
    let supOwned = own(sup.from, supEnd, supPoints);
    if (tail !== undefined && tail <= ycEnd) {
      warnings.push(`the downstream depth ${tail} is not above critical depth ${ycEnd}: the supercritical flow is set from upstream and the given depth is not used`);
    } else if (tail !== undefined && !sup.result.stopped) {
      const qEnd = layout.discharge(length);
      const supAtEnd = depthOnBranch(reach, supPoints, length, 'supercritical');
      if (momentumFunction(hs, tail, qEnd, beta) < momentumFunction(hs, supAtEnd, qEnd, beta)) {
        warnings.push(
          `the downstream depth ${tail} is too low to hold a hydraulic jump in the reach (its specific force is below that of the supercritical flow at the end): the supercritical flow leaves the reach`,
        );
      } else {
        const sub = integrateBranch(reach, { x: length, y: tail }, sup.from, 'subcritical', stations);
        // the last accepted point too, so a branch that stopped short of a station can still bracket the jump
        const subPoints = sub.stopped ? [...sub.points, sub.end] : sub.points;
        const difference = (x: number): number => {
          const q = layout.discharge(x);
          return (
            momentumFunction(hs, depthOnBranch(reach, subPoints, x, 'subcritical'), q, beta) -
            momentumFunction(hs, depthOnBranch(reach, supPoints, x, 'supercritical'), q, beta)
          );
        };
        // walk upstream over the computed subcritical points until the difference turns negative
        let bracket: [number, number] | undefined;
        let previous = length;
        for (const p of subPoints) {
          if (p.x <= sup.from) break;
          const q = layout.discharge(p.x);
          const dm = momentumFunction(hs, p.y, q, beta) - momentumFunction(hs, depthOnBranch(reach, supPoints, p.x, 'supercritical'), q, beta);
          if (dm < 0) {
            bracket = [p.x, previous];
            break;
          }
          previous = p.x;
        }
        if (bracket === undefined && sub.stopped) bracket = [sub.end.x, previous];
        if (bracket === undefined && sub.end.x <= sup.from) {
          // the tailwater drowns the control: one subcritical profile from the downstream end
          const rest = integrateBranch(reach, sub.end, 0, 'subcritical', stations);
          if (rest.stopped) warnings.push(`${rest.stopped.reason}; the profile is not continued upstream of it`);
          owned.push(own(rest.end.x, length, [...subPoints, ...rest.points]));
          warnings.push(`the downstream depth ${tail} drowns the ${control.kind === 'singular-point' ? 'critical section' : 'control'} at station ${control.station}: the flow is subcritical throughout`);
          control = { kind: 'downstream-depth', station: length, depth: tail, reason: `the given downstream depth drowns the critical section that would otherwise sit at station ${control.station}; the flow is subcritical throughout` };
          upstreamOwned = undefined;
          supOwned = { lo: 0, hi: -1, depths: new Map() };
        } else if (bracket !== undefined) {
          const [xa, xb] = bracket;
          const xj = xa === xb ? xa : brentRoot(difference, xa, xb, { xTolerance: svfControlStationTolerance * length, what: 'hydraulic jump station' });
          const y1 = depthOnBranch(reach, supPoints, xj, 'supercritical');
          const y2 = depthOnBranch(reach, subPoints, xj, 'subcritical');
          const f1 = termsAt(reach, xj, y1).froude;
          jump = { station: xj, upstreamDepth: y1, downstreamDepth: y2, froude: f1, type: jumpType(f1) };
          supOwned = own(sup.from, xj, supPoints);
          owned.push(own(xj, length, subPoints));
        }
      }
    }
    owned.push(supOwned);
  }
  if (upstreamOwned !== undefined) owned.push(upstreamOwned);

  const zEnd = input.downstreamBedElevation ?? 0;
  const rows: SpatiallyVariedStation[] = [];
  for (const x of stations) {
    let depth: number | undefined;
    for (const piece of owned) {
      if (x >= piece.lo && x <= piece.hi && piece.depths.has(x)) {
        depth = piece.depths.get(x);
        break;
      }
    }
    if (depth === undefined) continue; // a stretch the profile could not reach (warned above)
    rows.push(stationRow(reach, x, depth, zEnd + input.slope * (length - x)));
  }
  return {
    units: hs.units.system,
    method: `spatially varied flow, momentum form for lateral inflow (Chow 1959 ch. 12), integrated with odex (Gragg–Bulirsch–Stoer, relative tolerance ${svfOdeRelativeTolerance})`,
    length,
    slope: input.slope,
    beta,
    stations: rows,
    control,
    ...(jump ? { jump } : {}),
    warnings,
    cautions: [...spatiallyVariedCautions],
  };
}

function stationRow(reach: SpatiallyVariedReach, x: number, depth: number, bed: number): SpatiallyVariedStation {
  const { hs, beta, layout } = reach;
  const discharge = layout.discharge(x);
  const inflow = layout.inflowAt(x);
  const t = spatiallyVariedTerms(hs, depth, discharge, inflow, reach.slope, beta);
  const velocity = discharge / t.area;
  const wsel = bed + depth;
  const regime = t.denominator > svfCriticalDenominatorBand ? 'subcritical' : t.denominator < -svfCriticalDenominatorBand ? 'supercritical' : 'critical';
  return {
    station: x,
    bedElevation: bed,
    depth,
    wsel,
    energyElevation: wsel + (t.alpha * velocity * velocity) / (2 * hs.units.g),
    velocity,
    froude: t.froude,
    regime,
    discharge,
    inflow,
    criticalDepth: discharge > 0 ? lateralCriticalDepth(hs, discharge, beta) : 0,
    specificForce: momentumFunction(hs, depth, discharge, beta),
  };
}
