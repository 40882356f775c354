/**
 * Reading a surveyed reach's files: the stations file and (optionally) the cross-section points file, named in
 * the model relative to the model file and refused outside its folder unless the user allows it. Each problem
 * keeps its place: the JSON path of the file name, or file:line:column inside the file.
 */
import path from 'node:path';
import { InputError, type Problem } from '../core/errors.js';
import type { Units } from '../core/units.js';
import {
  type CrossSectionRows,
  type StationRow,
  matchColumns,
  parseCsvTable,
  readCrossSections,
  readModelFile,
  readStations,
  stationColumns,
} from '../input/csv/index.js';
import { ProblemList } from '../input/csv/problems.js';
import type { SurveySpec } from '../input/model/survey.js';

export interface SurveyFileOptions {
  /** the model file the paths are relative to */
  readonly modelFile: string;
  /** read files outside the model's folder (the CLI's --allow-outside) */
  readonly allowOutside?: boolean;
  /** accept unusual roughness (the CLI's --force) */
  readonly force?: boolean;
}

export interface SurveyFiles {
  /** the label of the stations file in messages (the model's folder joined with the path written) */
  readonly stationsFile: string;
  /** rows in flow order, upstream first */
  readonly stations: StationRow[];
  /** 1-based field positions of columns, for messages about a row's cells */
  readonly columnOf: { readonly bedElevation: number; readonly section: number; readonly station: number; readonly n: number; readonly reachLength: number };
  readonly crossSectionsFile?: string;
  readonly crossSections: ReadonlyMap<string, CrossSectionRows>;
}

/** The label a data file is named by in messages: the model's folder joined with the path as written. */
export function fileLabel(modelFile: string, written: string): string {
  return path.isAbsolute(written) ? written : path.join(path.dirname(modelFile), written);
}

/**
 * Read the files of one surveyed reach. `jsonPath` is the reach's place in the model (`reaches[1]`);
 * `sectionNames` are the model's named sections, which stations may name besides cross-section ids.
 */
export function readSurveyFiles(
  spec: SurveySpec,
  jsonPath: string,
  units: Units,
  sectionNames: readonly string[],
  options: SurveyFileOptions,
): SurveyFiles {
  const problems: Problem[] = [];
  const collect = <T>(read: () => T): T | undefined => {
    try {
      return read();
    } catch (error) {
      if (error instanceof InputError) {
        problems.push(...error.problems);
        return undefined;
      }
      throw error;
    }
  };
  const allow = options.allowOutside === true;
  let crossSections: Map<string, CrossSectionRows> = new Map();
  let crossSectionsFile: string | undefined;
  if (spec.crossSections !== undefined) {
    crossSectionsFile = fileLabel(options.modelFile, spec.crossSections);
    const label = crossSectionsFile;
    const file = collect(() => readModelFile(options.modelFile, spec.crossSections!, allow, `${jsonPath}.survey.crossSections`));
    if (file !== undefined) {
      crossSections = collect(() => readCrossSections(file.text, label, units, { force: options.force === true })) ?? new Map();
    }
  }
  const stationsFile = fileLabel(options.modelFile, spec.stations);
  const file = collect(() => readModelFile(options.modelFile, spec.stations, allow, `${jsonPath}.survey.stations`));
  let stations: StationRow[] = [];
  let columnOf: SurveyFiles['columnOf'] = { bedElevation: 2, section: 3, station: 1, n: 4, reachLength: 7 };
  if (file !== undefined) {
    const known = [...crossSections.keys(), ...sectionNames];
    // unknown section ids are only reported when the cross-section file (if any) was read
    const checkIds = spec.crossSections === undefined || problems.length === 0;
    stations =
      collect(() =>
        readStations(file.text, stationsFile, units, {
          direction: spec.stationing === 'increasing-downstream' ? 'downstream' : 'upstream',
          ...(checkIds ? { sections: known } : {}),
          force: options.force === true,
        }),
      ) ?? [];
    if (stations.length > 0) columnOf = columnsOf(file.text, stationsFile, units);
  }
  if (problems.length > 0) throw new InputError(problems);
  return { stationsFile, stations, columnOf, ...(crossSectionsFile === undefined ? {} : { crossSectionsFile }), crossSections };
}

/** Field positions of the stations file's columns (the file has already been read without problems). */
function columnsOf(text: string, label: string, units: Units): SurveyFiles['columnOf'] {
  const columns = matchColumns(parseCsvTable(text, label), stationColumns, units, new ProblemList());
  return {
    bedElevation: (columns.bedElevation?.index ?? 1) + 1,
    section: (columns.section?.index ?? 2) + 1,
    station: (columns.station?.index ?? 0) + 1,
    n: (columns.n?.index ?? 3) + 1,
    reachLength: (columns.reachLength?.index ?? 6) + 1,
  };
}
