/**
 * What `gvf run` adds from the analysis layer:
 * - `--flows flows.csv` (id, discharge[, downstream stage]) replaces the model's flows (analysis/batch.ts);
 * - `--sensitivity n=±20%,Q=±10%` runs the varied cases after the base run (analysis/sensitivity.ts), adds
 *   `sensitivity` to the result (so `--json` and result.json carry it) and prints the envelope table; with
 *   `--out DIR` the run command writes sensitivity.csv and the profile chart with the range drawn as a band
 *   together with the report (src/output/runFiles.ts: one staged step, every file recorded in DIR/.gvf-outputs),
 *   and report.html shows the band on its own profile and tables the widest range of each reach.
 * A progress bar for the cases shows on stderr when it is a terminal.
 */
import { flowBatch } from '../../analysis/batch.js';
import { parseSensitivity } from '../../analysis/options.js';
import { type Sensitivity, sensitivityAnalysis } from '../../analysis/sensitivity.js';
import type { Variation } from '../../analysis/variation.js';
import { InputError, type Problem } from '../../core/errors.js';
import { unitsOf } from '../../core/units.js';
import { readFlowTable } from '../../input/csv/flows.js';
import * as msg from '../../input/model/messages.js';
import type { Model } from '../../input/model/types.js';
import type { ProfileInput } from '../../profile/types.js';
import type { RunResult } from '../../results/types.js';
import type { ModelRun, RunOptions } from '../../run.js';
import type { Streams } from '../print.js';
import { type ProgressStream, createProgress } from '../progress.js';
import { sensitivityText } from './analysisReport.js';
import { readFlagFile } from './analysisInput.js';

export interface RunAnalysisFlags {
  flows?: string;
  sensitivity?: string;
}

export interface RunAnalysis {
  /** the model to run (its flows replaced by a batch) */
  model: Model;
  /** for RunOptions.adjustInput (a batch's downstream stages), when there is something to adjust */
  adjustInput?: (input: ProfileInput, index: number) => ProfileInput;
  notes: string[];
  /** after the base run: the sensitivity cases, with `sensitivity` added to the result */
  finish(run: ModelRun, options: Omit<RunOptions, 'compare' | 'adjustInput' | 'onProgress'>, progressStream: ProgressStream): ModelRun;
  /** after the run is printed (and its files written): the notes and the envelope table (text mode) */
  print(run: ModelRun, flags: { json?: boolean; out?: string }, streams: Streams): void;
}

/** The sensitivity list, read early so a bad value is reported with the other flags. */
export function readRunAnalysisFlags(flags: RunAnalysisFlags): { variations?: Variation[]; problems: Problem[] } {
  if (flags.sensitivity === undefined) return { problems: [] };
  try {
    return { variations: parseSensitivity(flags.sensitivity), problems: [] };
  } catch (error) {
    if (error instanceof InputError) return { problems: [...error.problems] };
    throw error;
  }
}

type WithSensitivity = RunResult & { sensitivity?: Sensitivity };

export function prepareRunAnalysis(model: Model, flags: RunAnalysisFlags, variations?: readonly Variation[]): RunAnalysis {
  let runModelOf = model;
  let adjustInput: RunAnalysis['adjustInput'];
  const notes: string[] = [];
  if (flags.flows !== undefined) {
    const rows = readFlowTable(readFlagFile('--flows', flags.flows), flags.flows, unitsOf(model.units));
    const batch = flowBatch(model, rows);
    runModelOf = batch.model;
    if (rows.some((r) => r.downstreamStage !== undefined)) adjustInput = batch.adjustInput;
    notes.push(msg.flowsReplaced(rows.length, flags.flows), ...batch.notes);
  }
  return {
    model: runModelOf,
    ...(adjustInput === undefined ? {} : { adjustInput }),
    notes,
    finish(run, options, progressStream) {
      if (variations === undefined || variations.length === 0) return run;
      const progress = createProgress(progressStream);
      try {
        const { sensitivity } = sensitivityAnalysis(runModelOf, variations, {
          base: run,
          run: { ...options, ...(adjustInput === undefined ? {} : { adjustInput }) },
          onCase: (done, total, label) => progress.update(done, total, msg.progressCase(label)),
        });
        const result: WithSensitivity = { ...run.result, sensitivity };
        return { ...run, result };
      } finally {
        progress.finish();
      }
    },
    print(run, printFlags, streams) {
      const sensitivity = (run.result as WithSensitivity).sensitivity;
      if (!printFlags.json) for (const note of notes) streams.out(msg.note(note));
      if (sensitivity === undefined || printFlags.json) return;
      streams.out(`\n${sensitivityText(sensitivity, run.result.units)}`);
      if (printFlags.out !== undefined) streams.out(msg.sensitivityWritten(printFlags.out));
    },
  };
}
