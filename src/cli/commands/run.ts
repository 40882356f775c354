/**
 * `gvf run MODEL.json`: validate the model file (every problem with its JSON path), compute every flow, print.
 */
import { InputError } from '../../core/errors.js';
import { FlagReader } from '../../input/model/flags.js';
import { ModelFileError } from '../../input/model/validate.js';
import { readModelFile } from '../../input/model/parse.js';
import { MethodName } from '../../input/model/types.js';
import { runModel } from '../../run.js';
import { type Streams, exitCode } from '../print.js';
import { type ReportOptions, printRun } from './report.js';

export interface RunOptions extends ReportOptions {
  method?: string;
  step?: string;
  compare?: boolean;
  force?: boolean;
}

export async function runCommand(path: string, options: RunOptions, streams: Streams): Promise<number> {
  const reader = new FlagReader();
  const method = reader.choice('--method', options.method, Object.keys(MethodName) as MethodName[]);
  const step = reader.number('--step', options.step, 'positive', false);
  reader.done();
  const model = readModelFile(path, { force: options.force === true });
  let run;
  try {
    run = runModel(model, {
      ...(method === undefined ? {} : { method }),
      ...(step === undefined ? {} : { outputSpacing: step }),
      compare: options.compare === true,
    });
  } catch (error) {
    // problems found while building the model's sections still belong to the model file
    if (error instanceof InputError && !(error instanceof ModelFileError)) throw new ModelFileError(path, error.problems);
    throw error;
  }
  printRun(run, options, streams);
  return exitCode.ok;
}
