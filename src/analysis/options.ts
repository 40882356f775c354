/**
 * Option values of the analysis commands, read from text: a sensitivity list (n=±20%,Q=±10%), a list or
 * range of discharges (2,5,10 or 1:20:1), a list of stations (120,480) and multiplier bounds (0.5:2).
 * Every problem names the flag, the value and the accepted form (InputError; the CLI exits with 2).
 */
import { InputError, type Problem } from '../core/errors.js';
import * as say from './messages.js';
import { batchMaxCases, multiplierLimits, rangeEndFraction, ratingMaxStations, sensitivityMaxParameters, sensitivityMaxPercent } from './tolerances.js';
import { SensitivityParameter, type Variation } from './variation.js';

const numeral = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function numberOf(text: string): number | undefined {
  const t = text.trim();
  if (!numeral.test(t)) return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : undefined;
}

const fail = (where: string, message: string, value: unknown): never => {
  throw new InputError({ where, message, value });
};

/** "n=±20%,Q=±10%" → variations. `±` may be written `+-` or left out ("n=20%"); the % sign is required. */
export function parseSensitivity(text: string, where = '--sensitivity'): Variation[] {
  const problems: Problem[] = [];
  const out: Variation[] = [];
  const parts = text.split(',').map((p) => p.trim());
  if (text.trim() === '') fail(where, say.expectedForm(say.sensitivityForm, text), text);
  for (const part of parts) {
    const m = /^([A-Za-z]+)\s*=\s*(?:±|\+-|\+\/-)?\s*([0-9.eE+-]+)\s*%$/.exec(part);
    if (m === null) {
      problems.push({ where, message: say.expectedForm(say.sensitivityForm, part), value: part });
      continue;
    }
    const name = m[1]!;
    const parameter = (Object.keys(SensitivityParameter) as SensitivityParameter[]).find((k) => k === name || (k === 'n' && name === 'N') || (k === 'Q' && name === 'q'));
    if (parameter === undefined) {
      problems.push({ where, message: say.unknownSensitivityParameter(name), value: part });
      continue;
    }
    const percent = numberOf(m[2]!);
    if (percent === undefined) {
      problems.push({ where, message: say.expectedForm(say.sensitivityForm, part), value: part });
      continue;
    }
    if (!(percent > 0 && percent <= sensitivityMaxPercent)) {
      problems.push({ where, message: say.percentRange(percent, sensitivityMaxPercent), value: part });
      continue;
    }
    if (out.some((v) => v.parameter === parameter)) {
      problems.push({ where, message: say.repeatedParameter(parameter), value: part });
      continue;
    }
    out.push({ parameter, percent });
  }
  if (problems.length === 0 && out.length > sensitivityMaxParameters) {
    problems.push({ where, message: say.expectedForm(say.sensitivityForm, text), value: text });
  }
  if (problems.length > 0) throw new InputError(problems);
  return out;
}

/** "2,5,10" or "1:20:1" (from:to:step, both ends included when the step lands on them) → discharges > 0. */
export function parseDischarges(text: string, where = '--discharges'): number[] {
  const t = text.trim();
  let values: number[];
  if (t.includes(':')) {
    const parts = t.split(':');
    const nums = parts.map(numberOf);
    if (parts.length !== 3 || nums.some((v) => v === undefined)) return fail(where, say.expectedForm(say.dischargeForm, text), text);
    const [from, to, step] = nums as [number, number, number];
    if (!(step > 0) || !(to >= from)) return fail(where, say.rangeStepSign(from, to, step), text);
    const count = Math.floor((to - from) / step + rangeEndFraction) + 1;
    if (count > batchMaxCases) return fail(where, say.tooManyCases(count, batchMaxCases), text);
    // each value from its index (no accumulated round-off), rounded to the step's decimals
    const decimals = Math.min(12, Math.max(decimalsOf(parts[0]!), decimalsOf(parts[2]!)));
    values = Array.from({ length: count }, (_, i) => Number((from + i * step).toFixed(decimals)));
  } else {
    const parts = t.split(',').map((p) => p.trim());
    const nums = parts.map(numberOf);
    if (t === '' || nums.some((v) => v === undefined)) return fail(where, say.expectedForm(say.dischargeForm, text), text);
    values = nums as number[];
    if (values.length > batchMaxCases) return fail(where, say.tooManyCases(values.length, batchMaxCases), text);
  }
  const bad = values.find((v) => !(v > 0));
  if (bad !== undefined) return fail(where, `${say.expectedForm(say.dischargeForm, text)} (${bad} is not greater than 0)`, text);
  const seen = new Set<number>();
  for (const v of values) {
    if (seen.has(v)) return fail(where, `discharge ${v} is listed twice; list each once`, text);
    seen.add(v);
  }
  return values;
}

function decimalsOf(text: string): number {
  const m = /\.(\d+)/.exec(text.trim());
  return m ? m[1]!.length : 0;
}

/** "120,480" → stations (any sign; their place on the channel is checked against the computed profile). */
export function parseStations(text: string, where = '--stations'): number[] {
  const parts = text.split(',').map((p) => p.trim());
  const nums = parts.map(numberOf);
  if (text.trim() === '' || nums.some((v) => v === undefined)) return fail(where, say.expectedForm(say.stationForm, text), text);
  if (nums.length > ratingMaxStations) return fail(where, say.tooManyStations(nums.length, ratingMaxStations), text);
  return nums as number[];
}

/** "0.5:2" → multiplier bounds with lower < 1 < upper inside the accepted limits. */
export function parseBounds(text: string, where = '--bounds'): { lower: number; upper: number } {
  const parts = text.split(':');
  const nums = parts.map(numberOf);
  if (parts.length !== 2 || nums.some((v) => v === undefined)) return fail(where, say.expectedForm(say.boundsForm, text), text);
  const [lower, upper] = nums as [number, number];
  if (!(lower >= multiplierLimits.lower && lower < 1 && upper > 1 && upper <= multiplierLimits.upper)) {
    return fail(where, say.boundsRange(lower, upper, multiplierLimits.lower, multiplierLimits.upper), text);
  }
  return { lower, upper };
}
