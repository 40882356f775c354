/**
 * Reading a computed profile between its output stations: straight-line interpolation of the water surface
 * (and depth) along the station table, the way a mark or a rating station is read off a printed profile.
 * At a station listed twice (a jump toe, a break) the upstream value is taken on the upstream side.
 */
import type { FlowResult, StationResult } from '../results/types.js';

export interface ProfileSample {
  station: number;
  wsel: number;
  depth: number;
  velocity: number;
  bedElevation: number;
  criticalDepth: number | null;
  regime: StationResult['regime'];
  reach: string | null;
}

/** Smallest and largest station of a flow's table, or null for an empty table. */
export function stationRange(flow: FlowResult): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of flow.stations) {
    if (!Number.isFinite(s.station)) continue;
    lo = Math.min(lo, s.station);
    hi = Math.max(hi, s.station);
  }
  return lo <= hi ? [lo, hi] : null;
}

const lerp = (a: number, b: number, t: number) => a + (b - a) * t;

/** The profile at `station` (null outside the computed stations or where a value is not finite). */
export function sampleProfile(flow: FlowResult, station: number): ProfileSample | null {
  const st = flow.stations.filter((s) => Number.isFinite(s.station) && Number.isFinite(s.wsel) && Number.isFinite(s.depth));
  if (st.length === 0 || !Number.isFinite(station)) return null;
  // stations may run either way along the table (the user's stationing); order them ascending here
  const ascending = st[0]!.station <= st[st.length - 1]!.station ? st : [...st].reverse();
  const first = ascending[0]!;
  const last = ascending[ascending.length - 1]!;
  if (station < first.station || station > last.station) return null;
  for (let i = 0; i < ascending.length; i++) {
    const b = ascending[i]!;
    if (b.station < station) continue;
    if (b.station === station || i === 0) return sampleOf(b);
    const a = ascending[i - 1]!;
    const t = (station - a.station) / (b.station - a.station);
    const critical = Number.isFinite(a.criticalDepth) && Number.isFinite(b.criticalDepth) ? lerp(a.criticalDepth!, b.criticalDepth!, t) : null;
    return {
      station,
      wsel: lerp(a.wsel, b.wsel, t),
      depth: lerp(a.depth, b.depth, t),
      velocity: lerp(a.velocity, b.velocity, t),
      bedElevation: lerp(a.bedElevation, b.bedElevation, t),
      criticalDepth: critical,
      regime: t < 0.5 ? a.regime : b.regime,
      reach: (t < 0.5 ? a.reach : b.reach) ?? null,
    };
  }
  return sampleOf(last);
}

function sampleOf(s: StationResult): ProfileSample {
  return {
    station: s.station,
    wsel: s.wsel,
    depth: s.depth,
    velocity: s.velocity,
    bedElevation: s.bedElevation,
    criticalDepth: Number.isFinite(s.criticalDepth) ? s.criticalDepth! : null,
    regime: s.regime,
    reach: s.reach ?? null,
  };
}

/** The water-surface elevation at `station`, or null outside the computed stations. */
export function wselAt(flow: FlowResult, station: number): number | null {
  return sampleProfile(flow, station)?.wsel ?? null;
}

/** The reach a station lies in (the one whose [from, to] contains it; the downstream one at a break). */
export function reachAt(flow: FlowResult, station: number): string | null {
  let found: string | null = null;
  for (const r of flow.reaches) {
    const lo = Math.min(r.from, r.to);
    const hi = Math.max(r.from, r.to);
    if (station >= lo && station <= hi) found = r.id;
  }
  return found;
}
