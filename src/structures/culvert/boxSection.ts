/**
 * A box culvert barrel as a closed rectangular section (span b, rise D), so the hydraulics layer and the
 * profile engine can compute in it like in any other closed conduit. Below the crown it is an open
 * rectangle (A = b·y, P = b + 2y, T = b); at the crown it is full (A = b·D, P = 2(b + D), T = 0), the same
 * convention as the circular conduit of geometry/shapes/circular.ts.
 */
import { HydraulicError } from '../../core/errors.js';
import { aboveLimit, checkDepth } from '../../geometry/depth.js';
import type { Elements, Section, SubsectionElements } from '../../geometry/section.js';
import { crownRoundoffFraction } from '../../core/tolerances.js';

/** Elements of a box of span b and rise D at depth y (0 ≤ y ≤ D; at D: full). */
export function boxElements(span: number, rise: number, y: number): Elements {
  const depth = Math.min(Math.max(y, 0), rise);
  if (depth >= rise * (1 - crownRoundoffFraction)) {
    return { area: span * rise, wettedPerimeter: 2 * (span + rise), topWidth: 0, firstMoment: (span * rise * rise) / 2 };
  }
  return { area: span * depth, wettedPerimeter: depth > 0 ? span + 2 * depth : 0, topWidth: span, firstMoment: (span * depth * depth) / 2 };
}

export function boxSection(span: number, rise: number, roughness: number): Section {
  const elements = (y: number): Elements => {
    checkDepth(y, 'box');
    if (aboveLimit(y, rise)) {
      throw new HydraulicError(`box barrel: depth ${y} is above the crown (rise ${rise}); a closed barrel flows full at depth = rise`);
    }
    return boxElements(span, rise, y);
  };
  return {
    // a rectangle closed at its rise: one critical depth and rising A³/T like the open rectangle
    shape: 'rectangular',
    closed: true,
    maxDepth: rise,
    lengthScale: Math.min(span, rise),
    compound: false,
    elements,
    subsections(y: number): SubsectionElements[] {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness }];
    },
    describe: () => ({ shape: 'box', span, rise, roughness }),
  };
}
