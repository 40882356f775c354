/**
 * `gvf calibrate MODEL --marks marks.csv [--per-reach] [--bounds 0.5:2]`: fit roughness multipliers to observed
 * high-water marks (src/analysis/calibrate.ts) and print the fitted values, each mark's residual and the RMSE;
 * `--out DIR` also writes calibration.json, marks.csv and the chart of the marks against the calibrated profile.
 */
import { calibrateRoughness } from '../../analysis/calibrate.js';
import { parseBounds } from '../../analysis/options.js';
import { lmMaxIterations } from '../../analysis/tolerances.js';
import { InputError } from '../../core/errors.js';
import { unitsOf } from '../../core/units.js';
import { readHighWaterMarks } from '../../input/csv/marks.js';
import { FlagReader } from '../../input/model/flags.js';
import * as msg from '../../input/model/messages.js';
import { readModelFile } from '../../input/model/parse.js';
import { type Streams, exitCode, toJson } from '../print.js';
import { type ProgressStream, createProgress } from '../progress.js';
import { calibrationChart, calibrationCsv, calibrationJson, calibrationText, chartFiles, jsonText } from './analysisReport.js';
import { type CommonFlags, fileOptions, modelProblems, readFlagFile, runFlags, writeCsvFile, writeFiles } from './analysisInput.js';

export interface CalibrateFlags extends CommonFlags {
  marks?: string;
  perReach?: boolean;
  bounds?: string;
  json?: boolean;
  csv?: string;
}

export async function calibrateCommand(path: string, flags: CalibrateFlags, streams: Streams, progressStream: ProgressStream = process.stderr): Promise<number> {
  const reader = new FlagReader();
  const run = runFlags(reader, flags);
  if (flags.marks === undefined) reader.problems.push({ where: '--marks', message: msg.marksRequired() });
  let bounds: { lower: number; upper: number } | undefined;
  if (flags.bounds !== undefined) {
    try {
      bounds = parseBounds(flags.bounds);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      reader.problems.push(...error.problems);
    }
  }
  reader.done();
  const model = readModelFile(path, { force: flags.force === true });
  const marks = readHighWaterMarks(readFlagFile('--marks', flags.marks!), flags.marks!, unitsOf(model.units), { flows: model.flows.map((f) => f.id) });
  const progress = createProgress(progressStream);
  let calibration;
  try {
    calibration = calibrateRoughness(
      model,
      marks.map((m) => ({ station: m.station, elevation: m.elevation, flow: m.flow, weight: m.weight, where: `${flags.marks}:${m.line}` })),
      {
        perReach: flags.perReach === true,
        ...(bounds ?? {}),
        run: { ...run, ...fileOptions(path, flags) },
        onIteration: (i, cost) => progress.update(Math.min(i, lmMaxIterations), lmMaxIterations, msg.progressFitStep(i, cost)),
      },
    );
  } catch (error) {
    throw modelProblems(path, error);
  } finally {
    progress.finish();
  }

  if (flags.csv !== undefined) writeCsvFile(flags.csv, calibrationCsv(calibration));
  if (flags.out !== undefined) {
    const files = [
      { name: 'calibration.json', content: jsonText(calibrationJson(calibration)) },
      { name: 'marks.csv', content: calibrationCsv(calibration) },
      ...(await chartFiles('calibration-profile', await calibrationChart(calibration))),
    ];
    await writeFiles(flags.out, files);
  }
  if (flags.json) streams.out(toJson(calibrationJson(calibration)));
  else {
    streams.out(calibrationText(calibration));
    if (flags.csv !== undefined) streams.out(msg.markTableWritten(flags.csv));
    if (flags.out !== undefined) streams.out(msg.calibrationWritten(flags.out));
  }
  return exitCode.ok;
}
