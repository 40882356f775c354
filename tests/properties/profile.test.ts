/**
 * Properties of computeProfile on random valid channels (all five section shapes, both unit systems, mild, steep,
 * horizontal and adverse slopes, one reach or a slope break, random boundaries at both ends, every method):
 *   - no NaN or Infinity anywhere in the FlowResult;
 *   - every depth positive, and inside the section where it has a top (a conduit's crown, a survey's end points);
 *   - each stretch's profile type is the one of the zone its depths lie in (Chow 1959 §9-2 and fig. 9-1, published
 *     classification: M1 above yn > yc, M2 between, M3 below yc; S1 above yc > yn, S2 between, S3 below yn; C1, C3;
 *     H2, H3; A2, A3 above and below yc);
 *   - the two depths of each jump have equal specific force M = Q²/(gA) + Aȳ (the momentum balance of a jump,
 *     Chow 1959 §3-9 and §15-1, published), recomputed here with hydraulics' specificForce.
 * A run may also refuse a case with a typed error saying why (HydraulicError, InputError); it must never throw
 * anything else.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { GvfError } from '../../src/core/errors.js';
import { accuracyFor } from '../../src/core/tolerances.js';
import { specificForce } from '../../src/hydraulics/specificForce.js';
import { computeProfile } from '../../src/profile/engine.js';
import { points } from '../../src/geometry/shapes/points.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { SI } from '../../src/core/units.js';
import type { PrismaticReachInput } from '../../src/profile/types.js';
import type { FlowResult, ProfileType, ReachResult } from '../../src/results/types.js';
import { type ChannelCase, channels, nonFinite, settings } from './support.js';

/** The profile types a slope class can have (Chow 1959 fig. 9-1). */
const typesOf: Record<ReachResult['slopeClass'], readonly ProfileType[]> = {
  mild: ['M1', 'M2', 'M3', 'uniform'],
  steep: ['S1', 'S2', 'S3', 'uniform'],
  critical: ['C1', 'C3', 'uniform'],
  horizontal: ['H2', 'H3'],
  adverse: ['A2', 'A3'],
};

/** True when depth y (give or take `b`) lies in the zone of profile type `type` for normal depth yn and critical depth yc. */
function inZone(type: ProfileType, y: number, yn: number | null, yc: number, b: number): boolean {
  const above = (d: number | null) => d !== null && y >= d - b;
  const below = (d: number | null) => d !== null && y <= d + b;
  switch (type) {
    case 'M1':
      return above(yn);
    case 'M2':
      return above(yc) && below(yn);
    case 'M3':
    case 'C3':
    case 'H3':
    case 'A3':
      return below(yc);
    case 'S1':
    case 'C1':
    case 'H2':
    case 'A2':
      return above(yc);
    case 'S2':
      return above(yn) && below(yc);
    case 'S3':
      return below(yn);
    case 'C2':
      return Math.abs(y - yc) <= b;
    case 'uniform':
      return yn !== null && Math.abs(y - yn) <= 2 * b;
  }
}

/** The problems of one result (empty when it keeps every property). */
function problemsOf(c: ChannelCase, result: FlowResult): string[] {
  const problems = nonFinite(result).map((p) => `not finite: ${p}`);
  const system = c.input.units.system;
  const reaches = c.input.reaches as readonly PrismaticReachInput[];
  const top = reaches[0]!.section.section.maxDepth;
  for (const s of result.stations) {
    if (!(s.depth > 0)) problems.push(`depth ${s.depth} at station ${s.station} is not positive`);
    if (s.depth > top * (1 + 1e-12)) problems.push(`depth ${s.depth} at station ${s.station} is above the section's top ${top}`);
  }
  for (const reach of result.reaches) {
    const own = result.stations.filter((s) => s.station >= reach.from && s.station <= reach.to);
    for (const stretch of reach.profiles) {
      if (!typesOf[reach.slopeClass].includes(stretch.type)) problems.push(`${stretch.type} on a ${reach.slopeClass} reach '${reach.id}'`);
      const inside = own.filter((s) => s.station >= stretch.from && s.station <= stretch.to);
      for (let i = 0; i + 1 < inside.length; i++) {
        const a = inside[i]!;
        const b = inside[i + 1]!;
        if (b.station <= a.station) continue; // the two sides of a jump
        const mean = 0.5 * (a.depth + b.depth);
        if (!inZone(stretch.type, mean, reach.normalDepth, reach.criticalDepth, accuracyFor(system, mean))) {
          problems.push(
            `${stretch.type} stretch ${stretch.from}–${stretch.to} of '${reach.id}': mean depth ${mean} between stations ${a.station} and ${b.station} ` +
              `is outside its zone (yn ${reach.normalDepth}, yc ${reach.criticalDepth})`,
          );
          break;
        }
      }
    }
  }
  for (const jump of result.jumps) {
    if (jump.atControl) continue; // held at a control or a channel end: no free momentum balance there
    const hs = reaches[0]!.section; // every reach of these channels has the same section
    const m1 = specificForce(hs, jump.upstreamDepth, c.input.discharge);
    const m2 = specificForce(hs, jump.downstreamDepth, c.input.discharge);
    // the toe is located to 1e-9 of the channel length, where M changes fast (a steep S2/H3 near its start): 1e-5 relative
    if (Math.abs(m1 - m2) > 1e-5 * Math.max(m1, m2)) {
      problems.push(`jump at ${jump.station}: specific force ${m1} (y1 ${jump.upstreamDepth}) ≠ ${m2} (y2 ${jump.downstreamDepth})`);
    }
    if (!(jump.upstreamDepth < jump.downstreamDepth)) problems.push(`jump at ${jump.station}: y1 ${jump.upstreamDepth} is not below y2 ${jump.downstreamDepth}`);
  }
  return problems;
}

