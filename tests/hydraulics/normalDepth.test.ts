import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { points } from '../../src/geometry/shapes/points.js';
import { conveyance, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth, normalDepths } from '../../src/hydraulics/normalDepth.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { compound, pipe, rect, SI, trap, US } from './sections.js';

/** Q/Qfull of a part-full circle with constant n, from the segment formulas: (A/Af)·(R/Rf)^(2/3). */
function circleDischargeRatio(ratio: number): number {
  const theta = 2 * Math.acos(1 - 2 * ratio);
  const areaRatio = (theta - Math.sin(theta)) / (2 * Math.PI);
  const radiusRatio = 1 - Math.sin(theta) / theta;
  return areaRatio * Math.cbrt(radiusRatio * radiusRatio);
}

describe('normalDepth', () => {
  it('normalDepth(trapezoidal) reproduces Chow 1959 Example 10-1 (yn ≈ 3.36 ft)', () => {
    // Chow, Open-Channel Hydraulics (1959), Example 10-1: b = 20 ft, z = 2, S0 = 0.0016, n = 0.025,
    // Q = 400 ft³/s (inputs and the published yn ≈ 3.36 ft from memory); tolerance 0.01 ft.
    assertInDelta(normalDepth(trap(20, 2, 0.025, US, 1.1), 400, 0.0016)!, 3.36, 0.01, 'yn');
  });

  it('normalDepth(rectangular) satisfies Manning exactly', () => {
    // Manning (1891): Q = (1/n)·A·R^(2/3)·√S0, evaluated by hand at the returned depth; exact
    const b = 4, n = 0.014, s = 0.002, q = 9;
    const y = normalDepth(rect(b, n), q, s)!;
    const a = b * y;
    assertRelative((1 / n) * a * Math.cbrt((a / (b + 2 * y)) ** 2) * Math.sqrt(s), q, 1e-10, 'Manning');
  });

  it('normalDepth(rectangular) approaches the wide-channel depth (qn/√S)^(3/5) when b ≫ y', () => {
    // wide-channel rule R ≈ y (common practice, no source); R/y = 1/(1 + 2y/b) exactly, so with b ≈ 1000·y
    // the Manning depth differs from the wide-channel one by about (2/5)·2y/b = 0.08 %
    const b = 1000, q = 1000, n = 0.03, s = 0.001;
    const wide = ((q / b) * n / Math.sqrt(s)) ** 0.6;
    const y = normalDepth(rect(b, n), q, s)!;
    assertRelative(y, wide, 2e-3, 'wide channel');
    expect(y).toBeGreaterThan(wide); // R < y, so a little more depth is needed
  });

  it('normalDepth is null on a horizontal or adverse slope, with the reason', () => {
    const hs = rect(3);
    const flat = normalDepths(hs, 5, 0);
    expect(flat.depth).toBeNull();
    expect(flat.reason).toMatch(/horizontal/);
    const adverse = normalDepths(hs, 5, -0.001);
    expect(adverse.depth).toBeNull();
    expect(adverse.depths).toEqual([]);
    expect(adverse.reason).toMatch(/adverse/);
  });

  it('normalDepths(circular) follows the part-full hydraulic elements: Q/Qfull at y/D = 0.5 and 0.75', () => {
    // computed from the segment geometry with constant n: Q/Qfull = 0.5 at y/D = 0.5, 0.91188 at 0.75
    const d = 0.9;
    const hs = pipe(d);
    const s = 0.004;
    const qFull = conveyance(hs, d) * Math.sqrt(s);
    assertRelative(normalDepth(hs, 0.5 * qFull, s)!, 0.5 * d, 1e-9, 'y/D = 0.5');
    assertRelative(normalDepth(hs, circleDischargeRatio(0.75) * qFull, s)!, 0.75 * d, 1e-9, 'y/D = 0.75');
    assertInDelta(circleDischargeRatio(0.75), 0.91188, 5e-5, 'Q/Qfull at 0.75 (segment formulas)');
  });

  it('normalDepths(circular) gives two depths between 0.8196·D and D, and full flow above Qmax ≈ 1.0757·Qfull', () => {
    // Part-full circle, constant n: Qmax at y/D ≈ 0.9382 with Qmax/Qfull ≈ 1.0757; Q = Qfull again at
    // y/D ≈ 0.8196 (computed from the segment geometry; the handbook source is the hydraulic-elements chart
    // of ASCE Manual of Practice 37, 1969 — from memory).
    const d = 1.5;
    const hs = pipe(d, 0.013);
    const s = 0.001;
    const qFull = conveyance(hs, d) * Math.sqrt(s);

    const atFull = normalDepths(hs, qFull * (1 - 1e-9), s);
    assertInDelta(atFull.depths[0]! / d, 0.8196, 1e-4, 'Q = Qfull at 0.8196 D');

    for (const ratio of [1.01, 1.05, 1.075]) {
      const r = normalDepths(hs, ratio * qFull, s);
      expect(r.fullFlow).toBe(false);
      expect(r.depths.length, `Q/Qfull = ${ratio}`).toBe(2);
      const [lower, upper] = r.depths as [number, number];
      expect(lower / d).toBeGreaterThan(0.8196);
      expect(lower / d).toBeLessThan(0.9382);
      expect(upper / d).toBeGreaterThan(0.9382);
      expect(upper).toBeLessThan(d);
      expect(r.depth).toBe(lower);
      // both are uniform-flow depths
      for (const y of r.depths) assertRelative(conveyance(hs, y) * Math.sqrt(s), ratio * qFull, 1e-9, `y = ${y}`);
      // and agree with the segment formulas
      for (const y of r.depths) assertInDelta(circleDischargeRatio(y / d), ratio, 1e-9, 'segment Q/Qfull');
    }
    // just below the maximum, both depths close in on 0.9382 D
    const near = normalDepths(hs, 1.0757 * qFull, s);
    expect(near.depths.length).toBe(2);
    for (const y of near.depths) assertInDelta(y / d, 0.9382, 0.005, 'near Qmax');

    const full = normalDepths(hs, 1.077 * qFull, s);
    expect(full.fullFlow).toBe(true);
    expect(full.depth).toBeNull();
    expect(full.reason).toMatch(/flows full/);
    expect(normalDepth(hs, 2 * qFull, s)).toBeNull();
  });

  it('normalDepths(circular) places the part-full maximum where a dense scan of the segment formulas does', () => {
    // independent: maximise (A/Af)(R/Rf)^(2/3) on a 10⁵-interval grid of y/D
    let best = 0;
    let bestRatio = 0;
    for (let i = 1; i < 100_000; i++) {
      const q = circleDischargeRatio(i / 100_000);
      if (q > best) {
        best = q;
        bestRatio = i / 100_000;
      }
    }
    assertInDelta(bestRatio, 0.9382, 1e-4, 'y/D at Qmax');
    assertInDelta(best, 1.0757, 1e-4, 'Qmax/Qfull');
    const hs = pipe(1);
    const s = 0.002;
    const qFull = conveyance(hs, 1) * Math.sqrt(s);
    expect(normalDepths(hs, best * (1 - 1e-7) * qFull, s).fullFlow).toBe(false);
    expect(normalDepths(hs, best * (1 + 1e-7) * qFull, s).fullFlow).toBe(true);
  });

  it('normalDepths(points) above the end points is a HydraulicError saying the section must be extended', () => {
    const shallow = hydraulicSection(points({ points: [[0, 0.5], [1, 0], [4, 0], [5, 0.5]], roughness: 0.03 }), 'manning', SI);
    expect(() => normalDepths(shallow, 20, 0.001)).toThrow(HydraulicError);
    expect(() => normalDepths(shallow, 20, 0.001)).toThrow(/extend the section/);
  });

  it('normalDepths(points) skips a jump of conveyance at a flat floodplain of the same roughness', () => {
    // one roughness, no subdivision: the floodplain's wetted perimeter appears at once at bank level, so K
    // drops there (the known artefact of an undivided section, Chow 1959 ch. 6). Every depth returned must
    // satisfy Q = K√S0; a discharge inside the drop has one root below bank level and one above it.
    const hs = hydraulicSection(points({ points: [[0, 1], [0, 0.5], [5, 0.5], [5.5, 0], [6.5, 0], [7, 0.5], [12, 0.5], [12, 1]], roughness: 0.01 }), 'manning', SI);
    const s = 1e-5;
    const below = conveyance(hs, 0.5 - 1e-9) * Math.sqrt(s);
    const above = conveyance(hs, 0.5 + 1e-9) * Math.sqrt(s);
    expect(above).toBeLessThan(below);
    const q = 0.5 * (above + below);
    const r = normalDepths(hs, q, s);
    expect(r.depths.length).toBe(2);
    expect(r.depths[0]!).toBeLessThan(0.5);
    expect(r.depths[1]!).toBeGreaterThan(0.5 + 1e-6);
    for (const y of r.depths) assertRelative(conveyance(hs, y) * Math.sqrt(s), q, 1e-9, `y = ${y}`);
  });

  it('normalDepths(compound) in the main channel equals the trapezoid depth (b = 10, z = 1, n = 0.03)', () => {
    // below bank level the compound section is the trapezoid alone: same Manning normal depth
    const q = 15, s = 0.0005;
    const inChannel = normalDepth(compound(), q, s)!;
    expect(inChannel).toBeLessThan(2);
    assertRelative(inChannel, normalDepth(trap(10, 1, 0.03), q, s)!, 1e-9, 'main channel');
  });

  it('normalDepth rejects a discharge ≤ 0 and a slope that is not a number', () => {
    const hs = rect(3);
    expect(() => normalDepth(hs, 0, 0.001)).toThrow(HydraulicError);
    expect(() => normalDepth(hs, -2, 0.001)).toThrow(/discharge/);
    expect(() => normalDepth(hs, 2, Number.NaN)).toThrow(/slope/);
  });
});
