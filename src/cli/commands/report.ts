/**
 * Printing a run for `gvf profile` and `gvf run`: JSON, or the readable summary and station table;
 * the station table to CSV on request (written to a temporary name, then renamed into place).
 */
import { renameSync, writeFileSync } from 'node:fs';
import { stationTableWritten } from '../../input/model/messages.js';
import { stationsCsv } from '../../output/csv.js';
import { runReport } from '../../output/table.js';
import type { ModelRun } from '../../run.js';
import { type Streams, toJson } from '../print.js';

export interface ReportOptions {
  json?: boolean;
  csv?: string;
}

export function printRun(run: ModelRun, options: ReportOptions, streams: Streams): void {
  if (options.csv !== undefined) {
    const temporary = `${options.csv}.${process.pid}.tmp`;
    writeFileSync(temporary, stationsCsv(run.result));
    renameSync(temporary, options.csv);
  }
  if (options.json) {
    streams.out(toJson(run.comparison === undefined ? run.result : { ...run.result, comparison: run.comparison }));
  } else {
    streams.out(runReport(run.result, run.comparison));
    if (options.csv !== undefined) streams.out(stationTableWritten(options.csv));
  }
}
