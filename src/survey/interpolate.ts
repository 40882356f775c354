/**
 * Interpolated sections where a survey is coarse for the accuracy asked.
 *
 * Between two surveyed sections the channel is taken to change gradually: an intermediate section at relative
 * position t is the blend of its neighbours (geometry/blend.ts: geometry by relative position), its bed
 * elevation, banks and roughness linear between theirs. How many are needed is decided by step halving, the
 * usual check of a second-order method (the standard step is the trapezoidal rule on dH/dx = −Sf):
 *
 *   1. run the flow with each surveyed interval divided into m steps (m = 1: the survey alone);
 *   2. run it again with every interval halved (2m);
 *   3. where no depth changes by more than halvingAcceptFraction × the accuracy goal (accuracyFor: 1 mm or
 *      0.003 ft, or 0.1 % of the depth), the coarse run is accepted: its error is about 4/3 of the change;
 *   4. otherwise the intervals that contribute most to the change (the largest jump of the change between
 *      neighbouring computed stations) have m doubled, and the check repeats (at most halvingRounds rounds,
 *      m at most largestSubdivision); a check that does not settle is reported with a warning.
 * Stations where the two runs are in different regimes (a jump toe that moves, a section set to critical
 * depth) are left out of the comparison.
 */
import { HydraulicError } from '../core/errors.js';
import { accuracyFor } from '../core/tolerances.js';
import { blendSections } from '../geometry/index.js';
import { type HydraulicSection, hydraulicSection } from '../hydraulics/hydraulicSection.js';
import { computeProfile } from '../profile/engine.js';
import type { ProfileInput, ReachInput, SurveyNode } from '../profile/types.js';
import type { FlowResult } from '../results/types.js';
import type { SurveySite } from './sites.js';
import { halvingAcceptFraction, halvingRounds, largestSubdivision, refineFloor, refineShare } from './tolerances.js';

/** The surveyed reaches of one flow's input: reach index → its surveyed sites, upstream first. */
export type SurveyedParts = ReadonlyMap<number, readonly SurveySite[]>;

export interface Refinement {
  readonly input: ProfileInput;
  readonly result: FlowResult;
  /** reach index → the sites used (surveyed and interpolated), upstream first */
  readonly sites: ReadonlyMap<number, readonly SurveySite[]>;
  /** reach index → steps per surveyed interval */
  readonly divisions: ReadonlyMap<number, readonly number[]>;
  readonly rounds: number;
  /** false when the check did not settle within its bounds */
  readonly settled: boolean;
  /** the largest change found on the last halving, as a fraction of the accuracy goal (0 without a check) */
  readonly largestChange: number;
}

const lerp = (a: number, b: number, t: number): number => (a === b ? a : (1 - t) * a + t * b);

/** The section blended between two neighbours, or null where they cannot be blended (then none is inserted). */
function blendHydraulic(a: HydraulicSection, b: HydraulicSection, t: number, invert: number): HydraulicSection | null {
  if (a === b) return a;
  if (a.law !== b.law) return null;
  try {
    const alpha = a.alpha === undefined || b.alpha === undefined ? undefined : lerp(a.alpha, b.alpha, t);
    return hydraulicSection(blendSections(a.section, b.section, t, { invertElevation: invert }), a.law, a.units, alpha);
  } catch (error) {
    if (error instanceof HydraulicError) return null;
    throw error;
  }
}

/** Can this interval take intermediate sections? */
function blendable(a: SurveySite, b: SurveySite): boolean {
  return blendHydraulic(a.node.section, b.node.section, 0.5, lerp(a.node.bedElevation, b.node.bedElevation, 0.5)) !== null;
}

/** The sites with interval i divided into divisions[i] steps. `cache` keeps blended sections between rounds. */
export function densify(sites: readonly SurveySite[], divisions: readonly number[], cache: Map<string, HydraulicSection>, key: string): SurveySite[] {
  const out: SurveySite[] = [];
  for (let i = 0; i < sites.length; i++) {
    const a = sites[i]!;
    out.push(a);
    const b = sites[i + 1];
    const m = divisions[i] ?? 1;
    if (b === undefined || m <= 1) continue;
    for (let j = 1; j < m; j++) {
      const t = j / m;
      const bed = lerp(a.node.bedElevation, b.node.bedElevation, t);
      const id = `${key}:${i}:${t}`;
      let hs = cache.get(id);
      if (hs === undefined) {
        const blended = blendHydraulic(a.node.section, b.node.section, t, bed);
        if (blended === null) break;
        hs = blended;
        cache.set(id, hs);
      }
      const node: SurveyNode = {
        station: lerp(a.node.station, b.node.station, t),
        bedElevation: bed,
        section: hs,
        // a transition's losses are spread over its steps (the coefficients are the upstream surveyed node's)
        ...(a.node.contraction === undefined ? {} : { contraction: a.node.contraction }),
        ...(a.node.expansion === undefined ? {} : { expansion: a.node.expansion }),
        ...(a.node.reachLength === undefined ? {} : { reachLength: a.node.reachLength / m }),
        interpolated: true,
      };
      out.push({
        node,
        userStation: lerp(a.userStation, b.userStation, t),
        sectionId: `${a.sectionId}→${b.sectionId}`,
        sectionWhere: `${a.sectionWhere} and ${b.sectionWhere}`,
        ...(a.leftBank !== undefined && b.leftBank !== undefined ? { leftBank: lerp(a.leftBank, b.leftBank, t) } : {}),
        ...(a.rightBank !== undefined && b.rightBank !== undefined ? { rightBank: lerp(a.rightBank, b.rightBank, t) } : {}),
      });
    }
    // the surveyed node upstream of a divided interval carries its flow length over the first step only
    if (a.node.reachLength !== undefined && out.length > 0) {
      const index = out.indexOf(a);
      out[index] = { ...a, node: { ...a.node, reachLength: a.node.reachLength / m } };
    }
  }
  return out;
}

