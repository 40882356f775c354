/**
 * Every user-facing message of the model and flag checks (after vega-lite's log/message module): one function
 * per message, so wording is reviewed in one place and tests pin it exactly. A message says what was found
 * and what is accepted; the place (JSON path or flag) is the Problem's `where`. The lines the command line
 * prints around a run (what was written where, notes, progress labels, the heading of an error) are here too,
 * at the end: src/cli writes no wording of its own.
 */
import {
  alphaRange,
  largestDiameter,
  largestMagnitude,
  manningRange,
  maxNesting,
  maxOutputStations,
  minimumPoints,
  slopeLimit,
  smallestDischarge,
  smallestWidth,
} from './limits.js';

/** A value as a user would recognise it in their file. */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) {
    const text = JSON.stringify(value);
    return text.length <= 40 ? text : `a list of ${value.length}`;
  }
  if (typeof value === 'object') return 'an object';
  return String(value);
}

function quoted(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(', ');
}

/** The closest of `candidates` to `word` within a small edit distance, for "did you mean". */
export function closest(word: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  // one edit in a short word, a third of the letters in a long one
  let bestDistance = Math.max(1, Math.floor(word.length / 3)) + 1;
  for (const c of candidates) {
    const d = editDistance(word.toLowerCase(), c.toLowerCase());
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  return best;
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let previous = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j]!;
      row[j] = Math.min(above + 1, row[j - 1]! + 1, previous + (a[i - 1] === b[j - 1] ? 0 : 1));
      previous = above;
    }
  }
  return row[b.length]!;
}

function suggestion(word: string, candidates: readonly string[]): string {
  const c = closest(word, candidates);
  return c === undefined ? '' : ` (did you mean ${JSON.stringify(c)}?)`;
}

// ---- types and shapes --------------------------------------------------------------------------------

export const expected = (expectation: string, got: unknown): string => `expected ${expectation}, got ${describeValue(got)}`;

export const missing = (expectation: string): string => `missing: expected ${expectation}`;

export const expectedOneOf = (values: readonly string[], got: unknown): string =>
  `expected one of ${quoted(values)}, got ${describeValue(got)}${typeof got === 'string' ? suggestion(got, values) : ''}`;

export const missingOneOf = (values: readonly string[]): string => `missing: expected one of ${quoted(values)}`;

export const unknownKey = (key: string, allowed: readonly string[]): string =>
  `unknown key${suggestion(key, allowed)}; the keys allowed here are ${allowed.join(', ')}`;

export const greaterThan = (limit: number, got: unknown): string => expected(`a number greater than ${limit}`, got);

export const atLeast = (limit: number, got: unknown): string => expected(`a number of at least ${limit}`, got);

export const atMost = (limit: number, got: unknown): string => expected(`a number of at most ${limit}`, got);

export const lessThan = (limit: number, got: unknown): string => expected(`a number less than ${limit}`, got);

export const listTooShort = (minimum: number, what: string, got: unknown): string =>
  `expected at least ${minimum} ${what}, got ${Array.isArray(got) ? got.length : describeValue(got)}`;

export const pair = (first: string, second: string): string => `a pair [${first}, ${second}] of numbers`;

export const notFinite = (got: unknown): string => expected('a finite number', got);

export const tooLarge = (got: unknown): string =>
  expected(`a number of magnitude at most ${largestMagnitude} (a larger one is a typing or unit mistake)`, got);

export const tooManyStations = (spacing: number, length: number, unit: string, flag: string): string =>
  `the output spacing ${spacing} ${unit} gives ${Math.ceil(length / spacing)} stations along the ${round(length)} ${unit} channel; ` +
  `at most ${maxOutputStations} are computed: use ${flag} ≥ ${Number((length / maxOutputStations).toPrecision(3))}`;

export const notJsonObject = (got: unknown): string =>
  `${expected('a JSON object holding the model (see schema/gvf-model.schema.json)', got)}`;

