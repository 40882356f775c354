/**
 * Every message the CSV readers give, in one place (after vega-lite's message module), so wording is
 * reviewed once and tests can pin it. Each says what was found and what is accepted.
 */
import { show } from '../../core/errors.js';

// --- the file as a whole -------------------------------------------------------------------------------

export const notText = (): string =>
  'the file contains NUL bytes, so it is not UTF-8 text (a UTF-16 or binary file?): save it as "CSV UTF-8"';

export const emptyFile = (): string =>
  'the file is empty: expected a header row naming the columns, then one row per entry';

export const badQuotes = (code: string): string =>
  code === 'MissingQuotes'
    ? 'a quoted field is not closed: add the closing double quote (") or remove the opening one'
    : 'a quoted field is malformed: a double quote inside quotes is written twice ("")';

export const wrongDelimiter = (kind: 'semicolon' | 'tab'): string =>
  `the header looks ${kind}-separated; gvf reads comma-separated values: save the file as CSV with commas ` +
  'between fields and a point as the decimal separator';

export const noDataRows = (what: string, headerLine: number): string =>
  `no ${what}: the file has a header row (line ${headerLine}) but no data rows`;

export const tooManyFields = (found: number, named: number): string =>
  `this row has ${found} values but the header names ${named} columns ` +
  '(a decimal comma? write decimals with a point, or quote text that contains commas)';

// --- headers -----------------------------------------------------------------------------------------

export const missingColumns = (missing: readonly string[], found: readonly string[]): string =>
  `missing required column${missing.length > 1 ? 's' : ''} ${missing.map((m) => `"${m}"`).join(', ')}; ` +
  `columns found: ${found.length > 0 ? found.map((f) => `"${f}"`).join(', ') : 'none'}`;

export const duplicateColumn = (label: string, header: string, firstColumn: number): string =>
  `column "${header}" is a second ${label} column (the first is column ${firstColumn}); keep one`;

export const unitConflict = (header: string, unit: string, modelUnit: string, system: string): string =>
  `column "${header}" is in ${unit}, but the model's units are ${system} (${modelUnit}): ` +
  `convert the column to ${modelUnit} or change the model's "units"`;

export const unknownUnit = (header: string, unit: string, accepted: string): string =>
  `column "${header}": unit "${unit}" is not recognised; write ${accepted} or leave the unit out`;

export const unitOnDimensionless = (header: string, unit: string): string =>
  `column "${header}" takes no unit (it is a pure number), but "${unit}" is given`;

export const percentCoefficient = (header: string): string =>
  `column "${header}" is marked as percent; give loss coefficients as fractions (0.1, not 10) and drop the "%"`;

// --- values ------------------------------------------------------------------------------------------

export const missingValue = (label: string): string => `missing ${label}: this column needs a number in every row`;

export const missingText = (label: string): string => `missing ${label}: this column needs a name in every row`;

export const notFinite = (label: string, text: string): string =>
  `${label}: ${show(text)} is not a finite number; give a number such as 12.5`;

export const notANumber = (label: string, text: string): string => {
  const hint = /^\s*[+-]?\d+,\d+\s*$/.test(text)
    ? ' (a decimal comma? write decimals with a point: 1.5)'
    : /^\s*[+-]?\d{1,3}(,\d{3})+(\.\d*)?\s*$/.test(text)
      ? ' (write numbers without thousands separators)'
      : '';
  return `${label}: expected a number, got ${show(text)}${hint}`;
};

export const tooLarge = (label: string, text: string, limit: number): string =>
  `${label}: ${text} is too large to be a real value (limit ±${limit}); check the value and its units`;

export const outOfRange = (label: string, value: number, low: number, high: number, hint = ''): string =>
  `${label} ${value} is outside the accepted range ${low}–${high}${hint}`;

export const negative = (label: string, value: number): string =>
  `${label} ${value} is negative; it must be zero or more`;

export const roughnessForce = ' (pass --force to accept an unusual value)';

// --- stations ----------------------------------------------------------------------------------------

export const duplicateStation = (station: number, firstLine: number): string =>
  `station ${station} appears twice (first at line ${firstLine}); each station needs one row`;

export const unsortedStation = (station: number, previous: number, previousLine: number, rising: boolean): string =>
  `station ${station} is out of order: the rows ${rising ? 'increase' : 'decrease'} in station up to ` +
  `${previous} (line ${previousLine}); sort the rows by station, all rising or all falling`;

