/**
 * `gvf run MODEL.json`: validate the model file (every problem with its JSON path), compute every flow, print;
 * with `--out DIR`, also write the report, result.json, stations.csv and the charts into DIR (report stack
 * loaded only then). A progress bar shows on stderr when it is a terminal.
 */
import type { Sensitivity } from '../../analysis/sensitivity.js';
import { InputError, type Problem } from '../../core/errors.js';
import { FlagReader } from '../../input/model/flags.js';
import * as msg from '../../input/model/messages.js';
import { isSurveyReach } from '../../input/model/survey.js';
import { ModelFileError } from '../../input/model/validate.js';
import { readModelFile } from '../../input/model/parse.js';
import { MethodName } from '../../input/model/types.js';
import type { RunResult } from '../../results/types.js';
import { runModel } from '../../run.js';
import { type Streams, exitCode } from '../print.js';
import { type ProgressStream, createProgress } from '../progress.js';
import { type ReportOptions, printRun } from './report.js';
import { type RunAnalysisFlags, prepareRunAnalysis, readRunAnalysisFlags } from './runAnalysis.js';

export interface RunOptions extends ReportOptions, RunAnalysisFlags {
  method?: string;
  step?: string;
  compare?: boolean;
  force?: boolean;
  /** survey files may lie outside the model's folder */
  allowOutside?: boolean;
  /** false with --no-interpolate */
  interpolate?: boolean;
  /** output folder for the report, result.json, stations.csv and charts */
  out?: string;
  /** stations for cross-section charts, comma-separated (replaces the model's sectionChartsAt) */
  sections?: string;
  /** station of the specific-energy and specific-force diagram */
  energyAt?: string;
  /** flow of that diagram (default: the first flow) */
  energyFlow?: string;
}

/** "120, 250.5" → [120, 250.5], each checked as a number. */
function stationList(reader: FlagReader, flag: string, text: string | undefined): number[] | undefined {
  if (text === undefined) return undefined;
  const parts = text.split(',').map((p) => p.trim());
  const out: number[] = [];
  for (const part of parts) {
    const x = reader.number(flag, part, 'any', false);
    if (x !== undefined) out.push(x);
  }
  return out;
}

