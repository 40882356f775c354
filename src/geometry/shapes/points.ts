/**
 * Irregular section given by station–elevation points across it (offset, elevation), left to right, with
 * roughness that may change across the section.
 *
 * - Depth is measured from the lowest point (the invert); the water surface is level across the whole
 *   section (level-pool assumption): every part of the ground below the surface is wet, including pockets
 *   behind a bank high point.
 * - The section holds water up to the lower of its two end points; a water surface above that is a
 *   HydraulicError asking for the section to be extended, never a silent extrapolation.
 * - Roughness subsections follow Chow 1959 (Open-Channel Hydraulics, §6-4, the divided-channel method):
 *   the flow area is split by vertical lines at each change of roughness, and those lines carry no wetted
 *   perimeter. Adjacent zones with the same value are merged (there is no change of roughness there).
 *   Each roughness zone gives one subsection; separate wet pockets inside one zone are summed into it.
 *
 * Speed: everything that does not depend on depth is done once. Zone boundaries are inserted as points,
 * the distinct point elevations are sorted, and for each interval between consecutive elevations the
 * set of fully wet and partly wet ground segments is fixed, so with u = depth above the interval's base
 *   T(u) = T₀ + s·u,  A(u) = A₀ + T₀·u + s·u²/2,  A·ȳ(u) = M₀ + A₀·u + T₀·u²/2 + s·u³/6,  P(u) = P₀ + p·u
 * (dA/dy = T and d(Aȳ)/dy = A). These are the exact polygon formulas; a look-up is a binary search and
 * a few multiplications. Coefficients are stored per interval for the whole section and for each zone,
 * built in one upward sweep (O(N log N) for N points).
 */
import { HydraulicError, InputError, type Problem, show } from '../../core/errors.js';
import { largestLength } from '../../core/tolerances.js';
import type { Elements, Section, SubsectionElements } from '../section.js';
import { aboveLimit, checkDepth } from '../depth.js';

/** [offset, elevation] */
export type StationElevation = readonly [number, number];
/** [fromOffset, roughness]: the value applies from this offset to the next zone's start */
export type RoughnessZoneSpec = readonly [number, number];

export interface PointsSpec {
  /** [offset, elevation] pairs, offsets non-decreasing (equal offsets make a vertical wall) */
  readonly points: readonly StationElevation[];
  /** one value for the whole section, or zones [fromOffset, value] in increasing order of offset;
   *  the first zone also covers any ground left of its start */
  readonly roughness: number | readonly RoughnessZoneSpec[];
}

/** A roughness zone after merging equal neighbours: from `from` to `to` (end points' offsets at the ends). */
export interface RoughnessZone {
  readonly from: number;
  readonly to: number;
  readonly value: number;
}

export interface EndPoint {
  readonly offset: number;
  readonly elevation: number;
}

export interface PointsSection extends Section {
  readonly shape: 'points';
  /** elevation of the lowest point: stage = invertElevation + depth */
  readonly invertElevation: number;
  readonly leftEnd: EndPoint;
  readonly rightEnd: EndPoint;
  /** the ground points as given (copied), left to right */
  readonly points: readonly StationElevation[];
  /** roughness zones, left to right, covering the section from end to end */
  readonly zones: readonly RoughnessZone[];
}

/** Coefficients per interval and group: A0, T0, s, P0, p, M0. */
const A0 = 0;
const T0 = 1;
const S = 2;
const P0 = 3;
const PS = 4;
const M0 = 5;
const STRIDE = 6;

export function isPointsSection(section: Section): section is PointsSection {
  return section.shape === 'points' && 'zones' in section && 'invertElevation' in section;
}

/** The end points of a points section (offsets and elevations), e.g. as bank positions. */
export function pointsBounds(section: PointsSection): { left: EndPoint; right: EndPoint } {
  return { left: section.leftEnd, right: section.rightEnd };
}

