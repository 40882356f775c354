import { describe, expect, it } from 'vitest';
import { rectangular } from '../../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection } from '../../../src/hydraulics/hydraulicSection.js';
import { brentRoot } from '../../../src/core/roots.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';
import { spatiallyVariedFlow } from '../../../src/profile/spatiallyVaried/spatiallyVariedFlow.js';
import type { SpatiallyVariedInput } from '../../../src/profile/spatiallyVaried/types.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';
import { bresseDistance, simpson, wideChannel } from './support.js';

const evenly = (length: number, intervals: number) => Array.from({ length: intervals + 1 }, (_, i) => (length * i) / intervals);

describe('spatiallyVariedFlow with zero inflow', () => {
  // Bresse's closed form (support.ts) for a wide channel, Chézy C = 50, S0 = 0.001, q = 2 m²/s per metre.
  const c = 50;
  const s0 = 0.001;
  const q = 2;
  const hs = hydraulicSection(wideChannel(1, c), 'chezy', SI);
  const yn = Math.cbrt((q * q) / (c * c * s0));
  const yc = Math.cbrt((q * q) / SI.g);
  const depthAt = (x: number, length: number, yEnd: number, lo: number, hi: number) =>
    brentRoot((y) => bresseDistance(y, yn, yc, s0) - bresseDistance(yEnd, yn, yc, s0) - (x - length), lo, hi, { xTolerance: 1e-13 });

  it('spatiallyVariedFlow(q* = 0, tailwater above normal depth) follows Bresse\'s M1 curve', () => {
    const length = 3000;
    const yEnd = 2.2;
    const r = spatiallyVariedFlow({ section: hs, length, slope: s0, upstreamDischarge: q, inflow: 0, downstream: { kind: 'depth', depth: yEnd }, stations: evenly(length, 30) });
    expect(r.control.kind).toBe('downstream-depth');
    expect(r.stations).toHaveLength(31);
    for (const s of r.stations) {
      assertInDelta(s.depth, depthAt(s.station, length, yEnd, yn * (1 + 1e-9), yEnd), 1e-7, `x = ${s.station}`);
      expect(s.regime).toBe('subcritical');
    }
  });

  it('spatiallyVariedFlow(q* = 0, free outfall on a mild slope) follows Bresse\'s M2 curve from critical depth at the end', () => {
    const length = 1500;
    const near = [length - 1, length - 0.1, length - 0.01];
    const r = spatiallyVariedFlow({ section: hs, length, slope: s0, upstreamDischarge: q, inflow: 0, downstream: { kind: 'critical' }, stations: [...evenly(length, 30), ...near] });
    expect(r.control.kind).toBe('downstream-end');
    expect(r.stations.filter((s) => near.includes(s.station))).toHaveLength(3);
    assertRelative(r.control.depth, yc, 1e-9, 'critical depth (q²/g)^(1/3)');
    for (const s of r.stations.filter((p) => p.station < length)) {
      assertInDelta(s.depth, depthAt(s.station, length, yc, yc, yn * (1 - 1e-12)), 1e-7, `x = ${s.station}`);
    }
  });
});

describe('spatiallyVariedFlow with zero inflow on a steep slope', () => {
  it('spatiallyVariedFlow(q* = 0, steep, Q0 > 0) enters at critical depth and follows Bresse\'s S2 curve', () => {
    // Wide channel, Chézy C = 50, S0 = 0.01, q = 2 m²/s: yn < yc (steep); Bresse's closed form (support.ts).
    const c = 50;
    const s0 = 0.01;
    const q = 2;
    const hs = hydraulicSection(wideChannel(1, c), 'chezy', SI);
    const yn = Math.cbrt((q * q) / (c * c * s0));
    const yc = Math.cbrt((q * q) / SI.g);
    const length = 200;
    const r = spatiallyVariedFlow({ section: hs, length, slope: s0, upstreamDischarge: q, inflow: 0, downstream: { kind: 'critical' }, stations: [...evenly(length, 20), 0.01, 0.1, 1] });
    expect(r.control.kind).toBe('upstream-end');
    for (const s of r.stations.filter((p) => p.station > 0)) {
      const expected = brentRoot((y) => bresseDistance(y, yn, yc, s0) - bresseDistance(yc, yn, yc, s0) - s.station, yn * (1 + 1e-12), yc, { xTolerance: 1e-13 });
      assertInDelta(s.depth, expected, 1e-7, `x = ${s.station}`);
      expect(s.regime).toBe('supercritical');
    }
  });
});

