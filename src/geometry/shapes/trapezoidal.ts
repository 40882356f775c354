/**
 * Trapezoidal channel: bottom width b ≥ 0, side slopes zLeft and zRight (horizontal : 1 vertical), which may differ.
 * Exact geometry: T = b + (zL + zR)·y, A = (b + (zL + zR)·y/2)·y, P = b + y·(√(1 + zL²) + √(1 + zR²)),
 * first moment about the surface A·ȳ = ∫₀ʸ T(η)(y − η) dη = b·y²/2 + (zL + zR)·y³/6.
 */
import type { Elements, Section, SubsectionElements } from '../section.js';
import { checkDepth } from '../depth.js';

export interface TrapezoidalSpec {
  readonly bottomWidth: number;
  readonly sideSlopeLeft: number;
  /** defaults to sideSlopeLeft */
  readonly sideSlopeRight?: number;
  readonly roughness: number;
}

/** The elements of a trapezoid (b may be 0: a triangle). Shared with triangular.ts. */
export function trapezoidElements(b: number, zLeft: number, zRight: number, y: number): Elements {
  const z = zLeft + zRight;
  const sides = Math.sqrt(1 + zLeft * zLeft) + Math.sqrt(1 + zRight * zRight);
  return {
    area: (b + 0.5 * z * y) * y,
    wettedPerimeter: b + sides * y,
    topWidth: b + z * y,
    firstMoment: 0.5 * b * y * y + (z * y * y * y) / 6,
  };
}

export function trapezoidal(spec: TrapezoidalSpec): Section {
  const b = spec.bottomWidth;
  const zl = spec.sideSlopeLeft;
  const zr = spec.sideSlopeRight ?? spec.sideSlopeLeft;
  const n = spec.roughness;
  const elements = (y: number): Elements => {
    checkDepth(y, 'trapezoidal');
    return trapezoidElements(b, zl, zr, y);
  };
  return {
    shape: 'trapezoidal',
    closed: false,
    maxDepth: Infinity,
    // a bottom width of 0 (a triangle) has no width to scale by: use 1 length unit
    lengthScale: b > 0 ? b : 1,
    compound: false,
    elements,
    subsections(y: number): SubsectionElements[] {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness: n }];
    },
    describe: () => ({ shape: 'trapezoidal', bottomWidth: b, sideSlopeLeft: zl, sideSlopeRight: zr, roughness: n }),
  };
}
