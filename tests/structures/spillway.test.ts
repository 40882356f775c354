import { describe, expect, it } from 'vitest';
import { SI, US } from '../../src/core/units.js';
import { rectangularSpecificForce } from '../../src/structures/gate.js';
import { apronCheck, jumpType, spillway, toeDepth, usbrOgeeCoefficientAt } from '../../src/structures/spillway.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';

// Invented scenario (not a real dam): a 20 m ogee crest 6 m above the apron.
const spec = { crestElevation: 106, crestLength: 20, approachBedElevation: 100, apronElevation: 100, apronLength: 40 };

describe('spillway', () => {
  it('apronCheck() gives y2/y1 = 6 at F1 = √21 and the Bélanger energy loss', () => {
    // Bélanger, Chow 1959 eq. 3-21: y2/y1 = ½(√(1 + 8F1²) − 1); ΔE = (y2 − y1)³/(4y1y2) (computed values)
    const y1 = 0.2;
    const q = Math.sqrt(21 * SI.g * y1 ** 3);
    const c = apronCheck(y1, q, null, undefined, SI);
    assertRelative(c.sequentDepth / y1, 6, 1e-12, 'y2/y1');
    assertRelative(c.energyLoss, (1.2 - 0.2) ** 3 / (4 * 0.2 * 1.2), 1e-9, 'ΔE');
    assertRelative(c.jumpLength, 6 * c.sequentDepth, 1e-12, 'L = 6·y2 (Peterka 1958, from memory)');
  });

  it('apronCheck() jump obeys the specific-force balance to round-off', () => {
    const c = apronCheck(0.15, 2.5, 2, 30, SI);
    expect(Math.abs(c.momentumResidual)).toBeLessThan(1e-12 * rectangularSpecificForce(0.15, 2.5, SI));
  });

  it('apronCheck() margin is tailwater minus sequent depth: positive drowned, negative swept out', () => {
    const y1 = 0.2;
    const q = Math.sqrt(21 * SI.g * y1 ** 3);
    const drowned = apronCheck(y1, q, 1.5, 20, SI);
    assertInDelta(drowned.margin ?? NaN, 0.3, 1e-12, 'margin');
    expect(drowned.fitsOnApron).toBe(true);
    const short = apronCheck(y1, q, 1.5, 5, SI);
    expect(short.fitsOnApron).toBe(false);
    const swept = apronCheck(y1, q, 1.0, 20, SI);
    expect(swept.margin).toBeLessThan(0);
    expect(swept.fitsOnApron).toBe(false);
    // the jump waits for the supercritical depth whose sequent is the tailwater
    const sequentOfThat = apronCheck(swept.jumpFormsAtDepth!, q, null, undefined, SI).sequentDepth;
    assertRelative(sequentOfThat, 1.0, 1e-12, 'sequent of jump-forming depth');
  });

  it('jumpType() follows the Froude ranges of Chow 1959 §15-3', () => {
    // Chow 1959 §15-3 after USBR tests (confirmed): 1–1.7 undular, 1.7–2.5 weak, 2.5–4.5 oscillating, 4.5–9 steady, > 9 strong
    expect([1.5, 2, 3, 6, 10].map(jumpType)).toEqual(['undular', 'weak', 'oscillating', 'steady', 'strong']);
  });

  it('toeDepth() solves the energy equation with the chute loss on the supercritical branch', () => {
    const q = 3;
    const y = toeDepth(q, 8, 0.1, SI);
    assertInDelta(y + (1.1 * q * q) / (2 * SI.g * y * y), 8, 1e-9, 'E');
    expect(q / Math.sqrt(SI.g * y ** 3)).toBeGreaterThan(1);
  });

  it('usbrOgeeCoefficientAt() is 3.95 ft^½/s for P/Hd ≥ 3, 2.18 m^½/s in SI', () => {
    // USBR Design of Small Dams, ogee crest with vertical upstream face (from memory); SI by √g scaling
    assertInDelta(usbrOgeeCoefficientAt(5, US), 3.95, 1e-12, 'US');
    assertInDelta(usbrOgeeCoefficientAt(5, SI), 2.18, 5e-3, 'SI');
  });

  it('spillway() recovers Q = C·L·He^1.5 and hands the toe depth downstream', () => {
    const out = spillway({ ...spec, coefficient: 2.1 }, 60, 103, SI);
    const he = out.headwaterEnergy - 106;
    assertRelative(2.1 * 20 * Math.pow(he, 1.5), 60, 1e-8, 'Q');
    assertInDelta(out.downstreamSupercriticalDepth ?? NaN, out.apron.toeDepth, 0, 'toe');
    const e0 = out.headwaterEnergy - 100;
    const y = out.apron.toeDepth;
    assertInDelta(y + 9 / (2 * SI.g * y * y), e0, 1e-9, 'toe energy');
    assertInDelta(Number(out.values['tailwaterMinusSequent']), 3 - out.apron.sequentDepth, 1e-12, 'margin');
    expect(out.caution).toMatch(/licensed engineer/);
  });

  it('spillway() headwater rises with discharge (user coefficient and USBR curve)', () => {
    for (const coefficient of [2.1, undefined]) {
      let last = -Infinity;
      for (const q of [1, 5, 20, 60, 150]) {
        const s = coefficient === undefined ? spec : { ...spec, coefficient };
        const e = spillway(s, q, null, SI).headwaterEnergy;
        expect(e).toBeGreaterThan(last);
        last = e;
      }
    }
  });
});
