/**
 * Shared pieces of the analysis commands: reading a data file named by a flag (a path the user typed, so read
 * as given, relative to the working folder), the run options every analysis command takes, and writing the
 * files of `--out DIR` in one staged step (output/files.ts: nothing is replaced unless every file is written).
 */
import { readFileSync, renameSync, writeFileSync } from 'node:fs';
import { InputError } from '../../core/errors.js';
import { FlagReader } from '../../input/model/flags.js';
import * as msg from '../../input/model/messages.js';
import { MethodName } from '../../input/model/types.js';
import { ModelFileError } from '../../input/model/validate.js';
import type { OutputFile } from '../../output/files.js';

/** The text of a file named by `flag`; a missing or unreadable file is bad input naming the flag. */
export function readFlagFile(flag: string, path: string): string {
  if (path.trim() === '') throw new InputError({ where: flag, message: msg.fileNameNeeded(), value: path });
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const message =
      code === 'ENOENT' ? msg.flagFileMissing(path) : code === 'EISDIR' ? msg.flagFileIsFolder(path) : msg.flagFileUnreadable(path, code ?? String(error));
    throw new InputError({ where: flag, message, value: path });
  }
}

export interface CommonFlags {
  method?: string;
  step?: string;
  out?: string;
  force?: boolean;
  allowOutside?: boolean;
  /** false with --no-interpolate */
  interpolate?: boolean;
}

/** The run options that tell runModel where the model's survey files are and how to read them. */
export function fileOptions(path: string, flags: CommonFlags): { modelFile: string; allowOutside: boolean; interpolate: boolean; force: boolean } {
  return { modelFile: path, allowOutside: flags.allowOutside === true, interpolate: flags.interpolate !== false, force: flags.force === true };
}

/** --method and --step as run options; problems go to the reader. */
export function runFlags(reader: FlagReader, flags: CommonFlags): { method?: MethodName; outputSpacing?: number } {
  const method = reader.choice('--method', flags.method, Object.keys(MethodName) as MethodName[]);
  const step = reader.number('--step', flags.step, 'positive', false);
  reader.outputFolder('--out', flags.out);
  return { ...(method === undefined ? {} : { method }), ...(step === undefined ? {} : { outputSpacing: step }) };
}

export async function writeFiles(dir: string, files: readonly OutputFile[]): Promise<string[]> {
  const { writeOutputs } = await import('../../output/files.js');
  return writeOutputs(dir, files);
}

/** A CSV file (`--csv FILE`) written to a temporary name and renamed into place. */
export function writeCsvFile(file: string, text: string): void {
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, text);
  renameSync(temporary, file);
}

/**
 * Problems found while building the model's sections and reaches still belong to the model file (the report
 * then names it); other input problems (a mark off the channel, a flag) are passed on as they are.
 */
export function modelProblems(path: string, error: unknown): unknown {
  if (error instanceof InputError && !(error instanceof ModelFileError) && error.problems.every((p) => /^(sections|reaches)[.[]/.test(p.where))) {
    return new ModelFileError(path, error.problems);
  }
  return error;
}
