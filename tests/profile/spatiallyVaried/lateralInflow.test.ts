import { describe, expect, it } from 'vitest';
import { inflowLayout } from '../../../src/profile/spatiallyVaried/lateralInflow.js';
import { assertRelative } from '../../helpers/assert.js';

describe('inflowLayout', () => {
  it('inflowLayout(stretches).discharge(x) is Q0 + ∫q* (continuity, Chow 1959 §12-1)', () => {
    const layout = inflowLayout(100, 2, [
      { from: 60, to: 100, inflow: 0.05 },
      { from: 10, to: 30, inflow: 0.2 },
    ]);
    expect(layout.breaks).toEqual([0, 10, 30, 60, 100]);
    expect(layout.discharge(0)).toBe(2);
    assertRelative(layout.discharge(20), 2 + 0.2 * 10, 1e-15);
    assertRelative(layout.discharge(45), 2 + 0.2 * 20, 1e-15);
    assertRelative(layout.discharge(100), 2 + 4 + 0.05 * 40, 1e-15);
    expect(layout.inflowAt(30)).toBe(0);
    expect(layout.inflowAt(30, 'upstream')).toBe(0.2);
    expect(layout.inflowAt(60)).toBe(0.05);
  });

  it('inflowLayout(q*) spreads one value over the whole reach', () => {
    const layout = inflowLayout(50, 0, 0.3);
    expect(layout.breaks).toEqual([0, 50]);
    assertRelative(layout.discharge(50), 15, 1e-15);
  });
});
