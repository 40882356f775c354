/** formatTable, formatNumber, formatPairs: aligned text with units in the headers and no NaN ever printed. */
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPairs, formatSignificant, formatTable, withUnit } from '../../src/output/table.js';

describe('formatTable(columns, rows)', () => {
  it('formatTable(columns, rows) aligns numbers right, text left, and puts units in the headers', () => {
    const rows = [
      { station: 0, depth: 1.23456, regime: 'subcritical' },
      { station: 125.5, depth: 0.5, regime: 'supercritical' },
    ];
    const text = formatTable(
      [
        { header: 'station', unit: 'm', value: (r: (typeof rows)[number]) => r.station, decimals: 1 },
        { header: 'depth', unit: 'm', value: (r) => r.depth, decimals: 3 },
        { header: 'regime', value: (r) => r.regime },
      ],
      rows,
    );
    expect(text.split('\n')).toEqual([
      'station (m)  depth (m)  regime',
      '───────────  ─────────  ─────────────',
      '        0.0      1.235  subcritical',
      '      125.5      0.500  supercritical',
    ]);
  });

  it('formatTable(columns, rows) prints a missing or non-finite value as a dash, never NaN', () => {
    const text = formatTable([{ header: 'normal depth', unit: 'ft', value: (r: { y: number | null }) => r.y }], [{ y: null }, { y: Number.NaN }, { y: Infinity }]);
    expect(text).not.toMatch(/NaN|Infinity/);
    // the header "normal depth (ft)" is 17 characters wide; the dash sits at its right edge
    expect(text.split('\n').slice(2)).toEqual(Array(3).fill(`${' '.repeat(16)}—`));
  });
});

describe('formatNumber(value, decimals)', () => {
  it('formatNumber(value) fixes the decimals and never prints −0', () => {
    expect(formatNumber(1.23456, 2)).toBe('1.23');
    expect(formatNumber(-0.0001, 2)).toBe('0.00');
    expect(formatNumber(Number.NaN)).toBe('—');
    expect(formatSignificant(0.0008)).toBe('0.0008');
    expect(formatSignificant(0.0027281)).toBe('0.002728');
    expect(withUnit(null, 'm')).toBe('—');
    expect(withUnit(2.5, 'm³/s', 2)).toBe('2.50 m³/s');
  });

  it('formatPairs(pairs) aligns the labels', () => {
    expect(formatPairs([['normal depth', '1.295 m'], ['slope class', 'mild']])).toBe('normal depth  1.295 m\nslope class   mild');
  });
});
