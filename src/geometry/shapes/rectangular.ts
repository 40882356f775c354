/** Rectangular channel of bottom width b: exact formulas. */
import type { Elements, Section, SubsectionElements } from '../section.js';
import { checkDepth } from '../depth.js';

export interface RectangularSpec {
  readonly bottomWidth: number;
  readonly roughness: number;
}

export function rectangular(spec: RectangularSpec): Section {
  const b = spec.bottomWidth;
  const elements = (y: number): Elements => {
    checkDepth(y, 'rectangular');
    return { area: b * y, wettedPerimeter: b + 2 * y, topWidth: b, firstMoment: (b * y * y) / 2 };
  };
  return {
    shape: 'rectangular',
    closed: false,
    maxDepth: Infinity,
    lengthScale: b,
    compound: false,
    elements,
    subsections(y: number): SubsectionElements[] {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness: spec.roughness }];
    },
    describe: () => ({ shape: 'rectangular', bottomWidth: b, roughness: spec.roughness }),
  };
}
