import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors.js';
import { SI } from '../../../src/core/units.js';
import { culvert, type CulvertSpec } from '../../../src/structures/culvert/culvert.js';
import { assertInDelta } from '../../helpers/assert.js';

// Invented scenarios (not a real site): a 1.2 m concrete pipe and a 2 m × 1.5 m box under a farm road.
const pipe: CulvertSpec = {
  barrel: { shape: 'circular', diameter: 1.2 }, length: 30, slope: 0.01, roughness: 0.013,
  inlet: 'concrete-pipe-square-edge-headwall', inletInvert: 100,
};
const box: CulvertSpec = {
  barrel: { shape: 'box', span: 2, rise: 1.5 }, length: 25, slope: 0.004, roughness: 0.013,
  inlet: 'box-wingwalls-30-75', inletInvert: 50,
};

describe('culvert', () => {
  it('culvert() controlling headwater is never below either control', () => {
    // HDS-5: the culvert works under the control that needs the larger headwater
    fc.assert(
      fc.property(fc.double({ min: 0.2, max: 8, noNaN: true }), fc.double({ min: -1, max: 3, noNaN: true }), fc.boolean(), (q, tw, useBox) => {
        const spec = useBox ? box : pipe;
        const outletInvert = spec.inletInvert - spec.length * spec.slope;
        const r = culvert(spec, q, outletInvert + tw, SI);
        const hw = r.headwaterStage - spec.inletInvert;
        expect(hw).toBeGreaterThanOrEqual(r.inletControlHeadwater - 1e-12);
        expect(hw).toBeGreaterThanOrEqual(r.outletControlHeadwater - 1e-12);
        expect(Number.isFinite(r.outletVelocity) && r.outletVelocity > 0).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('culvert() headwater rises with discharge at a fixed tailwater', () => {
    for (const spec of [pipe, box]) {
      let last = -Infinity;
      for (const q of [0.3, 0.8, 1.5, 2.5, 4, 6, 9]) {
        const hw = culvert(spec, q, spec.inletInvert - 0.5, SI).headwaterStage;
        expect(hw).toBeGreaterThan(last);
        last = hw;
      }
    }
  });

  it('culvert() turns to outlet control under a high tailwater and reports outlet depth and velocity', () => {
    const outletInvert = pipe.inletInvert - 0.3;
    const low = culvert(pipe, 2, null, SI);
    expect(low.controlling).toBe('inlet');
    const high = culvert(pipe, 2, outletInvert + 2, SI);
    expect(high.controlling).toBe('outlet');
    assertInDelta(high.outletDepth, 1.2, 1e-12, 'full at the outlet');
    assertInDelta(high.outletVelocity, 2 / (Math.PI * 0.36), 1e-9, 'V = Q/A');
    expect(high.caution).toMatch(/licensed engineer/);
  });

  it('culvert() on a steep barrel under inlet control hands a supercritical outlet depth downstream', () => {
    const steep = { ...pipe, slope: 0.05 };
    const r = culvert(steep, 1.5, null, SI);
    expect(r.controlling).toBe('inlet');
    expect(r.downstreamSupercriticalDepth).not.toBeNull();
    expect(r.downstreamSupercriticalDepth!).toBeLessThan(Number(r.values['barrelCriticalDepth']));
  });

  it('culvert() splits the flow between identical barrels', () => {
    const one = culvert(pipe, 2, null, SI);
    const two = culvert({ ...pipe, barrels: 2 }, 4, null, SI);
    assertInDelta(two.headwaterStage, one.headwaterStage, 1e-12, 'HW');
  });

  it('culvert() refuses an inlet type of the other barrel shape, naming the field', () => {
    expect(() => culvert({ ...pipe, inlet: 'box-wingwalls-30-75', where: 'structures[1]' }, 2, null, SI)).toThrow(/structures\[1\]\.inlet/);
    expect(() => culvert({ ...pipe, roughness: 0.5 }, 2, null, SI)).toThrow(InputError);
  });
});
