/** toCsv and stationsCsv: deterministic bytes, unit-labelled headers, RFC 4180 quoting, empty cells for missing values. */
import { describe, expect, it } from 'vitest';
import { csvHeader, stationsCsv, toCsv, unitSuffix } from '../../src/output/csv.js';
import type { RunResult } from '../../src/results/types.js';

describe('toCsv(columns, rows)', () => {
  it('unitSuffix(unit) turns printed units into header suffixes', () => {
    expect(unitSuffix('m³/s')).toBe('m3_s');
    expect(unitSuffix('ft/s')).toBe('ft_s');
    expect(csvHeader('station', 'm')).toBe('station_m');
    expect(csvHeader('froude')).toBe('froude');
  });

  it('toCsv(columns, rows) fixes decimals, quotes only where RFC 4180 needs it, leaves missing cells empty', () => {
    const text = toCsv(
      [
        { name: 'id', value: (r: { id: string; y: number | null }) => r.id },
        { name: 'depth', unit: 'm', value: (r) => r.y, decimals: 3 },
      ],
      [
        { id: 'a, "b"', y: 1.23456 },
        { id: 'c', y: null },
        { id: 'd', y: Number.NaN },
        { id: 'e', y: -0.0000001 },
      ],
    );
    expect(text).toBe('id,depth_m\n"a, ""b""",1.235\nc,\nd,\ne,0.000\n');
  });

  it('stationsCsv(run) writes one row per flow and station, the same bytes every time', () => {
    const run: RunResult = {
      units: 'US',
      method: 'standard-step',
      cautions: [],
      flows: [
        {
          id: 'Q100',
          discharge: 400,
          reaches: [],
          jumps: [],
          warnings: [],
          stations: [
            { station: 0, bedElevation: 10, depth: 3.36, wsel: 13.36, energyElevation: 13.7, velocity: 4.1, froude: 0.45, regime: 'subcritical', reach: 'r' },
          ],
        },
      ],
    };
    const text = stationsCsv(run);
    expect(text.split('\n')[0]).toBe(
      'flow,discharge_ft3_s,station_ft,reach,bed_elevation_ft,depth_ft,wsel_ft,energy_elevation_ft,velocity_ft_s,froude,regime,critical_depth_ft,normal_depth_ft',
    );
    expect(text.split('\n')[1]).toBe('Q100,400.0000,0.000,r,10.0000,3.3600,13.3600,13.7000,4.1000,0.4500,subcritical,,');
    expect(stationsCsv(run)).toBe(text);
  });
});
