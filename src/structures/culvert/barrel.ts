/**
 * Culvert barrel geometry and the part-full depths the culvert methods need (critical and normal depth,
 * α = 1 as in FHWA HDS-5). A circular barrel uses the segment formulas of geometry/shapes/circular.ts;
 * a box barrel is a rectangle closed at its rise (./boxSection.ts). Critical and normal depths come from the
 * hydraulics layer (criticalDepth, normalDepths) on the barrel's own hydraulic section, so the culvert and
 * the profile engine agree to the solvers' tolerance.
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { Elements } from '../../geometry/section.js';
import { circular, circularSegment } from '../../geometry/shapes/circular.js';
import { criticalDepth } from '../../hydraulics/criticalDepth.js';
import { type HydraulicSection, hydraulicSection } from '../../hydraulics/hydraulicSection.js';
import { normalDepths } from '../../hydraulics/normalDepth.js';
import { boxElements, boxSection } from './boxSection.js';

export type BarrelShape =
  | { readonly shape: 'circular'; readonly diameter: number }
  | { readonly shape: 'box'; readonly span: number; readonly rise: number };

export interface Barrel {
  readonly shape: BarrelShape;
  /** barrel height D (diameter or rise) */
  readonly rise: number;
  readonly fullArea: number;
  readonly fullPerimeter: number;
  readonly fullHydraulicRadius: number;
  /** elements at a depth 0 ≤ y ≤ D (at D: full, top width 0) */
  elements(depth: number): Elements;
}

export function barrel(shape: BarrelShape, where = 'structure.barrel'): Barrel {
  if (shape.shape === 'circular') {
    const d = shape.diameter;
    requireInput(d > 0 && Number.isFinite(d), `${where}.diameter`, 'the barrel diameter must be a positive number', d);
    const full = circularSegment(d, d);
    return {
      shape,
      rise: d,
      fullArea: full.area,
      fullPerimeter: full.wettedPerimeter,
      fullHydraulicRadius: d / 4,
      elements: (y) => circularSegment(d, Math.min(Math.max(y, 0), d)),
    };
  }
  const b = shape.span;
  const D = shape.rise;
  requireInput(b > 0 && Number.isFinite(b), `${where}.span`, 'the box span must be a positive number', b);
  requireInput(D > 0 && Number.isFinite(D), `${where}.rise`, 'the box rise must be a positive number', D);
  return {
    shape,
    rise: D,
    fullArea: b * D,
    fullPerimeter: 2 * (b + D),
    fullHydraulicRadius: (b * D) / (2 * (b + D)),
    elements: (y) => boxElements(b, D, y),
  };
}

/** Manning's n used where only geometry matters (critical depth does not depend on roughness). */
const geometryOnlyRoughness = 0.013;

/**
 * The barrel as a hydraulic section with Manning's n (α = 1): a circular conduit or a closed box, for the
 * hydraulics solvers and for running the profile engine through the barrel.
 */
export function barrelSection(b: Barrel, roughness: number, units: Units): HydraulicSection {
  const section = b.shape.shape === 'circular'
    ? circular({ diameter: b.shape.diameter, roughness })
    : boxSection(b.shape.span, b.shape.rise, roughness);
  return hydraulicSection(section, 'manning', units);
}

/**
 * Critical depth in the barrel, Q²·T = g·A³ (α = 1), capped at the rise: HDS-5 notes dc never exceeds D.
 * For a box, dc = (q²/g)^(1/3) exactly.
 */
export function barrelCriticalDepth(b: Barrel, discharge: number, units: Units): number {
  if (discharge <= 0) return 0;
  if (b.shape.shape === 'box') return Math.min(Math.cbrt((discharge / b.shape.span) ** 2 / units.g), b.rise);
  return Math.min(criticalDepth(barrelSection(b, geometryOnlyRoughness, units), discharge), b.rise);
}

/** Specific head at critical depth, Hc = dc + Ac/(2·Tc) (α = 1); Hc = 1.5·dc for a box. */
export function barrelCriticalHead(b: Barrel, criticalDepth: number): number {
  const e = b.elements(criticalDepth);
  if (!(e.topWidth > 0)) return criticalDepth;
  return criticalDepth + e.area / (2 * e.topWidth);
}

/** Manning conveyance K = (k/n)·A·R^(2/3) at a depth. */
export function barrelConveyance(b: Barrel, depth: number, roughness: number, units: Units): number {
  const e = b.elements(depth);
  if (!(e.area > 0) || !(e.wettedPerimeter > 0)) return 0;
  const r = e.area / e.wettedPerimeter;
  return (units.manningFactor / roughness) * e.area * Math.cbrt(r * r);
}

/**
 * Part-full normal depth in the barrel (Manning), the lower root where two exist; null when the slope is
 * zero or adverse, or when the discharge exceeds the largest part-full capacity (the barrel flows full).
 */
export function barrelNormalDepth(b: Barrel, discharge: number, slope: number, roughness: number, units: Units): number | null {
  if (!(slope > 0) || discharge <= 0) return null;
  return normalDepths(barrelSection(b, roughness, units), discharge, slope).depth;
}
