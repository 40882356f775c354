/**
 * The section registry: one spec type per shape and `createSection(spec)`, over an exhaustive record of
 * builders (a shape without a builder does not compile).
 *
 *   spec ──validateSectionSpec──▶ problems (none) ──builders[spec.shape]──▶ Section
 *
 * Parameters are checked strictly: each problem names the parameter (`bottomWidth`, `points[3]`,
 * `roughness[1][0]`), the value and the accepted range. The input layer prefixes its JSON path.
 * Roughness is only checked to be positive here: its range depends on the friction law (n, C or ks),
 * which the input layer knows.
 */
import { InputError, type Problem, show } from '../core/errors.js';
import { largestLength, largestSideSlope } from '../core/tolerances.js';
import { ShapeKind, type Section } from './section.js';
import { circular } from './shapes/circular.js';
import { pointsSpecProblems, type RoughnessZoneSpec, type StationElevation, points } from './shapes/points.js';
import { rectangular } from './shapes/rectangular.js';
import { trapezoidal } from './shapes/trapezoidal.js';
import { triangular } from './shapes/triangular.js';

export interface RectangularSectionSpec {
  readonly shape: 'rectangular';
  readonly bottomWidth: number;
  readonly roughness: number;
}
export interface TrapezoidalSectionSpec {
  readonly shape: 'trapezoidal';
  readonly bottomWidth: number;
  /** left side slope, horizontal : 1 vertical (and the right one unless sideSlopeRight is given) */
  readonly sideSlope: number;
  readonly sideSlopeRight?: number;
  readonly roughness: number;
}
export interface TriangularSectionSpec {
  readonly shape: 'triangular';
  readonly sideSlope: number;
  readonly sideSlopeRight?: number;
  readonly roughness: number;
}
export interface CircularSectionSpec {
  readonly shape: 'circular';
  readonly diameter: number;
  readonly roughness: number;
}
export interface PointsSectionSpec {
  readonly shape: 'points';
  readonly points: readonly StationElevation[];
  readonly roughness: number | readonly RoughnessZoneSpec[];
}
export type SectionSpec =
  | RectangularSectionSpec
  | TrapezoidalSectionSpec
  | TriangularSectionSpec
  | CircularSectionSpec
  | PointsSectionSpec;

type SpecOf<K extends ShapeKind> = Extract<SectionSpec, { shape: K }>;

interface ShapeEntry<K extends ShapeKind> {
  readonly validate: (spec: SpecOf<K>, problems: Problem[]) => void;
  readonly build: (spec: SpecOf<K>) => Section;
}

const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function length(value: unknown, where: string, problems: Problem[], allowZero: boolean): boolean {
  const ok = isNumber(value) && (allowZero ? value >= 0 : value > 0) && value <= largestLength;
  if (!ok) {
    const range = allowZero ? `≥ 0` : `> 0`;
    problems.push({ where, message: `must be a number ${range} and ≤ ${largestLength}, got ${show(value)}`, value });
  }
  return ok;
}

function sideSlope(value: unknown, where: string, problems: Problem[]): boolean {
  const ok = isNumber(value) && value >= 0 && value <= largestSideSlope;
  if (!ok) {
    problems.push({
      where,
      message: `must be a side slope (horizontal : 1 vertical) ≥ 0 and ≤ ${largestSideSlope}, got ${show(value)}`,
      value,
    });
  }
  return ok;
}

function roughnessValue(value: unknown, where: string, problems: Problem[]): boolean {
  const ok = isNumber(value) && value > 0;
  if (!ok) problems.push({ where, message: `must be a roughness value > 0, got ${show(value)}`, value });
  return ok;
}

function slopes(spec: { sideSlope: number; sideSlopeRight?: number }, problems: Problem[]): [number, number] | null {
  const left = sideSlope(spec.sideSlope, 'sideSlope', problems);
  const right = spec.sideSlopeRight === undefined || sideSlope(spec.sideSlopeRight, 'sideSlopeRight', problems);
  return left && right ? [spec.sideSlope, spec.sideSlopeRight ?? spec.sideSlope] : null;
}

