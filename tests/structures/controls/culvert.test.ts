import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { barrel } from '../../../src/structures/culvert/barrel.js';
import { engineBarrelProfile } from '../../../src/structures/controls/culvert.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';
import type { CulvertSpec } from '../../../src/input/model/types.js';
import { allFinite, channelWith, run, structureOf, trap, value } from './support.js';

const pipe = (over: Partial<CulvertSpec> = {}): CulvertSpec => ({
  id: 's',
  type: 'culvert',
  station: 300,
  barrel: { shape: 'circular', diameter: 1.2 },
  length: 20,
  slope: 0.005,
  n: 0.013,
  inlet: 'concrete-pipe-square-edge-headwall',
  ...over,
});

const drain = trap(1.5, 2, 0.03);

describe('culvertControl', () => {
  it('culvertControl: unsubmerged inlet control follows HDS-5 form 1, HW/D = Hc/D + K·(Ku·Q/(A·D^0.5))^M + Ks·S', () => {
    // FHWA HDS-5 (2012) App. A; square-edged concrete pipe with headwall K = 0.0098, M = 2.0, Ks = −0.5,
    // Ku = 1.811 in SI (coefficients as reproduced from HDS-5 Table A.1, from memory); a low tailwater so inlet control governs
    const flow = run(channelWith(pipe({ slope: 0.02 }), { section: drain, discharge: 1.0, slope: 0.004, downstreamLength: 300, upstreamLength: 300, downstream: { type: 'normal' } }));
    const r = structureOf(flow);
    const D = 1.2;
    const area = (Math.PI * D * D) / 4;
    const x = (1.811 * 1.0) / (area * Math.sqrt(D));
    expect(x).toBeLessThan(3.5);
    const hcOverD = value(r, 'criticalHeadOverRise');
    assertRelative(value(r, 'inletControlHeadwater'), D * (hcOverD + 0.0098 * x * x - 0.5 * 0.02), 1e-12, 'inlet-control HW');
    expect(allFinite(flow)).toBe(true);
  });

  it('culvertControl: a submerged outlet gives the full-flow headwater HW = TW + (1 + ke + 2g·n²L/R^(4/3))·V²/2g − L·S', () => {
    // FHWA HDS-5 (2012) ch. 3 outlet control, full flow (the 19.63 of the SI form is 2g); ke = 0.5 for a square edge (HDS-5 table)
    const tail = 102.0; // well above the outlet crown (outlet invert 100.0 + 0.8)
    const flow = run(channelWith(pipe(), { section: drain, discharge: 2.5, slope: 0.004, downstream: { type: 'stage', elevation: tail + 0.8 }, upstreamLength: 400, downstreamLength: 50 }));
    const r = structureOf(flow);
    expect(r.values['outletControlMethod']).toBe('full-flow');
    const D = 1.2;
    const A = (Math.PI * D * D) / 4;
    const V = 2.5 / A;
    const R = D / 4;
    const tw = value(r, 'tailwaterDepthAtOutlet');
    const expected = tw + (1 + 0.5 + (2 * SI.g * 0.013 * 0.013 * 20) / Math.pow(R, 4 / 3)) * ((V * V) / (2 * SI.g)) - 20 * 0.005;
    assertRelative(value(r, 'outletControlHeadwater'), expected, 1e-12, 'full-flow HW');
    expect(r.values['controlling']).toBe('outlet');
  });

  it('culvertControl: the controlling headwater is never below either control, over a range of discharges', () => {
    for (const q of [0.3, 0.8, 1.5, 2.5, 3.5, 5]) {
      const flow = run(channelWith(pipe(), { section: drain, discharge: q, slope: 0.001, downstream: { type: 'normal' } }));
      const r = structureOf(flow);
      const hw = value(r, 'headwaterDepth');
      expect(hw).toBeGreaterThanOrEqual(value(r, 'inletControlHeadwater') - 1e-12);
      expect(hw).toBeGreaterThanOrEqual(value(r, 'outletControlHeadwater') - 1e-12);
    }
  });

  it('engineBarrelProfile: the part-full barrel profile starts at max(TW, dc) at the outlet and is computed by the engine up to the inlet', () => {
    const b = barrel({ shape: 'circular', diameter: 1.2 });
    const result = engineBarrelProfile({ barrel: b, length: 30, slope: 0.002, roughness: 0.013, discharge: 1.0, outletControlDepth: 0.7, tailwaterDepth: 0.7, criticalDepth: 0.55, units: SI });
    const outlet = result.stations!.find((s) => s.distanceFromOutlet === 0)!;
    assertInDelta(outlet.depth, 0.7, 1e-12, 'outlet depth = the tailwater');
    expect(result.outletDepth).toBeCloseTo(0.7, 12);
    // a mild barrel with the tailwater above normal depth: an M1 profile, the depth falls towards the inlet (slope > Sf)
    expect(result.inletDepth).toBeLessThan(0.7);
    expect(result.inletDepth).toBeGreaterThan(0.55);
    expect(result.fullLength).toBe(0);
  });

  it('engineBarrelProfile: a profile reaching the crown runs full to the inlet with full-flow friction', () => {
    const b = barrel({ shape: 'circular', diameter: 0.9 });
    // large discharge, tailwater just below the crown: the subcritical profile reaches the crown inside the barrel
    const result = engineBarrelProfile({ barrel: b, length: 60, slope: 0.0005, roughness: 0.013, discharge: 1.6, outletControlDepth: 0.88, tailwaterDepth: 0.88, criticalDepth: 0.75, units: SI });
    expect(result.inletDepth).toBe(0.9);
    expect(result.fullLength).toBeGreaterThan(0);
    const A = (Math.PI * 0.81) / 4;
    const K = (1 / 0.013) * A * Math.pow(0.9 / 4, 2 / 3); // Manning full-flow conveyance
    const sf = (1.6 / K) ** 2;
    assertRelative(result.inletPressureHead!, 0.9 + (sf - 0.0005) * result.fullLength!, 1e-6, 'pressure head at the inlet');
  });

  it('culvertControl: the headwater rises with discharge in a whole-channel run', () => {
    let previous = -Infinity;
    for (const q of [0.3, 0.6, 1.0, 1.6, 2.4, 3.4]) {
      const flow = run(channelWith(pipe(), { section: drain, discharge: q, slope: 0.001, downstream: { type: 'normal' } }));
      const hw = value(structureOf(flow), 'headwaterStage');
      expect(hw).toBeGreaterThan(previous);
      previous = hw;
    }
  });
});
