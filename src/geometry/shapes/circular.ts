/**
 * Circular conduit of diameter D flowing part full (a circular segment), up to full flow at the crown.
 *
 * Segment geometry (e.g. Chow 1959, Table 2-1), with r = D/2 and the wetted central angle
 * θ = 2·acos(1 − 2y/D) = 2φ:
 *   A = r²·(θ − sin θ)/2 = r²·(φ − sin φ·cos φ),   P = r·θ = D·φ,   T = 2·√(y·(D − y)) = D·sin φ,
 *   A·ȳ = (2/3)·r³·sin³φ − A·r·cos φ = r³·(sin φ − sin³φ/3 − φ·cos φ)
 * (the segment's centroid lies 4r·sin³φ / (3(θ − sin θ)) below the centre; the surface lies r·cos φ below it).
 * At y = D: A = πr², P = πD, T = 0, A·ȳ = πr³ (full flow).
 *
 * φ is computed as 2·asin(√(y/D)) (or π − 2·asin(√((D − y)/D)) in the upper half), which keeps full precision
 * near the invert and the crown; at small φ the differences φ − sin φ cos φ and sin φ − sin³φ/3 − φ cos φ
 * are taken from their Taylor series to avoid cancellation.
 */
import { HydraulicError } from '../../core/errors.js';
import { segmentSeriesAngle } from '../../core/tolerances.js';
import type { Elements, Section, SubsectionElements } from '../section.js';
import { aboveLimit, checkDepth } from '../depth.js';

export interface CircularSpec {
  readonly diameter: number;
  readonly roughness: number;
}

/** Taylor coefficients (in φ², from the lowest power up) of φ − sin φ·cos φ / φ³ and of (sin φ − sin³φ/3 − φ·cos φ) / φ⁵. */
const areaSeries = [2 / 3, -2 / 15, 4 / 315, -2 / 2835, 4 / 155925, -4 / 6081075, 8 / 638512875, -2 / 10854718875, 4 / 1856156927625];
const momentSeries = [
  2 / 15, -11 / 315, 17 / 3780, -461 / 1247400, 8303 / 389188800, -24911 / 27243216000, 168151 / 5557616064000,
  -1513361 / 1900704693888000,
];

function horner(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) sum = sum * x + coefficients[i]!;
  return sum;
}

/** φ − sin φ·cos φ, accurate at small φ (the series to φ¹⁹ is exact to round-off below segmentSeriesAngle). */
function areaFactor(phi: number): number {
  if (phi < segmentSeriesAngle) return phi * phi * phi * horner(areaSeries, phi * phi);
  return phi - Math.sin(phi) * Math.cos(phi);
}

/** sin φ − sin³φ/3 − φ·cos φ, accurate at small φ (its terms cancel to order φ⁵). */
function momentFactor(phi: number): number {
  if (phi < segmentSeriesAngle) {
    const p2 = phi * phi;
    return phi * p2 * p2 * horner(momentSeries, p2);
  }
  const s = Math.sin(phi);
  return s - (s * s * s) / 3 - phi * Math.cos(phi);
}

/** Elements of a circular segment of depth y in a circle of diameter d (0 ≤ y ≤ d). */
export function circularSegment(d: number, y: number): Elements {
  const r = d / 2;
  if (y <= 0) return { area: 0, wettedPerimeter: 0, topWidth: 0, firstMoment: 0 };
  if (y >= d) return { area: Math.PI * r * r, wettedPerimeter: Math.PI * d, topWidth: 0, firstMoment: Math.PI * r * r * r };
  const phi = y <= r ? 2 * Math.asin(Math.sqrt(y / d)) : Math.PI - 2 * Math.asin(Math.sqrt((d - y) / d));
  return {
    area: r * r * areaFactor(phi),
    wettedPerimeter: d * phi,
    topWidth: 2 * Math.sqrt(y * (d - y)),
    firstMoment: r * r * r * momentFactor(phi),
  };
}

export function circular(spec: CircularSpec): Section {
  const d = spec.diameter;
  const n = spec.roughness;
  const elements = (y: number): Elements => {
    checkDepth(y, 'circular');
    if (aboveLimit(y, d)) {
      throw new HydraulicError(
        `circular conduit: depth ${y} is above the crown (diameter ${d}); a closed conduit flows full at depth = diameter`,
      );
    }
    return circularSegment(d, Math.min(y, d));
  };
  return {
    shape: 'circular',
    closed: true,
    maxDepth: d,
    lengthScale: d,
    compound: false,
    elements,
    subsections(y: number): SubsectionElements[] {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness: n }];
    },
    describe: () => ({ shape: 'circular', diameter: d, roughness: n }),
  };
}

/**
 * True when a closed section flows full at this depth: the depth reaches the crown (within round-off).
 * Always false for an open section.
 */
export function isFull(section: Section, depth: number): boolean {
  return section.closed && Number.isFinite(section.maxDepth) && !aboveLimit(section.maxDepth, depth);
}