// ---- file reading ------------------------------------------------------------------------------------

export const fileNotFound = (): string => 'no such file';

export const fileUnreadable = (reason: string): string => `cannot read the file (${reason})`;

export const fileIsFolder = (): string => 'this is a folder, not a file: give the path of the model file (a .json file)';

export const fileEmpty = (): string =>
  'the file is empty; expected a JSON object holding the model (see schema/gvf-model.schema.json)';

export const jsonSyntax = (problem: string): string => `not valid JSON: ${problem}`;

export const tooDeep = (): string =>
  `lists and objects nest more than ${maxNesting} levels deep here; a gvf model nests a few levels (see schema/gvf-model.schema.json)`;

export const notUtf8 = (): string =>
  'the file is not UTF-8 text (it holds NUL bytes: saved as UTF-16, or not a text file); save it as UTF-8';

// ---- sections ----------------------------------------------------------------------------------------

export const manningOutOfRange = (n: unknown, forceHint: string): string =>
  `Manning's n must lie between ${manningRange.min} and ${manningRange.max}, got ${describeValue(n)}${forceHint}`;

export const alphaOutOfRange = (alpha: unknown): string =>
  `α must lie between ${alphaRange.min} and ${alphaRange.max} (it is 1 for uniform velocity), got ${describeValue(alpha)}`;

export const noRoughness = (names: readonly string[]): string =>
  `a roughness is required: give ${names.slice(0, -1).join(', ')} or ${names[names.length - 1]} (Manning's n, Chézy C, or sand roughness ks)`;

export const severalRoughness = (keys: readonly string[]): string =>
  `give one roughness, not ${keys.join(' and ')}`;

export const frictionMismatch = (friction: string, key: string, given: string): string =>
  `the friction law "${friction}" takes its roughness from ${key}, but ${given} was given`;

export const widthTooSmall = (what: string, got: unknown, zeroAllowed: boolean): string =>
  expected(
    `${zeroAllowed ? '0 (a triangle) or ' : ''}${what} of at least ${smallestWidth} (${smallestWidth} m is a millimetre; a narrower channel is a capillary, ` +
      'where none of the friction laws apply)',
    got,
  );

export const diameterOutOfRange = (got: unknown): string =>
  expected(
    `a diameter from ${smallestWidth} to ${largestDiameter} (a narrower conduit is a capillary; the largest tunnels are some 20 m across)`,
    got,
  );

export const roughnessTableOrder = (previous: number, got: number): string =>
  `roughness stations must increase across the section: ${got} follows ${previous}`;

export const pointsOrder = (previous: number, got: number): string =>
  `stations across the section must not decrease: ${got} follows ${previous}`;

export const pointsTooFew = (count: number): string =>
  `an irregular section needs at least ${minimumPoints} points [station, elevation], got ${count}`;

export const pointsNoLowPoint = (): string =>
  'the section holds no water: both end points must lie above its lowest point';

// ---- reaches, flows, boundaries ----------------------------------------------------------------------

export const noSuchSection = (name: unknown, known: readonly string[]): string =>
  known.length === 0
    ? `no section named ${describeValue(name)}; the model defines no sections`
    : `no section named ${describeValue(name)}${typeof name === 'string' ? suggestion(name, known) : ''}; the sections defined are ${quoted(known)}`;

export const duplicateId = (what: string, id: string, firstIndex: number): string =>
  `the ${what} id ${JSON.stringify(id)} is used twice (first at index ${firstIndex}); ids must be unique`;

export const reachKind = (): string =>
  'a reach is either prismatic (keys "section", "length" and "slope") or surveyed (key "survey" with its files)';

export const bothReachKinds = (): string =>
  'give either "section", "length" and "slope" (a prismatic reach) or "survey" (a surveyed reach), not both';

export const slopeTooLarge = (slope: unknown): string =>
  `expected a bed slope as a fraction with magnitude below ${slopeLimit} (0.001 means 0.1 %), got ${describeValue(slope)}`;

