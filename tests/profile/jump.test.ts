/**
 * Hydraulic jumps: Bélanger's sequent-depth ratio y2/y1 = ½(√(1 + 8F1²) − 1) and energy loss
 * ΔE = (y2 − y1)³/(4·y1·y2) for a rectangular channel (Chow 1959, eq. 3-21 and ch. 15; published);
 * jump types by F1 (Chow 1959 §15-3; published); roller length (Hager, Bremen & Kawagoshi 1990; from memory).
 */
import { describe, expect, it } from 'vitest';
import { SI } from '../../src/core/units.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { sequentDepth, specificForce } from '../../src/hydraulics/specificForce.js';
import { computeProfile } from '../../src/profile/engine.js';
import { jumpAt, jumpLength, jumpType } from '../../src/profile/jump.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { channel, rect5, rect5Discharge } from './channels.js';

const width = 4;
const q = 6; // m²/s
const hs = hydraulicSection(rectangular({ bottomWidth: width, roughness: 0.014 }), 'manning', SI);
const depthFor = (froude: number) => Math.cbrt((q * q) / (SI.g * froude * froude));
const belanger = (f: number) => 0.5 * (Math.sqrt(1 + 8 * f * f) - 1);

describe('jumpAt (rectangle, Bélanger; Chow 1959 eq. 3-21, published)', () => {
  // computed from the formula (CHECK values): F1 = √3 → 2, √10 → 4, √21 → 6, 6 → 8; F1 = 4 → 5.1789
  for (const [f1, ratio] of [[Math.sqrt(3), 2], [Math.sqrt(10), 4], [Math.sqrt(21), 6], [6, 8], [4, 5.1789]] as const) {
    it(`jumpAt: F1 = ${f1.toFixed(4)} gives y2/y1 = ${ratio} and ΔE = (y2 − y1)³/(4y1y2)`, () => {
      const y1 = depthFor(f1);
      const y2 = sequentDepth(hs, y1, q * width)!;
      assertRelative(y2 / y1, ratio, 1e-4, 'sequent ratio');
      assertRelative(y2 / y1, belanger(f1), 1e-9, 'Bélanger');
      const jump = jumpAt(hs, hs, q * width, 10, y1, y2);
      assertRelative(jump.froude, f1, 1e-12, 'F1');
      assertRelative(jump.energyLoss, (y2 - y1) ** 3 / (4 * y1 * y2), 1e-9, 'energy loss');
    });
  }
  it('jumpAt: F1 = 4 gives ΔE/y1 = 3.5228 (computed from Bélanger and the loss formula)', () => {
    const y1 = depthFor(4);
    const jump = jumpAt(hs, hs, q * width, 0, y1, sequentDepth(hs, y1, q * width)!);
    assertInDelta(jump.energyLoss / y1, 3.5228, 1e-4);
  });
});

describe('jumpType (Chow 1959 §15-3, published)', () => {
  it('jumpType: 1–1.7 undular, 1.7–2.5 weak, 2.5–4.5 oscillating, 4.5–9 steady, above 9 strong', () => {
    expect([1.2, 1.69, 1.71, 2.49, 2.51, 4.49, 4.51, 8.99, 9.01, 14].map(jumpType)).toEqual([
      'undular', 'undular', 'weak', 'weak', 'oscillating', 'oscillating', 'steady', 'steady', 'strong', 'strong',
    ]);
  });
});

describe('jumpLength', () => {
  it('jumpLength: Lr/y1 = 160·tanh(F1/20) − 12 within 2 ≤ F1 ≤ 16 (Hager, Bremen & Kawagoshi 1990; from memory)', () => {
    const { length, method } = jumpLength(0.2, 1.0, 4);
    assertInDelta(length / 0.2, 160 * Math.tanh(0.2) - 12, 1e-12);
    assertInDelta(length / 0.2, 19.58, 0.01); // computed: 160·0.19738 − 12
    expect(method).toMatch(/Hager/);
  });
  it('jumpLength: outside that range, L ≈ 6·y2 (USBR Engineering Monograph 25, Peterka 1958; from memory)', () => {
    expect(jumpLength(0.5, 0.9, 1.5).length).toBeCloseTo(5.4, 12);
    expect(jumpLength(0.05, 2, 18).method).toMatch(/Monograph 25/);
  });
});

describe('computeProfile: mixed flow with a jump (steep chute into a mild channel)', () => {
  const input = channel(
    [
      { id: 'chute', section: rect5, length: 300, slope: 0.02 },
      { id: 'channel', section: rect5, length: 600, slope: 0.0005 },
    ],
    { downstream: { type: 'depth', depth: 2.6 } },
  );
  for (const method of ['standard-step', 'direct-step', 'ode'] as const) {
    it(`computeProfile (${method}): one jump, with equal specific force on both sides of the toe and Bélanger's sequent depth`, () => {
      const result = computeProfile({ ...input, method });
      expect(result.jumps).toHaveLength(1);
      const jump = result.jumps[0]!;
      const m1 = specificForce(rect5, jump.upstreamDepth, rect5Discharge);
      const m2 = specificForce(rect5, jump.downstreamDepth, rect5Discharge);
      assertRelative(m1, m2, 1e-6, 'specific force at the toe');
      assertRelative(jump.downstreamDepth / jump.upstreamDepth, belanger(jump.froude), 1e-5, 'Bélanger');
      // the toe is an output station, reported twice (both sides)
      const atToe = result.stations.filter((s) => s.station === jump.station);
      expect(atToe.map((s) => s.regime)).toEqual(['supercritical', 'subcritical']);
      expect(jump.type).toBe(jumpType(jump.froude));
      expect(jump.length).toBeGreaterThan(0);
      expect(jump.energyLoss).toBeGreaterThan(0);
    });
  }
  it('computeProfile: a tailwater too low to hold a jump sweeps it out, with a warning', () => {
    const low = computeProfile(channel([{ id: 'chute', section: rect5, length: 300, slope: 0.02 }, { id: 'tail', section: rect5, length: 40, slope: 0.0005 }], { downstream: { type: 'depth', depth: 1.3 } }));
    expect(low.jumps).toHaveLength(0);
    expect(low.warnings.join(' ')).toMatch(/too low to hold a jump/);
    expect(low.stations[low.stations.length - 1]!.regime).toBe('supercritical');
  });
  it('computeProfile: a tailwater high enough drowns the jump up to the upstream control, with a note', () => {
    const high = computeProfile(
      channel([{ id: 'apron', section: rect5, length: 100, slope: 0.0005 }], { upstream: { type: 'depth', depth: 0.5 }, downstream: { type: 'depth', depth: 3.5 } }),
    );
    expect(high.jumps).toHaveLength(0);
    expect(high.notes!.join(' ')).toMatch(/drowned up to the upstream control/);
    expect(high.stations.every((s) => s.regime === 'subcritical')).toBe(true);
  });
});