/** The zones of a spec, merged where neighbours have equal values, clipped to [left, right]. */
export function roughnessZones(roughness: PointsSpec['roughness'], left: number, right: number): RoughnessZone[] {
  if (typeof roughness === 'number') return [{ from: left, to: right, value: roughness }];
  const merged: { from: number; value: number }[] = [];
  for (const [from, value] of roughness) {
    const last = merged[merged.length - 1];
    if (last !== undefined && last.value === value) continue;
    merged.push({ from, value });
  }
  // zones starting at or before the left end: only the last of them reaches the ground
  while (merged.length > 1 && merged[1]!.from <= left) merged.shift();
  const zones: RoughnessZone[] = [];
  for (let i = 0; i < merged.length; i++) {
    const from = i === 0 ? left : Math.min(merged[i]!.from, right);
    const next = merged[i + 1];
    const to = next === undefined ? right : Math.min(next.from, right);
    if (i > 0 && from >= right) break;
    zones.push({ from, to, value: merged[i]!.value });
  }
  return zones;
}


const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function roughnessValue(value: unknown, where: string, problems: Problem[]): boolean {
  const ok = isNumber(value) && value > 0;
  if (!ok) problems.push({ where, message: `must be a roughness value > 0, got ${show(value)}`, value });
  return ok;
}

/**
 * The problems of a points spec (empty when valid): at least 3 [offset, elevation] pairs of finite numbers,
 * offsets non-decreasing, no vertical wall doubling back, the lowest point below both end points, and
 * roughness one value > 0 or zones with increasing starts inside the section and values > 0.
 */
export function pointsSpecProblems(spec: PointsSpec): Problem[] {
  const problems: Problem[] = [];
  const list: unknown = spec.points;
  if (!Array.isArray(list) || list.length < 3) {
    problems.push({
      where: 'points',
      message: `must be a list of at least 3 [offset, elevation] pairs, got ${Array.isArray(list) ? `${list.length}` : show(list)}`,
      value: list,
    });
    return problems;
  }
  let valid = true;
  list.forEach((p: unknown, i) => {
    const ok =
      Array.isArray(p) && p.length === 2 && p.every((v) => isNumber(v) && Math.abs(v) <= largestLength);
    if (!ok) {
      problems.push({
        where: `points[${i}]`,
        message: `must be an [offset, elevation] pair of numbers within ±${largestLength}, got ${show(p)}`,
        value: p,
      });
      valid = false;
    }
  });
  if (!valid) return problems;
  const pts = list as [number, number][];
  for (let i = 1; i < pts.length; i++) {
    const [x, z] = pts[i]!;
    const [xp, zp] = pts[i - 1]!;
    if (x < xp) {
      problems.push({
        where: `points[${i}]`,
        message: `offset ${x} goes backwards (previous offset ${xp}); offsets must not decrease from left to right`,
        value: pts[i],
      });
      valid = false;
    } else if (i >= 2 && x === xp && xp === pts[i - 2]![0] && (z - zp) * (zp - pts[i - 2]![1]) < 0) {
      problems.push({
        where: `points[${i}]`,
        message: `the vertical wall at offset ${x} doubles back on itself (elevations ${pts[i - 2]![1]}, ${zp}, ${z}); the ground line must not cross itself`,
        value: pts[i],
      });
      valid = false;
    }
  }
  if (!valid) return problems;
  const left = pts[0]!;
  const right = pts[pts.length - 1]!;
  if (right[0] <= left[0]) {
    problems.push({ where: 'points', message: `the section has no width (all offsets ${left[0]})`, value: list });
    return problems;
  }
  const lowest = Math.min(...pts.map((p) => p[1]));
  if (lowest >= Math.min(left[1], right[1])) {
    problems.push({
      where: 'points',
      message: `holds no water: the lowest elevation ${lowest} is not below both end points (left ${left[1]}, right ${right[1]})`,
      value: list,
    });
  }
  const r: unknown = spec.roughness;
  if (typeof r === 'number') {
    roughnessValue(r, 'roughness', problems);
    return problems;
  }
  if (!Array.isArray(r) || r.length === 0) {
    problems.push({
      where: 'roughness',
      message: `must be a roughness value > 0 or a non-empty list of [fromOffset, value] zones, got ${show(r)}`,
      value: r,
    });
    return problems;
  }
  let previous = -Infinity;
  r.forEach((zone: unknown, i) => {
    if (!Array.isArray(zone) || zone.length !== 2) {
      problems.push({ where: `roughness[${i}]`, message: `must be a [fromOffset, value] pair, got ${show(zone)}`, value: zone });
      return;
    }
    const [from, value] = zone as unknown[];
    if (!isNumber(from) || from <= previous) {
      problems.push({
        where: `roughness[${i}][0]`,
        message: `must be an offset greater than the previous zone's start (${previous}), got ${show(from)}`,
        value: from,
      });
    } else if (i > 0 && from >= right[0]) {
      problems.push({
        where: `roughness[${i}][0]`,
        message: `zone starts at ${from}, at or beyond the right end point (offset ${right[0]}); it would cover no ground`,
        value: from,
      });
    }
    if (isNumber(from)) previous = from;
    roughnessValue(value, `roughness[${i}][1]`, problems);
  });
  return problems;
}

