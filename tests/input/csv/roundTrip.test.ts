/**
 * Property tests (fast-check): a station table written out by an independent RFC 4180 writer (Shafranovich
 * 2005, §2: fields with commas, quotes or line breaks are quoted and quotes doubled; CRLF or LF records),
 * with a random byte-order mark, blank lines and comment lines, reads back to the same numbers, and a single
 * spoiled cell is reported at exactly the line and column the writer put it on.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readStations } from '../../../src/input/csv/stations.js';
import { InputError } from '../../../src/core/errors.js';
import { SI } from '../../../src/core/units.js';

interface Layout {
  bom: boolean;
  newline: '\n' | '\r\n';
  /** blank or comment lines before each record (header first) */
  fillers: ('' | '# invented survey')[][];
  quoteAll: boolean;
}

/** RFC 4180 field: quoted when it must be (or when asked), quotes doubled. */
function field(text: string, quote: boolean): string {
  return quote || /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Write records; return the text and the 1-based line where each record starts. */
function write(records: string[][], layout: Layout): { text: string; lines: number[] } {
  let text = layout.bom ? '\uFEFF' : '';
  let line = 1;
  const lines: number[] = [];
  records.forEach((record, i) => {
    for (const filler of layout.fillers[i] ?? []) {
      text += filler + layout.newline;
      line += 1;
    }
    lines.push(line);
    const written = record.map((f) => field(f, layout.quoteAll)).join(',');
    text += written + layout.newline;
    line += 1 + (written.match(/\n/g)?.length ?? 0);
  });
  return { text, lines };
}

const number = fc.double({ min: -1e5, max: 1e5, noNaN: true }).map((v) => (v === 0 ? 0 : Number(v.toPrecision(8))));
// Section names with commas, quotes and line breaks, to exercise quoting.
const name = fc.stringMatching(/^[A-Za-z][A-Za-z0-9 ,"\n-]{0,8}[A-Za-z0-9]$/);
const table = fc
  .tuple(fc.uniqueArray(number, { minLength: 2, maxLength: 12, comparator: 'SameValueZero' }), fc.array(number, { minLength: 12, maxLength: 12 }), fc.array(name, { minLength: 12, maxLength: 12 }))
  .map(([stations, beds, names]) => {
    const sorted = [...stations].sort((a, b) => a - b);
    return sorted.map((s, i) => ({ station: s, bed: beds[i] ?? 0, section: names[i] ?? 'A' }));
  });
const layout = (rows: number) =>
  fc.record({
    bom: fc.boolean(),
    newline: fc.constantFrom<'\n' | '\r\n'>('\n', '\r\n'),
    fillers: fc.array(fc.array(fc.constantFrom<'' | '# invented survey'>('', '# invented survey'), { maxLength: 2 }), {
      minLength: rows + 1,
      maxLength: rows + 1,
    }),
    quoteAll: fc.boolean(),
  });

describe('readStations round trip', () => {
  it('readStations(RFC 4180 text) gives back every value and the line each record started on', () => {
    fc.assert(
      fc.property(
        table.chain((rows) => fc.tuple(fc.constant(rows), layout(rows.length))),
        ([rows, lay]) => {
          const records = [['Station (m)', 'bed_elev_m', 'section'], ...rows.map((r) => [String(r.station), String(r.bed), r.section])];
          const { text, lines } = write(records, lay);
          const read = readStations(text, 's.csv', SI, { direction: 'downstream' });
          expect(read.map((r) => [r.station, r.bedElevation, r.section])).toEqual(rows.map((r) => [r.station, r.bed, r.section.trim()]));
          expect(read.map((r) => r.line)).toEqual(lines.slice(1));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('readStations(text with one spoiled cell) names that cell\'s line and column', () => {
    fc.assert(
      fc.property(
        table.chain((rows) =>
          fc.tuple(fc.constant(rows), layout(rows.length), fc.nat(rows.length - 1), fc.constantFrom(0, 1), fc.constantFrom('x1', 'NaN', '1,5', '')),
        ),
        ([rows, lay, row, column, spoil]) => {
          const records = [['station', 'bed', 'section'], ...rows.map((r) => [String(r.station), String(r.bed), 'A'])];
          const record = records[row + 1];
          if (record) record[column] = spoil;
          const { text, lines } = write(records, lay);
          let error: unknown;
          try {
            readStations(text, 's.csv', SI, { direction: 'downstream' });
          } catch (e) {
            error = e;
          }
          expect(error).toBeInstanceOf(InputError);
          const wheres = (error as InputError).problems.map((p) => p.where);
          expect(wheres).toContain(`s.csv:${lines[row + 1]}:${column + 1}`);
        },
      ),
      { numRuns: 300 },
    );
  });
});
