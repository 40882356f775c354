/**
 * Reading one cell as a number, strictly: a sign, digits, an optional decimal point and exponent.
 * JavaScript's Number() would take "", " ", "0x1A", "Infinity" and "1e999"; a survey value is none of those.
 */
import type { CsvCell } from './table.js';
import { at, type ProblemList } from './problems.js';
import * as say from './messages.js';

const decimal = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const spelledNonFinite = /^[+-]?(?:nan|inf|infinity|∞)$/i;

/**
 * Plausibility bounds: a value beyond these is a typing or unit mistake, not a survey.
 * 10⁷ length units is 10,000 km or about 1,900 miles; 10⁷ discharge units is some fifty times the largest river's flood.
 */
export const largestLength = 1e7;
export const largestDischarge = 1e7;
/** Coefficients and n are small numbers; anything this large is a mistake (and range checks follow). */
export const largestPureNumber = 1e6;

export interface NumberRule {
  readonly label: string;
  readonly limit: number;
}

/**
 * The number in `cell`, or undefined after adding a problem. A blank cell gives undefined with a problem only
 * when `required`.
 */
export function readNumber(
  cell: CsvCell | undefined,
  rule: NumberRule,
  file: string,
  problems: ProblemList,
  required: boolean,
): number | undefined {
  if (cell === undefined) return undefined;
  const where = at(file, cell.line, cell.column);
  const text = cell.text;
  if (text === '') {
    if (required) problems.add(where, say.missingValue(rule.label));
    return undefined;
  }
  if (spelledNonFinite.test(text)) {
    problems.add(where, say.notFinite(rule.label, text), text);
    return undefined;
  }
  if (!decimal.test(text)) {
    problems.add(where, say.notANumber(rule.label, text), text);
    return undefined;
  }
  const value = Number(text);
  if (!Number.isFinite(value) || Math.abs(value) > rule.limit) {
    problems.add(where, say.tooLarge(rule.label, text, rule.limit), text);
    return undefined;
  }
  // -0 reads as 0 so that messages and comparisons stay plain.
  return value === 0 ? 0 : value;
}