function withNodes(input: ProfileInput, sites: ReadonlyMap<number, readonly SurveySite[]>): ProfileInput {
  const reaches = input.reaches.map((reach, k): ReachInput => {
    const list = sites.get(k);
    if (list === undefined || reach.kind !== 'surveyed') return reach;
    return { ...reach, nodes: list.map((s) => s.node) };
  });
  return { ...input, reaches };
}

interface Trial {
  input: ProfileInput;
  result: FlowResult;
  sites: Map<number, SurveySite[]>;
}

/** Signed depth differences coarse − fine at the coarse run's stations, with the goal there (regimes alike only). */
function differences(coarse: FlowResult, fine: FlowResult, system: 'SI' | 'US'): Map<number, { e: number; goal: number }> {
  const count = (list: FlowResult['stations']) => {
    const m = new Map<number, number>();
    for (const s of list) m.set(s.station, (m.get(s.station) ?? 0) + 1);
    return m;
  };
  const cc = count(coarse.stations);
  const fc = count(fine.stations);
  const fineAt = new Map(fine.stations.map((s) => [s.station, s]));
  const out = new Map<number, { e: number; goal: number }>();
  for (const s of coarse.stations) {
    if (cc.get(s.station) !== 1 || fc.get(s.station) !== 1) continue;
    const f = fineAt.get(s.station)!;
    if (f.regime !== s.regime || s.regime === 'critical') continue;
    out.set(s.station, { e: s.depth - f.depth, goal: accuracyFor(system, f.depth) });
  }
  return out;
}

/**
 * The flow computed through its surveyed reaches with as many interpolated sections as the accuracy goal
 * needs (or none, with `interpolate` false).
 */
export function refineSurvey(input: ProfileInput, parts: SurveyedParts, interpolate: boolean): Refinement {
  const cache = new Map<string, HydraulicSection>();
  const trials = new Map<string, Trial>();
  const divisions = new Map<number, number[]>();
  const canBlend = new Map<number, boolean[]>();
  for (const [k, sites] of parts) {
    divisions.set(k, sites.slice(0, -1).map(() => 1));
    canBlend.set(k, interpolate ? sites.slice(0, -1).map((a, i) => blendable(a, sites[i + 1]!)) : []);
  }
  const trial = (factor: number): Trial => {
    const key = [...divisions.entries()].map(([k, d]) => `${k}:${d.map((m) => m * factor).join(',')}`).join(';');
    const known = trials.get(key);
    if (known) return known;
    const sites = new Map<number, SurveySite[]>();
    for (const [k, list] of parts) {
      const d = divisions.get(k)!.map((m, i) => (canBlend.get(k)![i] ? m * factor : 1));
      sites.set(k, densify(list, d, cache, String(k)));
    }
    const refined = withNodes(input, sites);
    const made = { input: refined, result: computeProfile(refined), sites };
    trials.set(key, made);
    return made;
  };
  const done = (t: Trial, rounds: number, settled: boolean, largestChange: number, factor = 1): Refinement => ({
    input: t.input,
    result: t.result,
    sites: t.sites,
    divisions: new Map([...divisions].map(([k, d]) => [k, d.map((m, i) => (canBlend.get(k)![i] ? m * factor : 1))])),
    rounds,
    settled,
    largestChange,
  });
  const anyBlendable = [...canBlend.values()].some((list) => list.some(Boolean));
  if (!interpolate || !anyBlendable) return done(trial(1), 0, true, 0);

  const system = input.units.system;
  let largest = 0;
  for (let round = 1; round <= halvingRounds; round++) {
    const coarse = trial(1);
    const fine = trial(2);
    const diff = differences(coarse.result, fine.result, system);
    largest = 0;
    for (const { e, goal } of diff.values()) largest = Math.max(largest, Math.abs(e) / goal);
    if (largest <= halvingAcceptFraction) return done(coarse, round, true, largest);
    // each interval's share: the largest jump of the change between neighbouring computed stations in it
    const shares: Array<{ k: number; i: number; share: number }> = [];
    for (const [k, sites] of parts) {
      const d = divisions.get(k)!;
      for (let i = 0; i + 1 < sites.length; i++) {
        if (!canBlend.get(k)![i]) continue;
        const a = sites[i]!.node.station;
        const b = sites[i + 1]!.node.station;
        let share = 0;
        for (let j = 0; j < d[i]!; j++) {
          const p = diff.get(lerp(a, b, j / d[i]!));
          const q = diff.get(lerp(a, b, (j + 1) / d[i]!));
          // a station left out of the comparison at an end of the stretch (a control at critical depth) counts as exact
          if (p || q) share = Math.max(share, Math.abs((p?.e ?? 0) - (q?.e ?? 0)) / Math.min(p?.goal ?? Infinity, q?.goal ?? Infinity));
        }
        shares.push({ k, i, share });
      }
    }
    const top = Math.max(0, ...shares.map((s) => s.share));
    let refined = false;
    for (const s of shares) {
      const d = divisions.get(s.k)!;
      if (s.share >= refineFloor && s.share >= refineShare * top && d[s.i]! < largestSubdivision) {
        d[s.i] = d[s.i]! * 2;
        refined = true;
      }
    }
    if (!refined) return done(fine, round, false, largest, 2);
  }
  // not settled within the rounds: report the finest run computed
  return done(trial(1), halvingRounds, false, largest);
}
