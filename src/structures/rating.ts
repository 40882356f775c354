/**
 * A downstream rating curve: a stage–discharge table, interpolated linearly between its points. A discharge
 * or stage outside the table is an error that names the table's range (no extrapolation).
 */
import { InputError, type Problem } from '../core/errors.js';

export interface RatingPoint {
  readonly stage: number;
  readonly discharge: number;
}

export interface RatingCurve {
  /** points by rising discharge (and stage) */
  readonly points: readonly RatingPoint[];
  /** where the table came from, for messages (a JSON path or file name) */
  readonly where: string;
}

/** Validate a table: at least two points, finite, discharge ≥ 0, stage and discharge both strictly rising. */
export function ratingCurve(points: readonly RatingPoint[], where = 'rating'): RatingCurve {
  const problems: Problem[] = [];
  if (points.length < 2) problems.push({ where, message: 'a rating curve needs at least two stage–discharge points', value: points.length });
  points.forEach((p, i) => {
    if (!Number.isFinite(p.stage)) problems.push({ where: `${where}[${i}].stage`, message: 'the stage must be a number', value: p.stage });
    if (!Number.isFinite(p.discharge) || p.discharge < 0) problems.push({ where: `${where}[${i}].discharge`, message: 'the discharge must be a number ≥ 0', value: p.discharge });
  });
  const sorted = [...points].sort((a, b) => a.discharge - b.discharge);
  for (let i = 1; i < sorted.length && problems.length === 0; i++) {
    const a = sorted[i - 1]!;
    const b = sorted[i]!;
    if (!(b.discharge > a.discharge) || !(b.stage > a.stage)) {
      problems.push({
        where,
        message: `stage and discharge must both rise from point to point; (${a.stage}, ${a.discharge}) and (${b.stage}, ${b.discharge}) do not`,
      });
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  return { points: sorted, where };
}

function interpolateBy(curve: RatingCurve, key: 'stage' | 'discharge', value: number, other: 'stage' | 'discharge'): number {
  const pts = curve.points;
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (!(value >= first[key] && value <= last[key])) {
    throw new InputError({
      where: curve.where,
      message: `${key} ${value} lies outside the rating curve, which covers ${key}s ${first[key]} to ${last[key]}; extend the table`,
      value,
    });
  }
  let i = 1;
  while (i < pts.length - 1 && pts[i]![key] < value) i++;
  const a = pts[i - 1]!;
  const b = pts[i]!;
  const t = (value - a[key]) / (b[key] - a[key]);
  return a[other] + t * (b[other] - a[other]);
}

/** Stage for a discharge, by linear interpolation in the table. */
export function stageFromRating(curve: RatingCurve, discharge: number): number {
  return interpolateBy(curve, 'discharge', discharge, 'stage');
}

/** Discharge for a stage, by linear interpolation in the table. */
export function dischargeFromRating(curve: RatingCurve, stage: number): number {
  return interpolateBy(curve, 'stage', stage, 'discharge');
}
