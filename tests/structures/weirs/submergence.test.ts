import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { sharpCrestedRectangular } from '../../../src/structures/weirs/sharpCrested.js';
import { submergedHead, villemonteFactor } from '../../../src/structures/weirs/submergence.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

const free = (h: number) => 1.84 * 2 * Math.pow(Math.max(h, 0), 1.5);

describe('Villemonte submergence', () => {
  it('villemonteFactor(0.5, 1.5) equals (1 − 0.5^1.5)^0.385 = 0.8454', () => {
    // Villemonte (1947), Q/Q1 = (1 − (H2/H1)^n)^0.385; value computed from the equation.
    assertInDelta(villemonteFactor(0.5, 1.5), 0.84539, 1e-5, 'factor');
    assertInDelta(villemonteFactor(0.8, 2.5), Math.pow(1 - Math.pow(0.8, 2.5), 0.385), 1e-15, 'V-notch');
  });

  it('villemonteFactor() is 1 at zero submergence and 0 at full submergence', () => {
    expect(villemonteFactor(0, 1.5)).toBe(1);
    expect(villemonteFactor(-0.2, 1.5)).toBe(1);
    expect(villemonteFactor(1, 1.5)).toBe(0);
  });

  it('submergedHead() reduces to the free head at zero tailwater head', () => {
    const s = submergedHead(free, 1.5, 0.8, 0, 0.5);
    assertRelative(s.head, s.freeHead, 1e-12, 'head');
    assertRelative(free(s.head), 0.8, 1e-9, 'Q');
  });

  it('submergedHead() satisfies Q = Q1(H1)·(1 − (H2/H1)^n)^0.385 and lies above both H2 and the free head', () => {
    const s = submergedHead(free, 1.5, 0.8, 0.35, 0.5);
    assertRelative(free(s.head) * villemonteFactor(0.35 / s.head, 1.5), 0.8, 1e-9, 'Q');
    expect(s.head).toBeGreaterThan(0.35);
    expect(s.head).toBeGreaterThan(s.freeHead);
  });

  it('sharpCrestedRectangular() headwater rises with the tailwater and with discharge when submerged', () => {
    const spec = { crestLength: 2, crestHeight: 1, crestElevation: 100 };
    let last = -Infinity;
    for (const tw of [99.5, 100.0, 100.1, 100.2, 100.3]) {
      const out = sharpCrestedRectangular(spec, 0.6, tw, SI);
      expect(out.headwaterStage).toBeGreaterThanOrEqual(last);
      last = out.headwaterStage;
    }
    expect(sharpCrestedRectangular(spec, 0.6, 100.2, SI).condition).toBe('submerged');
    last = -Infinity;
    for (const q of [0.3, 0.6, 1, 2]) {
      const out = sharpCrestedRectangular(spec, q, 100.25, SI);
      expect(out.headwaterStage).toBeGreaterThan(last);
      last = out.headwaterStage;
    }
  });

  it('sharpCrestedRectangular() with the tailwater below the crest is free flow', () => {
    const spec = { crestLength: 2, crestHeight: 1, crestElevation: 100 };
    const a = sharpCrestedRectangular(spec, 0.6, null, SI);
    const b = sharpCrestedRectangular(spec, 0.6, 99.9, SI);
    expect(b.condition).toBe('free');
    assertInDelta(b.headwaterStage, a.headwaterStage, 1e-12, 'stage');
  });
});
