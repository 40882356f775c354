/**
 * The analysis layer, above the engine and runModel: calibration of roughness to high-water marks,
 * sensitivity envelopes, rating tables and flow batches. Each runs the model through runModel (with
 * RunOptions.roughnessMultiplier for roughness, RunOptions.adjustInput for the other varied inputs) and
 * returns plain data for output and the CLI.
 */
export { calibrateRoughness, calibrationMethod, type Calibration, type CalibrationOptions, type FittedMultiplier, type MarkResidual, type ObservedMark, type SectionRoughness } from './calibrate.js';
export { boundedLeastSquares, jacobianOf, solveLinear, type LeastSquaresOptions, type LeastSquaresResult } from './leastSquares.js';
export { sampleProfile, stationRange, wselAt, reachAt, type ProfileSample } from './sample.js';
export { sensitivityCases, caseRoughness, variedDischarge, SensitivityParameter, type SensitivityCase, type Variation } from './variation.js';
export { sensitivityAnalysis, type Sensitivity, type SensitivityRun, type FlowSensitivity, type StationEnvelope, type ProfileTypeChange, type JumpChange, type SensitivityOptions } from './sensitivity.js';
export { ratingTable, ratingFlowId, type RatingTable, type RatingRow, type RatingValue, type RatingOptions } from './rating.js';
export { flowBatch, type BatchFlow, type FlowBatch } from './batch.js';
export { parseSensitivity, parseDischarges, parseStations, parseBounds } from './options.js';
