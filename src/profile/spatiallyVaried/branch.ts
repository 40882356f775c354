/**
 * One branch of a spatially varied profile, integrated with odex from a known point to another station:
 * subcritical branches run upstream, supercritical ones downstream, as the physics demands. The stretch is
 * split at every break of q* so the integrator never steps across a jump of the right-hand side.
 */
import { integrateScalar } from './odexSolver.js';
import { termsAt, type SpatiallyVariedReach } from './context.js';
import {
  svfCriticalDenominatorBand,
  svfDenominatorFloor,
  svfOdeAbsoluteFraction,
  svfOdeMaxSteps,
  svfOdeRelativeTolerance,
} from './tolerances.js';

export type Branch = 'subcritical' | 'supercritical';

export interface BranchPoint {
  x: number;
  y: number;
}

export interface BranchResult {
  /** the start and every requested station reached, in the direction of integration */
  points: BranchPoint[];
  end: BranchPoint;
  /** set when the branch could not go on (critical depth reached, or the depth left the section) */
  stopped?: { at: number; reason: string };
}

/** The break stations strictly between a and b, in the direction from a to b. */
function breaksBetween(reach: SpatiallyVariedReach, a: number, b: number): number[] {
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const inside = reach.layout.breaks.filter((x) => x > lo && x < hi);
  return b >= a ? inside : inside.reverse();
}

/** Integrate the branch from `start` to `xEnd`, reporting the depth at `stations` (any order; filtered). */
export function integrateBranch(
  reach: SpatiallyVariedReach,
  start: BranchPoint,
  xEnd: number,
  branch: Branch,
  stations: readonly number[],
): BranchResult {
  const direction = xEnd >= start.x ? 1 : -1;
  const sorted = stations
    .filter((x) => (x - start.x) * direction > 0 && (x - xEnd) * direction <= 0)
    .sort((a, b) => (a - b) * direction);
  const points: BranchPoint[] = [{ ...start }];
  const section = reach.hs.section;
  const top = Number.isFinite(section.maxDepth) ? section.maxDepth : Infinity;
  const nodes = [start.x, ...breaksBetween(reach, start.x, xEnd), xEnd];
  let current: BranchPoint = { ...start };
  for (let i = 0; i + 1 < nodes.length; i++) {
    const a = nodes[i]!;
    const b = nodes[i + 1]!;
    if (a === b) continue;
    const q = reach.layout.inflowAt(0.5 * (a + b));
    // Depths outside the section are held at its bounds inside the right-hand side (a trial stage of the
    // extrapolation may overshoot); `accept` refuses any accepted step that lies outside.
    const rhs = (x: number, y: number): number => {
      const depth = Math.min(Math.max(y, reach.minDepth), top);
      const t = termsAt(reach, x, depth);
      const n = reach.slope - t.frictionSlope - (2 * reach.beta * reach.layout.discharge(x) * q) / (reach.hs.units.g * t.area * t.area);
      const d = Math.abs(t.denominator) < svfDenominatorFloor ? (t.denominator < 0 ? -1 : 1) * svfDenominatorFloor : t.denominator;
      return n / d;
    };
    const accept = (x: number, y: number): string | undefined => {
      if (!(y > reach.minDepth)) return `the depth falls to zero near station ${x}`;
      if (y > top) return `the water reaches the top of the closed section near station ${x}`;
      const d = termsAt(reach, x, y).denominator;
      if (branch === 'subcritical' ? d <= svfCriticalDenominatorBand : d >= -svfCriticalDenominatorBand) {
        return `the ${branch} profile reaches critical depth near station ${x}`;
      }
      return undefined;
    };
    const run = integrateScalar(rhs, a, current.y, b, {
      relativeTolerance: svfOdeRelativeTolerance,
      absoluteTolerance: svfOdeAbsoluteFraction * section.lengthScale,
      maxSteps: svfOdeMaxSteps,
      stations: sorted.filter((x) => (x - a) * direction > 0 && (x - b) * direction <= 0),
      accept,
      what: `spatially varied flow (${branch}) from station ${a} to ${b}`,
    });
    for (const p of run.outputs) if (p.x !== start.x) points.push(p);
    current = run.end;
    if (run.stopped) {
      return { points, end: current, stopped: { at: current.x, reason: run.stopped.reason } };
    }
  }
  return { points, end: current };
}