const shapes: { readonly [K in ShapeKind]: ShapeEntry<K> } = {
  rectangular: {
    validate(spec, problems) {
      length(spec.bottomWidth, 'bottomWidth', problems, false);
      roughnessValue(spec.roughness, 'roughness', problems);
    },
    build: (spec) => rectangular({ bottomWidth: spec.bottomWidth, roughness: spec.roughness }),
  },
  trapezoidal: {
    validate(spec, problems) {
      const b = length(spec.bottomWidth, 'bottomWidth', problems, true);
      const z = slopes(spec, problems);
      if (b && z && spec.bottomWidth === 0 && z[0] + z[1] === 0) {
        problems.push({
          where: 'sideSlope',
          message: 'a trapezoid with bottom width 0 needs a side slope > 0 (it would have no width)',
          value: spec.sideSlope,
        });
      }
      roughnessValue(spec.roughness, 'roughness', problems);
    },
    build: (spec) =>
      trapezoidal({
        bottomWidth: spec.bottomWidth,
        sideSlopeLeft: spec.sideSlope,
        sideSlopeRight: spec.sideSlopeRight ?? spec.sideSlope,
        roughness: spec.roughness,
      }),
  },
  triangular: {
    validate(spec, problems) {
      const z = slopes(spec, problems);
      if (z && z[0] + z[1] === 0) {
        problems.push({ where: 'sideSlope', message: 'a triangular channel needs a side slope > 0 on at least one side', value: spec.sideSlope });
      }
      roughnessValue(spec.roughness, 'roughness', problems);
    },
    build: (spec) =>
      triangular({ sideSlopeLeft: spec.sideSlope, sideSlopeRight: spec.sideSlopeRight ?? spec.sideSlope, roughness: spec.roughness }),
  },
  circular: {
    validate(spec, problems) {
      length(spec.diameter, 'diameter', problems, false);
      roughnessValue(spec.roughness, 'roughness', problems);
    },
    build: (spec) => circular({ diameter: spec.diameter, roughness: spec.roughness }),
  },
  points: {
    validate: (spec, problems) => problems.push(...pointsSpecProblems(spec)),
    build: (spec) => points({ points: spec.points, roughness: spec.roughness }),
  },
};

/** The problems of a spec (empty when it is valid), without throwing. */
export function validateSectionSpec(spec: SectionSpec): Problem[] {
  const problems: Problem[] = [];
  const shape: unknown = (spec as { shape?: unknown } | null)?.shape;
  if (typeof shape !== 'string' || !Object.hasOwn(shapes, shape)) {
    problems.push({ where: 'shape', message: `must be one of ${Object.keys(ShapeKind).join(', ')}, got ${show(shape)}`, value: shape });
    return problems;
  }
  (shapes[spec.shape].validate as (s: SectionSpec, p: Problem[]) => void)(spec, problems);
  return problems;
}

/** Build the section a spec describes; throws InputError listing every problem of the spec. */
export function createSection(spec: SectionSpec): Section {
  const problems = validateSectionSpec(spec);
  if (problems.length > 0) throw new InputError(problems);
  return (shapes[spec.shape].build as (s: SectionSpec) => Section)(spec);
}

export { hydraulicDepth, hydraulicRadius, ShapeKind } from './section.js';
export type { Elements, Section, SubsectionElements } from './section.js';
export { circular, circularSegment, isFull } from './shapes/circular.js';
export { rectangular } from './shapes/rectangular.js';
export { trapezoidal } from './shapes/trapezoidal.js';
export { triangular } from './shapes/triangular.js';
export { isPointsSection, points, pointsBounds, pointsSpecProblems } from './shapes/points.js';
export type { EndPoint, PointsSection, PointsSpec, RoughnessZone, RoughnessZoneSpec, StationElevation } from './shapes/points.js';
export { blendSections, prismaticAsPoints } from './blend.js';
export type { BlendOptions } from './blend.js';