export const dischargeTooSmall = (got: unknown): string =>
  expected(
    `a discharge from ${smallestDischarge} to ${largestMagnitude} (${smallestDischarge} m³/s is a millilitre a second; less is a trickle ` +
      'held by surface tension, not open-channel flow)',
    got,
  );

export const stageBelowBed = (elevation: number, bed: number, end: string): string =>
  `the stage ${elevation} lies at or below the ${end} bed elevation ${round(bed)}; a stage is a water-surface elevation`;

export const depthAboveCrown = (depth: number, crown: number, unit: string): string =>
  `the depth ${depth} ${unit} lies above the conduit's crown at ${crown} ${unit}; a closed conduit holds at most its diameter`;

export const depthAbovePoints = (depth: number, limit: number, unit: string): string =>
  `the depth ${depth} ${unit} lies above the section's lower end point (at most ${round(limit)} ${unit}); extend the section`;

// ---- structures, rating curves, reservoirs, flow changes ----------------------------------------------

export const ratingNeedsOne = (): string => 'a rating curve needs either "table" ([[stage, discharge], ...]) or "file" (a CSV beside the model), not both and not neither';

export const dischargeRequired = (): string => 'missing: expected the discharge Q (a number greater than 0); only a reservoir upstream boundary lets gvf find it';

export const dischargeWithReservoir = (): string =>
  'a reservoir upstream boundary fixes the discharge: leave "discharge" out (gvf finds it from the pool elevation), or give this flow its own "poolElevation"';

export const poolWithoutReservoir = (): string => '"poolElevation" applies only where the upstream boundary is a reservoir ({"type": "reservoir", ...})';

export const unknownFlowId = (id: string, known: readonly string[]): string =>
  `no flow has the id ${JSON.stringify(id)}${suggestion(id, known)}; the flows are ${quoted(known)}`;

export const missingFlowValue = (id: string): string => `no value for flow ${JSON.stringify(id)}: give one for every flow, or one number for all`;

export const structureOutside = (from: number, to: number): string =>
  `a structure must lie inside the channel (between stations ${round(from)} and ${round(to)}); only a free overfall may sit at the downstream end`;

export const overfallPlacement = (end: number): string =>
  `a free overfall sits at the downstream end (station ${round(end)}) or, inside the channel, at a drop: give "bedDrop" greater than 0 there`;

export const overfallWithBoundary = (): string =>
  'a free overfall at the downstream end is the downstream control (critical depth at the brink): leave out boundaries.downstream, or give {"type": "critical"}';

export const structuresTooClose = (other: string): string => `two structures at the same station (this one and ${JSON.stringify(other)}); give them stations apart`;

export const gateWidthNeeded = (shape: string): string =>
  `a sluice gate in a ${shape} channel needs its "width" (the default comes only from a rectangular channel)`;

// ---- report --------------------------------------------------------------------------------------------

export const chartStationOutside = (station: number, from: number, to: number, unit: string): string =>
  `station ${station} ${unit} lies on no reach: a cross-section chart is drawn on the channel, between stations ${round(from)} and ${round(to)} ${unit}`;

export const chartStationRepeated = (station: number, firstIndex: number): string =>
  `station ${station} is listed twice (first at index ${firstIndex}); list each station once`;

// ---- command-line flags ------------------------------------------------------------------------------

export const flagRequired = (what: string): string => `required: ${what}`;

export const folderNameNeeded = (): string => 'needs a folder name';

export const outputFolderIsFile = (given: string, file: string): string =>
  `${file} is a file, so ${JSON.stringify(given)} cannot be a folder for the outputs: give a folder (it is created if missing)`;

export const flagNotForShape = (shape: string, allowed: readonly string[]): string =>
  `does not apply to a ${shape} section; a ${shape} section takes ${allowed.join(', ')}`;

export const boundaryFlag = (got: unknown): string =>
  expected('"normal", "critical" or a depth greater than 0', got);

