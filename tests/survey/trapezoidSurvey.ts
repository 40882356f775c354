/**
 * An invented surveyed channel that is in fact prismatic: the same trapezoid (bottom 3 m, side slopes 2:1,
 * 2.5 m deep, Manning's n 0.03) surveyed as points every `spacing` metres on a bed falling 0.001, and the same
 * channel described by a trapezoidal model section, so a surveyed run can be set against the prismatic engine
 * and against Manning's normal depth. Each station has its own cross-section (the trapezoid at its bed), so
 * interpolation blends two sections, as in a real survey.
 */
import { brentRoot } from '../../src/core/roots.js';
import type { Model } from '../../src/input/model/types.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { validateModel } from '../../src/input/model/validate.js';
import { modelFolder } from './folder.js';

export const trapezoid = { bottomWidth: 3, sideSlope: 2, n: 0.03, slope: 0.001, topBed: 10 } as const;

const points = [
  [-6.5, 2.5],
  [-1.5, 0],
  [1.5, 0],
  [6.5, 2.5],
] as const;

export interface SurveyedTrapezoid {
  /** the surveyed model and its file (runModel needs modelFile) */
  readonly model: Model;
  readonly file: string;
  /** the same channel as prismatic reaches of a trapezoidal model section */
  readonly prismatic: Model;
}

/**
 * Reaches of `length` metres each (ids from `reaches`), surveyed every `spacing` metres, stations increasing
 * downstream from 0; `boundaries` and `flows` as in a model file.
 */
export function surveyedTrapezoid(
  reaches: readonly string[],
  length: number,
  spacing: number,
  flows: readonly { id: string; discharge: number }[],
  boundaries: Record<string, unknown>,
): SurveyedTrapezoid {
  const bed = (s: number) => trapezoid.topBed - trapezoid.slope * s;
  const sections = ['section,offset,elevation,n'];
  const files: Record<string, string> = {};
  reaches.forEach((id, k) => {
    const rows = ['station,bed,section'];
    for (let j = 0; j * spacing <= length + 1e-9; j++) {
      const s = k * length + j * spacing;
      rows.push(`${s},${bed(s)},X${s}`);
      if (j > 0 || k === 0) sections.push(...points.map(([x, z], i) => `X${s},${x},${z + bed(s)},${i === 0 ? trapezoid.n : ''}`));
    }
    files[`${id}.csv`] = rows.join('\n');
  });
  files['xs.csv'] = sections.join('\n');
  const common = { units: 'SI', flows, boundaries, method: 'standard-step' };
  const folder = modelFolder(
    {
      title: 'Invented surveyed trapezoid',
      ...common,
      sections: {},
      reaches: reaches.map((id) => ({ id, survey: { stations: `${id}.csv`, crossSections: 'xs.csv', stationing: 'increasing-downstream', contraction: 0, expansion: 0 } })),
    },
    files,
  );
  const prismatic = validateModel(
    {
      title: 'Invented trapezoid',
      ...common,
      sections: { earth: { shape: 'trapezoidal', bottomWidth: trapezoid.bottomWidth, sideSlope: trapezoid.sideSlope, n: trapezoid.n } },
      reaches: reaches.map((id) => ({ id, section: 'earth', length, slope: trapezoid.slope })),
      downstreamBedElevation: bed(reaches.length * length),
    },
    'trapezoid.json',
  );
  return { model: readModelFile(folder.model), file: folder.model, prismatic };
}

/**
 * Normal depth of the trapezoid from Manning's equation (Manning 1891), Q = (1/n)·A·R^(2/3)·√S with
 * A = (b + z·y)·y and P = b + 2y·√(1 + z²), solved here by Brent's method, independent of the engine's solvers.
 */
export function trapezoidNormalDepth(q: number, n: number): number {
  const { bottomWidth: b, sideSlope: z, slope } = trapezoid;
  const f = (y: number) => {
    const a = (b + z * y) * y;
    const p = b + 2 * y * Math.sqrt(1 + z * z);
    return (a * Math.pow(a / p, 2 / 3) * Math.sqrt(slope)) / n - q;
  };
  return brentRoot(f, 1e-6, 100, { xTolerance: 1e-12, what: 'test normal depth' });
}
