/**
 * `gvf rating MODEL --stations 120,480 --discharges 1:20:1`: stage and velocity at chosen stations for each
 * discharge (src/analysis/rating.ts), as a table, CSV (`--csv FILE`) or JSON; `--out DIR` also writes
 * rating.json, rating.csv and the rating-curve chart.
 */
import { parseDischarges, parseStations } from '../../analysis/options.js';
import { ratingTable } from '../../analysis/rating.js';
import { InputError } from '../../core/errors.js';
import { FlagReader } from '../../input/model/flags.js';
import * as msg from '../../input/model/messages.js';
import { readModelFile } from '../../input/model/parse.js';
import { type Streams, exitCode, toJson } from '../print.js';
import { type ProgressStream, createProgress } from '../progress.js';
import { chartFiles, jsonText, ratingCsv, ratingJson, ratingTableChart, ratingText } from './analysisReport.js';
import { type CommonFlags, fileOptions, modelProblems, runFlags, writeCsvFile, writeFiles } from './analysisInput.js';

export interface RatingFlags extends CommonFlags {
  stations?: string;
  discharges?: string;
  json?: boolean;
  csv?: string;
}

function collect<T>(reader: FlagReader, read: () => T): T | undefined {
  try {
    return read();
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    reader.problems.push(...error.problems);
    return undefined;
  }
}

export async function ratingCommand(path: string, flags: RatingFlags, streams: Streams, progressStream: ProgressStream = process.stderr): Promise<number> {
  const reader = new FlagReader();
  const run = runFlags(reader, flags);
  if (flags.stations === undefined) reader.problems.push({ where: '--stations', message: msg.stationsRequired() });
  if (flags.discharges === undefined) reader.problems.push({ where: '--discharges', message: msg.dischargesRequired() });
  const stations = flags.stations === undefined ? undefined : collect(reader, () => parseStations(flags.stations!));
  const discharges = flags.discharges === undefined ? undefined : collect(reader, () => parseDischarges(flags.discharges!));
  reader.done();
  const model = readModelFile(path, { force: flags.force === true });
  const progress = createProgress(progressStream);
  let table;
  try {
    table = ratingTable(model, stations!, discharges!, { run: { ...run, ...fileOptions(path, flags), onProgress: (done, total, flow) => progress.update(done, total, flow) } });
  } catch (error) {
    throw modelProblems(path, error);
  } finally {
    progress.finish();
  }
  if (flags.csv !== undefined) writeCsvFile(flags.csv, ratingCsv(table));
  if (flags.out !== undefined) {
    await writeFiles(flags.out, [
      { name: 'rating.json', content: jsonText(ratingJson(table)) },
      { name: 'rating.csv', content: ratingCsv(table) },
      ...(await chartFiles('rating-curve', await ratingTableChart(table))),
    ]);
  }
  if (flags.json) streams.out(toJson(ratingJson(table)));
  else {
    streams.out(ratingText(table));
    if (flags.csv !== undefined) streams.out(msg.ratingTableWritten(flags.csv));
    if (flags.out !== undefined) streams.out(msg.ratingWritten(flags.out));
  }
  return exitCode.ok;
}