function check(c: ChannelCase): void {
  let result: FlowResult;
  try {
    result = computeProfile(c.input);
  } catch (error) {
    // a clean refusal with a reason is allowed; anything else (a TypeError, a bare Error) is a bug
    if (error instanceof GvfError) return;
    throw error;
  }
  const problems = problemsOf(c, result);
  expect(problems, `${c.label}\n${JSON.stringify(c.input.boundaries)}`).toEqual([]);
}

describe('computeProfile on random channels', () => {
  it('computeProfile(standard-step) gives finite results, depths inside the section, types by zone and balanced jumps', () => {
    fc.assert(fc.property(channels(['standard-step']), check), settings(500));
  });

  it('computeProfile: a jump whose depths cannot balance (α varying in a compound section) is marked held and warned of, never reported as free', () => {
    // found by the long property run (seed 1952670795): an S2 into an H3 that reaches critical depth, with a narrow
    // smooth main channel (n = 0.01) between rough floodplains; the H2 from a free overfall downstream meets it there.
    // The toe sat where the H3 ends at critical depth, with specific forces 125.215 and 125.207 (7e-5 apart) and an
    // energy gain of 0.27 m: reported as a free jump. The property here is the one above: a free jump balances.
    const pts: [number, number][] = [[0,8.388257596239725],[0,4.6779291002476775],[4.989165843189047,4.635650341359432],[9.978331686378095,4.593371582471186],[14.967497529567144,4.551092823582941],[19.95666337275619,4.508814064694696],[24.945829215945235,4.46653530580645],[29.934995059134287,4.424256546918205],[34.92416090232333,4.381977788029959],[39.91332674551238,4.3396990291417135],[44.90249258870142,4.297420270253468],[49.89165843189047,4.255141511365222],[54.88082427507952,4.212862752476977],[59.869990118268575,4.170583993588732],[64.85915596145762,4.128305234700486],[69.84832180464666,4.086026475812241],[74.8374876478357,4.0437477169239955],[79.82665349102476,4.001468958035749],[84.81581933421381,4e-323],[89.80498517740284,5e-323],[94.7941510205919,4.001468958035749],[99.78331686378094,4.0437477169239955],[104.77248270697,4.086026475812241],[109.76164855015904,4.128305234700486],[114.75081439334808,4.170583993588732],[119.73998023653715,4.212862752476977],[124.72914607972619,4.255141511365223],[129.71831192291523,4.297420270253468],[134.70747776610426,4.3396990291417135],[139.69664360929332,4.381977788029959],[144.68580945248237,4.424256546918205],[149.6749752956714,4.46653530580645],[154.6641411388605,4.508814064694696],[159.65330698204951,4.551092823582941],[164.64247282523854,4.593371582471186],[169.63163866842763,4.635650341359432],[174.62080451161665,4.6779291002476775],[174.62080451161665,8.388257596239725]];
    const zones: [number, number][] = [[0, 0.02995156781408624], [79.99999999999977, 0.010000000000000009], [94.62080451161688, 0.023961254251268993]];
    const hs = hydraulicSection(points({ points: pts, roughness: zones }), 'manning', SI);
    const input = {
      units: SI,
      reaches: [
        { id: 'reach 1', section: hs, length: 1214.6930525374453, slope: 0.0022323460992224506 },
        { id: 'reach 2', section: hs, length: 801.0637511595385, slope: 0 },
      ],
      discharge: 157.0609912711387,
      flowId: 'regression',
      boundaries: { upstream: { type: 'critical' }, downstream: { type: 'critical' } },
      method: 'standard-step',
    } as const;
    const result = computeProfile(input);
    expect(problemsOf({ input, label: 'regression' }, result)).toEqual([]);
    for (const jump of result.jumps.filter((j) => j.atControl)) {
      expect(result.warnings.some((w) => w.includes('do not balance'))).toBe(true);
    }
  });

  it('computeProfile(direct-step, ode) gives finite results, depths inside the section, types by zone and balanced jumps', () => {
    fc.assert(fc.property(channels(['direct-step', 'ode']), check), settings(300));
  });
});
