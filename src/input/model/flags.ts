/**
 * Model pieces from command-line flags: the same types and rules as the model file (types.ts, rules.ts),
 * with every problem named by its flag (`--n`, `--side-slope`). No schema library here, so `gvf section`
 * starts fast. Flag values arrive as text; a number must be written as one (no units, no percent sign).
 */
import { statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError, type Problem } from '../../core/errors.js';
import { type UnitSystem, isUnitSystem } from '../../core/units.js';
import { largestMagnitude, maxOutputStations, slopeLimit, smallestDischarge } from './limits.js';
import * as msg from './messages.js';
import { sectionProblems } from './rules.js';
import type { BoundarySpec, FrictionName, Model, SectionShapeName, SectionSpec } from './types.js';
import { FrictionAveragingName, FrictionName as Frictions, MethodName, modelDefaults } from './types.js';

/** Flag values as commander hands them over (text, or undefined when absent). */
export interface SectionFlags {
  shape?: string;
  bottomWidth?: string;
  sideSlope?: string;
  sideSlopeRight?: string;
  diameter?: string;
  n?: string;
  chezy?: string;
  ks?: string;
  friction?: string;
  alpha?: string;
  force?: boolean;
}

/** The flag that sets each section key. */
export const sectionFlagOf: Record<string, string> = {
  shape: '--shape',
  bottomWidth: '--bottom-width',
  sideSlope: '--side-slope',
  sideSlopeRight: '--side-slope-right',
  diameter: '--diameter',
  n: '--n',
  chezy: '--chezy',
  ks: '--ks',
  friction: '--friction',
  alpha: '--alpha',
  points: '--shape',
};

/** Shapes that can be described by flags, with their dimension keys (points sections need a model file). */
const flagShapes = {
  rectangular: ['bottomWidth'],
  trapezoidal: ['bottomWidth', 'sideSlope', 'sideSlopeRight'],
  triangular: ['sideSlope', 'sideSlopeRight'],
  circular: ['diameter'],
} as const satisfies Partial<Record<SectionShapeName, readonly string[]>>;
type FlagShape = keyof typeof flagShapes;

const dimensionKeys = ['bottomWidth', 'sideSlope', 'sideSlopeRight', 'diameter'] as const;
const requiredDimensions: Record<FlagShape, readonly string[]> = {
  rectangular: ['bottomWidth'],
  trapezoidal: ['bottomWidth', 'sideSlope'],
  triangular: ['sideSlope'],
  circular: ['diameter'],
};
const dimensionWords: Record<string, string> = {
  bottomWidth: 'the bottom width, a number greater than 0',
  sideSlope: 'the side slope (horizontal : 1 vertical), a number of at least 0',
  sideSlopeRight: 'the right side slope (horizontal : 1 vertical), a number of at least 0',
  diameter: 'the conduit diameter, a number greater than 0',
};

const numeral = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Collects problems while reading flags, so one run reports every bad flag at once. */
export class FlagReader {
  readonly problems: Problem[] = [];

  number(flag: string, text: string | undefined, rule: 'any' | 'positive' | 'nonNegative', required: string | false): number | undefined {
    if (text === undefined) {
      if (required !== false) this.problems.push({ where: flag, message: msg.flagRequired(required) });
      return undefined;
    }
    const trimmed = text.trim();
    const value = numeral.test(trimmed) ? Number(trimmed) : Number.NaN;
    if (!numeral.test(trimmed)) {
      this.problems.push({ where: flag, message: msg.expected('a number', text), value: text });
      return undefined;
    }
    if (!Number.isFinite(value)) {
      this.problems.push({ where: flag, message: msg.notFinite(text), value: text });
      return undefined;
    }
    if (Math.abs(value) > largestMagnitude) {
      this.problems.push({ where: flag, message: msg.tooLarge(value), value });
      return undefined;
    }
    if (rule === 'positive' && !(value > 0)) {
      this.problems.push({ where: flag, message: msg.greaterThan(0, value), value });
      return undefined;
    }
    if (rule === 'nonNegative' && !(value >= 0)) {
      this.problems.push({ where: flag, message: msg.atLeast(0, value), value });
      return undefined;
    }
    return value;
  }

  choice<T extends string>(flag: string, text: string | undefined, values: readonly T[]): T | undefined {
    if (text === undefined) return undefined;
    if ((values as readonly string[]).includes(text)) return text as T;
    this.problems.push({ where: flag, message: msg.expectedOneOf(values, text), value: text });
    return undefined;
  }

