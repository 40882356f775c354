import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { barrel, barrelCriticalDepth } from '../../../src/structures/culvert/barrel.js';
import {
  type BarrelProfileInputs,
  fullFlowFrictionFactor,
  fullFlowHeadLoss,
  outletControl,
} from '../../../src/structures/culvert/outletControl.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

const ft = 0.3048;
const pipe = barrel({ shape: 'circular', diameter: 1.2 });
const base = { barrel: pipe, length: 40, slope: 0.005, roughness: 0.013, entranceLoss: 0.5, discharge: 2.5, units: SI };

describe('culvert outlet control (FHWA HDS-5 2012)', () => {
  it('fullFlowFrictionFactor() reproduces the HDS-5 constants 29 (US) and 19.63 (SI)', () => {
    // 2g/k²: HDS-5 writes 29·n²L/R^1.33 in US units and 19.63 in SI (constants from memory)
    assertRelative(fullFlowFrictionFactor(US), 29, 5e-3, 'US');
    assertRelative(fullFlowFrictionFactor(SI), 19.63, 2e-3, 'SI');
  });

  it('fullFlowHeadLoss() equals entrance + exit + Manning friction loss written separately', () => {
    // Manning (1891): hf = L·(Q·n/(k·A·R^(2/3)))²; exit loss one velocity head, entrance ke velocity heads
    const r = fullFlowHeadLoss(pipe, 40, 0.013, 0.5, 2.5, SI);
    const a = pipe.fullArea;
    const hf = 40 * ((2.5 * 0.013) / (a * Math.pow(0.3, 2 / 3))) ** 2;
    const hv = (2.5 / a) ** 2 / (2 * SI.g);
    assertRelative(r.headLoss, hf + 1.5 * hv, 1e-12, 'H');
  });

  it('fullFlowHeadLoss() is the same loss in SI and US units', () => {
    // unit conversion, 1 ft = 0.3048 m: the general form needs no unit-specific constant
    const si = fullFlowHeadLoss(pipe, 40, 0.013, 0.5, 2.5, SI).headLoss;
    const us = fullFlowHeadLoss(barrel({ shape: 'circular', diameter: 1.2 / ft }), 40 / ft, 0.013, 0.5, 2.5 / ft ** 3, US).headLoss;
    assertRelative(us * ft, si, 1e-3, 'H');
  });

  it('outletControl() with the outlet submerged is HW = TW + H − L·S', () => {
    // HDS-5 outlet-control energy equation with ho = TW when TW ≥ D
    const r = outletControl({ ...base, tailwaterDepth: 1.5 });
    const h = fullFlowHeadLoss(pipe, 40, 0.013, 0.5, 2.5, SI).headLoss;
    assertInDelta(r.headwaterDepth, 1.5 + h - 40 * 0.005, 1e-12, 'HW');
    expect(r.method).toBe('full-flow');
  });

  it('outletControl() with a low tailwater uses ho = (dc + D)/2', () => {
    // HDS-5: ho = max(TW, (dc + D)/2)
    const r = outletControl({ ...base, tailwaterDepth: 0.3 });
    const dc = barrelCriticalDepth(pipe, 2.5, SI);
    assertInDelta(Number(r.values['outletPressureLine']), (dc + 1.2) / 2, 1e-12, 'ho');
    expect(r.method).toBe('full-flow-ho');
  });

  it('outletControl() calls the injected barrel profile from max(TW, dc) and adds (1 + ke)·V²/2g at the inlet', () => {
    let seen: BarrelProfileInputs | undefined;
    const r = outletControl({
      ...base,
      tailwaterDepth: 0.3,
      barrelProfile: (inputs) => {
        seen = inputs;
        return { inletDepth: 0.9, outletDepth: inputs.outletControlDepth, stations: [{ distanceFromOutlet: 0, depth: inputs.outletControlDepth }, { distanceFromOutlet: 40, depth: 0.9 }] };
      },
    });
    const dc = barrelCriticalDepth(pipe, 2.5, SI);
    assertInDelta(seen?.outletControlDepth ?? NaN, Math.max(0.3, dc), 1e-12, 'start depth');
    const a = pipe.elements(0.9).area;
    assertInDelta(r.headwaterDepth, 0.9 + (1.5 * (2.5 / a) ** 2) / (2 * SI.g), 1e-12, 'HW');
    expect(r.method).toBe('barrel-profile');
    expect(r.stations?.length).toBe(2);
  });

  it('outletControl() falls back to full flow when the injected profile fills the inlet', () => {
    const r = outletControl({ ...base, tailwaterDepth: 0.3, barrelProfile: () => ({ inletDepth: 1.2, outletDepth: 1.0 }) });
    assertInDelta(r.headwaterDepth, Number(r.values['fullFlowHeadwater']), 1e-12, 'HW');
  });

  it('outletControl() headwater rises with discharge and with tailwater', () => {
    let last = -Infinity;
    for (const q of [0.5, 1, 2, 3, 4]) {
      const hw = outletControl({ ...base, discharge: q, tailwaterDepth: 0.5 }).headwaterDepth;
      expect(hw).toBeGreaterThan(last);
      last = hw;
    }
    last = -Infinity;
    for (const tw of [0, 0.5, 1.0, 1.3, 2]) {
      const hw = outletControl({ ...base, tailwaterDepth: tw }).headwaterDepth;
      expect(hw).toBeGreaterThanOrEqual(last);
      last = hw;
    }
  });
});
