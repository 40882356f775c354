/**
 * Roughness multipliers on section specs (input/model/roughness.ts), checked on the sections built from them:
 * conveyance by Manning's and Chézy's equations, normal depth from Manning's equation solved independently.
 */
import { describe, expect, it } from 'vitest';
import { hydraulicSectionOf } from '../../../src/assembleSection.js';
import { SI } from '../../../src/core/units.js';
import { conveyance } from '../../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../../src/hydraulics/normalDepth.js';
import { scaleManning, scaledRoughnessSpec } from '../../../src/input/model/roughness.js';
import type { SectionSpec } from '../../../src/input/model/types.js';
import { assertRelative } from '../../helpers/assert.js';
import { manningRectangleDepth } from '../../analysis/models.js';

const build = (spec: SectionSpec) => hydraulicSectionOf(spec, SI, (k) => k);
const rectSpec: SectionSpec = { shape: 'rectangular', bottomWidth: 4, n: 0.025 };
const rect = build(rectSpec);

describe('scaledRoughnessSpec', () => {
  it('scaledRoughnessSpec(Manning, m) divides conveyance by m exactly (K = A·R^(2/3)/n, Manning 1891)', () => {
    for (const m of [0.5, 1.3, 2]) {
      const scaled = build(scaledRoughnessSpec(rectSpec, m));
      for (const y of [0.2, 1, 3]) assertRelative(conveyance(scaled, y), conveyance(rect, y) / m, 1e-14, `m ${m}, y ${y}`);
    }
  });

  it('scaledRoughnessSpec(Chézy, m) divides C by m, so m > 1 is rougher there too (K = C·A·√R, Chézy)', () => {
    const spec: SectionSpec = { shape: 'rectangular', bottomWidth: 4, chezy: 50 };
    expect(scaledRoughnessSpec(spec, 1.25)).toEqual({ shape: 'rectangular', bottomWidth: 4, chezy: 40 });
    assertRelative(conveyance(build(scaledRoughnessSpec(spec, 1.25)), 1.5), conveyance(build(spec), 1.5) / 1.25, 1e-14);
  });

  it('scaledRoughnessSpec(Darcy–Weisbach, m > 1) multiplies ks and lowers conveyance', () => {
    const spec: SectionSpec = { shape: 'rectangular', bottomWidth: 4, ks: 0.002 };
    expect(scaledRoughnessSpec(spec, 2)).toEqual({ shape: 'rectangular', bottomWidth: 4, ks: 0.004 });
    expect(conveyance(build(scaledRoughnessSpec(spec, 2)), 1, 10)).toBeLessThan(conveyance(build(spec), 1, 10));
  });

  it("scaledRoughnessSpec(rectangle) gives the normal depth of Manning's equation with n·m", () => {
    // Manning 1891: Q = (1/n)·A·R^(2/3)·√S, solved independently in the test
    const y = normalDepth(build(scaledRoughnessSpec(rectSpec, 1.4)), 10, 0.0005)!;
    assertRelative(y, manningRectangleDepth(10, 4, 0.025 * 1.4, 0.0005), 1e-8);
  });

  it('scaledRoughnessSpec(points with two roughnesses) scales every zone alike, so α is unchanged', () => {
    // α = Σ(Ki³/Ai²)/(K³/A²) is homogeneous of degree 0 in a common factor on all Ki (Chow 1959 §2-8, from memory)
    const spec: SectionSpec = {
      shape: 'points',
      points: [[0, 3], [10, 1], [12, 0], [16, 0], [18, 1], [28, 3]],
      n: [[0, 0.05], [12, 0.03], [16, 0.05]],
    };
    const compound = build(spec);
    const scaled = build(scaledRoughnessSpec(spec, 1.6));
    for (const y of [0.5, 1.5, 2.5]) {
      assertRelative(conveyance(scaled, y), conveyance(compound, y) / 1.6, 1e-12);
      const sa = scaled.section.subsections(y).map((s) => s.roughness);
      const ca = compound.section.subsections(y).map((s) => s.roughness * 1.6);
      expect(sa).toHaveLength(ca.length);
      sa.forEach((v, i) => assertRelative(v, ca[i]!, 1e-14));
    }
  });

  it('scaledRoughnessSpec keeps the geometry, the law and a fixed α, and returns the spec itself for m = 1', () => {
    const spec: SectionSpec = { shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2, friction: 'manning', n: 0.03, alpha: 1.1 };
    expect(scaledRoughnessSpec(spec, 1)).toBe(spec);
    const scaled = scaledRoughnessSpec(spec, 1.5);
    expect(scaled).toEqual({ ...spec, n: 0.03 * 1.5 });
    expect(spec.n).toBe(0.03);
  });

  it('scaledRoughnessSpec and scaleManning refuse a multiplier that is not positive', () => {
    expect(() => scaledRoughnessSpec(rectSpec, 0)).toThrow(/greater than 0/);
    expect(() => scaledRoughnessSpec(rectSpec, Number.NaN)).toThrow(/greater than 0/);
    expect(() => scaleManning(0.03, -1)).toThrow(/greater than 0/);
  });

  it('scaleManning scales a zone table value by value and keeps the zone boundaries', () => {
    expect(scaleManning([[0, 0.05], [12, 0.03]], 2)).toEqual([[0, 0.1], [12, 0.06]]);
    expect(scaleManning(0.03, 2)).toBe(0.06);
  });
});
