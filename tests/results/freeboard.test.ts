/** freeboardRows: freeboard = bank − water surface; required = fixed + fraction × αV²/2g (the model's rule, common practice). */
import { describe, expect, it } from 'vitest';
import { freeboardRows, freeboardWarnings } from '../../src/results/freeboard.js';
import type { StationResult } from '../../src/results/types.js';
import { assertInDelta } from '../helpers/assert.js';

const station = (x: number, wsel: number, hv: number, left?: number, right?: number): StationResult => ({
  station: x, bedElevation: wsel - 1, depth: 1, wsel, energyElevation: wsel + hv, velocity: 1, froude: 0.3, regime: 'subcritical',
  ...(left === undefined ? {} : { leftBank: left }), ...(right === undefined ? {} : { rightBank: right }),
});

describe('freeboardRows(stations, requirement)', () => {
  it('freeboardRows: each side against fixed + fraction × velocity head; pass, overtopping of water and energy line', () => {
    const rows = freeboardRows(
      [station(0, 10, 0.2, 10.5, 10.45), station(10, 10, 0.2, 10.2, 10.6), station(20, 10, 0.3, 9.9, 11), station(30, 10, 0.2)],
      { fixed: 0.3, velocityHeadFraction: 0.5 },
    );
    expect(rows).toHaveLength(3); // the station without banks has no row
    assertInDelta(rows[0]!.required, 0.3 + 0.5 * 0.2, 1e-12, 'required');
    assertInDelta(rows[0]!.freeboardLeft!, 0.5, 1e-12, 'left');
    assertInDelta(rows[0]!.freeboardRight!, 0.45, 1e-12, 'right');
    expect(rows.map((r) => r.pass)).toEqual([true, false, false]);
    expect(rows.map((r) => r.overtopped)).toEqual([false, false, true]);
    // at station 10 the energy line (10.2) reaches the left bank top exactly: not above it
    expect(rows.map((r) => r.energyOvertopped)).toEqual([false, false, true]);
    const warnings = freeboardWarnings(rows, 'm', { fixed: 0.3, velocityHeadFraction: 0.5 });
    expect(warnings[0]).toMatch(/overtops .* station 20/);
    expect(warnings[1]).toMatch(/less than the required 0.3 m \+ 0.5 × velocity head at station 10\.$/);
  });
});
