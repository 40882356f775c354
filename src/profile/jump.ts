/**
 * The hydraulic jump where a supercritical profile meets a subcritical one.
 *
 * - Toe: where the specific force M = Q²/(gA) + Aȳ of the two profiles is equal (the momentum balance
 *   across a short jump with friction neglected; Chow 1959 §3-9 and §15-1; Henderson 1966 §3.4). The toe
 *   is bracketed between output stations and refined by Brent's method on the difference.
 * - Type by upstream Froude number (Chow 1959 §15-3, after USBR tests): 1–1.7 undular, 1.7–2.5 weak,
 *   2.5–4.5 oscillating, 4.5–9 steady, above 9 strong.
 * - Length: roller length Lr/y1 = 160·tanh(F1/20) − 12 for 2 ≤ F1 ≤ 16 (Hager, Bremen & Kawagoshi 1990,
 *   J. Hydraulic Research 28(5); from memory); outside that range the jump length L ≈ 6·y2 of USBR
 *   Engineering Monograph 25 (Peterka 1958). Reported, not used to move the toe.
 * - Energy loss E1 − E2 with each side's α.
 */
import { brentRoot } from '../core/roots.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type { JumpResult, JumpType } from '../results/types.js';
import { pointState } from './energy.js';

/** Chow 1959 §15-3. */
export function jumpType(froude: number): JumpType {
  if (froude < 1.7) return 'undular';
  if (froude < 2.5) return 'weak';
  if (froude < 4.5) return 'oscillating';
  if (froude < 9) return 'steady';
  return 'strong';
}

export const hagerRange = { low: 2, high: 16 } as const;

/** Roller (or jump) length and the correlation it comes from. */
export function jumpLength(y1: number, y2: number, froude: number): { length: number; method: string } {
  if (froude >= hagerRange.low && froude <= hagerRange.high) {
    return {
      length: y1 * (160 * Math.tanh(froude / 20) - 12),
      method: 'roller length, Hager, Bremen & Kawagoshi (1990): Lr/y1 = 160·tanh(F1/20) − 12',
    };
  }
  return { length: 6 * y2, method: 'jump length ≈ 6·y2, USBR Engineering Monograph 25 (Peterka 1958)' };
}

/** The jump between depth y1 (supercritical, section hs1) and y2 (subcritical, section hs2) at a station. */
export function jumpAt(
  hs1: HydraulicSection,
  hs2: HydraulicSection,
  discharge: number,
  station: number,
  y1: number,
  y2: number,
): JumpResult {
  const s1 = pointState(hs1, y1, discharge);
  const s2 = pointState(hs2, y2, discharge);
  const froude = Math.sqrt((s1.alpha * discharge * discharge * s1.topWidth) / (hs1.units.g * s1.area ** 3));
  const { length, method } = jumpLength(y1, y2, froude);
  return {
    station,
    upstreamDepth: y1,
    downstreamDepth: y2,
    froude,
    type: jumpType(froude),
    length,
    lengthMethod: method,
    energyLoss: s1.energy - s2.energy,
  };
}

/**
 * Locate the toe in [a, b] where difference(a) > 0 ≥ difference(b) (supercritical force minus subcritical
 * force), to within xTolerance.
 */
export function locateToe(difference: (x: number) => number, a: number, b: number, xTolerance: number): number {
  const fa = difference(a);
  const fb = difference(b);
  if (fa <= 0) return a;
  if (fb >= 0) return b;
  return brentRoot(difference, a, b, { xTolerance, what: 'jump toe' });
}
