import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { criticalDepth, criticalDepths } from '../../src/hydraulics/criticalDepth.js';
import { alternateDepth, depthsForSpecificEnergy, specificEnergy } from '../../src/hydraulics/specificEnergy.js';
import { assertRelative } from '../helpers/assert.js';
import { compound, pipe, rect, SI, trap } from './sections.js';

describe('specificEnergy', () => {
  it('specificEnergy(rectangular) is y + q²/(2gy²)', () => {
    // definition (Bakhmeteff 1912; Chow 1959, ch. 3); exact
    const hs = rect(2.5);
    assertRelative(specificEnergy(hs, 0.8, 4), 0.8 + (1.6 * 1.6) / (2 * SI.g * 0.64), 1e-14, 'E');
  });

  it('specificEnergy is least at critical depth: E(yc ± δ) > E(yc)', () => {
    // property of critical flow (Chow 1959, ch. 3: critical depth is the depth of minimum specific energy)
    const cases = [
      [rect(3), 6],
      [trap(2, 1.5, 0.02, SI, 1.1), 8],
      [pipe(1.2), 1.5],
      [compound(), 40],
    ] as const;
    for (const [hs, q] of cases) {
      const yc = criticalDepth(hs, q);
      const e = specificEnergy(hs, yc, q);
      for (const f of [0.99, 0.999, 1.001, 1.01]) {
        expect(specificEnergy(hs, yc * f, q), `${hs.section.shape} at ${f}·yc`).toBeGreaterThan(e);
      }
    }
  });

  it('alternateDepth(rectangular) satisfies q²/(2g) = y1²y2²/(y1 + y2)', () => {
    // exact: equal specific energy in a rectangle, y1 + q²/(2gy1²) = y2 + q²/(2gy2²), rearranged
    const b = 3, q = 6;
    const hs = rect(b);
    const unit = q / b;
    for (const y1 of [0.2, 0.5, 1.2, 3]) {
      const y2 = alternateDepth(hs, y1, q)!;
      assertRelative((y1 * y1 * y2 * y2) / (y1 + y2), (unit * unit) / (2 * SI.g), 1e-9, `y1 = ${y1}`);
      assertRelative(specificEnergy(hs, y2, q), specificEnergy(hs, y1, q), 1e-12, 'equal E');
      expect((y2 - criticalDepth(hs, q)) * (y1 - criticalDepth(hs, q))).toBeLessThan(0);
    }
  });

  it('alternateDepth(circular) is null when the subcritical alternate would be above the crown', () => {
    // E(D) = D + Q²/(2g·Af²) is the most a part-full subcritical flow can have; beyond it the conduit is full
    const d = 1;
    const hs = pipe(d);
    const q = 1;
    const shallow = 0.2; // supercritical, E far above E(D)
    expect(specificEnergy(hs, shallow, q)).toBeGreaterThan(specificEnergy(hs, d, q));
    expect(alternateDepth(hs, shallow, q)).toBeNull();
    // a moderately supercritical depth has its alternate inside the conduit
    const y = 0.45;
    const alt = alternateDepth(hs, y, q)!;
    expect(alt).toBeGreaterThan(criticalDepth(hs, q));
    expect(alt).toBeLessThan(d);
    assertRelative(specificEnergy(hs, alt, q), specificEnergy(hs, y, q), 1e-12, 'equal E');
  });

  it('alternateDepth at critical depth is critical depth', () => {
    const hs = trap(3, 2, 0.02);
    const yc = criticalDepth(hs, 10);
    assertRelative(alternateDepth(hs, yc, 10)!, yc, 1e-9, 'yc');
  });

  it('alternateDepth(compound) crosses the critical depth next to the given depth', () => {
    // two critical depths at Q = 70 (see criticalDepth.test.ts); a supercritical depth below the first
    const hs = compound();
    const q = 70;
    const [yc1] = criticalDepths(hs, q) as [number, number];
    const y1 = 0.8 * yc1;
    const y2 = alternateDepth(hs, y1, q)!;
    expect(y2).toBeGreaterThan(yc1);
    assertRelative(specificEnergy(hs, y2, q), specificEnergy(hs, y1, q), 1e-10, 'equal E');
    // and back again
    assertRelative(alternateDepth(hs, y2, q)!, y1, 1e-8, 'round trip');
  });

  it('depthsForSpecificEnergy gives both depths, and none below the minimum energy', () => {
    const hs = rect(3);
    const q = 6;
    const ec = 1.5 * criticalDepth(hs, q); // exact minimum for a rectangle
    expect(depthsForSpecificEnergy(hs, ec * 0.99, q)).toEqual([]);
    const both = depthsForSpecificEnergy(hs, 2 * ec, q);
    expect(both.length).toBe(2);
    for (const y of both) assertRelative(specificEnergy(hs, y, q), 2 * ec, 1e-12, `y = ${y}`);
  });

  it('specificEnergy rejects a depth ≤ 0 or above the crown', () => {
    expect(() => specificEnergy(rect(3), 0, 1)).toThrow(HydraulicError);
    expect(() => specificEnergy(rect(3), -1, 1)).toThrow(HydraulicError);
    expect(() => specificEnergy(pipe(1), 1.01, 1)).toThrow(/above the crown/);
    expect(() => specificEnergy(pipe(1), 0.5, 0)).toThrow(/discharge/);
  });
});
