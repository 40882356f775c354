/**
 * Tolerances and iteration bounds of the analysis layer (calibration, sensitivity, rating tables), named in one
 * place like core/tolerances.ts (which holds those of the engine below).
 */

/** Calibration: default bounds of a roughness multiplier (0.5–2 times the model's roughness). */
export const multiplierBounds = { lower: 0.5, upper: 2 } as const;
/** Calibration: the widest bounds a user may ask for (a multiplier outside this is not a calibration but a new model). */
export const multiplierLimits = { lower: 0.05, upper: 20 } as const;
/** Levenberg–Marquardt: largest number of outer iterations (each one Jacobian). */
export const lmMaxIterations = 40;
/** Levenberg–Marquardt: largest number of damping increases within one iteration before giving up on a descent. */
export const lmMaxDampingSteps = 30;
/** Levenberg–Marquardt: first damping factor λ (Marquardt 1963 scales it by diag(JᵀJ)). */
export const lmInitialDamping = 1e-3;
/** Levenberg–Marquardt: damping is divided by this after a successful step and multiplied after a failed one. */
export const lmDampingFactor = 10;
/** Levenberg–Marquardt: stop when no parameter moves by more than this (absolute, multipliers are near 1). */
export const lmParameterTolerance = 1e-7;
/** Levenberg–Marquardt: stop when the sum of squares falls by less than this fraction in an accepted step. */
export const lmCostTolerance = 1e-12;
/**
 * Finite-difference step of the Jacobian (central differences), absolute on a multiplier. Large enough that the
 * engine's own adaptive-step round-off (well under its 1 mm accuracy goal) does not swamp the difference,
 * small enough that the O(h²) truncation error of central differences is negligible.
 */
export const jacobianStep = 1e-3;
/**
 * Calibration: a mark whose water surface moves by less than this fraction of the local depth for a change of
 * the multiplier by 1 (∂WSEL/∂m · 1 / depth) is taken to be where roughness cannot move the water (a critical
 * or structure control). A uniform-flow stretch responds with about 0.6 (y ∝ n^0.6 for a wide channel: Manning).
 */
export const insensitiveMarkFraction = 0.01;
/** Calibration: a station whose depth is within this fraction of critical depth counts as at critical depth. */
export const atCriticalFraction = 0.01;
/** Sensitivity: a jump toe that moves by more than this fraction of the channel length counts as moved. */
export const jumpShiftFraction = 1e-3;
/** Sensitivity: at most this many varied parameters (3^k cases are run). */
export const sensitivityMaxParameters = 2;
/** Sensitivity: largest variation accepted, in percent (a multiplier of 0 or less is not a roughness). */
export const sensitivityMaxPercent = 90;
/** Rating tables and batches: the most discharges or flows one command computes. */
export const batchMaxCases = 10_000;
/** Rating tables: the most stations one table reports. */
export const ratingMaxStations = 200;
/** Levenberg–Marquardt: the damping factor is never lowered below this (keeps the scaled system regular). */
export const lmMinimumDamping = 1e-12;
/** Ranges from:to:step: the end is included when the last step falls short of it by less than this fraction of a step (round-off). */
export const rangeEndFraction = 1e-9;
