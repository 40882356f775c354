/**
 * The one interface every cross-section shape implements (one shape per module in shapes/).
 *
 * Depth y is measured from the lowest point of the section. Geometry knows nothing of discharge or
 * friction law: it reports areas, perimeters and widths, split into roughness subsections where the
 * roughness changes across the section. hydraulics/ turns those into conveyance and α.
 */
export const ShapeKind = {
  rectangular: 'rectangular',
  trapezoidal: 'trapezoidal',
  triangular: 'triangular',
  circular: 'circular',
  points: 'points',
} as const;
export type ShapeKind = keyof typeof ShapeKind;

/** Geometric elements of the whole flow area at one depth. */
export interface Elements {
  /** flow area A */
  area: number;
  /** wetted perimeter P */
  wettedPerimeter: number;
  /** top width T (0 at the crown of a full closed conduit) */
  topWidth: number;
  /** first moment of the flow area about the free surface, A·ȳ (ȳ = centroid depth below the surface) */
  firstMoment: number;
}

/** One roughness subsection: bounded by vertical lines that carry no wetted perimeter (Chow 1959 §6-4). */
export interface SubsectionElements {
  area: number;
  wettedPerimeter: number;
  topWidth: number;
  /** the roughness value of this subsection in the section's friction law (n, C or ks) */
  roughness: number;
}

export interface Section {
  readonly shape: ShapeKind;
  /** true for a closed conduit (circular): depth cannot exceed maxDepth and the top closes */
  readonly closed: boolean;
  /** the largest depth the section can hold: the crown, or the lower of an irregular section's end points; Infinity if unbounded */
  readonly maxDepth: number;
  /** a length typical of the section (bottom width, diameter, depth range) used to scale tolerances and searches */
  readonly lengthScale: number;
  /** true when roughness varies across the section (then subsections has more than one entry at some depth) */
  readonly compound: boolean;
  elements(depth: number): Elements;
  /** the subsections wetted at this depth (one entry for a uniform-roughness shape) */
  subsections(depth: number): SubsectionElements[];
  /**
   * Optional allocation-free form of `subsections` for the solvers' inner loops: the same subsections, in the
   * same order, written into `out` as [area, wettedPerimeter, topWidth, roughness] each; returns how many.
   * `out` must hold 4 × subsectionLimit numbers. When `rates` is given (subsectionLimit numbers), each
   * subsection's dP/dy is written there too: the rate at which its wetted perimeter grows with depth just above
   * `depth` (the ground's 1/sin of slope at the water's edges; a section that cannot tell leaves `rates` as it was).
   * With dA/dy = T it gives the depth derivative of conveyance and α without numerical differencing.
   */
  subsectionsInto?(depth: number, out: Float64Array, rates?: Float64Array): number;
  /** the most subsections `subsectionsInto` can write (present with it) */
  readonly subsectionLimit?: number;
  /**
   * Optional: the depths above the lowest point where the section's formulas change (for a points section, the
   * elevation of every ground point and zone boundary): the curves of depth have their kinks, and compound sections
   * their sudden changes of α, only there, so a scan for extrema samples them.
   */
  readonly breakDepths?: readonly number[];
  /** the defining dimensions, for tables and reports (e.g. { bottomWidth: 3, sideSlopeLeft: 2 }) */
  describe(): Readonly<Record<string, number | string>>;
}

/** Hydraulic radius R = A/P (0 for a dry section). */
export function hydraulicRadius(e: Elements): number {
  return e.wettedPerimeter > 0 ? e.area / e.wettedPerimeter : 0;
}

/** Hydraulic depth D = A/T (Infinity at the crown of a full conduit, where T = 0). */
export function hydraulicDepth(e: Elements): number {
  return e.topWidth > 0 ? e.area / e.topWidth : Infinity;
}
