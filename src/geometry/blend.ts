/**
 * Interpolated sections between two surveyed ones (non-prismatic standard step): the geometry at relative
 * position t ∈ [0, 1] from `upstream` (t = 0) to `downstream` (t = 1).
 *
 * 1. Two circular conduits: the diameter and roughness are blended linearly.
 * 2. Two open prismatic sections (rectangular, trapezoidal, triangular: all trapezoids, with b = 0 or z = 0):
 *    bottom width, both side slopes and roughness are blended linearly; the shape kind is kept when both
 *    are of one kind, otherwise the result is trapezoidal. (A linear blend of two trapezoids' parameters is
 *    the trapezoid whose every width at a given depth is the linear blend of the two widths.)
 * 3. Otherwise (at least one points section) both are taken as points sections — a prismatic one as its
 *    outline up to the other section's maximum depth, its bottom centred under the other's invert — and
 *    blended along chords joining corresponding points (common practice for interpolated cross-sections in
 *    one-dimensional river models):
 *    - corresponding points: the two end points, the roughness-zone boundaries (bank stations) when both
 *      sections have the same number of zones, and the inverts when both lie between the same pair of
 *      those; between them, points correspond by their fraction of the offset (normalised offset); a vertical
 *      wall in one section stands against a single point of the other;
 *    - every point of either section is kept (the union of both sets of fractions), so each end section is
 *      reproduced exactly at t = 0 and t = 1;
 *    - offsets and elevations relative to each invert are blended linearly, and the invert elevation too
 *      (bed elevation linear between stations), unless `options.invertElevation` places the result;
 *    - roughness is blended linearly per piece of ground where both sections' zones are constant.
 * A closed conduit cannot be blended with an open section (HydraulicError).
 */
import { HydraulicError, InputError, show } from '../core/errors.js';
import type { Section } from './section.js';
import { circular } from './shapes/circular.js';
import { isPointsSection, type PointsSection, points, type RoughnessZone, type StationElevation } from './shapes/points.js';
import { rectangular } from './shapes/rectangular.js';
import { trapezoidal } from './shapes/trapezoidal.js';
import { triangular } from './shapes/triangular.js';

export interface BlendOptions {
  /** place the blended points section's lowest point at this elevation (default: the inverts blended linearly) */
  readonly invertElevation?: number;
}

// (1 − t)·a + t·b is exact at both ends; equal values stay equal (so equal roughness zones merge)
const lerp = (a: number, b: number, t: number): number => (a === b ? a : (1 - t) * a + t * b);

interface Trapezoid {
  readonly b: number;
  readonly zl: number;
  readonly zr: number;
  readonly n: number;
}

function num(d: Readonly<Record<string, number | string>>, key: string, fallback: number): number {
  const v = d[key];
  return typeof v === 'number' ? v : fallback;
}

/** The trapezoid parameters of an open prismatic section, from its describe() (this module's own shapes). */
function trapezoidOf(section: Section): Trapezoid | null {
  const d = section.describe();
  switch (section.shape) {
    case 'rectangular':
      return { b: num(d, 'bottomWidth', NaN), zl: 0, zr: 0, n: num(d, 'roughness', NaN) };
    case 'trapezoidal':
    case 'triangular': {
      const zl = num(d, 'sideSlopeLeft', NaN);
      return { b: num(d, 'bottomWidth', 0), zl, zr: num(d, 'sideSlopeRight', zl), n: num(d, 'roughness', NaN) };
    }
    default:
      return null;
  }
}

/**
 * The outline of an open prismatic section as a points section `height` deep, its bottom centred at offset
 * `centre` and its invert at `invert`.
 */
export function prismaticAsPoints(section: Section, height: number, centre = 0, invert = 0): PointsSection {
  const p = trapezoidOf(section);
  if (p === null || !Object.values(p).every(Number.isFinite)) {
    throw new HydraulicError(`a ${section.shape} section has no open prismatic outline to convert to points`);
  }
  const left = centre - p.b / 2;
  const right = centre + p.b / 2;
  const pts: StationElevation[] = [[left - p.zl * height, invert + height], [left, invert]];
  if (p.b > 0) pts.push([right, invert]);
  pts.push([right + p.zr * height, invert + height]);
  return points({ points: pts, roughness: p.n });
}

/** A ground line with its zone boundaries as vertices and each vertex's position ξ along the anchors. */
interface Line {
  readonly xs: number[];
  readonly zs: number[];
  readonly zones: readonly RoughnessZone[];
  /** ξ of each vertex: anchor index + fraction of offset to the next anchor (non-decreasing; equal on a wall) */
  xi: number[];
  readonly invert: number;
  /** vertex index of the first lowest point */
  readonly invertIndex: number;
  /** vertex indices of the zone boundaries (the first vertex at each boundary offset) */
  readonly boundaries: number[];
}