  /**
   * An output folder from a flag (`--out DIR`): named, and not a file, nor below a file (it is created if missing).
   * Checked before any computing, so a long run does not end in a failed write.
   */
  outputFolder(flag: string, text: string | undefined): void {
    if (text === undefined) return;
    if (text.trim() === '') {
      this.problems.push({ where: flag, message: msg.folderNameNeeded(), value: text });
      return;
    }
    // the path itself, or the nearest part of it that exists, must be a folder
    let path = resolve(text);
    for (let guard = 0; guard < 256; guard++) {
      let found;
      try {
        found = statSync(path, { throwIfNoEntry: false });
      } catch (error) {
        // a file further up makes every path below it "not a directory": look further up; other errors are the writer's
        if ((error as NodeJS.ErrnoException).code !== 'ENOTDIR') return;
      }
      if (found !== undefined) {
        if (!found.isDirectory()) this.problems.push({ where: flag, message: msg.outputFolderIsFile(text, path), value: text });
        return;
      }
      const up = dirname(path);
      if (up === path) return;
      path = up;
    }
  }

  /** Throw one InputError with everything found so far. */
  done(): void {
    if (this.problems.length > 0) throw new InputError(this.problems);
  }
}

/** The unit system from `--units` (default SI). */
export function unitsFromFlag(reader: FlagReader, text: string | undefined): UnitSystem {
  if (text === undefined) return 'SI';
  const upper = text.toUpperCase();
  if (isUnitSystem(upper)) return upper;
  reader.problems.push({ where: '--units', message: msg.expectedOneOf(['SI', 'US'], text), value: text });
  return 'SI';
}

/** A section spec from flags; problems are added to the reader (check `reader.done()` after). */
export function sectionFromFlags(reader: FlagReader, flags: SectionFlags): SectionSpec | undefined {
  const start = reader.problems.length;
  const shapes = Object.keys(flagShapes) as FlagShape[];
  if (flags.shape === undefined) {
    reader.problems.push({ where: '--shape', message: msg.flagRequired(`the section shape, one of ${shapes.join(', ')}`) });
    return undefined;
  }
  if (flags.shape === 'points') {
    reader.problems.push({
      where: '--shape',
      message: 'an irregular ("points") section is given in a model file: use gvf run MODEL.json',
      value: flags.shape,
    });
    return undefined;
  }
  const shape = reader.choice('--shape', flags.shape, shapes);
  if (shape === undefined) return undefined;

  const allowed = flagShapes[shape] as readonly string[];
  const dims: Record<string, number> = {};
  for (const key of dimensionKeys) {
    const flag = sectionFlagOf[key]!;
    const text = flags[key];
    if (!allowed.includes(key)) {
      if (text !== undefined) {
        reader.problems.push({ where: flag, message: msg.flagNotForShape(shape, allowed.map((k) => sectionFlagOf[k]!)), value: text });
      }
      continue;
    }
    const required = requiredDimensions[shape].includes(key) ? dimensionWords[key]! : false;
    const rule = key === 'bottomWidth' && shape === 'rectangular' ? 'positive' : key === 'diameter' ? 'positive' : 'nonNegative';
    const value = reader.number(flag, text, rule, required);
    if (value !== undefined) dims[key] = value;
  }

  const friction = reader.choice<FrictionName>('--friction', flags.friction, Object.keys(Frictions) as FrictionName[]);
  const roughness: Record<string, number> = {};
  for (const key of ['n', 'chezy', 'ks'] as const) {
    const value = reader.number(sectionFlagOf[key]!, flags[key], 'positive', false);
    if (value !== undefined) roughness[key] = value;
  }
  const alpha = reader.number('--alpha', flags.alpha, 'positive', false);
  const spec = {
    shape,
    ...dims,
    ...roughness,
    ...(friction === undefined ? {} : { friction }),
    ...(alpha === undefined ? {} : { alpha }),
  } as SectionSpec;
  const flagOf = (key: string) => sectionFlagOf[key] ?? `--${key}`;
  // roughness problems only when every roughness flag was readable (otherwise "none given" would mislead)
  const roughnessFlagsRead = (['n', 'chezy', 'ks'] as const).every((k) => flags[k] === undefined || roughness[k] !== undefined);
  const rules = sectionProblems(spec, flagOf, { force: flags.force, forceHint: msg.forceHintFlag, nameOf: flagOf }).filter(
    (p) => roughnessFlagsRead || !['--n', '--chezy', '--ks'].includes(p.where),
  );
  reader.problems.push(...rules);
  return reader.problems.length === start ? spec : undefined;
}

