/**
 * Assembly of one section: a validated SectionSpec → the HydraulicSection the solvers compute with.
 *
 *   SectionSpec ──geometrySpecOf──▶ geometry spec ──createSection──▶ Section ──hydraulicSection──▶ HydraulicSection
 *
 * Kept apart from assemble.ts (whole models, structures, data files) so that `gvf section` loads only
 * what one section needs and starts fast.
 */
import { InputError, type Problem } from './core/errors.js';
import type { Units } from './core/units.js';
import { type SectionSpec as GeometrySpec, createSection } from './geometry/index.js';
import { type HydraulicSection, hydraulicSection } from './hydraulics/hydraulicSection.js';
import type { WhereOf } from './input/model/rules.js';
import { resolveRoughness } from './input/model/rules.js';
import type { SectionSpec } from './input/model/types.js';

/** The geometry layer's spec for a section: the roughness key (n, chezy or ks) becomes `roughness`. */
export function geometrySpecOf(spec: SectionSpec): GeometrySpec {
  const roughness = resolveRoughness(spec);
  if (roughness === undefined) throw new InputError({ where: 'n', message: 'a roughness is required' });
  const r = roughness.value;
  switch (spec.shape) {
    case 'rectangular':
      return { shape: 'rectangular', bottomWidth: spec.bottomWidth, roughness: r as number };
    case 'trapezoidal':
      return {
        shape: 'trapezoidal',
        bottomWidth: spec.bottomWidth,
        sideSlope: spec.sideSlope,
        ...(spec.sideSlopeRight === undefined ? {} : { sideSlopeRight: spec.sideSlopeRight }),
        roughness: r as number,
      };
    case 'triangular':
      return {
        shape: 'triangular',
        sideSlope: spec.sideSlope,
        ...(spec.sideSlopeRight === undefined ? {} : { sideSlopeRight: spec.sideSlopeRight }),
        roughness: r as number,
      };
    case 'circular':
      return { shape: 'circular', diameter: spec.diameter, roughness: r as number };
    case 'points':
      return { shape: 'points', points: spec.points, roughness: r };
  }
}

/** A geometry problem's place (`roughness[1][0]`, `points[3]`) in the user's terms. */
function relocate(problem: Problem, whereOf: WhereOf, roughnessKey: string): Problem {
  const match = /^([A-Za-z]+)(.*)$/.exec(problem.where);
  const key = match?.[1] ?? problem.where;
  const rest = match?.[2] ?? '';
  return { ...problem, where: `${whereOf(key === 'roughness' ? roughnessKey : key)}${rest}` };
}

/** Build the hydraulic section a spec describes; geometry problems are re-placed with `whereOf`. */
export function hydraulicSectionOf(spec: SectionSpec, units: Units, whereOf: WhereOf): HydraulicSection {
  const roughness = resolveRoughness(spec);
  if (roughness === undefined) throw new InputError({ where: whereOf('n'), message: 'a roughness is required' });
  try {
    const section = createSection(geometrySpecOf(spec));
    return hydraulicSection(section, roughness.friction, units, spec.alpha);
  } catch (error) {
    if (error instanceof InputError) throw new InputError(error.problems.map((p) => relocate(p, whereOf, roughness.key)));
    throw error;
  }
}
