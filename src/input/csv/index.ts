/** CSV input: survey stations, cross-section points and rating curves, each problem placed at file:line:column. */
export { parseCsvTable, cellAt, type CsvCell, type CsvRow, type CsvTable } from './table.js';
export {
  matchColumns,
  normalizeName,
  splitHeader,
  stationColumns,
  crossSectionColumns,
  ratingCurveColumns,
  highWaterMarkColumns,
  flowTableColumns,
  type ColumnSpec,
  type ColumnMap,
  type MatchedColumn,
  type Quantity,
} from './columns.js';
export {
  readStations,
  manningRange,
  lossCoefficientRange,
  type StationRow,
  type StationOptions,
  type StationDirection,
} from './stations.js';
export { readCrossSections, minimumPoints, type CrossSectionRows, type CrossSectionOptions } from './crossSections.js';
export { readRatingCurve, type RatingPair } from './ratingCurve.js';
export { readHighWaterMarks, type HighWaterMark, type MarkOptions } from './marks.js';
export { readFlowTable, type FlowRow } from './flows.js';
export { resolveModelPath, readModelFile } from './paths.js';
export { problemCap } from './problems.js';
export { largestLength, largestDischarge } from './numbers.js';
