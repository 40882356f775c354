import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { conveyance } from '../../src/hydraulics/hydraulicSection.js';
import { criticalDepth } from '../../src/hydraulics/criticalDepth.js';
import { normalDepth, normalDepths } from '../../src/hydraulics/normalDepth.js';
import { classifySlope, criticalSlope } from '../../src/hydraulics/slopeClass.js';
import { assertRelative } from '../helpers/assert.js';
import { pipe, rect, trap } from './sections.js';

describe('classifySlope', () => {
  it('classifySlope follows the definitions: mild yn > yc, steep yn < yc, horizontal, adverse', () => {
    // slope classes by comparing normal and critical depth (Chow 1959, ch. 9; published)
    expect(classifySlope(0.001, 1.4, 0.9)).toBe('mild');
    expect(classifySlope(0.02, 0.6, 0.9)).toBe('steep');
    expect(classifySlope(0, null, 0.9)).toBe('horizontal');
    expect(classifySlope(-0.001, null, 0.9)).toBe('adverse');
    expect(classifySlope(0.001, 0.9 * (1 + 1e-4), 0.9)).toBe('critical');
  });

  it('classifySlope with the critical slope uses the band on the slope', () => {
    const hs = trap(3, 2, 0.02);
    const q = 10;
    const sc = criticalSlope(hs, q);
    const yc = criticalDepth(hs, q);
    // at the critical slope the normal depth is the critical depth (definition of Sc; exact)
    assertRelative(normalDepth(hs, q, sc)!, yc, 1e-9, 'yn(Sc) = yc');
    expect(classifySlope(sc * (1 + 5e-4), normalDepth(hs, q, sc * (1 + 5e-4)), yc, sc)).toBe('critical');
    expect(classifySlope(sc * 1.1, normalDepth(hs, q, sc * 1.1), yc, sc)).toBe('steep');
    expect(classifySlope(sc * 0.9, normalDepth(hs, q, sc * 0.9), yc, sc)).toBe('mild');
  });

  it('classifySlope of a conduit flowing full is mild', () => {
    const hs = pipe(1);
    const s = 0.001;
    const q = 1.2 * conveyance(hs, 1) * Math.sqrt(s);
    const r = normalDepths(hs, q, s);
    expect(r.fullFlow).toBe(true);
    expect(classifySlope(s, r.depth, criticalDepth(hs, q))).toBe('mild');
  });

  it('classifySlope of a real channel: mild at 0.0005, steep at 0.02', () => {
    const hs = rect(3, 0.015);
    const q = 6;
    const yc = criticalDepth(hs, q);
    expect(classifySlope(0.0005, normalDepth(hs, q, 0.0005), yc)).toBe('mild');
    expect(classifySlope(0.02, normalDepth(hs, q, 0.02), yc)).toBe('steep');
  });

  it('classifySlope rejects a slope that is not a number', () => {
    expect(() => classifySlope(Number.NaN, 1, 1)).toThrow(HydraulicError);
  });
});