describe('spatiallyVariedFlow on a horizontal frictionless collector', () => {
  // Critical depth at the outlet of a horizontal, frictionless rectangular channel with uniform inflow and
  // Q0 = 0: the specific force is constant, q*²x²/(g·b·y) + b·y²/2 = 1.5·b·yc², i.e.
  // (x/L)² = 1.5·(y/yc) − 0.5·(y/yc)³ (Novak, Moffat, Nalluri & Narayanan, Hydraulic Structures, eq. 4.29, seen in
  // a reproduction), so the upstream-end depth is √3·yc (same source; Chow 1959 ch. 12 from memory).
  // "Frictionless": Chézy C = 1e9, so Sf ≈ 1e-18.
  for (const units of [SI, US]) {
    it(`spatiallyVariedFlow(horizontal, Sf ≈ 0, free outfall) gives y(0) = √3·yc and (x/L)² = 1.5u − 0.5u³ (${units.system})`, () => {
      const b = 3;
      const inflow = 0.5;
      const length = 40;
      const hs = hydraulicSection(rectangular({ bottomWidth: b, roughness: 1e9 }), 'chezy', units);
      const r = spatiallyVariedFlow({ section: hs, length, slope: 0, upstreamDischarge: 0, inflow, downstream: { kind: 'critical' } });
      const yc = Math.cbrt((inflow * length) ** 2 / (units.g * b * b));
      expect(r.control.kind).toBe('downstream-end');
      assertRelative(r.control.depth, yc, 1e-9, 'critical depth at the outlet');
      assertRelative(r.stations[0]!.depth, Math.sqrt(3) * yc, 1e-8, 'upstream-end depth √3·yc');
      for (const s of r.stations) {
        const u = s.depth / yc;
        assertInDelta(1.5 * u - 0.5 * u ** 3, (s.station / length) ** 2, 1e-7, `x = ${s.station}`);
      }
      expect(r.cautions.some((c) => /licensed engineer/.test(c))).toBe(true);
    });
  }
});

