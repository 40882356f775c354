/**
 * Every tolerance and iteration bound in one place (after d3's math module): no tolerance is written inline.
 * Depth tolerances are relative to a length scale of the problem so SI and US runs behave alike.
 */

/** Relative tolerance on a depth found by root finding (of the depth itself). */
export const depthRelativeTolerance = 1e-10;
/** Absolute floor for depth root finding, as a fraction of the section's length scale. */
export const depthAbsoluteTolerance = 1e-12;
/** Largest number of iterations of a bracketed root finder. */
export const rootMaxIterations = 200;
/** Number of sample intervals when scanning a depth range for sign changes or minima. */
export const scanSamples = 400;
/** Smallest depth considered (fraction of the length scale): flow thinner than this is treated as dry. */
export const minimumDepthFraction = 1e-9;
/** Slopes within this of the critical slope (relative) classify as critical. */
export const criticalSlopeRelativeBand = 1e-3;
/** |S0| below this is a horizontal bed. */
export const horizontalSlope = 1e-12;

/** The profile accuracy goal (issue: every method within 1 mm, 0.003 ft, or 0.1 % of depth of the ODE solution). */
export const accuracyGoal = {
  SI: 0.001,
  US: 0.003,
  relative: 0.001,
} as const;

export function accuracyFor(system: 'SI' | 'US', depth: number): number {
  return Math.max(accuracyGoal[system], accuracyGoal.relative * Math.abs(depth));
}

/** Geometry: a depth above a closed conduit's crown (or an irregular section's end point) by no more than
 *  this fraction of that limit is round-off and is treated as being at the limit. */
export const crownRoundoffFraction = 1e-12;
/** Geometry: below this half-angle (rad) circular-segment formulas switch to their Taylor series, which
 *  avoid the cancellation of θ − sin θ at shallow depth. */
export const segmentSeriesAngle = 1e-2;
