/**
 * The CSV layer against the format's published definition: RFC 4180 (Shafranovich 2005, "Common Format and
 * MIME Type for Comma-Separated Values (CSV) Files", §2: CRLF line breaks, a header line, fields in double
 * quotes may hold commas and line breaks, a quote inside a quoted field is doubled), and the Unicode
 * Standard's U+FEFF byte-order mark (chapter 23, "Specials"; from memory) that spreadsheet programs put
 * at the start of a "CSV UTF-8" file.
 */
import { describe, expect, it } from 'vitest';
import { parseCsvTable, cellAt } from '../../../src/input/csv/table.js';
import { InputError } from '../../../src/core/errors.js';

/** The InputError a call throws (fails the test when it throws nothing or something else). */
function inputError(call: () => unknown): InputError {
  try {
    call();
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return error as InputError;
  }
  throw new Error('expected an InputError, nothing was thrown');
}

const texts = (t: ReturnType<typeof parseCsvTable>) => t.rows.map((r) => r.cells.map((c) => c.text));

describe('parseCsvTable', () => {
  it('parseCsvTable(text) reads a header and rows, with 1-based lines and columns', () => {
    const t = parseCsvTable('station,bed\n0,10\n5,9.5\n', 'a.csv');
    expect(t.header.cells.map((c) => c.text)).toEqual(['station', 'bed']);
    expect(texts(t)).toEqual([['0', '10'], ['5', '9.5']]);
    expect(t.rows[1]?.line).toBe(3);
    expect(t.rows[1]?.cells[1]).toEqual({ text: '9.5', line: 3, column: 2 });
  });

  it('parseCsvTable(text) strips a UTF-8 byte-order mark (Unicode U+FEFF) from the first header', () => {
    const t = parseCsvTable('\uFEFFstation,bed\n0,1\n', 'a.csv');
    expect(t.header.cells[0]?.text).toBe('station');
    expect(t.header.cells[0]?.column).toBe(1);
  });

  it('parseCsvTable(text) accepts CRLF (RFC 4180 §2.1) and lone CR line breaks, counting lines alike', () => {
    const crlf = parseCsvTable('station,bed\r\n0,1\r\n2,3\r\n', 'a.csv');
    const cr = parseCsvTable('station,bed\r0,1\r2,3\r', 'a.csv');
    for (const t of [crlf, cr]) {
      expect(texts(t)).toEqual([['0', '1'], ['2', '3']]);
      expect(t.rows.map((r) => r.line)).toEqual([2, 3]);
    }
  });

  it('parseCsvTable(text) keeps commas, doubled quotes and line breaks inside quoted fields (RFC 4180 §2.6–2.7)', () => {
    const t = parseCsvTable('id,note,value\r\n"A, left","say ""hi""\r\nagain",7\r\nB,x,8\r\n', 'a.csv');
    expect(texts(t)).toEqual([['A, left', 'say "hi"\nagain', '7'], ['B', 'x', '8']]);
    // The third field starts on line 3, after the line break inside the quoted second field.
    expect(t.rows[0]?.cells[2]).toEqual({ text: '7', line: 3, column: 3 });
    expect(t.rows[1]?.line).toBe(4);
  });

  it('parseCsvTable(text) skips blank and comment lines but counts them in line numbers', () => {
    const t = parseCsvTable('\n# invented data\nstation,bed\n\n0,1\n , \n# a note\n2,3\n', 'a.csv');
    expect(t.header.line).toBe(3);
    expect(t.rows.map((r) => r.line)).toEqual([5, 8]);
  });

  it('parseCsvTable(text) trims white space around fields', () => {
    const t = parseCsvTable(' station , bed \n 0 ,\t1 \n', 'a.csv');
    expect(t.header.cells.map((c) => c.text)).toEqual(['station', 'bed']);
    expect(texts(t)).toEqual([['0', '1']]);
  });

  it('parseCsvTable(text) refuses a semicolon-separated file, naming the header cell and asking for commas', () => {
    const e = inputError(() => parseCsvTable('station;bed;section\n0;10,5;A\n', 'survey.csv'));
    expect(e.problems).toHaveLength(1);
    expect(e.message).toMatchInlineSnapshot(
      `"survey.csv:1:1: the header looks semicolon-separated; gvf reads comma-separated values: save the file as CSV with commas between fields and a point as the decimal separator"`,
    );
  });

  it('parseCsvTable(text) refuses a tab-separated file', () => {
    const e = inputError(() => parseCsvTable('# invented\nstation\tbed\n0\t1\n', 't.csv'));
    expect(e.problems[0]?.where).toBe('t.csv:2:1');
    expect(e.message).toContain('tab-separated');
  });

  it('parseCsvTable(text) refuses an empty file, a file of blank lines, and one of only a byte-order mark', () => {
    for (const text of ['', '\n\n  \r\n', '\uFEFF', '# only a comment\n']) {
      const e = inputError(() => parseCsvTable(text, 'e.csv'));
      expect(e.message).toBe('e.csv:1:1: the file is empty: expected a header row naming the columns, then one row per entry');
    }
  });

  it('parseCsvTable(text) refuses NUL bytes (a UTF-16 or binary file), naming the line', () => {
    const e = inputError(() => parseCsvTable('station,bed\n0,1\n\u00002', 'u.csv'));
    expect(e.problems[0]?.where).toBe('u.csv:3:1');
    expect(e.message).toContain('not UTF-8 text');
  });

  it('parseCsvTable(text) refuses an unclosed quote, naming the line where the quoted field starts', () => {
    const e = inputError(() => parseCsvTable('station,bed\n0,1\n2,"3\n4,5\n', 'q.csv'));
    expect(e.message).toMatchInlineSnapshot(
      `"q.csv:3: a quoted field is not closed: add the closing double quote (") or remove the opening one"`,
    );
  });

  it('cellAt(row, index) gives an empty cell at the right column for a short row', () => {
    const t = parseCsvTable('a,b,c\n1\n', 'a.csv');
    const row = t.rows[0];
    expect(row && cellAt(row, 2)).toEqual({ text: '', line: 2, column: 3 });
  });
});
