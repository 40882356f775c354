import { describe, expect, it } from 'vitest';
import { scaledSection, withRoughnessMultipliers } from '../../src/analysis/roughness.js';
import { SI } from '../../src/core/units.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { points } from '../../src/geometry/shapes/points.js';
import { conveyance, hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../src/hydraulics/normalDepth.js';
import type { ProfileInput } from '../../src/profile/types.js';
import { assertRelative } from '../helpers/assert.js';
import { manningRectangleDepth } from './models.js';

const rect = hydraulicSection(rectangular({ bottomWidth: 4, roughness: 0.025 }), 'manning', SI);

describe('scaledSection', () => {
  it('scaledSection(Manning, m) divides conveyance by m exactly (K = A·R^(2/3)/n, Manning 1891)', () => {
    for (const m of [0.5, 1.3, 2]) {
      for (const y of [0.2, 1, 3]) assertRelative(conveyance(scaledSection(rect, m), y), conveyance(rect, y) / m, 1e-14, `m ${m}, y ${y}`);
    }
  });

  it('scaledSection(Chézy, m) divides C by m, so m > 1 is rougher there too (K = C·A·√R, Chézy)', () => {
    const chezy = hydraulicSection(rectangular({ bottomWidth: 4, roughness: 50 }), 'chezy', SI);
    assertRelative(conveyance(scaledSection(chezy, 1.25), 1.5), conveyance(chezy, 1.5) / 1.25, 1e-14);
  });

  it('scaledSection(Darcy–Weisbach, m > 1) lowers conveyance (ks multiplied)', () => {
    const dw = hydraulicSection(rectangular({ bottomWidth: 4, roughness: 0.002 }), 'darcy-weisbach', SI);
    expect(conveyance(scaledSection(dw, 2), 1, 10)).toBeLessThan(conveyance(dw, 1, 10));
  });

  it('scaledSection(rectangle) gives the normal depth of Manning\'s equation with n·m', () => {
    // Manning 1891: Q = (1/n)·A·R^(2/3)·√S, solved independently in the test
    const y = normalDepth(scaledSection(rect, 1.4), 10, 0.0005)!;
    assertRelative(y, manningRectangleDepth(10, 4, 0.025 * 1.4, 0.0005), 1e-8);
  });

  it('scaledSection(points with two roughnesses) scales every subsection alike, so α is unchanged', () => {
    // α = Σ(Ki³/Ai²)/(K³/A²) is homogeneous of degree 0 in a common factor on all Ki (Chow 1959 §2-8, from memory)
    const compound = hydraulicSection(
      points({ points: [[0, 3], [10, 1], [12, 0], [16, 0], [18, 1], [28, 3]], roughness: [[0, 0.05], [12, 0.03], [16, 0.05]] }),
      'manning',
      SI,
    );
    const scaled = scaledSection(compound, 1.6);
    for (const y of [0.5, 1.5, 2.5]) {
      assertRelative(conveyance(scaled, y), conveyance(compound, y) / 1.6, 1e-12);
      const sa = scaled.section.subsections(y).map((s) => s.roughness);
      const ca = compound.section.subsections(y).map((s) => s.roughness * 1.6);
      sa.forEach((v, i) => assertRelative(v, ca[i]!, 1e-14));
    }
  });

  it('scaledSection refuses a multiplier that is not positive', () => {
    expect(() => scaledSection(rect, 0)).toThrow(/greater than 0/);
    expect(() => scaledSection(rect, Number.NaN)).toThrow(/greater than 0/);
  });
});

describe('withRoughnessMultipliers', () => {
  it('withRoughnessMultipliers(input, per reach) scales each reach by its own multiplier and shares wrappers', () => {
    const input: ProfileInput = {
      units: SI,
      reaches: [
        { id: 'a', section: rect, length: 100, slope: 0.001 },
        { id: 'b', section: rect, length: 100, slope: 0.001 },
        { id: 'c', section: rect, length: 100, slope: 0.001 },
      ],
      discharge: 5,
      flowId: 'f',
      boundaries: {},
      method: 'standard-step',
    };
    const of: Record<string, number> = { a: 1.5, b: 1.5, c: 1 };
    const out = withRoughnessMultipliers(input, (id) => of[id]!);
    const [a, b, c] = out.reaches as unknown as { section: typeof rect }[];
    expect(a!.section).toBe(b!.section);
    expect(c!.section).toBe(rect);
    assertRelative(conveyance(a!.section, 1), conveyance(rect, 1) / 1.5, 1e-14);
    expect(input.reaches[0]).not.toBe(out.reaches[0]);
  });
});
