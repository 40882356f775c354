/**
 * Tolerances and bounds of the spatially varied flow solver, named in one place (no literal tolerance inline).
 * They belong with src/core/tolerances.ts; they live here until the owner of that file takes them over.
 */

/** Relative and absolute (× the section's length scale) tolerance of the ODE integrator on depth. */
export const svfOdeRelativeTolerance = 1e-10;
export const svfOdeAbsoluteFraction = 1e-11;
/** Step bound of one odex call; a profile running into critical depth stops well before this. */
export const svfOdeMaxSteps = 20000;
/** Distance stepped off a singular (critical) point before the integrator takes over, as a fraction of the
 *  stretch being integrated. The start is placed on the solution by a local series (see controlSection.ts),
 *  whose error is far below the accuracy goal at this offset. */
export const svfSingularOffsetFraction = 1e-6;
/** |1 − F²| below this at an accepted step means the profile has reached critical depth. */
export const svfCriticalDenominatorBand = 1e-7;
/** Relative step of the central differences in depth used for ∂N/∂y and ∂D/∂y at the control. */
export const svfDepthDifferenceStep = 1e-5;
/** Tolerance on the control station found by root finding, as a fraction of the reach length. */
export const svfControlStationTolerance = 1e-12;
/** Samples per inflow stretch when scanning for the control section. */
export const svfControlScanSamples = 400;
/** Default number of equal intervals of the output stations. */
export const svfDefaultIntervals = 100;
/** Two stations closer than this fraction of the reach length are the same station. */
export const svfStationMergeFraction = 1e-12;
/** The smallest |1 − F²| the right-hand side divides by: keeps dy/dx finite on a trial stage that lands
 *  exactly on critical depth (such a step is refused by the critical-depth band above). */
export const svfDenominatorFloor = 1e-13;