/** A boundary from `--upstream` / `--downstream`: normal, critical, or a number (a depth). */
export function boundaryFromFlag(reader: FlagReader, flag: string, text: string | undefined): BoundarySpec | undefined {
  if (text === undefined) return undefined;
  const word = text.trim().toLowerCase();
  if (word === 'normal' || word === 'critical') return { type: word };
  const trimmed = text.trim();
  const depth = numeral.test(trimmed) ? Number(trimmed) : Number.NaN;
  if (Number.isFinite(depth) && depth > largestMagnitude) {
    reader.problems.push({ where: flag, message: msg.tooLarge(depth), value: depth });
    return undefined;
  }
  if (Number.isFinite(depth) && depth > 0) return { type: 'depth', depth };
  reader.problems.push({ where: flag, message: msg.boundaryFlag(text), value: text });
  return undefined;
}

export interface ProfileFlags extends SectionFlags {
  units?: string;
  slope?: string;
  discharge?: string;
  length?: string;
  upstream?: string;
  downstream?: string;
  method?: string;
  step?: string;
  frictionAveraging?: string;
}

/** Read slope and discharge (shared by `gvf section` and `gvf profile`). */
export function slopeAndDischarge(reader: FlagReader, flags: { slope?: string; discharge?: string }): { slope?: number; discharge?: number } {
  const slope = reader.number('--slope', flags.slope, 'any', 'the bed slope as a fraction (0.001 means 0.1 %)');
  if (slope !== undefined && Math.abs(slope) >= slopeLimit) {
    reader.problems.push({ where: '--slope', message: msg.slopeTooLarge(slope), value: slope });
  }
  const discharge = reader.number('--discharge', flags.discharge, 'positive', 'the discharge, a number greater than 0');
  if (discharge !== undefined && discharge < smallestDischarge) {
    reader.problems.push({ where: '--discharge', message: msg.dischargeTooSmall(discharge), value: discharge });
    return { slope, discharge: undefined };
  }
  return { slope, discharge };
}

/** One prismatic reach from `gvf profile` flags, as a model (so it runs through the same engine as a file). */
export function modelFromProfileFlags(flags: ProfileFlags): Model {
  const reader = new FlagReader();
  const units = unitsFromFlag(reader, flags.units);
  const section = sectionFromFlags(reader, flags);
  const { slope, discharge } = slopeAndDischarge(reader, flags);
  const length = reader.number('--length', flags.length, 'positive', 'the reach length, a number greater than 0');
  const upstream = boundaryFromFlag(reader, '--upstream', flags.upstream);
  const downstream = boundaryFromFlag(reader, '--downstream', flags.downstream);
  const method = reader.choice('--method', flags.method, Object.keys(MethodName) as MethodName[]);
  const averaging = reader.choice(
    '--friction-averaging',
    flags.frictionAveraging,
    Object.keys(FrictionAveragingName) as FrictionAveragingName[],
  );
  const step = reader.number('--step', flags.step, 'positive', false);
  if (length !== undefined && step !== undefined && length / step > maxOutputStations) {
    reader.problems.push({ where: '--step', message: msg.tooManyStations(step, length, units === 'US' ? 'ft' : 'm', '--step'), value: step });
  }
  if (section?.shape === 'circular') {
    for (const [flag, b] of [['--upstream', upstream], ['--downstream', downstream]] as const) {
      if (b?.type === 'depth' && b.depth > section.diameter) {
        reader.problems.push({ where: flag, message: msg.depthAboveCrown(b.depth, section.diameter, units === 'US' ? 'ft' : 'm'), value: b.depth });
      }
    }
  }
  reader.done();
  return {
    units,
    sections: { channel: section! },
    reaches: [{ id: 'reach', section: 'channel', length: length!, slope: slope! }],
    downstreamBedElevation: modelDefaults.downstreamBedElevation,
    flows: [{ id: 'flow', discharge: discharge! }],
    boundaries: {
      ...(upstream === undefined ? {} : { upstream }),
      ...(downstream === undefined ? {} : { downstream }),
    },
    method: method ?? modelDefaults.method,
    frictionAveraging: averaging ?? modelDefaults.frictionAveraging,
    ...(step === undefined ? {} : { outputSpacing: step }),
  };
}
