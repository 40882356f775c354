/**
 * A CSV file as a table of text cells, each knowing its line and column, so every later problem can name
 * `file:line:column`. Parsing is papaparse's (RFC 4180 quoting); this module adds the positions and the
 * checks a spreadsheet export needs.
 *
 * Stages:
 *   1. strip a UTF-8 byte-order mark; refuse NUL bytes (UTF-16 or binary files);
 *   2. turn CRLF and lone CR line breaks into LF (so line counting and papaparse agree);
 *   3. papaparse with the delimiter fixed to a comma and blank lines kept, so rows map to lines;
 *   4. give each row and field its line, counting the line breaks kept inside quoted fields;
 *   5. drop blank rows (all cells empty) and comment rows (first cell starting with `#`);
 *   6. the first remaining row is the header; a semicolon or tab inside it means another delimiter: refused.
 *
 * Columns are counted the way a spreadsheet counts them: the first field of a row is column 1.
 */
import Papa from 'papaparse';
import { InputError } from '../../core/errors.js';
import { at } from './problems.js';
import * as say from './messages.js';

export interface CsvCell {
  /** the field's text, trimmed of surrounding white space */
  readonly text: string;
  /** 1-based line where the field starts */
  readonly line: number;
  /** 1-based field position in its row */
  readonly column: number;
}

export interface CsvRow {
  /** 1-based line where the row starts */
  readonly line: number;
  readonly cells: readonly CsvCell[];
}

export interface CsvTable {
  /** the label used in messages, e.g. `survey/stations.csv` */
  readonly file: string;
  readonly header: CsvRow;
  /** the data rows after the header, blank and comment rows left out */
  readonly rows: readonly CsvRow[];
}

const byteOrderMark = '\uFEFF';

/** Parse CSV text into positioned cells. Throws InputError for a file that is not readable as CSV at all. */
export function parseCsvTable(text: string, fileLabel: string): CsvTable {
  let source = text.startsWith(byteOrderMark) ? text.slice(byteOrderMark.length) : text;
  const nul = source.indexOf('\u0000');
  if (nul >= 0) {
    const line = lineStarts(source.slice(0, nul + 1)).length;
    throw new InputError({ where: at(fileLabel, line, 1), message: say.notText() });
  }
  source = source.replace(/\r\n?/g, '\n');
  const parsed = Papa.parse<string[]>(source, {
    delimiter: ',',
    newline: '\n',
    header: false,
    skipEmptyLines: false,
    dynamicTyping: false,
  });
  const error = parsed.errors[0];

  // With blank lines kept, papaparse gives one row per line, except that a line break inside a quoted field
  // (kept in the field's text) continues the row. So a row's line is its index plus the breaks inside the
  // fields before it, and a field's line adds the breaks in the fields before it in its row.
  const rows: CsvRow[] = [];
  let line = 1;
  for (const [index, fields] of parsed.data.entries()) {
    if (error !== undefined && index >= (error.row ?? Infinity)) break;
    const rowLine = line;
    const cells: CsvCell[] = [];
    let blank = true;
    for (const [i, raw] of fields.entries()) {
      const text = raw.trim();
      if (text !== '') blank = false;
      cells.push({ text, line, column: i + 1 });
      for (let k = raw.indexOf('\n'); k >= 0; k = raw.indexOf('\n', k + 1)) line += 1;
    }
    line += 1;
    if (blank || cells[0]?.text.startsWith('#')) continue;
    rows.push({ line: rowLine, cells });
  }
  if (error !== undefined) {
    throw new InputError({ where: at(fileLabel, line), message: say.badQuotes(error.code) });
  }

  const header = rows.shift();
  if (header === undefined) {
    throw new InputError({ where: at(fileLabel, 1, 1), message: say.emptyFile() });
  }
  for (const cell of header.cells) {
    if (cell.text.includes(';') || cell.text.includes('\t')) {
      const delimiter = cell.text.includes(';') ? 'semicolon' : 'tab';
      throw new InputError({ where: at(fileLabel, cell.line, cell.column), message: say.wrongDelimiter(delimiter), value: cell.text });
    }
  }
  return { file: fileLabel, header, rows };
}

/** The cell of `row` at 0-based field `index`; a missing trailing field reads as empty text at its position. */
export function cellAt(row: CsvRow, index: number): CsvCell {
  const cell = row.cells[index];
  if (cell !== undefined) return cell;
  const last = row.cells[row.cells.length - 1];
  return { text: '', line: last?.line ?? row.line, column: index + 1 };
}

/** Offsets where each line starts. */
function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
  return starts;
}
