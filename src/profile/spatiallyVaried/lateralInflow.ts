/**
 * Lateral inflow along a reach: q* per unit length, constant or piecewise over stretches, and the discharge
 * it builds up, Q(x) = Q0 + ∫₀ˣ q*(ξ) dξ (continuity, Chow 1959 §12-1; Henderson 1966 §7).
 * Stations x are distances from the upstream end of the reach, increasing downstream.
 */
import { InputError, type Problem } from '../../core/errors.js';

/** One stretch of the reach receiving q* (length²/s per unit length) between two stations. */
export interface LateralInflowStretch {
  readonly from: number;
  readonly to: number;
  /** inflow per unit length q*, ≥ 0 (m³/s per m, ft³/s per ft) */
  readonly inflow: number;
}

/** The inflow laid out over the reach: sorted stretches, with the discharge at any station. */
export interface InflowLayout {
  readonly length: number;
  readonly upstreamDischarge: number;
  /** sorted, non-overlapping stretches with positive inflow */
  readonly stretches: readonly LateralInflowStretch[];
  /** every station where q* changes, with 0 and the length, ascending */
  readonly breaks: readonly number[];
  /** q* at x; at a break, the value just downstream (side = 'downstream') or just upstream */
  inflowAt(x: number, side?: 'upstream' | 'downstream'): number;
  discharge(x: number): number;
}

/** Lay out the inflow: `inflow` is one q* over the whole reach or a list of stretches. Throws InputError. */
export function inflowLayout(
  length: number,
  upstreamDischarge: number,
  inflow: number | readonly LateralInflowStretch[],
  where = 'inflow',
): InflowLayout {
  const problems: Problem[] = [];
  if (!(Number.isFinite(length) && length > 0)) problems.push({ where: 'length', message: 'the reach length must be a finite number > 0', value: length });
  if (!(Number.isFinite(upstreamDischarge) && upstreamDischarge >= 0)) {
    problems.push({ where: 'upstreamDischarge', message: 'the upstream discharge must be a finite number ≥ 0', value: upstreamDischarge });
  }
  if (problems.length > 0) throw new InputError(problems);
  const list: LateralInflowStretch[] =
    typeof inflow === 'number' ? [{ from: 0, to: length, inflow }] : inflow.map((s) => ({ from: s.from, to: s.to, inflow: s.inflow }));
  list.forEach((s, i) => {
    const at = typeof inflow === 'number' ? where : `${where}[${i}]`;
    if (!Number.isFinite(s.inflow) || s.inflow < 0) {
      problems.push({
        where: typeof inflow === 'number' ? at : `${at}.inflow`,
        message: 'the inflow per unit length must be a finite number ≥ 0 (outflow along a side weir follows another equation and is not modelled here)',
        value: s.inflow,
      });
    }
    if (!(Number.isFinite(s.from) && Number.isFinite(s.to) && s.from >= 0 && s.to <= length && s.from < s.to)) {
      problems.push({ where: at, message: `a stretch needs 0 ≤ from < to ≤ the reach length ${length}`, value: { from: s.from, to: s.to } });
    }
  });
  if (problems.length > 0) throw new InputError(problems);
  const sorted = list.filter((s) => s.inflow > 0).sort((a, b) => a.from - b.from);
  for (let i = 1; i < sorted.length; i++) {
    const previous = sorted[i - 1]!;
    const current = sorted[i]!;
    if (current.from < previous.to) {
      problems.push({ where, message: `the inflow stretches ${previous.from}–${previous.to} and ${current.from}–${current.to} overlap`, value: current });
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  const total = sorted.reduce((sum, s) => sum + s.inflow * (s.to - s.from), upstreamDischarge);
  if (!(total > 0)) {
    throw new InputError({ where, message: 'there is no flow: give an upstream discharge > 0 or an inflow > 0', value: inflow });
  }
  const breakSet = new Set<number>([0, length]);
  for (const s of sorted) {
    breakSet.add(s.from);
    breakSet.add(s.to);
  }
  const breaks = [...breakSet].sort((a, b) => a - b);
  const inflowAt = (x: number, side: 'upstream' | 'downstream' = 'downstream'): number => {
    for (const s of sorted) {
      const inside = side === 'downstream' ? x >= s.from && x < s.to : x > s.from && x <= s.to;
      if (inside) return s.inflow;
    }
    return 0;
  };
  const discharge = (x: number): number => {
    let q = upstreamDischarge;
    for (const s of sorted) {
      if (x <= s.from) break;
      q += s.inflow * (Math.min(x, s.to) - s.from);
    }
    return q;
  };
  return { length, upstreamDischarge, stretches: sorted, breaks, inflowAt, discharge };
}
