/**
 * compareMethods: the same input through all three methods and through the ODE at a tight tolerance,
 * with the largest depth difference of each method from that reference at the output stations, against the
 * accuracy goal (core/tolerances.ts accuracyFor). Stations between two solutions' jump toes are left out
 * of the depth comparison (the depth there is discontinuous); the toe shift is reported instead.
 */
import { accuracyFor } from '../core/tolerances.js';
import type { FlowResult } from '../results/types.js';
import { computeProfile } from './engine.js';
import { ProfileMethod, type ProfileInput } from './types.js';

export interface MethodComparison {
  readonly method: ProfileMethod;
  /** largest |depth − reference depth| over the compared stations */
  readonly maxDifference: number;
  /** where it occurs */
  readonly station: number;
  /** the accuracy goal at that station */
  readonly allowed: number;
  /** largest ratio difference / goal over all stations (≤ 1 meets the goal everywhere) */
  readonly worstRatio: number;
  readonly withinGoal: boolean;
  /** largest shift of a jump toe from the reference's, when both have the same jumps */
  readonly toeShift: number | null;
  readonly comparedStations: number;
}

export interface ComparisonResult {
  readonly reference: FlowResult;
  readonly results: Readonly<Record<ProfileMethod, FlowResult>>;
  readonly methods: readonly MethodComparison[];
  readonly largestDifference: number;
  readonly withinGoal: boolean;
}

function depthsByStation(result: FlowResult): Map<number, number[]> {
  const map = new Map<number, number[]>();
  for (const s of result.stations) {
    const list = map.get(s.station);
    if (list) list.push(s.depth);
    else map.set(s.station, [s.depth]);
  }
  return map;
}

export function compareMethods(input: ProfileInput): ComparisonResult {
  const reference = computeProfile(input, { reference: true });
  const refDepths = depthsByStation(reference);
  const system = input.units.system;
  const results = {} as Record<ProfileMethod, FlowResult>;
  const methods: MethodComparison[] = [];
  for (const method of Object.keys(ProfileMethod) as ProfileMethod[]) {
    const result = computeProfile({ ...input, method });
    results[method] = result;
    const own = depthsByStation(result);
    const gaps = result.jumps.map((j, i) => {
      const r = reference.jumps[i];
      return r ? [Math.min(j.station, r.station), Math.max(j.station, r.station)] : [j.station, j.station];
    });
    for (const r of reference.jumps.slice(result.jumps.length)) gaps.push([r.station, r.station]);
    let maxDifference = 0;
    let station = NaN;
    let allowed = accuracyFor(system, 0);
    let worstRatio = 0;
    let compared = 0;
    for (const [x, refList] of refDepths) {
      const list = own.get(x);
      if (!list || list.length !== refList.length) continue;
      if (gaps.some(([a, b]) => x >= a! && x <= b!)) continue;
      refList.forEach((d, k) => {
        const diff = Math.abs(list[k]! - d);
        const goal = accuracyFor(system, d);
        compared++;
        if (diff / goal > worstRatio) worstRatio = diff / goal;
        if (diff > maxDifference) {
          maxDifference = diff;
          station = x;
          allowed = goal;
        }
      });
    }
    const toeShift =
      result.jumps.length === reference.jumps.length && result.jumps.length > 0
        ? Math.max(...result.jumps.map((j, i) => Math.abs(j.station - reference.jumps[i]!.station)))
        : null;
    methods.push({ method, maxDifference, station, allowed, worstRatio, withinGoal: worstRatio <= 1, toeShift, comparedStations: compared });
  }
  return {
    reference,
    results,
    methods,
    largestDifference: Math.max(...methods.map((m) => m.maxDifference)),
    withinGoal: methods.every((m) => m.withinGoal),
  };
}
