/**
 * Normal depth: the depth of uniform flow, where the friction slope equals the bed slope, Q = K(y)·√S0
 * (Chow 1959, ch. 5–6 for Manning, chapters from memory; the same condition for Chézy and Darcy–Weisbach, whose
 * conveyance depends on the discharge through the Reynolds number, so the discharge is passed on).
 * Solved by Brent's method on K(y)·√S0 − Q.
 *
 * - Zero or adverse slope: no uniform flow, no normal depth (null, with the reason).
 * - Open prismatic shapes: K rises with depth, one root, bracketed by doubling the depth upward.
 * - Closed conduits: K rises to a maximum below the crown (near 0.938·D in a circle, where the wetted
 *   perimeter grows faster than the area) and falls to the full-conduit value. Between the full-conduit
 *   discharge and the part-full maximum there are two normal depths: both are reported, the lower one as
 *   `depth` (the upper one is unstable: a small disturbance seals the conduit). Above the part-full
 *   maximum the conduit flows full: `depth` is null and `fullFlow` is true.
 * - Irregular sections: K is scanned over the section's depth range (it may dip where the water spills onto
 *   a floodplain) and every root is reported; a normal depth above the section's end points is a
 *   HydraulicError saying the section must be extended.
 */
import { NumericalError } from '../core/errors.js';
import { brentMinimum, brentRoot, expandUpward, scanSignChanges } from '../core/roots.js';
import { conveyanceJumpFraction, horizontalSlope } from '../core/tolerances.js';
import { conveyance, type HydraulicSection } from './hydraulicSection.js';
import { depthTolerance, extendSectionError, requireDischarge, requireSlope, smallestDepth } from './depthSearch.js';
import { depthTable } from './depthTable.js';

export interface NormalDepthResult {
  /** the normal depth (the lower one where a closed conduit has two); null where none exists */
  depth: number | null;
  /** every normal depth, ascending (empty where none exists) */
  depths: number[];
  /** true when the discharge exceeds a closed conduit's part-full maximum: it flows full */
  fullFlow: boolean;
  /** why there is no normal depth, or why there are two */
  reason?: string;
}

/** Shapes whose conveyance rises with depth (one normal depth). */
const risingConveyanceShapes: ReadonlySet<string> = new Set(['rectangular', 'trapezoidal', 'triangular']);

export function normalDepths(hs: HydraulicSection, discharge: number, slope: number): NormalDepthResult {
  requireDischarge(discharge, 'normal depth');
  requireSlope(slope, 'normal depth');
  if (Math.abs(slope) <= horizontalSlope) {
    return { depth: null, depths: [], fullFlow: false, reason: 'horizontal bed: uniform flow needs a falling bed, so there is no normal depth' };
  }
  if (slope < 0) {
    return {
      depth: null,
      depths: [],
      fullFlow: false,
      reason: `adverse slope (${slope}): the bed rises in the flow direction, so there is no normal depth`,
    };
  }
  const section = hs.section;
  const root = Math.sqrt(slope);
  const what = `normal depth (Q = ${discharge}, S0 = ${slope})`;
  const residual = (y: number) => conveyance(hs, y, discharge) * root - discharge;
  const lo = smallestDepth(section);
  const solve = (a: number, b: number) => brentRoot(residual, a, b, { xTolerance: depthTolerance(section, a), what });

  if (section.closed) return closedConduit(hs, discharge, root, residual, solve, what);

  if (!section.compound && risingConveyanceShapes.has(section.shape) && !Number.isFinite(section.maxDepth)) {
    const bracket = expandUpward(residual, lo, section.lengthScale);
    if (!bracket) throw new NumericalError(`${what}: no bracket found doubling the depth up from ${section.lengthScale}`);
    const y = solve(bracket[0], bracket[1]);
    return { depth: y, depths: [y], fullFlow: false };
  }

  if (!Number.isFinite(section.maxDepth)) {
    // an unbounded section of another kind: bracket upward, then scan below the bracket for every root
    const bracket = expandUpward(residual, lo, section.lengthScale);
    if (!bracket) throw new NumericalError(`${what}: no bracket found doubling the depth up from ${section.lengthScale}`);
    const depths = scanSignChanges(residual, lo, bracket[1]).map(([a, b]) => solve(a, b));
    return { depth: depths[0] ?? null, depths, fullFlow: false };
  }

  // irregular section with end points: scan the tabulated conveyance over its whole depth range
  const table = depthTable(hs, section.maxDepth, discharge);
  const depths: number[] = [];
  for (let i = 0; i + 1 < table.depth.length; i++) {
    const fa = table.conveyance[i]! * root - discharge;
    const fb = table.conveyance[i + 1]! * root - discharge;
    if (fa === 0) depths.push(table.depth[i]!);
    else if (fa * fb < 0) {
      const y = solve(table.depth[i]!, table.depth[i + 1]!);
      // a sign change across a jump of conveyance (a flat floodplain wetted at once) is not a root
      if (Math.abs(residual(y)) <= conveyanceJumpFraction * discharge) depths.push(y);
    }
  }
  const last = table.depth.length - 1;
  if (table.conveyance[last]! * root === discharge) depths.push(table.depth[last]!);
  if (table.conveyance[last]! * root < discharge) throw extendSectionError(section, `the ${what}`);
  return { depth: depths[0] ?? null, depths, fullFlow: false };
}

function closedConduit(
  hs: HydraulicSection,
  discharge: number,
  root: number,
  residual: (y: number) => number,
  solve: (a: number, b: number) => number,
  what: string,
): NormalDepthResult {
  const section = hs.section;
  const crown = section.maxDepth;
  const table = depthTable(hs, crown, discharge);
  const n = table.depth.length;
  let best = 0;
  for (let i = 1; i < n; i++) if (table.conveyance[i]! > table.conveyance[best]!) best = i;
  // the part-full maximum of conveyance, refined between the neighbouring samples
  let peak = crown;
  if (best < n - 1) {
    const a = table.depth[Math.max(best - 1, 0)]!;
    const b = table.depth[best + 1]!;
    peak = brentMinimum((y) => -conveyance(hs, y, discharge), a, b, { xTolerance: depthTolerance(section, a), what });
  }
  const largest = conveyance(hs, peak, discharge) * root;
  if (discharge > largest) {
    return {
      depth: null,
      depths: [],
      fullFlow: true,
      reason:
        `the discharge ${discharge} exceeds the largest part-full discharge ${largest} (at depth ${peak}): ` +
        'the conduit flows full (under pressure), so there is no part-full normal depth',
    };
  }
  const lower = solve(smallestDepth(section), peak);
  if (peak < crown && residual(crown) < 0) {
    const upper = solve(peak, crown);
    if (upper - lower > depthTolerance(section, lower)) {
      return {
        depth: lower,
        depths: [lower, upper],
        fullFlow: false,
        reason:
          `the discharge lies between the full-conduit discharge ${conveyance(hs, crown, discharge) * root} and the ` +
          `part-full maximum ${largest}: two normal depths; the lower is reported as the normal depth`,
      };
    }
  }
  return { depth: lower, depths: [lower], fullFlow: false };
}

/** The normal depth, or null on a zero or adverse slope or in a conduit that flows full (see normalDepths for why). */
export function normalDepth(hs: HydraulicSection, discharge: number, slope: number): number | null {
  return normalDepths(hs, discharge, slope).depth;
}