export async function runCommand(path: string, options: RunOptions, streams: Streams, progressStream: ProgressStream = process.stderr): Promise<number> {
  const reader = new FlagReader();
  const method = reader.choice('--method', options.method, Object.keys(MethodName) as MethodName[]);
  const step = reader.number('--step', options.step, 'positive', false);
  const sections = stationList(reader, '--sections', options.sections);
  const energyAt = reader.number('--energy-at', options.energyAt, 'any', false);
  reader.outputFolder('--out', options.out);
  const reportFlags = ['sections', 'energyAt', 'energyFlow'] as const;
  for (const key of reportFlags) {
    if (options[key] !== undefined && options.out === undefined) {
      reader.problems.push({ where: `--${key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`, message: msg.reportFlagNeedsOut() });
    }
  }
  const analysisFlags = readRunAnalysisFlags(options);
  reader.problems.push(...analysisFlags.problems);
  reader.done();
  const model0 = readModelFile(path, { force: options.force === true });
  // --flows and --sensitivity (src/analysis): the model's flows replaced by a batch; varied cases after the run
  const analysis = prepareRunAnalysis(model0, options, analysisFlags.variations);
  const model = analysis.model;
  const progress = createProgress(progressStream);
  let run;
  try {
    run = runModel(model, {
      ...(method === undefined ? {} : { method }),
      ...(step === undefined ? {} : { outputSpacing: step }),
      compare: options.compare === true,
      modelFile: path,
      allowOutside: options.allowOutside === true,
      interpolate: options.interpolate !== false,
      force: options.force === true,
      ...(analysis.adjustInput === undefined ? {} : { adjustInput: analysis.adjustInput }),
      onProgress: (done, total, flow) => progress.update(done, total, msg.progressFlow(flow)),
    });
  } catch (error) {
    progress.finish();
    // problems found while building the model's sections still belong to the model file
    if (error instanceof InputError && !(error instanceof ModelFileError)) throw new ModelFileError(path, error.problems);
    throw error;
  }
  progress.finish();
  run = analysis.finish(
    run,
    {
      ...(method === undefined ? {} : { method }),
      ...(step === undefined ? {} : { outputSpacing: step }),
      modelFile: path,
      allowOutside: options.allowOutside === true,
      interpolate: options.interpolate !== false,
      force: options.force === true,
    },
    progressStream,
  );

  // the model's chart stations on surveyed reaches (numbered by the survey) can be checked only now
  if (model.sectionChartsAt !== undefined && model.reaches.some(isSurveyReach)) checkModelChartStations(path, run.result, model.sectionChartsAt);
  if (options.out !== undefined) {
    checkStations(run.result.flows, sections, energyAt, options.energyFlow);
    const { writeRunOutputs } = await import('../../output/runFiles.js');
    const charts = createProgress(progressStream);
    let written;
    try {
      // a sensitivity run (--sensitivity) is drawn on the report's profile and tabled in the report
      const sensitivity = (run.result as RunResult & { sensitivity?: Sensitivity }).sensitivity;
      written = await writeRunOutputs(options.out, run, {
        ...(sections === undefined ? {} : { sections }),
        ...(sensitivity === undefined ? {} : { sensitivity }),
        ...(energyAt === undefined ? {} : { energyAt: { station: energyAt, ...(options.energyFlow === undefined ? {} : { flow: options.energyFlow }) } }),
        modelFile: path,
        onProgress: (done, total, label) => charts.update(done, total, label),
      });
    } finally {
      charts.finish();
    }
    printRun(run, options, streams);
    // with --json, stdout holds the JSON alone: the notes go to stderr and the files written are not listed
    for (const note of written.notes) (options.json ? streams.err : streams.out)(msg.note(note));
    if (!options.json) streams.out(msg.reportWritten(written.report, written.charts.length, options.out));
    analysis.print(run, options, streams);
    return exitCode.ok;
  }
  printRun(run, options, streams);
  analysis.print(run, options, streams);
  return exitCode.ok;
}

/** `sectionChartsAt` stations off the computed channel, as problems of the model file (at their JSON paths). */
function checkModelChartStations(path: string, result: RunResult, stations: readonly number[]): void {
  const all = result.flows.flatMap((f) => f.stations.map((s) => s.station)).filter(Number.isFinite);
  if (all.length === 0) return;
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const unit = result.units === 'US' ? 'ft' : 'm';
  const problems: Problem[] = [];
  stations.forEach((x, i) => {
    if (x < lo || x > hi) problems.push({ where: `sectionChartsAt[${i}]`, message: msg.chartStationOutside(x, lo, hi, unit), value: x });
  });
  if (problems.length > 0) throw new ModelFileError(path, problems);
}

/** Stations asked for charts must lie on the channel, and the flow named must exist: checked before writing. */
function checkStations(
  flows: readonly { id: string; stations: readonly { station: number }[] }[],
  sections: readonly number[] | undefined,
  energyAt: number | undefined,
  energyFlow: string | undefined,
): void {
  const all = flows.flatMap((f) => f.stations.map((s) => s.station));
  if (all.length === 0) return;
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const problems: Problem[] = [];
  for (const x of sections ?? []) {
    if (x < lo || x > hi) problems.push({ where: '--sections', message: msg.flagStationOutside(x, lo, hi), value: x });
  }
  if (energyAt !== undefined && (energyAt < lo || energyAt > hi)) {
    problems.push({ where: '--energy-at', message: msg.flagStationOutside(energyAt, lo, hi), value: energyAt });
  }
  if (energyFlow !== undefined && !flows.some((f) => f.id === energyFlow)) {
    problems.push({ where: '--energy-flow', message: msg.noFlowNamed(energyFlow, flows.map((f) => f.id)), value: energyFlow });
  }
  if (problems.length > 0) throw new InputError(problems);
}
