/**
 * Every user-facing message of the analysis layer (calibration, sensitivity, rating tables, flow batches):
 * problems with option values and model data, and the warnings that go with results. Tests pin the text.
 */
const fmt = (x: number, decimals = 3) => (Number.isFinite(x) ? x.toFixed(decimals) : String(x));

/* ---- option values ---- */
export const expectedForm = (form: string, value: string) => `expected ${form}, got ${JSON.stringify(value)}`;
export const sensitivityForm = 'a list like n=±20%,Q=±10% (n: roughness, Q: discharge; ± may be written +-)';
export const unknownSensitivityParameter = (name: string) =>
  `unknown parameter ${JSON.stringify(name)}: vary n (roughness) or Q (discharge), e.g. n=±20%,Q=±10%`;
export const repeatedParameter = (name: string) => `${name} is given twice; give each parameter once`;
export const percentRange = (value: number, largest: number) =>
  `a variation must be greater than 0 % and at most ${largest} %, got ${value} %`;
export const dischargeForm = 'a list of discharges like 2,5,10 or a range from:to:step like 1:20:1 (all greater than 0)';
export const rangeStepSign = (from: number, to: number, step: number) =>
  `the step ${step} does not lead from ${from} to ${to}: give a step greater than 0 and from ≤ to`;
export const tooManyCases = (count: number, largest: number) =>
  `that is ${count} discharges; at most ${largest} are computed in one table`;
export const stationForm = 'a list of stations like 120,480 (numbers along the channel)';
export const tooManyStations = (count: number, largest: number) => `that is ${count} stations; at most ${largest} in one table`;
export const stationOutside = (station: number, lo: number, hi: number) =>
  `station ${station} lies outside the channel (stations ${lo} to ${hi})`;
export const boundsForm = 'two multipliers lower:upper like 0.5:2 (0 < lower < 1 < upper)';
export const boundsRange = (lower: number, upper: number, lo: number, hi: number) =>
  `bounds ${lower}:${upper} must satisfy ${lo} ≤ lower < 1 < upper ≤ ${hi}`;
export const optionRequired = (what: string) => `required: ${what}`;

/* ---- calibration ---- */
export const noMarks = () => 'no high-water marks to calibrate with';
export const markOutside = (station: number, flow: string, lo: number, hi: number) =>
  `mark at station ${station} (flow ${JSON.stringify(flow)}) lies outside the computed profile (stations ${lo} to ${hi})`;
export const markFlowUnknown = (flow: string, known: readonly string[]) =>
  `mark names flow ${JSON.stringify(flow)}, which is not in the model (flows: ${known.join(', ')})`;
export const insensitiveMark = (station: number, flow: string, change: number, unit: string, why: string) =>
  `mark at station ${station} (flow ${flow}): roughness hardly moves the water surface here ` +
  `(${fmt(change, 4)} ${unit} for a change of the multiplier by ${shownMultiplierChange}): ${why}; it tells nothing about roughness`;
/** The change of multiplier a warning states the water-surface response for (a 10 % change of n). */
export const shownMultiplierChange = 0.1;
export const whyCritical = (station: number) => `the flow passes through critical depth at station ${station}`;
export const whyControl = (kind: string, station: number) => `the water surface is held by the ${kind} at station ${station}`;
export const whyUnknown = () => 'it lies in a stretch held by a control (critical depth, a structure or a fixed stage)';
export const parameterNotFitted = (id: string) =>
  `no mark responds to the roughness of ${id}: its multiplier is left at 1 (the model's roughness)`;
export const parameterAtBound = (id: string, value: number, which: 'lower' | 'upper') =>
  `the multiplier of ${id} ended on its ${which} bound (${fmt(value)}): the marks ask for ${which === 'lower' ? 'a smoother' : 'a rougher'} channel than the bounds allow — check the marks, the discharge and the controls before widening the bounds`;
export const fewMarks = (marks: number, parameters: number) =>
  `${marks} mark${marks === 1 ? '' : 's'} for ${parameters} multiplier${parameters === 1 ? '' : 's'}: the fit passes through the marks and says nothing about their scatter (no standard error)`;
export const noDescent = () => 'the fit stopped where no damped step lowers the sum of squares (a minimum to the engine\'s accuracy)';

/* ---- sensitivity ---- */
export const profileTypesChanged = (caseLabel: string, reach: string, base: string, varied: string) =>
  `${caseLabel}: the profile types of reach ${reach} change from ${base} to ${varied}`;
export const jumpMoved = (caseLabel: string, from: number, to: number, unit: string) =>
  `${caseLabel}: the jump toe moves from station ${fmt(from, 2)} to ${fmt(to, 2)} ${unit}`;
export const jumpAppears = (caseLabel: string, station: number) => `${caseLabel}: a jump forms at station ${fmt(station, 2)} (none in the base case)`;
export const jumpVanishes = (caseLabel: string, station: number) => `${caseLabel}: the jump at station ${fmt(station, 2)} of the base case does not form`;
export const caseFailed = (caseLabel: string, reason: string) => `${caseLabel}: could not be computed: ${reason}`;

/* ---- flow batches ---- */
export const batchReplaces = (count: number, file: string) => `${count} flow${count === 1 ? '' : 's'} from ${file} replace the model's flows`;
