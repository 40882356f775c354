/**
 * A surveyed reach that is mild in one part and steep in another (the same section at every node, a break in the
 * bed slope between two nodes): classed interval by interval, with the control at the break found inside the reach.
 *
 * Outside references:
 * - a mild slope followed by a steep one passes the flow through critical depth at the break, with an M2 drawdown
 *   upstream of it and an S2 profile downstream (Chow 1959 §9-3 and fig. 9-3, published; the figure from memory);
 * - critical depth of a trapezoid: Q²T/(gA³) = 1 with A = (b + zy)y, T = b + 2zy (Chow 1959 §4-2, from memory);
 * - the wide channel with Chézy friction: yc = (q²/g)^(1/3), yn = (q²/(C²S0))^(1/3), and Bresse's closed-form
 *   profile x = (yn/S0)·{u − [1 − (yc/yn)³]·φ(u)} + const (Bresse 1860, as given in Chow 1959 §10-5; form from
 *   memory, checked against Bakhmeteff's table in tests/profile/ode.test.ts);
 * - the prismatic engine's two-reach result for the same channel (its own checks against Bresse and published
 *   examples are in tests/profile/ode.test.ts and engine.test.ts).
 * The channels are invented.
 */
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../src/core/roots.js';
import { accuracyFor } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { ProfileInput, SurveyNode } from '../../src/profile/types.js';
import type { FlowResult } from '../../src/results/types.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { bresseDistance } from './spatiallyVaried/support.js';
import { wideChannel } from './channels.js';

/** Nodes every `spacing` m over a mild part of `mildLength` m then a steep part, the bed falling to `bottom`. */
function brokenSurvey(hs: HydraulicSection, parts: { mildLength: number; mildSlope: number; steepLength: number; steepSlope: number; spacing: number }): SurveyNode[] {
  const { mildLength, mildSlope, steepLength, steepSlope, spacing } = parts;
  const bottom = 20;
  const total = mildLength + steepLength;
  const bedAt = (x: number) => (x <= mildLength ? bottom + steepSlope * steepLength + mildSlope * (mildLength - x) : bottom + steepSlope * (total - x));
  const n = Math.round(total / spacing);
  return Array.from({ length: n + 1 }, (_, i) => ({ station: i * spacing, bedElevation: bedAt(i * spacing), section: hs, contraction: 0, expansion: 0 }));
}

function depthAt(result: FlowResult, station: number): number {
  const found = result.stations.filter((s) => Math.abs(s.station - station) < 1e-9);
  expect(found.length, `station ${station}`).toBeGreaterThan(0);
  return found[0]!.depth;
}

