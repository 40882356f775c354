/**
 * Reading a model file: text → JSON → validated Model. A byte-order mark is dropped; an empty file, a file that
 * is not UTF-8 (UTF-16), a syntax error (with line:column) or a missing file is an InputError naming the file.
 */
import { readFileSync } from 'node:fs';
import { InputError } from '../../core/errors.js';
import { findJsonSyntaxProblem, lineColumn } from './jsonPosition.js';
import { maxNesting } from './limits.js';
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
  // valid JSON nested thousands deep would overflow the call stack of the checks that walk it
  const deep = nestedTooDeep(body, maxNesting);
  if (deep !== undefined) {
    const { line, column } = lineColumn(body, deep);
    throw new ModelFileError(fileLabel, [{ where: `${fileLabel}:${line}:${column}`, message: msg.tooDeep() }]);
  }
  return validateModel(json, fileLabel, options);
}

/** The offset where valid JSON `text` first opens more than `limit` lists and objects, if it does. */
function nestedTooDeep(text: string, limit: number): number | undefined {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (inString) {
      if (c === '\\') i++;
      else if (c === '"') inString = false;
    } else if (c === '"') inString = true;
    else if (c === '[' || c === '{') {
      if (++depth > limit) return i;
    } else if (c === ']' || c === '}') depth--;
  }
  return undefined;
}

/** Read and validate a model file. */
export function readModelFile(path: string, options: ValidateOptions = {}): Model {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const message =
      code === 'ENOENT' ? msg.fileNotFound() : code === 'EISDIR' ? msg.fileIsFolder() : msg.fileUnreadable(code ?? String(error));
    throw new InputError({ where: path, message });
  }
  return parseModelText(text, path, options);
}
