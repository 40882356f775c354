/**
 * Varied cases for a sensitivity run: roughness (a multiplier on every reach's roughness, RunOptions.roughnessMultiplier:
 * the section specs of prismatic and surveyed reaches, and so the sections interpolated in a survey) and
 * discharge (a factor on each flow's discharge), each at −p %, 0 and +p %, in every combination (3^k cases,
 * the base case first). Every combination rather than one at a time, so the envelope includes the corners
 * (rougher and more flow) where the water stands highest.
 */
import type { ProfileInput, ReachInput } from '../profile/types.js';

export const SensitivityParameter = { n: 'n', Q: 'Q' } as const;
export type SensitivityParameter = keyof typeof SensitivityParameter;

/** ±percent on one parameter. */
export interface Variation {
  readonly parameter: SensitivityParameter;
  readonly percent: number;
}

export interface SensitivityCase {
  /** e.g. "base", "n −20 %", "n +20 %, Q −10 %" */
  readonly label: string;
  /** roughness multiplier */
  readonly n: number;
  /** discharge factor */
  readonly Q: number;
  readonly base: boolean;
}

const signed = (step: -1 | 1, percent: number) => `${step < 0 ? '−' : '+'}${percent} %`;

/** Every combination of −, 0, + over the variations; the base case first. */
export function sensitivityCases(variations: readonly Variation[]): SensitivityCase[] {
  let combos: { n: number; Q: number; parts: string[] }[] = [{ n: 1, Q: 1, parts: [] }];
  for (const v of variations) {
    const next: typeof combos = [];
    for (const c of combos) {
      for (const step of [0, -1, 1] as const) {
        const factor = 1 + (step * v.percent) / 100;
        next.push({
          n: v.parameter === 'n' ? c.n * factor : c.n,
          Q: v.parameter === 'Q' ? c.Q * factor : c.Q,
          parts: step === 0 ? c.parts : [...c.parts, `${v.parameter} ${signed(step, v.percent)}`],
        });
      }
    }
    combos = next;
  }
  return combos.map((c) => ({ label: c.parts.length === 0 ? 'base' : c.parts.join(', '), n: c.n, Q: c.Q, base: c.parts.length === 0 }));
}

/** The roughness multiplier of a case's runs, for RunOptions.roughnessMultiplier (absent in a case without one). */
export function caseRoughness(c: Pick<SensitivityCase, 'n'>): ((reachId: string) => number) | undefined {
  return c.n === 1 ? undefined : () => c.n;
}

/**
 * The engine input of one case, discharge only: times `Q` (and a reach's own discharge, where a flow change
 * gives it one, by the same factor: the whole hydrograph scaled). The roughness goes by caseRoughness.
 */
export function variedDischarge(input: ProfileInput, c: Pick<SensitivityCase, 'Q'>): ProfileInput {
  if (c.Q === 1) return input;
  const reaches = input.reaches.map((r): ReachInput => (r.discharge === undefined ? r : { ...r, discharge: r.discharge * c.Q }));
  return { ...input, reaches, discharge: input.discharge * c.Q };
}
