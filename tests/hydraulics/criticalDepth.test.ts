import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { points } from '../../src/geometry/shapes/points.js';
import { criticalDepth, criticalDepths } from '../../src/hydraulics/criticalDepth.js';
import { froudeNumber } from '../../src/hydraulics/froude.js';
import { conveyanceAndAlpha, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { specificEnergy } from '../../src/hydraulics/specificEnergy.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { compound, pipe, rect, SI, trap, US } from './sections.js';

describe('criticalDepth', () => {
  it('criticalDepth(rectangular) equals (q²/g)^(1/3) and E(yc) = 1.5·yc', () => {
    // exact closed form of the Froude condition for a rectangle (Chow, Open-Channel Hydraulics, 1959, ch. 4, critical flow; published, chapter from memory)
    for (const [b, q, units] of [[3, 6, SI], [0.5, 0.02, SI], [20, 400, US]] as const) {
      const hs = rect(b, 0.015, units);
      const yc = criticalDepth(hs, q);
      const unit = q / b;
      assertRelative(yc, Math.cbrt((unit * unit) / units.g), 1e-10, `yc b=${b}`);
      assertRelative(specificEnergy(hs, yc, q), 1.5 * yc, 1e-10, `Ec b=${b}`);
    }
  });

  it('criticalDepth(trapezoidal) reproduces Chow 1959 Example 10-1 (yc ≈ 2.22 ft)', () => {
    // Chow, Open-Channel Hydraulics (1959), Example 10-1: b = 20 ft, z = 2, Q = 400 ft³/s, α = 1.10.
    // Inputs and the published yc ≈ 2.22 ft are from memory; the book read yc from a section-factor curve
    // (and probably used g = 32.2), so the tolerance is 0.02 ft.
    const hs = trap(20, 2, 0.025, US, 1.1);
    assertInDelta(criticalDepth(hs, 400), 2.22, 0.02, 'yc');
  });

  it('criticalDepth(trapezoidal) meets the Froude condition αQ²T = gA³', () => {
    // definition of critical flow with α (Chow 1959, ch. 3; chapter from memory); exact
    const hs = trap(3, 1.5, 0.02, SI, 1.15);
    const yc = criticalDepth(hs, 12);
    const b = 3, z = 1.5;
    const a = (b + z * yc) * yc;
    const t = b + 2 * z * yc;
    assertRelative(1.15 * 144 * t, SI.g * a ** 3, 1e-9, 'Froude condition');
    assertRelative(froudeNumber(hs, yc, 12), 1, 1e-9, 'F = 1');
  });

  it('criticalDepth(circular) matches the Froude condition from the segment formulas, and stays below the crown', () => {
    // computed from the circular-segment geometry (Chow 1959, Table 2-1):
    // A = D²(θ − sin θ)/8, T = D·sin(θ/2), θ = 2·acos(1 − 2y/D); Q = √(gA³/T) at y = yc
    const d = 1.2;
    const hs = pipe(d);
    for (const ratio of [0.3, 0.5, 0.8, 0.9, 0.95, 0.99]) {
      const y = ratio * d;
      const theta = 2 * Math.acos(1 - 2 * ratio);
      const a = (d * d * (theta - Math.sin(theta))) / 8;
      const t = d * Math.sin(theta / 2);
      const q = Math.sqrt((SI.g * a ** 3) / t);
      assertRelative(criticalDepth(hs, q), y, 1e-8, `yc/D = ${ratio}`);
    }
    // near the crown T → 0, so A³/T → ∞: a root exists for any discharge, ever closer to the crown
    for (const q of [10, 100, 1e4]) {
      const yc = criticalDepth(hs, q);
      expect(yc).toBeLessThanOrEqual(d);
      expect(yc).toBeGreaterThan(0.99 * d);
    }
  });

  it('criticalDepths(compound) finds two minima of specific energy where the flow spills onto the floodplains', () => {
    // Compound sections can have two critical depths (Blalock & Sturm 1981, J. Hydraulics Division ASCE
    // 107(HY6); from memory). The invented section of sections.ts, Q = 70 and 80 m³/s; the minima are
    // checked against an independent dense scan of E (20 000 intervals) and by E(yc ± δ) > E(yc).
    const hs = compound();
    for (const q of [70, 80]) {
      const found = criticalDepths(hs, q);
      expect(found.length, `Q = ${q}`).toBe(2);
      expect(found[0]!).toBeLessThan(2); // in the main channel
      expect(found[1]!).toBeGreaterThan(2); // on the floodplains
      const n = 20_000;
      const dense: number[] = [];
      let prev2 = Infinity;
      let prev = specificEnergy(hs, 4 / n, q);
      for (let i = 2; i <= n; i++) {
        const e = specificEnergy(hs, (4 * i) / n, q);
        if (prev < prev2 && prev <= e) dense.push((4 * (i - 1)) / n);
        prev2 = prev;
        prev = e;
      }
      expect(dense.length).toBe(2);
      found.forEach((y, i) => {
        assertInDelta(y, dense[i]!, 4 / n, `minimum ${i}`);
        const e = specificEnergy(hs, y, q);
        expect(specificEnergy(hs, y * 0.999, q)).toBeGreaterThan(e);
        expect(specificEnergy(hs, y * 1.001, q)).toBeGreaterThan(e);
      });
    }
    // the critical depth is the one of least specific energy: the main-channel one at 70, the floodplain one at 80
    expect(criticalDepth(hs, 70)).toBeLessThan(2);
    expect(criticalDepth(hs, 80)).toBeGreaterThan(2);
    // α > 1 at the floodplain critical depth (subsection method, Chow 1959 ch. 6; published, chapter from memory)
    expect(conveyanceAndAlpha(hs, criticalDepths(hs, 80)[1]!).alpha).toBeGreaterThan(1);
  });

  it('criticalDepths(compound) gives one depth for a discharge that stays in the main channel', () => {
    // the main channel alone is a trapezoid b = 10, z = 1: exact Froude condition Q²T = gA³ at Q = 10
    const hs = compound();
    const found = criticalDepths(hs, 10);
    expect(found.length).toBe(1);
    const y = found[0]!;
    assertRelative(100 * (10 + 2 * y), SI.g * ((10 + y) * y) ** 3, 1e-6, 'Froude condition in the main channel');
  });

  it('criticalDepth(points) above the end points is a HydraulicError asking to extend the section', () => {
    const low = hydraulicSection(points({ points: [[0, 0.2], [1, 0], [9, 0], [10, 0.2]], roughness: 0.03 }), 'manning', SI);
    expect(() => criticalDepth(low, 50)).toThrow(HydraulicError);
    expect(() => criticalDepth(low, 50)).toThrow(/extend the section/);
  });

  it('criticalDepth rejects a discharge ≤ 0 or not finite', () => {
    const hs = rect(3);
    for (const q of [0, -1, Number.NaN, Infinity]) expect(() => criticalDepth(hs, q)).toThrow(HydraulicError);
  });
});