describe('computeProfile: a surveyed trapezoid with a mild-to-steep break inside the reach', () => {
  // an invented lined trapezoid: b = 3 m, side slopes 1.5:1, n = 0.015, Q = 10 m³/s; 600 m at 0.0008 then 300 m at 0.02
  const trapezoid = hydraulicSection(trapezoidal({ bottomWidth: 3, sideSlopeLeft: 1.5, roughness: 0.015 }), 'manning', SI);
  const Q = 10;
  const geometry = { mildLength: 600, mildSlope: 0.0008, steepLength: 300, steepSlope: 0.02, spacing: 2 };
  const nodes = brokenSurvey(trapezoid, geometry);
  const surveyed = computeProfile({
    units: SI,
    reaches: [{ kind: 'surveyed', id: 'drain', nodes }],
    discharge: Q,
    flowId: 'q',
    boundaries: {},
    method: 'standard-step',
  });
  // the trapezoid's critical depth from Q²T/(gA³) = 1 (closed form of the condition), solved here on its own
  const yc = brentRoot(
    (y) => {
      const a = (3 + 1.5 * y) * y;
      const t = 3 + 3 * y;
      return (Q * Q * t) / (SI.g * a * a * a) - 1;
    },
    0.1,
    3,
    { xTolerance: 1e-12 },
  );

  it('computeProfile: the reach has a mild part and a steep part, split where the bed slope changes', () => {
    const reach = surveyed.reaches[0]!;
    expect(reach.parts).toHaveLength(2);
    expect(reach.parts!.map((p) => [p.slopeClass, p.from, p.to])).toEqual([
      ['mild', 0, 600],
      ['steep', 600, 900],
    ]);
    assertRelative(reach.parts![0]!.slope, 0.0008, 1e-9, 'mild slope');
    assertRelative(reach.parts![1]!.slope, 0.02, 1e-9, 'steep slope');
  });

  it('computeProfile: critical depth (Q²T/(gA³) = 1) is the control at the break, M2 upstream and S2 downstream (Chow 1959 §9-3)', () => {
    const control = surveyed.controls!.find((c) => c.kind === 'critical depth at a break');
    expect(control, 'a control at the break').toBeDefined();
    expect(control!.station).toBe(600);
    assertRelative(control!.depth!, yc, 1e-6, 'control depth');
    assertRelative(depthAt(surveyed, 600), yc, 1e-6, 'depth at the break');
    const types = surveyed.reaches[0]!.profiles;
    const upstream = types.find((p) => p.to === 600);
    const downstream = types.find((p) => p.from === 600);
    expect(upstream?.type).toBe('M2');
    expect(downstream?.type).toBe('S2');
    // nothing but M2 (or uniform, where the drawdown has died out) above the break, S2 (or uniform) below it
    for (const p of types) expect(p.to <= 600 ? ['M2', 'uniform'] : ['S2', 'uniform']).toContain(p.type);
    expect(surveyed.warnings).toEqual([]);
  });

  it('computeProfile: the surveyed reach gives the prismatic engine\'s two-reach profile within the accuracy goal', () => {
    const prismatic = computeProfile(
      {
        units: SI,
        reaches: [
          { id: 'mild', section: trapezoid, length: 600, slope: 0.0008 },
          { id: 'steep', section: trapezoid, length: 300, slope: 0.02 },
        ],
        discharge: Q,
        flowId: 'q',
        boundaries: {},
        method: 'ode',
        outputSpacing: 10,
        downstreamBedElevation: 20,
      },
      { reference: true },
    );
    expect(prismatic.reaches.map((r) => r.slopeClass)).toEqual(['mild', 'steep']);
    let compared = 0;
    for (const p of prismatic.stations) {
      const s = surveyed.stations.find((x) => Math.abs(x.station - p.station) < 1e-9);
      if (!s) continue;
      compared++;
      assertInDelta(s.depth, p.depth, accuracyFor('SI', p.depth), `station ${p.station}`);
      assertInDelta(s.bedElevation, p.bedElevation, 1e-9, `bed at ${p.station}`);
    }
    expect(compared).toBeGreaterThan(80);
    expect(surveyed.reaches[0]!.profiles.map((p) => p.type)).toEqual([...prismatic.reaches[0]!.profiles, ...prismatic.reaches[1]!.profiles].map((p) => p.type));
  });
});

describe("computeProfile: a surveyed wide Chézy channel with a break, against Bresse's closed form", () => {
  // an invented wide channel, 1 m strip, Chézy C = 50, q = 2 m²/s: yc = 0.742 m; mild S0 = 0.0004 (yn = 1.587 m) for
  // 1500 m, then steep S0 = 0.01 (yn = 0.543 m) for 300 m
  const C = 50;
  const q = 2;
  const hs = wideChannel(1, C);
  const geometry = { mildLength: 1500, mildSlope: 0.0004, steepLength: 300, steepSlope: 0.01, spacing: 1 };
  const nodes = brokenSurvey(hs, geometry);
  const input: ProfileInput = { units: SI, reaches: [{ kind: 'surveyed', id: 'wide', nodes }], discharge: q, flowId: 'q', boundaries: {}, method: 'standard-step' };
  const result = computeProfile(input);
  const yc = Math.cbrt((q * q) / SI.g);
  const ynOf = (slope: number) => Math.cbrt((q * q) / (C * C * slope));

  it('computeProfile: the control at the break is critical depth (q²/g)^(1/3); the reach result is the longest part, with its Chézy normal depth', () => {
    assertRelative(depthAt(result, 1500), yc, 1e-6, 'depth at the break');
    const reach = result.reaches[0]!;
    expect(reach.slopeClass).toBe('mild');
    assertRelative(reach.normalDepth!, ynOf(0.0004), 1e-6, 'normal depth of the mild part');
    assertRelative(reach.criticalDepth, yc, 1e-6, 'critical depth');
    expect(reach.parts!.map((p) => p.slopeClass)).toEqual(['mild', 'steep']);
  });

  it('computeProfile: the M2 drawdown above the break and the S2 profile below it follow Bresse within the accuracy goal', () => {
    // Bresse's constant fixed at the break, where both profiles start at critical depth
    const mildYn = ynOf(0.0004);
    const steepYn = ynOf(0.01);
    const xBreakMild = bresseDistance(yc, mildYn, yc, 0.0004);
    const xBreakSteep = bresseDistance(yc, steepYn, yc, 0.01);
    let checked = 0;
    for (const s of result.stations) {
      const d = s.station - 1500;
      if (d === 0) continue;
      // x increases downstream in Bresse's form; the M2 lies between yc and yn, the S2 between yn and yc
      const exact =
        d < 0
          ? brentRoot((y) => bresseDistance(y, mildYn, yc, 0.0004) - xBreakMild - d, yc, mildYn * (1 - 1e-12), { xTolerance: 1e-12 })
          : brentRoot((y) => bresseDistance(y, steepYn, yc, 0.01) - xBreakSteep - d, steepYn * (1 + 1e-12), yc, { xTolerance: 1e-12 });
      // within 2 m of the break the depth varies like the square root of the distance, and a 1 m survey step cannot
      // follow it to the accuracy goal; the comparison starts beyond
      if (Math.abs(d) < 2) continue;
      assertInDelta(s.depth, exact, accuracyFor('SI', exact), `station ${s.station}`);
      checked++;
    }
    expect(checked).toBeGreaterThan(1700);
  });
});

