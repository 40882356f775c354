/**
 * Tolerances and bounds of the survey layer, named in one place (the engine's own live in core/tolerances.ts).
 */

/**
 * A stated bed elevation may differ from its cross-section's lowest point by this much before it is a problem:
 * survey levels are usually booked to the centimetre, or to a few hundredths of a foot (common practice).
 */
export const bedMismatchTolerance = { SI: 0.01, US: 0.03 } as const;

/**
 * Interpolation by step halving: a coarse run is accepted where halving every interval changes no depth by
 * more than this fraction of the accuracy goal (for a second-order step the coarse error is about 4/3 of the
 * change, so a half keeps the coarse run inside the goal with margin).
 */
export const halvingAcceptFraction = 0.5;
/**
 * At most this many rounds of halving (each round doubles the subdivision of the intervals that fail). Nine: on
 * samples/survey-drain the 10- and 100-year flows need eight, because the free jump's toe lies beside a narrowing
 * and the S1 profile below it runs close to critical depth, where the depth converges at the second order but from a
 * large first change (with seven the last halving still moved a depth by 0.6 of the goal).
 */
export const halvingRounds = 9;
/** No surveyed interval is divided into more than this many steps. */
export const largestSubdivision = 128;
/** Intervals whose share of the change is at least this fraction of the largest share are refined in a round. */
export const refineShare = 0.1;
/** ...and at least this fraction of the accuracy goal (smaller shares cannot matter). */
export const refineFloor = 0.1;
