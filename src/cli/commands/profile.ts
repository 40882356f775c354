/**
 * `gvf profile`: the water-surface profile along one prismatic reach given by flags. The flags become a
 * one-reach model, so the profile runs through exactly the same path as `gvf run`.
 */
import { type ProfileFlags, modelFromProfileFlags } from '../../input/model/flags.js';
import { runModel } from '../../run.js';
import { type Streams, exitCode } from '../print.js';
import { type ReportOptions, printRun } from './report.js';

export interface ProfileOptions extends ProfileFlags, ReportOptions {
  compare?: boolean;
}

export async function profileCommand(options: ProfileOptions, streams: Streams): Promise<number> {
  const model = modelFromProfileFlags(options);
  const run = runModel(model, { compare: options.compare === true });
  printRun(run, options, streams);
  return exitCode.ok;
}
