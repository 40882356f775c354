/**
 * Submerged weir flow: Villemonte's correction (J. R. Villemonte, "Submerged-weir discharge studies",
 * Engineering News-Record 139, 1947, pp. 866–869):
 *   Q / Q1 = (1 − (H2/H1)^n)^0.385,
 * Q1 the free discharge at the upstream head H1, H2 the downstream head over the crest, n the exponent of
 * head in the free-flow law (1.5 for a rectangular crest, 2.5 for a triangular notch).
 * Villemonte's tests were on sharp-crested weirs; applied to broad crests it reduces the flow earlier than
 * their modular limit (about H2/H1 = 0.66–0.8), so headwaters come out high (conservative for backwater).
 */
import { HydraulicError, NumericalError } from '../../core/errors.js';
import { invertRising } from '../invert.js';

/** Villemonte's exponent. */
export const villemonteExponent = 0.385;

/** Q/Q1 for a submergence ratio H2/H1 (0 or less: free flow, factor 1). */
export function villemonteFactor(submergenceRatio: number, headExponent: number): number {
  if (!(submergenceRatio > 0)) return 1;
  if (submergenceRatio >= 1) return 0;
  return Math.pow(1 - Math.pow(submergenceRatio, headExponent), villemonteExponent);
}

export interface SubmergedHead {
  /** upstream head H1 over the crest */
  readonly head: number;
  /** the free-flow head for the same discharge */
  readonly freeHead: number;
  /** H2/H1 */
  readonly submergenceRatio: number;
  /** Q/Q1 at the solution */
  readonly factor: number;
}

/**
 * The upstream head H1 that passes `discharge` with the downstream head `tailwaterHead` over the crest.
 * Q1(H1)·(1 − (H2/H1)^n)^0.385 rises with H1 from 0 at H1 = H2, so the root is bracketed between the
 * larger of H2 and the free head, and a doubling upper end.
 */
export function submergedHead(
  freeDischarge: (head: number) => number,
  headExponent: number,
  discharge: number,
  tailwaterHead: number,
  scale: number,
): SubmergedHead {
  const freeHead = invertRising(freeDischarge, discharge, { lo: 0, guess: scale, scale, what: 'free weir head' });
  if (!(tailwaterHead > 0) || discharge === 0) {
    return { head: freeHead, freeHead, submergenceRatio: 0, factor: 1 };
  }
  const submerged = (h1: number) => (h1 <= tailwaterHead ? 0 : freeDischarge(h1) * villemonteFactor(tailwaterHead / h1, headExponent));
  const lo = Math.max(freeHead, tailwaterHead);
  let head: number;
  try {
    head = invertRising(submerged, discharge, { lo, guess: 2 * lo, scale, what: 'submerged weir head (Villemonte)' });
  } catch (error) {
    if (error instanceof NumericalError) {
      throw new HydraulicError(`submerged weir: no upstream head passes ${discharge} with a downstream head of ${tailwaterHead} (${error.message})`);
    }
    throw error;
  }
  const ratio = tailwaterHead / head;
  return { head, freeHead, submergenceRatio: ratio, factor: villemonteFactor(ratio, headExponent) };
}