/** A report flag (--sections, --energy-at, --energy-flow) given without --out. */
export const reportFlagNeedsOut = (): string => 'draws a chart of the report: use it with --out DIR';

/** A station of --sections or --energy-at off the computed channel. */
export const flagStationOutside = (station: number, from: number, to: number): string =>
  `station ${station} is outside the channel (stations ${from} to ${to})`;

/** --energy-flow naming no flow of the run. */
export const noFlowNamed = (name: string, known: readonly string[]): string =>
  `no flow named ${JSON.stringify(name)}; the flows are ${known.join(', ')}`;

export const marksRequired = (): string => flagRequired('a CSV file of high-water marks (station, elevation, flow[, weight])');

export const stationsRequired = (): string => flagRequired('a list of stations like 120,480');

export const dischargesRequired = (): string => flagRequired('a list like 2,5,10 or a range from:to:step like 1:20:1');

/** A data file named by a flag (--flows, --marks): the Problem's `where` is the flag. */
export const fileNameNeeded = (): string => 'needs a file name';

export const flagFileMissing = (path: string): string => `${path}: no such file`;

export const flagFileIsFolder = (path: string): string => `${path}: a folder, not a file`;

export const flagFileUnreadable = (path: string, reason: string): string => `${path}: cannot be read (${reason})`;

export const forceHintFlag = '; pass --force if the value is intended';
export const forceHintModel = '; run with --force if the value is intended';

// ---- what the command line prints ---------------------------------------------------------------------

const plural = (count: number, word: string): string => `${count} ${word}${count === 1 ? '' : 's'}`;

/** A note beside a result (a chart not drawn, flows replaced), printed on its own line. */
export const note = (text: string): string => `note: ${text}`;

export const reportWritten = (report: string, charts: number, dir: string): string =>
  `report written to ${report} (with result.json, stations.csv and ${plural(charts, 'chart')} in ${dir})`;

export const sensitivityWritten = (dir: string): string => `sensitivity.csv and charts/sensitivity-profile (.vl.json, .svg, .png) written to ${dir}`;

export const calibrationWritten = (dir: string): string =>
  `calibration.json, marks.csv and charts/calibration-profile (.vl.json, .svg, .png) written to ${dir}`;

export const ratingWritten = (dir: string): string => `rating.json, rating.csv and charts/rating-curve (.vl.json, .svg, .png) written to ${dir}`;

export const stationTableWritten = (file: string): string => `station table written to ${file}`;

export const markTableWritten = (file: string): string => `mark table written to ${file}`;

export const ratingTableWritten = (file: string): string => `rating table written to ${file}`;

export const flowsReplaced = (count: number, file: string): string => `${plural(count, 'flow')} from ${file} replace the model's flows`;

/** Progress-bar labels: what was just finished. */
export const progressFlow = (id: string): string => `flow ${id}`;

export const progressCase = (label: string): string => `case ${label}`;

export const progressFitStep = (step: number, cost: number): string => `fit step ${step}, Σw·r²/2 = ${cost.toExponential(2)}`;

/** The first line of an error report; the problems follow, one a line. */
export const invalidModelHeading = (file: string, count: number): string => `gvf: ${file} is not a valid model (${plural(count, 'problem')}):`;

export const badInputHeading = (count: number): string => `gvf: bad input (${plural(count, 'problem')}):`;

export const cannotBeComputed = (why: string): string => `gvf: cannot be computed: ${why}`;

export const computationFailed = (why: string): string => `gvf: the computation failed: ${why}`;

export const unexpectedError = (why: string): string => `gvf: unexpected error: ${why} (set GVF_DEBUG=1 for details)`;

/** Printed by commander after a flag it refuses (unknown option, missing value, bad choice). */
export const helpAfterError = '(run gvf --help, or gvf <command> --help, for the options)';

function round(value: number): string {
  return String(Math.round(value * 1e6) / 1e6);
}
