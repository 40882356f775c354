/**
 * Triangular channel (a V with its vertex at the bottom): side slopes zLeft and zRight (horizontal : 1 vertical).
 * Exact geometry: T = (zL + zR)·y, A = (zL + zR)·y²/2, P = y·(√(1 + zL²) + √(1 + zR²)), A·ȳ = (zL + zR)·y³/6.
 */
import type { Elements, Section, SubsectionElements } from '../section.js';
import { checkDepth } from '../depth.js';
import { trapezoidElements } from './trapezoidal.js';

export interface TriangularSpec {
  readonly sideSlopeLeft: number;
  /** defaults to sideSlopeLeft */
  readonly sideSlopeRight?: number;
  readonly roughness: number;
}

export function triangular(spec: TriangularSpec): Section {
  const zl = spec.sideSlopeLeft;
  const zr = spec.sideSlopeRight ?? spec.sideSlopeLeft;
  const n = spec.roughness;
  const elements = (y: number): Elements => {
    checkDepth(y, 'triangular');
    return trapezoidElements(0, zl, zr, y);
  };
  return {
    shape: 'triangular',
    closed: false,
    maxDepth: Infinity,
    // no width at the vertex to scale by: use 1 length unit
    lengthScale: 1,
    compound: false,
    elements,
    subsections(y: number): SubsectionElements[] {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness: n }];
    },
    describe: () => ({ shape: 'triangular', sideSlopeLeft: zl, sideSlopeRight: zr, roughness: n }),
  };
}
