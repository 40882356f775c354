/**
 * The accepted ranges of model and flag values, in one place so messages, validation and README agree.
 * These are plausibility limits of practice, not physics: `--force` lifts the roughness limits.
 */

/** Manning's n of channels and conduits in practice lies well inside this (Chow 1959, Table 5-6 spans about 0.008–0.15). */
export const manningRange = { min: 0.005, max: 0.2 } as const;

/** α is at least 1 by definition (mean of v³ over V³); compound natural sections reach about 2 (Chow 1959 §2-7). */
export const alphaRange = { min: 1, max: 3 } as const;

/** A bed slope is a fraction; a value of 1 or more is a 45° bed, outside gradually varied flow (common practice). */
export const slopeLimit = 1;

/** An irregular section needs at least this many points to enclose an area. */
export const minimumPoints = 3;