export const bankBelowBed = (side: 'left' | 'right', bank: number, bed: number): string =>
  `${side} bank ${bank} is below the bed elevation ${bed}; bank (top of bank or lining) elevations must be at or above the bed`;

export const unknownSection = (id: string, known: readonly string[]): string => {
  const list = known.slice(0, 8).map((k) => `"${k}"`).join(', ');
  return `section ${show(id)} is not defined; defined sections: ${list || 'none'}${known.length > 8 ? ', ...' : ''}`;
};

// --- cross-sections ----------------------------------------------------------------------------------

export const tooFewStations = (count: number): string =>
  `a surveyed reach needs at least two stations; found ${count}`;

export const tooFewPoints = (id: string, count: number): string =>
  `cross-section ${show(id)} has ${count} point${count === 1 ? '' : 's'}; a cross-section needs at least three`;

export const offsetBackwards = (id: string, offset: number, previous: number, previousLine: number): string =>
  `cross-section ${show(id)}: offset ${offset} goes backwards from ${previous} (line ${previousLine}); ` +
  'list the points across the section with offsets rising (equal offsets make a vertical wall)';

export const repeatedPoint = (id: string, offset: number, elevation: number, previousLine: number): string =>
  `cross-section ${show(id)}: the point (${offset}, ${elevation}) repeats the one at line ${previousLine}; remove one`;

export const foldedWall = (id: string, offset: number): string =>
  `cross-section ${show(id)}: at offset ${offset} the vertical wall goes down and back up, so the section ` +
  'crosses itself; a wall at one offset runs in one direction only';

export const noWidth = (id: string, offset: number): string =>
  `cross-section ${show(id)} has no width: every point is at offset ${offset}`;

export const sectionSplit = (id: string, firstLine: number): string =>
  `cross-section ${show(id)} continues here after rows of other sections (it starts at line ${firstLine}); ` +
  "keep each section's rows together";

export const firstPointNeedsN = (id: string): string =>
  `cross-section ${show(id)}: n is given further across but not at the first point; ` +
  'give n at the first point and wherever it changes';

export const sectionNeedsN = (id: string): string =>
  `cross-section ${show(id)} has no Manning's n: give n at its first point (and wherever it changes)`;

export const nColumnRequired = (): string =>
  "Manning's n is required here but the file has no n column; add one (e.g. \"n\")";

// --- rating curves -----------------------------------------------------------------------------------

export const ratingTooShort = (count: number): string =>
  `a rating curve needs at least two (stage, discharge) rows; found ${count}`;

export const ratingDuplicateStage = (stage: number, otherLine: number): string =>
  `stage ${stage} appears twice (also at line ${otherLine}); a rating curve gives one discharge per stage`;

export const ratingNotMonotone = (
  stage: number,
  discharge: number,
  lowerStage: number,
  lowerDischarge: number,
  lowerLine: number,
): string =>
  `discharge ${discharge} at stage ${stage} is not more than ${lowerDischarge} at the lower stage ${lowerStage} ` +
  `(line ${lowerLine}); discharge must increase with stage`;

// --- paths -------------------------------------------------------------------------------------------

export const emptyPath = (): string => 'expected a file path relative to the model file, got an empty string';

export const nulInPath = (): string => 'the path contains a NUL character';

export const outsideModelFolder = (given: string, resolved: string, folder: string): string =>
  `${show(given)} resolves to ${resolved}, outside the model's folder ${folder}; gvf reads only files in ` +
  "the model's folder tree, so that a model from someone else cannot read other files: move the file " +
  'into that folder, or run with --allow-outside if you trust the model';

export const fileNotFound = (given: string, resolved: string): string =>
  `file not found: ${resolved} (${show(given)}, relative to the model file's folder)`;

export const notAFile = (given: string, resolved: string): string =>
  `${show(given)} resolves to ${resolved}, which is not a file (a folder?): give the path of the CSV file itself`;

export const unreadable = (resolved: string, reason: string): string => `cannot read ${resolved}: ${reason}`;

// --- high-water marks and flow tables ---------------------------------------------------------------------

export const notPositive = (label: string, value: number): string => `${label} ${value} must be more than zero`;

export const duplicateFlowId = (id: string, firstLine: number): string =>
  `flow id ${show(id)} appears twice (first at line ${firstLine}); give each flow its own id`;

export const unknownFlow = (id: string, known: readonly string[]): string =>
  `flow ${show(id)} is not one of the model's flows (${known.map((k) => `"${k}"`).join(', ') || 'none'})`;
