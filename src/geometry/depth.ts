/**
 * Depth guards shared by every shape: a depth must be a finite number ≥ 0, and not above a closed
 * conduit's crown or an irregular section's lower end point. Failing requests are physically
 * impossible (HydraulicError), never silently clamped — except for round-off just above the limit.
 */
import { HydraulicError } from '../core/errors.js';
import { crownRoundoffFraction } from '../core/tolerances.js';

/** Throws unless depth is finite and ≥ 0. */
export function checkDepth(depth: number, shape: string): void {
  if (!(depth >= 0) || !Number.isFinite(depth)) {
    throw new HydraulicError(`${shape} section: the depth must be a finite number ≥ 0, got ${depth}`);
  }
}

/** True when depth lies above `limit` by more than round-off (crownRoundoffFraction of the limit). */
export function aboveLimit(depth: number, limit: number): boolean {
  return depth > limit * (1 + crownRoundoffFraction);
}
