/**
 * Reading a model file: text → JSON → validated Model. A byte-order mark is dropped; an empty file, a file that
 * is not UTF-8 (UTF-16), a syntax error (with line:column) or a missing file is an InputError naming the file.
 */
import { readFileSync } from 'node:fs';
import { InputError } from '../../core/errors.js';
import { findJsonSyntaxProblem } from './jsonPosition.js';
import * as msg from './messages.js';
import type { Model } from './types.js';
import { ModelFileError, type ValidateOptions, validateModel } from './validate.js';

/** Parse model text; `fileLabel` names the file in problems (e.g. "samples/swale.json"). */
export function parseModelText(text: string, fileLabel: string, options: ValidateOptions = {}): Model {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') throw new ModelFileError(fileLabel, [{ where: fileLabel, message: msg.fileEmpty() }]);
  // JSON text holds no NUL; a UTF-16 file read as UTF-8 is full of them (every ASCII character has a zero byte)
  if (body.includes('\u0000')) throw new ModelFileError(fileLabel, [{ where: fileLabel, message: msg.notUtf8() }]);
  let json: unknown;
  try {
    json = JSON.parse(body);
  } catch (error) {
    const found = findJsonSyntaxProblem(body);
    const where = found === undefined ? fileLabel : `${fileLabel}:${found.line}:${found.column}`;
    const problem = found?.message ?? (error instanceof Error ? error.message : String(error));
    throw new ModelFileError(fileLabel, [{ where, message: msg.jsonSyntax(problem) }]);
  }
  return validateModel(json, fileLabel, options);
}

/** Read and validate a model file. */
export function readModelFile(path: string, options: ValidateOptions = {}): Model {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const message = code === 'ENOENT' ? msg.fileNotFound() : msg.fileUnreadable(code ?? String(error));
    throw new InputError({ where: path, message });
  }
  return parseModelText(text, path, options);
}
