/**
 * A CSV file as a table of text cells, each knowing its line and column, so every later problem can name
 * `file:line:column`. Parsing is papaparse's (RFC 4180 quoting); this module adds the positions and the
 * checks a spreadsheet export needs.
 *
 * Stages:
 *   1. strip a UTF-8 byte-order mark; refuse NUL bytes (UTF-16 or binary files);
 *   2. turn CRLF and lone CR line breaks into LF (so line counting and papaparse agree);
 *   3. papaparse row by row (delimiter fixed to a comma), recording where each row starts (meta.cursor);
 *   4. locate each field's start inside its row (a quoted field may span lines) to give its line;
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
  const starts = lineStarts(source);

  const rows: CsvRow[] = [];
  let rowStart = 0;
  let parseError: { line: number; message: string } | undefined;
  Papa.parse<string[]>(source, {
    delimiter: ',',
    newline: '\n',
    header: false,
    skipEmptyLines: false,
    dynamicTyping: false,
    step(result, parser) {
      const start = rowStart;
      rowStart = result.meta.cursor;
      const line = lineOf(starts, start);
      const error = result.errors[0];
      if (error !== undefined) {
        parseError = { line, message: say.badQuotes(error.code) };
        parser.abort();
        return;
      }
      const fields = result.data;
      const fieldLines = locateFields(source, start, fields.length, starts);
      const cells = fields.map((raw, i) => ({ text: raw.trim(), line: fieldLines[i] ?? line, column: i + 1 }));
      if (cells.every((c) => c.text === '')) return;
      if (cells[0]?.text.startsWith('#')) return;
      rows.push({ line, cells });
    },
  });
  if (parseError !== undefined) {
    throw new InputError({ where: at(fileLabel, parseError.line), message: parseError.message });
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

/** 1-based line holding offset `offset` (binary search over line starts). */
function lineOf(starts: readonly number[], offset: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((starts[mid] ?? 0) <= offset) lo = mid;
    else hi = mid - 1;
  }
  return lo + 1;
}

/**
 * The line where each field of the row starting at `start` begins. Follows RFC 4180 quoting as papaparse
 * does: a quote opens a quoted field only at the field's start, and `""` inside it is a literal quote.
 * If the count disagrees with papaparse's, positions fall back to the row's line (cellAt's default).
 */
function locateFields(text: string, start: number, count: number, starts: readonly number[]): number[] {
  const lines: number[] = [lineOf(starts, start)];
  let i = start;
  let fieldStart = start;
  let quoted = false;
  // Bounded by the text length: each pass advances i by at least one.
  while (i < text.length) {
    const c = text[i];
    if (quoted) {
      if (c === '"') {
        if (text[i + 1] === '"') i += 1;
        else quoted = false;
      }
    } else if (c === '"' && i === fieldStart) {
      quoted = true;
    } else if (c === ',') {
      fieldStart = i + 1;
      lines.push(lineOf(starts, fieldStart));
    } else if (c === '\n') {
      break;
    }
    i += 1;
  }
  return lines.length === count ? lines : [];
}
