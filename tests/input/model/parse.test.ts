/**
 * parseModelText / readModelFile: JSON syntax errors are placed by line and column (RFC 8259 grammar),
 * a byte-order mark is dropped, an empty or missing file says so.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors.js';
import { findJsonSyntaxProblem, lineColumn } from '../../../src/input/model/jsonPosition.js';
import { parseModelText, readModelFile } from '../../../src/input/model/parse.js';

const model = `{
  "units": "SI",
  "sections": { "c": { "shape": "rectangular", "bottomWidth": 2, "n": 0.015 } },
  "reaches": [ { "id": "r", "section": "c", "length": 100, "slope": 0.001 } ],
  "flows": [ { "id": "q", "discharge": 1.5 } ]
}
`;

function problemOf(text: string): string {
  try {
    parseModelText(text, 'swale.json');
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`).join('\n');
  }
  throw new Error('accepted');
}

describe('parseModelText(text, file)', () => {
  it('parseModelText(text) reads a model, with or without a byte-order mark and with CRLF line ends', () => {
    expect(parseModelText(model, 'swale.json').flows[0]!.discharge).toBe(1.5);
    expect(parseModelText(`\uFEFF${model}`, 'swale.json').units).toBe('SI');
    expect(parseModelText(model.replace(/\n/g, '\r\n'), 'swale.json').reaches).toHaveLength(1);
  });

  it('parseModelText(text) places a trailing comma at its line and column', () => {
    const text = model.replace('"discharge": 1.5 } ]', '"discharge": 1.5, } ]');
    expect(problemOf(text)).toBe(
      'swale.json:5:45: not valid JSON: expected another key after "," (a trailing comma is not allowed), found "}"',
    );
  });

  it('parseModelText(text) places a missing comma, an unquoted word and a truncated file', () => {
    expect(problemOf(model.replace('"units": "SI",', '"units": "SI"'))).toBe(
      'swale.json:3:3: not valid JSON: expected "," or "}", found "\\""',
    );
    expect(problemOf(model.replace('"SI"', 'SI'))).toBe(
      'swale.json:2:12: not valid JSON: expected a value (a number, text in double quotes, true, false, null, [ or {), found "S"',
    );
    expect(problemOf(model.slice(0, 37))).toBe('swale.json:3:19: not valid JSON: the file ends inside text; a closing double quote is missing');
    expect(problemOf(model.slice(0, 40))).toBe(
      'swale.json:3:22: not valid JSON: expected a value (a number, text in double quotes, true, false, null, [ or {), found the end of the file',
    );
    expect(problemOf('{ "units": "SI" ')).toBe('swale.json:1:17: not valid JSON: expected "," or "}", found the end of the file');
  });

  it('parseModelText(text) refuses NaN and Infinity written as words, and numbers too large for a double', () => {
    expect(problemOf('{"units": NaN}')).toBe(
      'swale.json:1:11: not valid JSON: expected a value (a number, text in double quotes, true, false, null, [ or {), found "N" (NaN and Infinity are not numbers in JSON: give a finite number)',
    );
    const huge = model.replace('"discharge": 1.5', '"discharge": 1e400');
    expect(problemOf(huge)).toBe('flows[0].discharge: expected a finite number, got Infinity');
  });

  it('parseModelText(text) says an empty file is empty', () => {
    const message = 'swale.json: the file is empty; expected a JSON object holding the model (see schema/gvf-model.schema.json)';
    expect(problemOf('')).toBe(message);
    expect(problemOf('\uFEFF  \r\n')).toBe(message);
  });

  it('lineColumn(text, offset) counts lines from 1 and columns from 1', () => {
    expect(lineColumn('ab\ncd', 0)).toEqual({ line: 1, column: 1 });
    expect(lineColumn('ab\ncd', 4)).toEqual({ line: 2, column: 2 });
    expect(findJsonSyntaxProblem('{"a": [1, 2]}')).toBeUndefined();
    expect(findJsonSyntaxProblem('{"a": "\\x"}')).toEqual({ line: 1, column: 9, message: 'expected an escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t or \\uXXXX), found "x"' });
  });
});

describe('readModelFile(path)', () => {
  it('readModelFile(path) reads a file, and names a missing one', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gvf-model-'));
    const file = join(dir, 'swale.json');
    writeFileSync(file, model);
    expect(readModelFile(file).sections.c).toMatchObject({ shape: 'rectangular' });
    const missing = join(dir, 'nothing.json');
    expect(() => readModelFile(missing)).toThrowError(new InputError({ where: missing, message: 'no such file' }));
  });
});