describe('spatiallyVariedFlow on a steep side channel', () => {
  // Rectangular b = 3 m, Chézy C = 60, S0 = 0.05, q* = 0.1 m²/s, Q0 = 0. The control section solves
  // x = 8q*²/(g·b²·(S0 − gP/(C²b))³) with P = b + 2yc(x) (Novak et al., Hydraulic Structures, eq. 4.27, seen in a
  // reproduction; derived again here: N = 0 and D = 0 with Sf = Q²P/(C²A³) and Q = q*·x).
  const b = 3;
  const c = 60;
  const s0 = 0.05;
  const inflow = 0.1;
  const length = 50;
  const hs = hydraulicSection(rectangular({ bottomWidth: b, roughness: c }), 'chezy', SI);
  const g = SI.g;
  const input: SpatiallyVariedInput = { section: hs, length, slope: s0, upstreamDischarge: 0, inflow, downstream: { kind: 'critical' }, stations: evenly(length, 400) };
  const r = spatiallyVariedFlow(input);

  it('spatiallyVariedFlow locates the singular point at the published closed-form station', () => {
    let x = 10;
    for (let i = 0; i < 200; i++) {
      const ycx = Math.cbrt((inflow * x) ** 2 / (g * b * b));
      x = (8 * inflow * inflow) / (g * b * b * (s0 - (g * (b + 2 * ycx)) / (c * c * b)) ** 3);
    }
    expect(r.control.kind).toBe('singular-point');
    assertRelative(r.control.station, x, 1e-9, 'control station');
  });

  it('spatiallyVariedFlow: numerator and denominator vanish together at the control section', () => {
    const x = r.control.station;
    const y = r.control.depth;
    const discharge = inflow * x;
    const area = b * y;
    const numerator = s0 - (discharge * discharge * (b + 2 * y)) / (c * c * area ** 3) - (2 * discharge * inflow) / (g * area * area);
    const denominator = 1 - (discharge * discharge * b) / (g * area ** 3);
    expect(Math.abs(numerator)).toBeLessThan(1e-12);
    expect(Math.abs(denominator)).toBeLessThan(1e-8);
    const before = r.stations.filter((s) => s.station < x - 0.2);
    const after = r.stations.filter((s) => s.station > x + 0.2);
    expect(before.every((s) => s.regime === 'subcritical')).toBe(true);
    expect(after.every((s) => s.regime === 'supercritical')).toBe(true);
  });

  it('spatiallyVariedFlow satisfies the momentum balance dM/dx = A(S0 − Sf) over a stretch through the control', () => {
    // Independent check: M = Q²/(gA) + b·y²/2 and ∫A(S0 − Sf)dx by Simpson's rule over the station table
    // (rectangular geometry written out here; Sf = Q²/(C²A²R), Chézy).
    const rows = r.stations.filter((s) => s.station >= 2 - 1e-9 && s.station <= 42 + 1e-9 && Math.abs(s.station - r.control.station) > 1e-9);
    expect(rows.length % 2).toBe(1);
    const h = rows[1]!.station - rows[0]!.station;
    const force = rows.map((s) => {
      const a = b * s.depth;
      const rh = a / (b + 2 * s.depth);
      return a * (s0 - (s.discharge * s.discharge) / (c * c * a * a * rh));
    });
    const m = (s: (typeof rows)[number]) => (s.discharge * s.discharge) / (g * b * s.depth) + (b * s.depth * s.depth) / 2;
    const first = rows[0]!;
    const last = rows[rows.length - 1]!;
    assertRelative(m(last) - m(first), simpson(force, h), 1e-7, 'M(42) − M(2)');
    assertRelative(last.specificForce, m(last), 1e-12, 'reported specific force');
  });

  it('spatiallyVariedFlow puts a jump where the two branches have equal specific force against a subcritical tailwater', () => {
    const tail = spatiallyVariedFlow({ ...input, downstream: { kind: 'depth', depth: 1.2 } });
    expect(tail.jump).toBeDefined();
    const jump = tail.jump!;
    expect(jump.station).toBeGreaterThan(r.control.station);
    expect(jump.station).toBeLessThan(length);
    const discharge = inflow * jump.station;
    const m = (y: number) => (discharge * discharge) / (g * b * y) + (b * y * y) / 2;
    assertRelative(m(jump.upstreamDepth), m(jump.downstreamDepth), 1e-9, 'specific force across the jump');
    // Bélanger's equation holds for a rectangle at one discharge (Chow 1959 eq. 3-21)
    assertRelative(jump.downstreamDepth / jump.upstreamDepth, 0.5 * (Math.sqrt(1 + 8 * jump.froude ** 2) - 1), 1e-8, 'Bélanger');
    const last = tail.stations[tail.stations.length - 1]!;
    expect(last.depth).toBe(1.2);
    expect(tail.stations.filter((s) => s.station > jump.station).every((s) => s.regime === 'subcritical')).toBe(true);
  });

  it('spatiallyVariedFlow with a tailwater that drowns the control is subcritical throughout', () => {
    const deep = spatiallyVariedFlow({ ...input, downstream: { kind: 'depth', depth: 4 } });
    expect(deep.control.kind).toBe('downstream-depth');
    expect(deep.jump).toBeUndefined();
    expect(deep.stations.every((s) => s.regime === 'subcritical')).toBe(true);
    expect(deep.warnings.some((w) => /drowns/.test(w))).toBe(true);
  });
});

