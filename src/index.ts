/**
 * gvf as a library: the public names, re-exported layer by layer (index files only re-export).
 *
 *   core → input → geometry → hydraulics → profile → structures → results → run → analysis → output
 *
 * The charting and report modules (vega, vega-lite, resvg) are not re-exported here, so importing gvf stays
 * light; import them from their own modules when charts are wanted.
 */

// core: typed errors, unit systems, tolerances and the accuracy goal
export * from './core/errors.js';
export * from './core/units.js';
export { accuracyGoal, accuracyFor } from './core/tolerances.js';
export { brentRoot, brentMinimum, expandUpward, scanSignChanges } from './core/roots.js';

// input: the model file (schema, validation, reading) and the flags; CSV survey data
export type {
  BoundarySpec,
  BoundariesSpec,
  FlowSpec,
  FrictionName,
  Model,
  ReachSpec,
  SectionSpec as ModelSectionSpec,
} from './input/model/types.js';
export { modelDefaults } from './input/model/types.js';
export { validateModel, ModelFileError, type ValidateOptions } from './input/model/validate.js';
export { parseModelText, readModelFile } from './input/model/parse.js';
export { modelSchema, sectionSchema, modelJsonSchema } from './input/model/schema.js';
export { modelFromProfileFlags, sectionFromFlags, FlagReader } from './input/model/flags.js';
export { readModelFile as readModelDataFile } from './input/csv/paths.js';
export {
  parseCsvTable,
  readCrossSections,
  readRatingCurve,
  readHighWaterMarks,
  readFlowTable,
  resolveModelPath,
} from './input/csv/index.js';

// geometry: the Section interface and the shape registry
export * from './geometry/index.js';

// hydraulics: conveyance, flow state, normal and critical depth, specific energy and force, slope class
export * from './hydraulics/index.js';

// profile: the engine and its input types
export { computeProfile, type EngineOptions } from './profile/engine.js';
export type {
  Boundary,
  ControlContext,
  ControlResponse,
  InternalControl,
  PrismaticReachInput,
  ProfileInput,
  ReachInput,
  SurveyedReachInput,
  SurveyNode,
} from './profile/types.js';
export { FrictionAveraging, ProfileMethod } from './profile/types.js';

// structures: weirs, gates, culverts, drops, spillways, rating curves (internal and end controls)
export * from './structures/index.js';

// results: what a run returns (and --json prints)
export type {
  FlowResult,
  FreeboardRow,
  JumpResult,
  JumpType,
  ProfileStretch,
  ProfileType,
  ReachPart,
  ReachResult,
  Regime,
  RunResult,
  StationResult,
  StructureResult,
} from './results/types.js';

// run: model and section runs with their stages
export { assembleProfileInputs, assembleSections, geometrySpecOf, hydraulicSectionOf } from './assemble.js';
export { runModel, type ModelRun, type RunOptions, type RunStages, type MethodComparison, type FlowComparison } from './run.js';
export { runSection, screeningCaution, type SectionRunInput, type SectionRunResult, type SectionState } from './runSection.js';

// analysis: calibration to high-water marks, sensitivity envelopes, rating tables, flow batches (plain data;
// their charts and reports are in the output layer, not re-exported)
export * from './analysis/index.js';

// output: text tables and CSV
export { formatTable, formatNumber, formatPairs, runReport, sectionReport } from './output/table.js';
export { stationsCsv, toCsv, csvHeader } from './output/csv.js';
