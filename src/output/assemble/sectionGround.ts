/**
 * The ground line of any section, for a cross-section chart: [offset, elevation] points left to right with the
 * section's lowest point at `invert`, and its roughness subsections.
 *
 * - points sections: the surveyed points as given (shifted so the lowest point sits at `invert`);
 * - rectangular, trapezoidal, triangular: the outline `height` deep, bottom centred at offset 0;
 * - circular conduit: the lower half of the circle (a ground line cannot fold back over itself), with
 *   `closedNote` saying so; the chart's water surface is exact up to the springline.
 */
import type { Section } from '../../geometry/section.js';
import { isPointsSection } from '../../geometry/shapes/points.js';
import { prismaticAsPoints } from '../../geometry/blend.js';
import type { FrictionLaw } from '../../hydraulics/friction.js';
import type { SectionZone } from '../charts/sectionChart.js';

export interface SectionGround {
  ground: [number, number][];
  zones: SectionZone[];
  /** words for the caption when the drawing simplifies the section */
  closedNote?: string;
}

/** Points on the lower half of a circle of diameter D: chosen by angle so the curve looks round. */
const circleSegments = 36;

/** Ground drawn level beside an open prismatic outline, as a fraction of its top width. */
const bankShoulder = 0.15;

const roughnessSymbol: Record<FrictionLaw, string> = { manning: 'n', chezy: 'C', 'darcy-weisbach': 'ks' };

function zoneLabel(law: FrictionLaw, value: number): string {
  return `${roughnessSymbol[law]} = ${Number(value.toPrecision(4))}`;
}

/**
 * The ground of `section` with its lowest point at `invert`; open prismatic outlines are drawn `height` deep
 * (the caller passes a height above the highest water surface drawn).
 */
export function sectionGround(section: Section, law: FrictionLaw, invert: number, height: number): SectionGround {
  if (isPointsSection(section)) {
    const shift = invert - section.invertElevation;
    return {
      ground: section.points.map(([x, z]) => [x, z + shift]),
      zones: section.zones.map((z) => ({ from: z.from, to: z.to, n: z.value, label: zoneLabel(law, z.value) })),
    };
  }
  const d = section.describe();
  const roughness = typeof d.roughness === 'number' ? d.roughness : NaN;
  if (section.shape === 'circular') {
    const diameter = typeof d.diameter === 'number' ? d.diameter : section.maxDepth;
    const radius = diameter / 2;
    const ground: [number, number][] = [];
    for (let i = 0; i <= circleSegments; i++) {
      const angle = Math.PI + (Math.PI * i) / circleSegments; // from the left springline through the invert
      ground.push([radius * Math.cos(angle), invert + radius + radius * Math.sin(angle)]);
    }
    ground[0] = [-radius, invert + radius];
    ground[circleSegments] = [radius, invert + radius];
    return {
      ground,
      zones: Number.isFinite(roughness) ? [{ from: -radius, to: radius, n: roughness, label: zoneLabel(law, roughness) }] : [],
      closedNote: `circular conduit of diameter ${Number(diameter.toPrecision(4))}: lower half drawn`,
    };
  }
  const outline = prismaticAsPoints(section, height, 0, invert);
  // a short stretch of ground level with the top on each side, so the channel reads as cut into the ground
  const pts = outline.points.map(([x, z]): [number, number] => [x, z]);
  const reach = bankShoulder * Math.max(section.lengthScale, outline.rightEnd.offset - outline.leftEnd.offset);
  const left = pts[0]!;
  const right = pts[pts.length - 1]!;
  return {
    ground: [[left[0] - reach, left[1]], ...pts, [right[0] + reach, right[1]]],
    zones: Number.isFinite(roughness) ? [{ from: left[0] - reach, to: right[0] + reach, n: roughness, label: zoneLabel(law, roughness) }] : [],
  };
}
