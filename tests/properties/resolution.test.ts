/**
 * Resolution independence: doubling the internal resolution (ProfileInput.refinement 2: half the internal steps,
 * tighter tolerances) changes no reported depth by more than the accuracy goal (core/tolerances.ts accuracyFor:
 * 1 mm or 0.003 ft, or 0.1 % of depth) — the check that the answer does not depend on the step size
 * (common practice for any numerical integration). Stations between the two runs' jump toes are left out: the
 * depth there jumps, so a toe that moves by a hair changes it by the jump's height; the number of jumps must agree.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { GvfError } from '../../src/core/errors.js';
import { accuracyFor } from '../../src/core/tolerances.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { FlowResult } from '../../src/results/types.js';
import { type ChannelCase, channels, settings } from './support.js';

function run(c: ChannelCase, refinement: number): FlowResult | null {
  try {
    return computeProfile({ ...c.input, refinement });
  } catch (error) {
    if (error instanceof GvfError) return null;
    throw error;
  }
}

function differences(base: FlowResult, fine: FlowResult, system: 'SI' | 'US'): string[] {
  const problems: string[] = [];
  if (base.jumps.length !== fine.jumps.length) {
    problems.push(`jumps: ${base.jumps.length} at resolution 1, ${fine.jumps.length} at resolution 2`);
    return problems;
  }
  const gaps = base.jumps.map((j, i) => [Math.min(j.station, fine.jumps[i]!.station), Math.max(j.station, fine.jumps[i]!.station)] as const);
  const fineByStation = new Map<number, number[]>();
  for (const s of fine.stations) fineByStation.set(s.station, [...(fineByStation.get(s.station) ?? []), s.depth]);
  const seen = new Map<number, number>();
  for (const s of base.stations) {
    const k = seen.get(s.station) ?? 0;
    seen.set(s.station, k + 1);
    if (gaps.some(([a, b]) => s.station >= a && s.station <= b)) continue;
    const other = fineByStation.get(s.station)?.[k];
    if (other === undefined) continue; // a toe station present in one run only
    const allowed = accuracyFor(system, s.depth);
    if (!(Math.abs(other - s.depth) <= allowed)) {
      problems.push(`station ${s.station}: depth ${s.depth} at resolution 1, ${other} at resolution 2 (goal ${allowed})`);
      break;
    }
  }
  return problems;
}

describe('resolution independence', () => {
  it('computeProfile({refinement: 2}) changes no reported depth by more than the accuracy goal', () => {
    fc.assert(
      fc.property(channels(['standard-step', 'direct-step', 'ode']), (c) => {
        const base = run(c, 1);
        if (base === null) return;
        const fine = run(c, 2);
        expect(fine, `${c.label}: resolution 2 refused a case resolution 1 computed`).not.toBeNull();
        expect(differences(base, fine!, c.input.units.system), c.label).toEqual([]);
      }),
      settings(200),
    );
  });
});
