/**
 * Paths to data files named inside a model file. They are read relative to the model file's folder, and a
 * path that leads outside that folder tree is refused unless the user allows it (`--allow-outside`): a model
 * received from someone else must not be able to read arbitrary files.
 *
 * The check is made twice: on the path as written (so `../../etc/x` and absolute paths are refused before
 * anything is touched), and again after resolving symbolic links with realpath (so a link inside the folder
 * cannot point out of it).
 */
import { readFileSync, realpathSync, statSync } from 'node:fs';
import path from 'node:path';
import { InputError } from '../../core/errors.js';
import * as say from './messages.js';

/**
 * The real path of the file `relativePath` names, relative to the folder of `modelFile`.
 * `jsonPath` is where the path was written in the model (e.g. `survey.stations`), for messages.
 * Throws InputError when the path is empty, outside the model's folder tree (unless `allowOutside`),
 * missing, or not a file.
 */
export function resolveModelPath(modelFile: string, relativePath: string, allowOutside: boolean, jsonPath: string): string {
  const fail = (message: string): never => {
    throw new InputError({ where: jsonPath, message, value: relativePath });
  };
  if (relativePath.trim() === '') fail(say.emptyPath());
  if (relativePath.includes('\u0000')) fail(say.nulInPath());

  const folder = path.dirname(path.resolve(modelFile));
  const realFolder = realOrSelf(folder);
  const lexical = path.resolve(folder, relativePath);
  if (!allowOutside && !inside(folder, lexical) && !inside(realFolder, lexical)) {
    fail(say.outsideModelFolder(relativePath, lexical, folder));
  }

  let real: string;
  try {
    real = realpathSync.native(lexical);
  } catch {
    return fail(say.fileNotFound(relativePath, lexical));
  }
  if (!allowOutside && !inside(realFolder, real)) fail(say.outsideModelFolder(relativePath, real, realFolder));
  if (!statSync(real).isFile()) fail(say.notAFile(relativePath, real));
  return real;
}

/** The text of a data file named in a model (resolved and checked by resolveModelPath), read as UTF-8. */
export function readModelFile(
  modelFile: string,
  relativePath: string,
  allowOutside: boolean,
  jsonPath: string,
): { path: string; text: string } {
  const resolved = resolveModelPath(modelFile, relativePath, allowOutside, jsonPath);
  try {
    return { path: resolved, text: readFileSync(resolved, 'utf8') };
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new InputError({ where: jsonPath, message: say.unreadable(resolved, reason), value: relativePath });
  }
}

/** true when `target` is `folder` itself or lies below it. */
function inside(folder: string, target: string): boolean {
  const relative = path.relative(folder, target);
  return relative === '' || (!relative.startsWith(`..${path.sep}`) && relative !== '..' && !path.isAbsolute(relative));
}

function realOrSelf(p: string): string {
  try {
    return realpathSync.native(p);
  } catch {
    return p;
  }
}
