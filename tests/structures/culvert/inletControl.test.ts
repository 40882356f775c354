import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { barrel, barrelCriticalDepth, barrelCriticalHead } from '../../../src/structures/culvert/barrel.js';
import { type InletType, inletCoefficients, inletControl, inletUnitFactor } from '../../../src/structures/culvert/inletControl.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

const ft = 0.3048;
const pipe = barrel({ shape: 'circular', diameter: 1.2 });
const box = barrel({ shape: 'box', span: 2, rise: 1.5 });
/** Q giving the discharge intensity X = Ku·Q/(A·D^0.5) in SI */
const qFor = (b: typeof pipe, x: number) => (x * b.fullArea * Math.sqrt(b.rise)) / 1.811;

describe('culvert inlet control (FHWA HDS-5 2012, App. A)', () => {
  it('inletUnitFactor() is 1.811 in SI, the ft/m conversion √(1/0.3048) of Q/(A·D^0.5)', () => {
    // Ku = 1.811 SI, 1.0 US (HDS-5 App. A, confirmed); Q/(A·D^0.5) has units length^½/s.
    assertInDelta(inletUnitFactor(SI), Math.sqrt(1 / ft), 5e-4, 'Ku');
    expect(inletUnitFactor(US)).toBe(1);
  });

  it('inletControl(submerged) equals HW/D = c·X² + Y − 0.5·S with the Table A.1 box 90°/15° constants', () => {
    // HDS-5 submerged form; c = 0.0400, Y = 0.80 (HDS-5 Table A.1 as reproduced)
    const x = 5;
    const r = inletControl(box, inletCoefficients['box-wingwalls-90-15'], qFor(box, x), 0.01, SI);
    expect(r.regime).toBe('submerged');
    assertRelative(r.headwaterDepth / 1.5, 0.04 * x * x + 0.8 - 0.5 * 0.01, 1e-3, 'HW/D');
  });

  it('inletControl(unsubmerged form 1) equals Hc/D + K·X^M − 0.5·S for a square-edge concrete pipe', () => {
    // HDS-5 form 1, K = 0.0098, M = 2.0 (Table A.1 as reproduced); Hc from the critical depth in the pipe
    const x = 2;
    const q = qFor(pipe, x);
    const r = inletControl(pipe, inletCoefficients['concrete-pipe-square-edge-headwall'], q, 0.02, SI);
    const hc = barrelCriticalHead(pipe, barrelCriticalDepth(pipe, q, SI));
    expect(r.regime).toBe('unsubmerged');
    assertRelative(r.headwaterDepth / 1.2, hc / 1.2 + 0.0098 * x * x - 0.5 * 0.02, 1e-3, 'HW/D');
  });

  it('inletControl() gives the same headwater for the same culvert in SI and US units', () => {
    // unit conversion, 1 ft = 0.3048 m: checks Ku and the slope term in every regime
    const pipeUS = barrel({ shape: 'circular', diameter: 1.2 / ft });
    for (const x of [1.5, 3.0, 3.75, 5.0]) {
      const q = qFor(pipe, x);
      for (const type of ['concrete-pipe-square-edge-headwall', 'concrete-pipe-groove-end-headwall'] as const) {
        const si = inletControl(pipe, inletCoefficients[type], q, 0.01, SI);
        const us = inletControl(pipeUS, inletCoefficients[type], q / ft ** 3, 0.01, US);
        assertRelative(us.headwaterDepth * ft, si.headwaterDepth, 2e-3, `${type} X = ${x}`);
        expect(us.regime).toBe(si.regime);
      }
    }
  });

  it('inletControl() is continuous at X = 3.5 and X = 4.0 (transition by interpolation)', () => {
    for (const type of Object.keys(inletCoefficients) as InletType[]) {
      const co = inletCoefficients[type];
      const b = co.barrel === 'box' ? box : pipe;
      for (const x of [3.5, 4.0]) {
        const below = inletControl(b, co, qFor(b, x * (1 - 1e-7)), 0.01, SI).headwaterDepth;
        const above = inletControl(b, co, qFor(b, x * (1 + 1e-7)), 0.01, SI).headwaterDepth;
        assertInDelta(above, below, 1e-5, `${type} at X = ${x}`);
      }
    }
  });

  it('inletControl() headwater rises with discharge for every entrance type', () => {
    for (const type of Object.keys(inletCoefficients) as InletType[]) {
      const co = inletCoefficients[type];
      const b = co.barrel === 'box' ? box : pipe;
      let last = -Infinity;
      for (let x = 0.25; x <= 8; x += 0.25) {
        const hw = inletControl(b, co, qFor(b, x), 0.01, SI).headwaterDepth;
        expect(hw, `${type} X = ${x}`).toBeGreaterThan(last);
        last = hw;
      }
    }
  });

  it('inletCoefficients carries the confirmed HDS-5 entrance losses ke', () => {
    // HDS-5 entrance-loss table (confirmed): square edge 0.5, groove end 0.2, mitered 0.7, CM projecting 0.9, box 30–75° 0.4
    expect(inletCoefficients['concrete-pipe-square-edge-headwall'].ke).toBe(0.5);
    expect(inletCoefficients['concrete-pipe-groove-end-headwall'].ke).toBe(0.2);
    expect(inletCoefficients['corrugated-pipe-mitered'].ke).toBe(0.7);
    expect(inletCoefficients['corrugated-pipe-projecting'].ke).toBe(0.9);
    expect(inletCoefficients['box-wingwalls-30-75'].ke).toBe(0.4);
    expect(inletCoefficients['corrugated-pipe-mitered'].Ks).toBe(0.7);
  });
});
