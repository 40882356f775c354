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
/** Number of evenly spaced sample intervals of a specific-energy curve, besides a sample at each of the section's break
 *  depths (where its formulas change, and where narrow extrema arise); a section without break depths gets scanSamples. */
export const energyCurveSamples = 200;
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
/** Geometry: below this half-angle φ (rad) the circular-segment area and first moment are taken from their
 *  Taylor series (to φ¹⁹, truncation < 1e-14 relative here), which avoid the cancellation of the closed forms
 *  at shallow depth (the first moment's terms cancel to order φ⁵). */
export const segmentSeriesAngle = 0.5;

/** Hydraulics: a minimum found by Brent's minimiser is located to about √ε relative; a depth this close
 *  (relative) to a located extremum of specific energy or specific force is treated as being at it. */
export const extremumRelativeTolerance = 1e-6;
/** Geometry: the largest length (offset, width, diameter, elevation magnitude) accepted, in the unit system's
 *  length unit; beyond it the section formulas would lose precision (and squares could overflow). */
export const largestLength = 1e7;
/** Geometry: the largest side slope (horizontal : 1 vertical) accepted; flatter than this is a floodplain, not a bank. */
export const largestSideSlope = 1e4;

/* ---- Profile engine (src/profile) ---- */
/** Profile: fraction of the accuracy goal each integration method aims at internally (the rest is margin). */
export const profileAccuracySafety = 0.25;
/** Profile: |dE/dy| below this counts as the near-critical band, where the ODE method integrates x(y) instead of y(x). */
export const nearCriticalBand = 0.3;
/** Profile: floor of |dE/dy| used when the ODE right-hand side is evaluated inside the near-critical band (keeps it finite). */
export const nearCriticalFloor = 0.03;
/** Profile: a depth within this fraction of critical depth (relative) is at critical depth. */
export const criticalReachFraction = 1e-7;
/** Profile: the depth step (relative to the depth) of the central difference d ln K/dy in the estimate of a depth's distance
 *  from normal depth on a surveyed reach (profile/surveyedClass.ts); ln K is smooth, so the difference is accurate to
 *  about this fraction squared. */
export const normalEstimateStep = 1e-4;
/** Profile: a depth within this fraction of critical depth (relative) lies on the boundary between two profile zones and
 *  takes the zone between normal and critical depth (M2, S2): a depth set to critical depth, or a profile's end at it,
 *  differs from the critical depth it is compared with by round-off, which must not flip S2 and S1 (or M2 and M3). */
export const profileCriticalBand = 1e-6;
/** Profile: a depth within this fraction of normal depth (relative) starts a uniform stretch exactly. */
export const normalStartFraction = 1e-9;
/** Profile: largest number of internal steps of one stretch (any method); beyond it the method fails with a NumericalError. */
export const profileMaxSteps = 2_000_000;
/** Profile: largest growth of the standard step's internal step from one step to the next. */
export const stepGrowthLimit = 2;
/** Profile: first internal step of the standard step, as a fraction of the stretch length. */
export const firstStepFraction = 1e-4;
/** Profile: first internal step of the standard step starting at or near critical depth, as a fraction of critical depth. */
export const criticalStartStepFraction = 1e-3;
/** Profile: the direct step's depth increment, as a fraction of the distance to the depth the profile tends to (first try). */
export const directStepIncrement = 0.02;
/** Profile: the direct step halves its increments at most this many times to meet the accuracy goal. */
export const directStepHalvings = 8;
/** Profile: ODE tolerances relative to the accuracy goal (default run) and for a reference run. */
export const odeToleranceFraction = 1e-3;
export const odeReferenceFraction = 1e-6;
/** Profile: relative tolerance of the ODE method (default run, reference run). */
export const odeRelativeTolerance = 1e-8;
export const odeReferenceRelativeTolerance = 1e-11;
/** Profile: relative step for the numerical derivative dα/dy of a compound section. */
export const alphaDerivativeStep = 1e-6;
/** Profile: a free jump whose two depths' specific forces differ by more than this fraction is reported as not balancing. */
export const jumpBalanceFraction = 1e-5;
/** Profile: a jump toe is located to this fraction of the channel length (Brent on the specific-force difference). */
export const jumpToeTolerance = 1e-9;
/** Profile: the jump toe is searched on each side's profile integrated once through this many equal parts of the
 *  output interval that holds it, joined by cubic Hermite interpolation (a function continuous in x). */
export const jumpToeSubdivisions = 32;

/** Hydraulics: Colebrook–White is solved for x = 1/√f within these bounds (f from 10⁶ down to 2.5·10⁻⁵).
 *  Where the roughness is as large as the flow (ks/(14.8R) near or above 1) the equation has no root in
 *  range and f is held at the largest value, so a thin sheet of flow carries almost nothing. */
export const colebrookWhiteBounds = { low: 1e-3, high: 200 } as const;
/** Hydraulics: absolute tolerance on x = 1/√f in Colebrook–White. */
export const colebrookWhiteTolerance = 1e-12;
/** Hydraulics: a bracketed sign change of Q − K(y)·√S0 whose residual at the converged depth is still above
 *  this fraction of Q is a jump of conveyance (the wetted perimeter of a flat floodplain appearing at once
 *  in a section of one roughness), not a normal depth. */
export const conveyanceJumpFraction = 1e-6;
/** Profile: the standard step solves each step's depth to this fraction of the accuracy goal (Brent's x tolerance). */
export const energyStepDepthFraction = 1e-5;
/** Profile: the standard step widens the bracket around its guessed depth at most this many times (fourfold each) before
 *  it searches the whole branch. */
export const guessExpansions = 4;
/** Profile: where critical depth is not yet known (a surveyed section), the bracket around a guessed depth reaches down
 *  to at most this fraction of the guess (it must stay inside the section, above a zero depth). */
export const lazyBracketFloor = 1 / 16;
/** Profile: the standard step's bracket from its guess reaches this many times as far as a Newton step would (the slope is an estimate). */
export const newtonBracketMargin = 3;
/** Profile: the standard step closes in on a critical stop until it lies within this fraction of the stretch length. */
export const stopApproachFraction = 1e-9;
/** Profile: at most this many closing-in steps towards a critical stop. */
export const stopApproachLimit = 200;
/** Profile: a standard-step stretch that ends at critical depth is re-run at most this many times, each 16 times tighter. */
/** Profile: a standard-step stretch whose energy errors grow by more than this factor on the way (|dE/dy| falling towards
 *  critical depth) is re-run with its tolerance divided by the growth, at most by errorGrowthLimit. The trigger is where the
 *  growth uses up the margin the method keeps (it aims at profileAccuracySafety of the goal). */
export const errorGrowthTrigger = 4;
export const errorGrowthLimit = 256;
export const stopRefinements = 3;
/** Profile: the ODE method's step bound per integration leg (odex maxSteps), and its bound on switches between y(x) and x(y). */
export const odeMaxSteps = 100_000;
export const odeMaxPhases = 8;
/** Profile: an integration that ends within this fraction of the stations' magnitude of an output station has reached it
 *  (odex stops up to about ten rounding units short of its end point). */
export const stationRoundoffFraction = 1e-12;

/* ---- Boundaries and structures (src/profile/reservoir.ts, src/structures/controls) ---- */
/** Reservoir: the discharge drawn from a pool is found to this fraction of the critical-entrance discharge. */
export const reservoirDischargeTolerance = 1e-7;
/** Reservoir: the lower end of the discharge bracket is halved at most this many times. */
export const reservoirBracketHalvings = 60;