function lineOf(s: PointsSection): Line {
  const zones = s.zones;
  const xs: number[] = [];
  const zs: number[] = [];
  const boundaries: number[] = [];
  const push = (x: number, z: number) => {
    const n = xs.length;
    if (n > 0 && xs[n - 1] === x && zs[n - 1] === z) return;
    xs.push(x);
    zs.push(z);
  };
  let next = 1;
  for (let i = 0; i < s.points.length; i++) {
    const [x, z] = s.points[i]!;
    if (i > 0) {
      const [xp, zp] = s.points[i - 1]!;
      while (next < zones.length && zones[next]!.from < x) {
        const b = zones[next]!.from;
        push(b, zp + ((z - zp) * (b - xp)) / (x - xp));
        boundaries.push(xs.length - 1);
        next++;
      }
    }
    push(x, z);
    while (next < zones.length && zones[next]!.from === x) {
      boundaries.push(xs.length - 1);
      next++;
    }
  }
  let invertIndex = 0;
  for (let i = 1; i < zs.length; i++) if (zs[i]! < zs[invertIndex]!) invertIndex = i;
  return { xs, zs, zones, xi: [], invert: zs[invertIndex]!, invertIndex, boundaries };
}

/** Set ξ for each vertex from the anchor vertex indices (strictly increasing, first 0, last the end). */
function setPositions(line: Line, anchors: number[]): void {
  const xi: number[] = new Array(line.xs.length);
  for (let a = 0; a + 1 < anchors.length; a++) {
    const i0 = anchors[a]!;
    const i1 = anchors[a + 1]!;
    const span = line.xs[i1]! - line.xs[i0]!;
    // between anchors at one offset (a wall) the vertices are spread by their order
    for (let i = i0; i <= i1; i++) xi[i] = a + (span > 0 ? (line.xs[i]! - line.xs[i0]!) / span : (i - i0) / (i1 - i0));
  }
  line.xi = xi;
}

/** The vertices of a line at ξ: its own vertices there (several on a wall), else one point interpolated on its segment. */
function verticesAt(line: Line, xi: number): { x: number; z: number[] } {
  let lo = 0;
  let hi = line.xi.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (line.xi[mid]! < xi) lo = mid + 1;
    else hi = mid;
  }
  // lo: the first vertex with ξ ≥ xi
  if (line.xi[lo] === xi) {
    const z: number[] = [];
    for (let i = lo; i < line.xi.length && line.xi[i] === xi; i++) z.push(line.zs[i]! - line.invert);
    return { x: line.xs[lo]!, z };
  }
  const j = lo - 1;
  const f = (xi - line.xi[j]!) / (line.xi[lo]! - line.xi[j]!);
  return { x: lerp(line.xs[j]!, line.xs[lo]!, f), z: [lerp(line.zs[j]!, line.zs[lo]!, f) - line.invert] };
}

/** The roughness of a line's zone holding offset x (a boundary belongs to the zone starting there). */
function roughnessAt(line: Line, x: number): number {
  let k = 0;
  for (let i = 1; i < line.zones.length; i++) if (line.zones[i]!.from <= x) k = i;
  return line.zones[k]!.value;
}

/** Where a vertex index lies among the anchors: a with anchors[a] < i < anchors[a+1], or −1 on an anchor. */
function anchorInterval(anchors: number[], i: number): number {
  for (let a = 0; a + 1 < anchors.length; a++) {
    if (i === anchors[a] || i === anchors[a + 1]) return -1;
    if (i > anchors[a]! && i < anchors[a + 1]!) return a;
  }
  return -1;
}

