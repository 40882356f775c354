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
/** At most this many rounds of halving (each round doubles the subdivision of the intervals that fail). */
export const halvingRounds = 7;
/** No surveyed interval is divided into more than this many steps. */
export const largestSubdivision = 128;
/** Intervals whose share of the change is at least this fraction of the largest share are refined in a round. */
export const refineShare = 0.1;
/** ...and at least this fraction of the accuracy goal (smaller shares cannot matter). */
export const refineFloor = 0.1;