/** The zone of a ground segment: the zone that holds its mid offset (a wall on a boundary goes right). */
function zoneIndexAt(zones: readonly RoughnessZone[], offset: number): number {
  let k = 0;
  for (let i = 1; i < zones.length; i++) if (zones[i]!.from <= offset) k = i;
  return k;
}

/** Build a points section; throws InputError listing the spec's problems (see pointsSpecProblems). */
export function points(spec: PointsSpec): PointsSection {
  const problems = pointsSpecProblems(spec);
  if (problems.length > 0) throw new InputError(problems);
  const given = spec.points.map(([x, z]) => [x, z] as const);
  const first = given[0]!;
  const last = given[given.length - 1]!;
  const zones = roughnessZones(spec.roughness, first[0], last[0]);

  // ground points with the zone boundaries inserted (no repeated identical points)
  const xs: number[] = [];
  const zs: number[] = [];
  const push = (x: number, z: number) => {
    const n = xs.length;
    if (n > 0 && xs[n - 1] === x && zs[n - 1] === z) return;
    xs.push(x);
    zs.push(z);
  };
  let boundary = 1;
  for (let i = 0; i < given.length; i++) {
    const [x, z] = given[i]!;
    if (i > 0) {
      const [xp, zp] = given[i - 1]!;
      while (boundary < zones.length && zones[boundary]!.from <= xp) boundary++;
      while (boundary < zones.length && zones[boundary]!.from < x) {
        const b = zones[boundary]!.from;
        push(b, zp + ((z - zp) * (b - xp)) / (x - xp));
        boundary++;
      }
    }
    push(x, z);
  }

  const segments = xs.length - 1;
  const segZone = new Int32Array(segments);
  const segLow = new Float64Array(segments);
  const segHigh = new Float64Array(segments);
  let invert = Infinity;
  for (const z of zs) invert = Math.min(invert, z);
  for (let j = 0; j < segments; j++) {
    segZone[j] = zoneIndexAt(zones, 0.5 * (xs[j]! + xs[j + 1]!));
    // elevations relative to the invert, so shallow depths keep their precision
    segLow[j] = Math.min(zs[j]!, zs[j + 1]!) - invert;
    segHigh[j] = Math.max(zs[j]!, zs[j + 1]!) - invert;
  }

  // distinct elevations above the invert, ascending: the interval bases
  const levels = Float64Array.from(new Set(zs.map((z) => z - invert))).sort();
  const intervals = levels.length;
  const groups = zones.length + 1; // group 0: the whole section; 1 + k: zone k
  const coef = new Float64Array(intervals * groups * STRIDE);
  const wetZones: number[][] = [];

  // Sweep upward through the levels. Between levels the elements follow the polynomials above; at a level,
  // segments whose low end lies there start to wet (a flat one at once: T and P jump by its width), and
  // partly wet segments whose high end lies there become fully wet. s and p are re-summed at each level over
  // the few partly wet segments (all terms positive: no cancellation); A, Aȳ, T and P grow by positive terms.
  const segDx = new Float64Array(segments);
  const segLength = new Float64Array(segments);
  const segSlope = new Float64Array(segments); // dx/dz: top width gained per unit rise while partly wet
  const segRate = new Float64Array(segments); // length/dz: perimeter gained per unit rise
  const segFlat = new Uint8Array(segments);
  for (let j = 0; j < segments; j++) {
    const dx = xs[j + 1]! - xs[j]!;
    const dz = segHigh[j]! - segLow[j]!;
    const length = Math.sqrt(dx * dx + dz * dz);
    segDx[j] = dx;
    segLength[j] = length;
    segSlope[j] = dx / dz;
    segRate[j] = length / dz;
    // a rise too small to divide by (a subnormal difference) is flat
    segFlat[j] = dz === 0 || !Number.isFinite(segRate[j]!) ? 1 : 0;
  }
  const byLow = Array.from({ length: segments }, (_, j) => j).sort((p, q) => segLow[p]! - segLow[q]!);
  const cur = new Float64Array(groups * STRIDE);
  const active = new Int32Array(segments);
  let activeCount = 0;
  const wetCount = new Int32Array(zones.length);
  let wetList: number[] = [];
  let nextLow = 0;
  for (let k = 0; k < intervals; k++) {
    const e = levels[k]!;
    if (k > 0) {
      const du = e - levels[k - 1]!;
      for (let g = 0; g < groups; g++) {
        const o = g * STRIDE;
        const a = cur[o + A0]!;
        const t = cur[o + T0]!;
        const sl = cur[o + S]!;
        cur[o + M0] = cur[o + M0]! + du * (a + du * (0.5 * t + (sl * du) / 6));
        cur[o + A0] = a + du * (t + 0.5 * sl * du);
        cur[o + T0] = t + sl * du;
        cur[o + P0] = cur[o + P0]! + cur[o + PS]! * du;
      }
    }
    // partly wet segments topping out at this level are fully wet from here on
    let kept = 0;
    for (let i = 0; i < activeCount; i++) {
      const j = active[i]!;
      if (segHigh[j]! > e) active[kept++] = j;
    }
    activeCount = kept;
    // segments starting to wet at this level
    let newlyWet = false;
    while (nextLow < segments && segLow[byLow[nextLow]!]! <= e) {
      const j = byLow[nextLow++]!;
      const zone = segZone[j]!;
      if (segFlat[j]) {
        for (const o of [0, (1 + zone) * STRIDE]) {
          cur[o + T0] = cur[o + T0]! + segDx[j]!;
          cur[o + P0] = cur[o + P0]! + segLength[j]!;
        }
      } else {
        active[activeCount++] = j;
      }
      if (wetCount[zone] === 0) newlyWet = true;
      wetCount[zone] = wetCount[zone]! + 1;
    }
    for (let g = 0; g < groups; g++) cur[g * STRIDE + S] = cur[g * STRIDE + PS] = 0;
    for (let i = 0; i < activeCount; i++) {
      const j = active[i]!;
      for (const o of [0, (1 + segZone[j]!) * STRIDE]) {
        cur[o + S] = cur[o + S]! + segSlope[j]!;
        cur[o + PS] = cur[o + PS]! + segRate[j]!;
      }
    }
    if (newlyWet) {
      wetList = [];
      for (let z = 0; z < zones.length; z++) if (wetCount[z]! > 0) wetList.push(z);
    }
    wetZones.push(wetList);
    coef.set(cur, k * groups * STRIDE);
  }

  const maxDepth = Math.min(first[1], last[1]) - invert;
  const zoneValues = zones.map((zone) => zone.value);

  /** the interval found last: the solvers evaluate runs of nearby depths, and elements and subsections at the same one */
  let lastInterval = 0;
  /** index of the interval holding depth y (the last level ≤ y) */
  const intervalOf = (y: number): number => {
    const k = lastInterval;
    if (levels[k]! <= y && (k + 1 === intervals || y < levels[k + 1]!)) return k;
    let lo = 0;
    let hi = intervals - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (levels[mid]! <= y) lo = mid;
      else hi = mid - 1;
    }
    lastInterval = lo;
    return lo;
  };

  const check = (y: number): void => {
    checkDepth(y, 'points');
    if (aboveLimit(y, maxDepth)) {
      throw new HydraulicError(
        `points section: the water surface at elevation ${invert + y} (depth ${y}) is above the lower end point ` +
          `(left end elevation ${first[1]}, right end elevation ${last[1]}); the section must be extended`,
      );
    }
  };

  const elements = (depth: number): Elements => {
    check(depth);
    const y = Math.min(depth, maxDepth);
    const k = intervalOf(y);
    const u = y - levels[k]!;
    const o = k * groups * STRIDE;
    const a = coef[o + A0]!;
    const t = coef[o + T0]!;
    const s = coef[o + S]!;
    return {
      area: a + u * (t + 0.5 * s * u),
      wettedPerimeter: coef[o + P0]! + coef[o + PS]! * u,
      topWidth: t + s * u,
      firstMoment: coef[o + M0]! + u * (a + u * (0.5 * t + (s * u) / 6)),
    };
  };

  const subsections = (depth: number): SubsectionElements[] => {
    check(depth);
    const y = Math.min(depth, maxDepth);
    const k = intervalOf(y);
    const u = y - levels[k]!;
    const list = wetZones[k]!;
    const out: SubsectionElements[] = new Array(list.length);
    for (let i = 0; i < list.length; i++) {
      const zone = list[i]!;
      const o = (k * groups + 1 + zone) * STRIDE;
      const t = coef[o + T0]!;
      const s = coef[o + S]!;
      out[i] = {
        area: coef[o + A0]! + u * (t + 0.5 * s * u),
        wettedPerimeter: coef[o + P0]! + coef[o + PS]! * u,
        topWidth: t + s * u,
        roughness: zoneValues[zone]!,
      };
    }
    return out;
  };

  // the same values as `subsections`, written into a caller's buffer (no allocation; see Section.subsectionsInto)
  const subsectionsInto = (depth: number, out: Float64Array, rates?: Float64Array): number => {
    check(depth);
    const y = Math.min(depth, maxDepth);
    const k = intervalOf(y);
    const u = y - levels[k]!;
    const list = wetZones[k]!;
    for (let i = 0; i < list.length; i++) {
      const zone = list[i]!;
      const o = (k * groups + 1 + zone) * STRIDE;
      const t = coef[o + T0]!;
      const s = coef[o + S]!;
      const w = 4 * i;
      out[w] = coef[o + A0]! + u * (t + 0.5 * s * u);
      out[w + 1] = coef[o + P0]! + coef[o + PS]! * u;
      out[w + 2] = t + s * u;
      out[w + 3] = zoneValues[zone]!;
      if (rates !== undefined) rates[i] = coef[o + PS]!;
    }
    return list.length;
  };

  const copied: StationElevation[] = given.map(([x, z]) => [x, z] as const);
  return {
    shape: 'points',
    closed: false,
    maxDepth,
    lengthScale: maxDepth,
    compound: zones.length > 1,
    elements,
    subsections,
    subsectionsInto,
    subsectionLimit: zones.length,
    breakDepths: Array.from(levels),
    describe: () => ({
      shape: 'points',
      points: copied.length,
      leftOffset: first[0],
      rightOffset: last[0],
      invertElevation: invert,
      maxDepth,
      zones: zones.length,
      roughness: zones.length === 1 ? zones[0]!.value : zones.map((z) => `${z.value} from ${z.from}`).join(', '),
    }),
    invertElevation: invert,
    leftEnd: { offset: first[0], elevation: first[1] },
    rightEnd: { offset: last[0], elevation: last[1] },
    points: copied,
    zones,
  };
}
