import { describe, expect, it } from 'vitest';
import { ratingTable } from '../../src/analysis/rating.js';
import { InputError } from '../../src/core/errors.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { manningRectangleDepth, twoReachModel, uniformModel } from './models.js';

describe('ratingTable', () => {
  it('ratingTable stages rise with discharge at every station', () => {
    const discharges = [2, 4, 6, 8, 10, 12, 14];
    const table = ratingTable(twoReachModel(), [100, 700, 1300], discharges);
    expect(table.rows.map((r) => r.discharge)).toEqual(discharges);
    for (let i = 1; i < table.rows.length; i++) {
      table.rows[i]!.values.forEach((v, j) => expect(v.stage).toBeGreaterThan(table.rows[i - 1]!.values[j]!.stage));
    }
    // the fixed stage downstream is said to shape the stages there
    expect(table.warnings[0]).toMatch(/fixed stage for every discharge/);
  });

  it('ratingTable(uniform canal) gives bed + Manning normal depth and velocity Q/A', () => {
    // Manning 1891 normal depth, solved independently; continuity V = Q/A
    const table = ratingTable(uniformModel(), [1000], [5, 10, 20]);
    for (const row of table.rows) {
      const v = row.values[0]!;
      const y = manningRectangleDepth(row.discharge, 6, 0.02, 0.001);
      assertInDelta(v.depth, y, 1e-3, `depth at Q ${row.discharge}`);
      assertRelative(v.velocity, row.discharge / (6 * v.depth), 1e-9, 'velocity');
      assertInDelta(v.stage - v.depth, 1, 1e-9, 'bed elevation (0.001 × 1000 m above the outlet)');
    }
  });

  it('ratingTable refuses a station off the channel, naming the flag', () => {
    expect(() => ratingTable(uniformModel(), [2500], [5])).toThrow(InputError);
    expect(() => ratingTable(uniformModel(), [2500], [5])).toThrow('--stations: station 2500 lies outside the channel (stations 0 to 2000)');
  });
});