describe('spatiallyVariedFlow with piecewise inflow', () => {
  it('spatiallyVariedFlow puts the control at a break where q* stops, and follows Bresse\'s S2 curve below it', () => {
    // Wide channel, Chézy C = 50, S0 = 0.01 (steep: yn < yc for q = 2 m²/s). Inflow 0.1 m²/s over 0–20 m.
    // Below the break the flow is ordinary gradually varied flow leaving critical depth: Bresse's S2 curve.
    const c = 50;
    const s0 = 0.01;
    const hs = hydraulicSection(wideChannel(1, c), 'chezy', SI);
    const r = spatiallyVariedFlow({
      section: hs,
      length: 60,
      slope: s0,
      upstreamDischarge: 0,
      inflow: [{ from: 0, to: 20, inflow: 0.1 }],
      downstream: { kind: 'critical' },
      stations: evenly(60, 60),
    });
    const q = 2;
    const yn = Math.cbrt((q * q) / (c * c * s0));
    const yc = Math.cbrt((q * q) / SI.g);
    expect(r.control.kind).toBe('inflow-break');
    expect(r.control.station).toBe(20);
    assertRelative(r.control.depth, yc, 1e-9, 'critical depth at the break');
    for (const s of r.stations.filter((p) => p.station >= 21)) {
      const expected = brentRoot((y) => bresseDistance(y, yn, yc, s0) - bresseDistance(yc, yn, yc, s0) - (s.station - 20), yn * (1 + 1e-12), yc, { xTolerance: 1e-13 });
      assertInDelta(s.depth, expected, 1e-7, `x = ${s.station}`);
      expect(s.discharge).toBe(2);
    }
    assertRelative(r.stations.find((s) => s.station === 10)!.discharge, 1, 1e-14, 'Q(10) = 10·q*');
  });
});

describe('spatiallyVariedFlow input checks', () => {
  const hs = hydraulicSection(trapezoidal({ bottomWidth: 2, sideSlopeLeft: 2, roughness: 0.015 }), 'manning', SI);
  const base: SpatiallyVariedInput = { section: hs, length: 30, slope: 0.002, upstreamDischarge: 0, inflow: 0.2, downstream: { kind: 'critical' } };
  const problemAt = (input: SpatiallyVariedInput): string | undefined => {
    try {
      spatiallyVariedFlow(input);
    } catch (error) {
      if (error instanceof InputError) return error.problems[0]?.where;
      throw error;
    }
    return undefined;
  };

  it('spatiallyVariedFlow refuses negative inflow, overlapping stretches, no flow, a bad depth and a bad β', () => {
    expect(problemAt({ ...base, inflow: -0.1 })).toBe('inflow');
    expect(problemAt({ ...base, inflow: [{ from: 0, to: 20, inflow: 0.1 }, { from: 10, to: 30, inflow: 0.1 }] })).toBe('inflow');
    expect(problemAt({ ...base, inflow: [{ from: 5, to: 40, inflow: 0.1 }] })).toBe('inflow[0]');
    expect(problemAt({ ...base, inflow: 0 })).toBe('inflow');
    expect(problemAt({ ...base, downstream: { kind: 'depth', depth: Number.NaN } })).toBe('downstream.depth');
    expect(problemAt({ ...base, beta: 0.5 })).toBe('beta');
    expect(problemAt({ ...base, stations: [0, 31] })).toBe('stations[1]');
    expect(problemAt(base)).toBeUndefined();
  });

  it('spatiallyVariedFlow returns finite numbers at every station of a trapezoidal collector', () => {
    const r = spatiallyVariedFlow(base);
    expect(r.stations.length).toBeGreaterThan(100);
    for (const s of r.stations) {
      for (const v of [s.depth, s.velocity, s.froude, s.wsel, s.energyElevation, s.specificForce, s.criticalDepth]) expect(Number.isFinite(v)).toBe(true);
      expect(s.depth).toBeGreaterThan(0);
    }
  });
});
