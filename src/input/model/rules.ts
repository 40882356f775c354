/**
 * Plausibility rules for a section, shared by the model file and the command-line flags: the same rule
 * gives the same words whether the place is `sections.lined.n` or `--n`. Types are already right here
 * (checked by the schema or by the flag reader); these rules look at values and at their relations.
 */
import type { Problem } from '../../core/errors.js';
import { alphaRange, largestDiameter, manningRange, minimumPoints, smallestWidth } from './limits.js';
import * as msg from './messages.js';
import type { FrictionName, RoughnessKey, RoughnessTable, SectionSpec } from './types.js';
import { roughnessKey } from './types.js';

/** Names the place of a key of the section: a JSON path or a flag. */
export type WhereOf = (key: string) => string;

export interface RuleOptions {
  /** lift the roughness plausibility limits */
  readonly force?: boolean;
  /** how to tell the user to lift them ("pass --force ...") */
  readonly forceHint: string;
  /** how a key is named in a message (a flag for the CLI); default the key itself */
  readonly nameOf?: (key: string) => string;
}

const roughnessKeys: readonly RoughnessKey[] = ['n', 'chezy', 'ks'];
const lawOfKey: Record<RoughnessKey, FrictionName> = { n: 'manning', chezy: 'chezy', ks: 'darcy-weisbach' };

/** The friction law and roughness of a section whose rules passed. */
export interface ResolvedRoughness {
  readonly friction: FrictionName;
  readonly key: RoughnessKey;
  readonly value: number | RoughnessTable;
}

/** The friction law and roughness value of a spec (the first roughness key given; rules report several). */
export function resolveRoughness(spec: SectionSpec): ResolvedRoughness | undefined {
  const given = roughnessKeys.filter((k) => spec[k] !== undefined);
  const key = spec.friction !== undefined ? roughnessKey[spec.friction] : given[0];
  if (key === undefined) return undefined;
  const value = spec[key];
  if (value === undefined) return undefined;
  return { friction: spec.friction ?? lawOfKey[key], key, value };
}

export function sectionProblems(spec: SectionSpec, whereOf: WhereOf, options: RuleOptions): Problem[] {
  const problems: Problem[] = [];
  const nameOf = options.nameOf ?? ((key: string) => key);
  const given = roughnessKeys.filter((k) => spec[k] !== undefined);
  if (given.length === 0) {
    problems.push({ where: whereOf('n'), message: msg.noRoughness(roughnessKeys.map(nameOf)) });
  } else if (given.length > 1) {
    problems.push({ where: whereOf(given[1]!), message: msg.severalRoughness(given.map(nameOf)), value: spec[given[1]!] });
  } else if (spec.friction !== undefined && roughnessKey[spec.friction] !== given[0]) {
    problems.push({
      where: whereOf('friction'),
      message: msg.frictionMismatch(spec.friction, nameOf(roughnessKey[spec.friction]), nameOf(given[0]!)),
      value: spec.friction,
    });
  }

  if (spec.n !== undefined && !options.force) {
    const outside = (n: number) => n < manningRange.min || n > manningRange.max;
    if (typeof spec.n === 'number') {
      if (outside(spec.n)) problems.push({ where: whereOf('n'), message: msg.manningOutOfRange(spec.n, options.forceHint), value: spec.n });
    } else {
      spec.n.forEach(([, n], i) => {
        if (outside(n)) {
          problems.push({ where: `${whereOf('n')}[${i}][1]`, message: msg.manningOutOfRange(n, options.forceHint), value: n });
        }
      });
    }
  }

  if (spec.alpha !== undefined && (spec.alpha < alphaRange.min || spec.alpha > alphaRange.max)) {
    problems.push({ where: whereOf('alpha'), message: msg.alphaOutOfRange(spec.alpha), value: spec.alpha });
  }

  problems.push(...dimensionProblems(spec, whereOf));
  if (spec.shape === 'points') problems.push(...pointsProblems(spec.points, whereOf));
  if (spec.shape === 'points' && problems.length === 0) {
    for (const key of roughnessKeys) {
      const table = spec[key];
      if (Array.isArray(table)) problems.push(...tableProblems(table, whereOf(key)));
    }
  }
  return problems;
}

/**
 * Widths and diameters no real channel has (limits.ts): the solvers bracket depths from a fraction of the section's
 * width, so a nanometre slot, or a pipe a hundred kilometres across, sends them beyond their bounds.
 */
function dimensionProblems(spec: SectionSpec, whereOf: WhereOf): Problem[] {
  if (spec.shape === 'rectangular' || spec.shape === 'trapezoidal') {
    const b = spec.bottomWidth;
    const zeroAllowed = spec.shape === 'trapezoidal';
    if (b > 0 && b < smallestWidth) {
      return [{ where: whereOf('bottomWidth'), message: msg.widthTooSmall('a bottom width', b, zeroAllowed), value: b }];
    }
  }
  if (spec.shape === 'circular' && (spec.diameter < smallestWidth || spec.diameter > largestDiameter)) {
    return [{ where: whereOf('diameter'), message: msg.diameterOutOfRange(spec.diameter), value: spec.diameter }];
  }
  return [];
}

function pointsProblems(points: ReadonlyArray<readonly [number, number]>, whereOf: WhereOf): Problem[] {
  const where = whereOf('points');
  if (points.length < minimumPoints) {
    return [{ where, message: msg.pointsTooFew(points.length), value: points.length }];
  }
  for (let i = 1; i < points.length; i++) {
    const previous = points[i - 1]![0];
    const station = points[i]![0];
    if (station < previous) {
      return [{ where: `${where}[${i}][0]`, message: msg.pointsOrder(previous, station), value: station }];
    }
  }
  let lowest = Infinity;
  for (const [, elevation] of points) lowest = Math.min(lowest, elevation);
  const first = points[0]![1];
  const last = points[points.length - 1]![1];
  if (!(first > lowest && last > lowest)) return [{ where, message: msg.pointsNoLowPoint() }];
  return [];
}

function tableProblems(table: RoughnessTable, where: string): Problem[] {
  // the first entry also covers any ground left of it (as the geometry defines), so only the order is checked
  const problems: Problem[] = [];
  for (let i = 1; i < table.length; i++) {
    const previous = table[i - 1]![0];
    const station = table[i]![0];
    if (!(station > previous)) {
      problems.push({ where: `${where}[${i}][0]`, message: msg.roughnessTableOrder(previous, station), value: station });
    }
  }
  return problems;
}
