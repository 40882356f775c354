import { describe, expect, it } from 'vitest';
import { energyCurveSamples } from '../../src/core/tolerances.js';
import { criticalDepth, criticalDepths, energyAt } from '../../src/hydraulics/criticalDepth.js';
import { curveDepths } from '../../src/hydraulics/energyCurve.js';
import { compound } from './sections.js';

describe('energyCurve', () => {
  it('curveDepths(compound) holds the even samples and every break depth of the section, strictly ascending', () => {
    const hs = compound();
    const top = hs.section.maxDepth;
    const depths = Array.from(curveDepths(hs, top));
    for (let i = 1; i < depths.length; i++) expect(depths[i]!).toBeGreaterThan(depths[i - 1]!);
    expect(depths[depths.length - 1]).toBe(top);
    // a break within a rounding distance (1e-9 of the range) of an even sample is that sample
    for (const b of hs.section.breakDepths!) {
      if (b > depths[0]! && b < top) expect(Math.min(...depths.map((d) => Math.abs(d - b))), `break ${b}`).toBeLessThanOrEqual(1e-9 * top);
    }
    expect(depths.length).toBeGreaterThan(energyCurveSamples);
  });

  it('criticalDepths(compound) finds every local minimum of E that a brute-force scan of 20,000 depths finds', () => {
    // an independent method: E evaluated directly at 20,000 even depths, each sampled minimum compared with the
    // solver's (the compound section of sections.ts, whose floodplains make E fall again above bank level)
    const hs = compound();
    const top = hs.section.maxDepth;
    for (const q of [5, 20, 60, 150, 400, 900]) {
      const n = 20_000;
      const e = Array.from({ length: n + 1 }, (_, i) => energyAt(hs, (top * (i + 0.5)) / (n + 1), q));
      const brute: number[] = [];
      for (let i = 1; i < n; i++) if (e[i]! < e[i - 1]! && e[i]! <= e[i + 1]!) brute.push((top * (i + 0.5)) / (n + 1));
      const found = criticalDepths(hs, q);
      expect(found.length, `Q = ${q}: ${found} against ${brute}`).toBe(brute.length);
      found.forEach((y, k) => expect(Math.abs(y - brute[k]!)).toBeLessThanOrEqual((2 * top) / n));
    }
  });

  it('criticalDepth(compound) gives the least-energy minimum of criticalDepths exactly (its one-minimum shortcut included)', () => {
    // the shortcut for one sampled minimum must give the general search's depth; the least energy is compared here
    // directly with E at each minimum (the definition of the critical depth of least energy, Blalock & Sturm 1981, from memory)
    const hs = compound();
    for (const q of [1, 5, 20, 60, 150, 400, 900]) {
      const all = criticalDepths(hs, q);
      const least = all.reduce((best, y) => (energyAt(hs, y, q) < energyAt(hs, best, q) ? y : best));
      expect(criticalDepth(hs, q), `Q = ${q}`).toBe(least);
    }
  });
});