function blendPoints(up: PointsSection, down: PointsSection, t: number, options: BlendOptions): PointsSection {
  const l1 = lineOf(up);
  const l2 = lineOf(down);
  const a1 = [0];
  const a2 = [0];
  if (l1.boundaries.length === l2.boundaries.length) {
    a1.push(...l1.boundaries);
    a2.push(...l2.boundaries);
  }
  a1.push(l1.xs.length - 1);
  a2.push(l2.xs.length - 1);
  const s1 = anchorInterval(a1, l1.invertIndex);
  if (s1 >= 0 && s1 === anchorInterval(a2, l2.invertIndex)) {
    a1.splice(s1 + 1, 0, l1.invertIndex);
    a2.splice(s1 + 1, 0, l2.invertIndex);
  }
  setPositions(l1, a1);
  setPositions(l2, a2);

  const xis = [...new Set([...l1.xi, ...l2.xi])].sort((p, q) => p - q);
  const pts: [number, number][] = [];
  const offsets: number[] = [];
  for (const xi of xis) {
    const v1 = verticesAt(l1, xi);
    const v2 = verticesAt(l2, xi);
    const x = lerp(v1.x, v2.x, t);
    offsets.push(x);
    // a wall in one section and not the other: the single point stands against each point of the wall
    const count = Math.max(v1.z.length, v2.z.length);
    for (let i = 0; i < count; i++) {
      pts.push([x, lerp(v1.z[Math.min(i, v1.z.length - 1)]!, v2.z[Math.min(i, v2.z.length - 1)]!, t)]);
    }
  }
  // offsets must stay non-decreasing: a blend of two non-decreasing functions of ξ is, but guard round-off
  for (let i = 1; i < pts.length; i++) if (pts[i]![0] < pts[i - 1]![0]) pts[i]![0] = pts[i - 1]![0];
  // a vertical run keeps only its first and last points: walls blended against walls going the other way
  // could otherwise double back (a slot of no width, with perimeter but no area)
  for (let i = pts.length - 2; i >= 1; i--) {
    if (pts[i]![0] === pts[i - 1]![0] && pts[i]![0] === pts[i + 1]![0]) pts.splice(i, 1);
  }
  // place the lowest blended point at the invert (it is there already when the inverts correspond)
  const invert = options.invertElevation ?? lerp(l1.invert, l2.invert, t);
  let lowest = Infinity;
  for (const p of pts) lowest = Math.min(lowest, p[1]);
  for (const p of pts) p[1] = p[1] - lowest + invert;

  // roughness: constant where both sections' zones are; the pieces start at either section's zone boundaries
  const starts = [...new Set([0, ...l1.boundaries.map((i) => l1.xi[i]!), ...l2.boundaries.map((i) => l2.xi[i]!)])].sort(
    (p, q) => p - q,
  );
  const end = xis[xis.length - 1]!;
  const right = pts[pts.length - 1]![0];
  const zones: [number, number][] = [];
  for (let k = 0; k < starts.length; k++) {
    const from = starts[k]!;
    const to = starts[k + 1] ?? end;
    const mid = 0.5 * (from + to);
    const value = lerp(roughnessAt(l1, verticesAt(l1, mid).x), roughnessAt(l2, verticesAt(l2, mid).x), t);
    const x = lerp(verticesAt(l1, from).x, verticesAt(l2, from).x, t);
    const last = zones[zones.length - 1];
    if (last === undefined || x > last[0]) {
      if (last === undefined || x < right) zones.push([x, value]);
    } else last[1] = value; // a piece of no width
  }
  return points({ points: pts, roughness: zones.length === 1 ? zones[0]![1] : zones });
}

export function blendSections(upstream: Section, downstream: Section, t: number, options: BlendOptions = {}): Section {
  if (!(Number.isFinite(t) && t >= 0 && t <= 1)) {
    throw new InputError({ where: 't', message: `must be a relative position between 0 and 1, got ${show(t)}`, value: t });
  }
  if (upstream.closed !== downstream.closed) {
    throw new HydraulicError(
      `cannot interpolate between a closed conduit (${upstream.closed ? upstream.shape : downstream.shape}) and an open section (${upstream.closed ? downstream.shape : upstream.shape})`,
    );
  }
  if (upstream.shape === 'circular' && downstream.shape === 'circular') {
    const d1 = upstream.describe();
    const d2 = downstream.describe();
    return circular({
      diameter: lerp(num(d1, 'diameter', NaN), num(d2, 'diameter', NaN), t),
      roughness: lerp(num(d1, 'roughness', NaN), num(d2, 'roughness', NaN), t),
    });
  }
  const p1 = trapezoidOf(upstream);
  const p2 = trapezoidOf(downstream);
  if (p1 !== null && p2 !== null) {
    const b = lerp(p1.b, p2.b, t);
    const zl = lerp(p1.zl, p2.zl, t);
    const zr = lerp(p1.zr, p2.zr, t);
    const n = lerp(p1.n, p2.n, t);
    const kind = upstream.shape === downstream.shape ? upstream.shape : 'trapezoidal';
    if (kind === 'rectangular') return rectangular({ bottomWidth: b, roughness: n });
    if (kind === 'triangular') return triangular({ sideSlopeLeft: zl, sideSlopeRight: zr, roughness: n });
    return trapezoidal({ bottomWidth: b, sideSlopeLeft: zl, sideSlopeRight: zr, roughness: n });
  }
  const asPoints = (s: Section, other: Section): PointsSection => {
    if (isPointsSection(s)) return s;
    if (!isPointsSection(other)) throw new HydraulicError(`cannot interpolate between ${upstream.shape} and ${downstream.shape} sections`);
    const inv = other.points.findIndex((p) => p[1] === other.invertElevation);
    return prismaticAsPoints(s, other.maxDepth, other.points[inv]![0], other.invertElevation);
  };
  return blendPoints(asPoints(upstream, downstream), asPoints(downstream, upstream), t, options);
}
