/**
 * Controls (Chow 1959 §9-3 "control sections" and §10-1; Henderson 1966 §4.3; published principle):
 * subcritical flow is controlled from downstream, supercritical from upstream; a break from a mild into a
 * steep reach passes through critical depth; boundaries the regime does not need are ignored with a note.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core/errors.js';
import { SI } from '../../src/core/units.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { InternalControl } from '../../src/profile/types.js';
import { assertInDelta } from '../helpers/assert.js';
import { channel, rect5, rect5Discharge } from './channels.js';

const mild = 0.0005;
const steep = 0.02;
const yc = Math.cbrt((rect5Discharge / 5) ** 2 / SI.g); // rectangle: (q²/g)^(1/3), exact

describe('computeProfile: controls at the ends', () => {
  it('computeProfile: the order boundaries are written in does not matter; an upstream depth on subcritical flow is ignored with a note', () => {
    const a = computeProfile(channel([{ id: 'm', section: rect5, length: 2000, slope: mild }], { upstream: { type: 'depth', depth: 2.9 }, downstream: { type: 'depth', depth: 3 } }));
    const b = computeProfile(channel([{ id: 'm', section: rect5, length: 2000, slope: mild }], { downstream: { type: 'depth', depth: 3 }, upstream: { type: 'depth', depth: 2.9 } }));
    expect(a.stations.map((s) => s.depth)).toEqual(b.stations.map((s) => s.depth));
    expect(a.notes!.join(' ')).toMatch(/Upstream boundary \(depth 2.9\) ignored/);
    expect(a.controls!.find((c) => c.kind === 'upstream boundary')!.status).toBe('ignored');
    assertInDelta(a.stations[a.stations.length - 1]!.depth, 3, 1e-12);
  });

  it('computeProfile: a downstream depth below critical on a mild reach cannot hold; critical depth is used and the warning says why', () => {
    const r = computeProfile(channel([{ id: 'm', section: rect5, length: 2000, slope: mild }], { downstream: { type: 'depth', depth: 0.6 } }));
    expect(r.warnings.join(' ')).toMatch(/cannot hold: it is below critical depth/);
    assertInDelta(r.stations[r.stations.length - 1]!.depth, yc, 1e-9);
    expect(r.controls!.find((c) => c.kind === 'downstream boundary')!.status).toBe('replaced');
  });

  it('computeProfile: a stage boundary is the water-surface elevation above the bed there', () => {
    const r = computeProfile(channel([{ id: 'm', section: rect5, length: 1000, slope: mild }], { downstream: { type: 'stage', elevation: 103 } }, { downstreamBedElevation: 100 }));
    const end = r.stations[r.stations.length - 1]!;
    assertInDelta(end.depth, 3, 1e-12);
    assertInDelta(end.wsel, 103, 1e-12);
    assertInDelta(r.stations[0]!.bedElevation, 100 + mild * 1000, 1e-12);
  });

  it('computeProfile: normal depth on a horizontal reach is an input error naming the boundary', () => {
    expect(() => computeProfile(channel([{ id: 'h', section: rect5, length: 100, slope: 0 }], { downstream: { type: 'normal' } }))).toThrow(InputError);
    try {
      computeProfile(channel([{ id: 'h', section: rect5, length: 100, slope: 0 }], { downstream: { type: 'normal' } }));
    } catch (e) {
      expect((e as InputError).problems[0]!.where).toBe('boundaries.downstream');
    }
  });

  it('computeProfile: bad numbers are input errors with their JSON paths', () => {
    const bad = () =>
      computeProfile(channel([{ id: 'a', section: rect5, length: 100, slope: mild }, { id: 'b', section: rect5, length: -5, slope: Number.NaN }], {}, { discharge: -1 }));
    expect(bad).toThrow(InputError);
    try {
      bad();
    } catch (e) {
      expect((e as InputError).problems.map((p) => p.where)).toEqual(['discharge', 'reaches[1].length', 'reaches[1].slope']);
    }
  });
});

describe('computeProfile: internal control at a break (critical depth)', () => {
  it('computeProfile: mild into steep passes through critical depth at the break: M2 above, S2 below', () => {
    for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
      const r = computeProfile(channel([{ id: 'mild', section: rect5, length: 1500, slope: mild }, { id: 'steep', section: rect5, length: 400, slope: steep }], {}, { method }));
      const atBreak = r.stations.filter((s) => s.station === 1500);
      expect(atBreak).toHaveLength(1);
      assertInDelta(atBreak[0]!.depth, yc, 1e-9, method);
      expect(atBreak[0]!.reach).toBe('steep');
      expect(r.controls!.some((c) => c.kind === 'critical depth at a break' && c.station === 1500)).toBe(true);
      expect(r.reaches[0]!.profiles[0]!.type).toBe('M2');
      expect(r.reaches[1]!.profiles[0]!.type).toBe('S2');
      expect(r.reaches[0]!.profiles[r.reaches[0]!.profiles.length - 1]!.to).toBe(1500);
    }
  });

  it('computeProfile: stations start at 0 upstream, increase downstream, include every reach end, at most 1/100 of the length apart by default', () => {
    const r = computeProfile(channel([{ id: 'a', section: rect5, length: 730, slope: mild }, { id: 'b', section: rect5, length: 270, slope: steep }], {}));
    const xs = r.stations.map((s) => s.station);
    expect(xs[0]).toBe(0);
    expect(xs[xs.length - 1]).toBe(1000);
    expect(xs).toContain(730);
    for (let i = 1; i < xs.length; i++) {
      expect(xs[i]!).toBeGreaterThanOrEqual(xs[i - 1]!);
      expect(xs[i]! - xs[i - 1]!).toBeLessThanOrEqual(10 + 1e-9);
    }
    expect(r.stations.every((s) => Number.isFinite(s.depth) && Number.isFinite(s.velocity) && Number.isFinite(s.froude))).toBe(true);
  });
});

describe('computeProfile: below a gate on a horizontal apron (vena contracta depth as the upstream boundary)', () => {
  // sluice gate, opening a = 0.5 m, Cc = 0.61 (Henderson 1966; published): vena contracta depth Cc·a = 0.305 m
  const veinDepth = 0.61 * 0.5;
  const apron = (length: number) =>
    channel([{ id: 'apron', section: rect5, length, slope: 0 }], { upstream: { type: 'depth', depth: veinDepth }, downstream: { type: 'critical' } });

  it('computeProfile: a long apron: H3 from the vena contracta, a jump, then H2 to the drop at its end', () => {
    const r = computeProfile(apron(300));
    expect(r.reaches[0]!.profiles.map((p) => p.type)).toEqual(['H3', 'H2']);
    expect(r.jumps).toHaveLength(1);
    expect(r.jumps[0]!.station).toBeCloseTo(r.reaches[0]!.profiles[0]!.to, 9);
    assertInDelta(r.stations[0]!.depth, veinDepth, 1e-12);
    assertInDelta(r.stations[r.stations.length - 1]!.depth, yc, 1e-9);
  });

  it('computeProfile: a short apron: H3 all the way, the flow leaves supercritical over the drop (noted)', () => {
    const r = computeProfile(apron(15));
    expect(r.reaches[0]!.profiles.map((p) => p.type)).toEqual(['H3']);
    expect(r.jumps).toHaveLength(0);
    expect(r.notes!.join(' ')).toMatch(/still supercritical/);
  });
});

describe('computeProfile: internal controls supplied by structures (the hook)', () => {
  it('computeProfile: a weir-like control raises the headwater; the profile upstream starts from it and both sides are reported', () => {
    const weir: InternalControl = {
      id: 'w1',
      kind: 'weir',
      station: 1000,
      // a toy rule for the test: headwater 1 m above the larger of tailwater and critical depth
      respond: (ctx) => ({ upstreamDepth: Math.max(ctx.tailwaterDepth ?? 0, yc) + 1 }),
    };
    const r = computeProfile(channel([{ id: 'm', section: rect5, length: 2000, slope: mild }], { downstream: { type: 'normal' } }, { controls: [weir] }));
    const at = r.stations.filter((s) => s.station === 1000);
    expect(at).toHaveLength(2);
    assertInDelta(at[1]!.depth, r.reaches[0]!.normalDepth!, 1e-9, 'tailwater (normal depth)');
    assertInDelta(at[0]!.depth, at[1]!.depth + 1, 1e-12, 'headwater');
    expect(r.reaches[0]!.profiles.map((p) => p.type)).toEqual(['M1', 'uniform']);
  });

  it('computeProfile: a gate-like control issuing a supercritical depth starts an M3 below it, which jumps to the tailwater', () => {
    const gate: InternalControl = {
      id: 'g1',
      kind: 'gate',
      station: 500,
      respond: () => ({ upstreamDepth: 4, downstreamDepth: 0.35 }),
    };
    const r = computeProfile(channel([{ id: 'm', section: rect5, length: 2000, slope: mild }], { downstream: { type: 'normal' } }, { controls: [gate] }));
    expect(r.jumps).toHaveLength(1);
    expect(r.jumps[0]!.station).toBeGreaterThan(500);
    const types = r.reaches[0]!.profiles.map((p) => p.type);
    expect(types.slice(0, 2)).toEqual(['M1', 'M3']);
    const at = r.stations.filter((s) => s.station === 500);
    expect(at.map((s) => s.depth)).toEqual([4, 0.35]);
  });
});

describe('computeProfile: a profile running into critical depth', () => {
  it('computeProfile: the S1 from a tailwater stops at critical depth going upstream; the stop is reported with its station', () => {
    const r = computeProfile(channel([{ id: 's', section: rect5, length: 300, slope: steep }], { upstream: { type: 'critical' }, downstream: { type: 'depth', depth: 3 } }));
    const stop = r.stops!.find((s) => s.direction === 'upstream')!;
    expect(stop.reason).toBe('critical');
    expect(stop.station).toBeGreaterThan(0);
    expect(stop.station).toBeLessThan(300);
    expect(stop.resolved).toBe(true);
    expect(r.jumps[0]!.station).toBeGreaterThan(stop.station);
    expect(r.stations.every((s) => s.depth > 0 && s.depth < 3.0000001)).toBe(true);
  });
});


describe('computeProfile: a flow change between reaches (a tributary)', () => {
  it('computeProfile: each reach carries its own discharge; the depth is continuous at the junction and the reach below matches a run of its own', () => {
    const reaches = [
      { id: 'above', section: rect5, length: 1000, slope: mild },
      { id: 'below', section: rect5, length: 1000, slope: mild, discharge: 30 },
    ];
    const joined = computeProfile(channel(reaches, { downstream: { type: 'depth', depth: 3.5 } }, { method: 'ode', outputSpacing: 10 }));
    const alone = computeProfile(
      channel([{ id: 'below', section: rect5, length: 1000, slope: mild }], { downstream: { type: 'depth', depth: 3.5 } }, { method: 'ode', discharge: 30, outputSpacing: 10 }),
    );
    const below = joined.stations.filter((s) => s.station >= 1000);
    expect(below).toHaveLength(alone.stations.length);
    below.forEach((s, i) => {
      expect(s.station - 1000).toBeCloseTo(alone.stations[i]!.station, 9);
      assertInDelta(s.depth, alone.stations[i]!.depth, 1e-9, `station ${s.station}`);
    });
    // upstream of the junction the smaller flow: its velocity at the junction depth is 20/30 of the one below
    const above = joined.stations.filter((s) => s.station < 1000);
    const last = above[above.length - 1]!;
    expect(joined.reaches[1]!.discharge).toBe(30);
    expect(joined.reaches[0]!.criticalDepth).toBeLessThan(joined.reaches[1]!.criticalDepth);
    expect(last.velocity).toBeCloseTo(20 / (5 * last.depth), 12);
  });
});
