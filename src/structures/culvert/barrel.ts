/**
 * Culvert barrel geometry and the part-full depths the culvert methods need (critical and normal depth,
 * α = 1 as in FHWA HDS-5). A circular barrel uses the segment formulas of geometry/shapes/circular.ts;
 * a box barrel is a rectangle closed at its rise.
 */
import { requireInput } from '../../core/errors.js';
import { brentRoot, scanSignChanges } from '../../core/roots.js';
import { minimumDepthFraction } from '../../core/tolerances.js';
import type { Units } from '../../core/units.js';
import type { Elements } from '../../geometry/section.js';
import { circularSegment } from '../../geometry/shapes/circular.js';
import { structureTolerance } from '../invert.js';

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
    elements: (y) => {
      const depth = Math.min(Math.max(y, 0), D);
      if (depth >= D) return { area: b * D, wettedPerimeter: 2 * (b + D), topWidth: 0, firstMoment: (b * D * D) / 2 };
      return { area: b * depth, wettedPerimeter: b + 2 * depth, topWidth: b, firstMoment: (b * depth * depth) / 2 };
    },
  };
}

/**
 * Critical depth in the barrel, Q²·T = g·A³ (α = 1), capped at the rise: HDS-5 notes dc never exceeds D.
 * For a box, dc = (q²/g)^(1/3) exactly.
 */
export function barrelCriticalDepth(b: Barrel, discharge: number, units: Units): number {
  if (discharge <= 0) return 0;
  if (b.shape.shape === 'box') return Math.min(Math.cbrt((discharge / b.shape.span) ** 2 / units.g), b.rise);
  const D = b.rise;
  const f = (y: number) => {
    const e = b.elements(y);
    return discharge * discharge * e.topWidth - units.g * e.area * e.area * e.area;
  };
  // f > 0 near the invert (A → 0), f < 0 at the crown (T = 0): one sign change.
  const lo = D * minimumDepthFraction;
  if (f(lo) <= 0) return lo;
  return brentRoot(f, lo, D, { xTolerance: structureTolerance(D), what: 'critical depth in the culvert barrel' });
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
  const D = b.rise;
  const f = (y: number) => barrelConveyance(b, y, roughness, units) * Math.sqrt(slope) - discharge;
  const top = D * (1 - minimumDepthFraction);
  const brackets = scanSignChanges(f, 0, top);
  const first = brackets[0];
  if (!first) return null;
  return brentRoot(f, first[0], first[1], { xTolerance: structureTolerance(D), what: 'normal depth in the culvert barrel' });
}