describe('computeProfile: a surveyed steep-to-mild reach forms its jump where the prismatic engine does', () => {
  it('computeProfile: one surveyed reach, steep then mild, with a tailwater: the toe and sequent depth of the prismatic two-reach result', () => {
    // an invented trapezoid, 200 m at 0.02 then 800 m at 0.0008, a tailwater depth of 2.2 m
    const trapezoid = hydraulicSection(trapezoidal({ bottomWidth: 3, sideSlopeLeft: 1.5, roughness: 0.015 }), 'manning', SI);
    const nodes: SurveyNode[] = Array.from({ length: 501 }, (_, i) => {
      const x = i * 2;
      return { station: x, bedElevation: x <= 200 ? 20 + 0.0008 * 800 + 0.02 * (200 - x) : 20 + 0.0008 * (1000 - x), section: trapezoid, contraction: 0, expansion: 0 };
    });
    const tail = { upstream: { type: 'critical' as const }, downstream: { type: 'depth' as const, depth: 2.2 } };
    const surveyed = computeProfile({ units: SI, reaches: [{ kind: 'surveyed', id: 's', nodes }], discharge: 10, flowId: 'q', boundaries: tail, method: 'standard-step' });
    const prismatic = computeProfile(
      {
        units: SI,
        reaches: [
          { id: 'steep', section: trapezoid, length: 200, slope: 0.02 },
          { id: 'mild', section: trapezoid, length: 800, slope: 0.0008 },
        ],
        discharge: 10,
        flowId: 'q',
        boundaries: tail,
        method: 'ode',
        downstreamBedElevation: 20,
      },
      { reference: true },
    );
    expect(prismatic.jumps).toHaveLength(1);
    expect(surveyed.jumps).toHaveLength(1);
    assertInDelta(surveyed.jumps[0]!.station, prismatic.jumps[0]!.station, 2, 'toe station (one survey interval)');
    assertInDelta(surveyed.jumps[0]!.downstreamDepth, prismatic.jumps[0]!.downstreamDepth, 0.005, 'sequent depth');
    expect(surveyed.reaches[0]!.parts!.map((p) => p.slopeClass)).toEqual(['steep', 'mild']);
    // no internal control at a steep-to-mild change: the flow passes it through the jump
    expect(surveyed.controls!.some((c) => c.kind === 'critical depth at a break')).toBe(false);
    // the types in order; a stretch reported uniform (within the accuracy goal of normal depth) depends on the output
    // spacing (2 m surveyed, 10 m prismatic), so uniform stretches are left out of the comparison
    const types = surveyed.reaches[0]!.profiles.map((p) => p.type).filter((t) => t !== 'uniform');
    expect(types).toEqual([...prismatic.reaches[0]!.profiles, ...prismatic.reaches[1]!.profiles].map((p) => p.type).filter((t) => t !== 'uniform'));
    expect(types).toEqual(['S2', 'S1', 'M1']);
  });
});
