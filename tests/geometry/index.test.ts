import { describe, expect, it } from 'vitest';
import { InputError, type Problem } from '../../src/core/errors.js';
import { createSection, type SectionSpec, validateSectionSpec } from '../../src/geometry/index.js';
import { ShapeKind } from '../../src/geometry/section.js';
import { assertRelative } from '../helpers/assert.js';

function problemsOf(spec: unknown): Problem[] {
  try {
    createSection(spec as SectionSpec);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return [...(error as InputError).problems];
  }
  throw new Error('expected an InputError');
}

describe('createSection', () => {
  it('createSection(spec) builds every shape kind of the vocabulary', () => {
    const specs: Record<ShapeKind, SectionSpec> = {
      rectangular: { shape: 'rectangular', bottomWidth: 3, roughness: 0.015 },
      trapezoidal: { shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2, sideSlopeRight: 1, roughness: 0.015 },
      triangular: { shape: 'triangular', sideSlope: 1.5, roughness: 0.013 },
      circular: { shape: 'circular', diameter: 1.2, roughness: 0.013 },
      points: { shape: 'points', points: [[0, 3], [2, 0], [4, 0], [6, 3]], roughness: [[0, 0.04], [2, 0.03], [4, 0.04]] },
    };
    for (const kind of Object.keys(ShapeKind) as ShapeKind[]) {
      const s = createSection(specs[kind]);
      expect(s.shape).toBe(kind);
      expect(s.elements(0.5).area).toBeGreaterThan(0);
    }
    // trapezoid with different slopes: exact geometry A = (b + (zL + zR)·y/2)·y
    assertRelative(createSection(specs.trapezoidal).elements(1).area, 4.5, 1e-15, 'A');
  });

  it('createSection(spec) names the parameter, the value and the accepted range of each bad value', () => {
    expect(problemsOf({ shape: 'rectangular', bottomWidth: -2, roughness: 0.015 })).toEqual([
      { where: 'bottomWidth', message: 'must be a number > 0 and ≤ 10000000, got -2', value: -2 },
    ]);
    const trap = problemsOf({ shape: 'trapezoidal', bottomWidth: 3, sideSlope: -1, sideSlopeRight: Number.NaN, roughness: 0 });
    expect(trap.map((p) => p.where)).toEqual(['sideSlope', 'sideSlopeRight', 'roughness']);
    expect(trap[0]!.message).toMatch(/≥ 0 .*got -1/);
    expect(problemsOf({ shape: 'trapezoidal', bottomWidth: 0, sideSlope: 0, roughness: 0.02 })[0]!.where).toBe('sideSlope');
    expect(problemsOf({ shape: 'triangular', sideSlope: 0, roughness: 0.02 })[0]!.where).toBe('sideSlope');
    expect(problemsOf({ shape: 'circular', diameter: Number.POSITIVE_INFINITY, roughness: 0.013 })[0]!.where).toBe('diameter');
    expect(problemsOf({ shape: 'oval', diameter: 1 })[0]).toMatchObject({ where: 'shape', value: 'oval' });
    expect(problemsOf({ shape: 'oval' })[0]!.message).toMatch(/rectangular, trapezoidal, triangular, circular, points/);
  });

  it('createSection(points) refuses a section with too few points, offsets going back, or one that holds no water', () => {
    expect(problemsOf({ shape: 'points', points: [[0, 1], [1, 0]], roughness: 0.03 })[0]!.where).toBe('points');
    const back = problemsOf({ shape: 'points', points: [[0, 3], [2, 0], [1.5, 1], [4, 3]], roughness: 0.03 });
    expect(back[0]).toMatchObject({ where: 'points[2]' });
    expect(back[0]!.message).toMatch(/goes backwards/);
    const doubled = problemsOf({ shape: 'points', points: [[0, 3], [1, 0], [1, 2], [1, 1], [3, 3]], roughness: 0.03 });
    expect(doubled[0]!.message).toMatch(/doubles back/);
    expect(problemsOf({ shape: 'points', points: [[0, 0], [1, 1], [2, 2]], roughness: 0.03 })[0]!.message).toMatch(/holds no water/);
    expect(problemsOf({ shape: 'points', points: [[0, 3], ['1', 0], [2, 3]], roughness: 0.03 })[0]!.where).toBe('points[1]');
  });

  it('createSection(points) checks each roughness zone: increasing starts inside the section, positive values', () => {
    const ground = [[0, 3], [2, 0], [4, 0], [6, 3]];
    const zones = problemsOf({ shape: 'points', points: ground, roughness: [[0, 0.04], [0, 0.03], [7, 0.05], [8, -1]] });
    expect(zones.map((p) => p.where)).toEqual(['roughness[1][0]', 'roughness[2][0]', 'roughness[3][0]', 'roughness[3][1]']);
    expect(validateSectionSpec({ shape: 'points', points: ground as [number, number][], roughness: [[0, 0.04], [3, 0.03]] })).toEqual([]);
  });
});
