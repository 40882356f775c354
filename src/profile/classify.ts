/**
 * Classification of a reach and of each stretch of its profile (Chow 1959, §9-2 and fig. 9-1; Henderson
 * 1966, §4.3). The slope class comes from normal and critical depth (hydraulics/slopeClass.ts); the profile
 * type from the zone the depth lies in:
 *   mild (yn > yc):  M1 above yn, M2 between, M3 below yc;   steep (yc > yn): S1 above yc, S2 between, S3 below yn;
 *   critical (yn = yc): C1 above, C3 below;   horizontal: H2 above yc, H3 below;   adverse: A2 above yc, A3 below.
 * A stretch within the accuracy goal of normal depth is reported as uniform. A depth within round-off of critical
 * depth (profileCriticalBand) takes the zone between normal and critical depth (M2, S2; C1, H2, A2 as before).
 * A surveyed reach is classed interval by interval (surveyedClass.ts): profileStretchesBy takes the class at
 * each place.
 */
import { profileCriticalBand } from '../core/tolerances.js';
import { classifySlope, criticalSlope } from '../hydraulics/slopeClass.js';
import { criticalDepth } from '../hydraulics/criticalDepth.js';
import { normalDepth } from '../hydraulics/normalDepth.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import type { ProfileStretch, ProfileType, SlopeClass } from '../results/types.js';

export interface ReachClass {
  readonly normalDepth: number | null;
  readonly criticalDepth: number;
  readonly slopeClass: SlopeClass;
}

/** Normal depth, critical depth and the slope class of a prismatic reach for a discharge. */
export function classifyReach(hs: HydraulicSection, discharge: number, slope: number): ReachClass {
  const yc = criticalDepth(hs, discharge);
  const yn = slope > 0 ? normalDepth(hs, discharge, slope) : null;
  const sc = slope > 0 ? criticalSlope(hs, discharge) : undefined;
  return { normalDepth: yn, criticalDepth: yc, slopeClass: classifySlope(slope, yn, yc, sc) };
}

/** True for the slope classes on which the subcritical profile of a break into a steep reach starts at critical depth. */
export function isSteep(slopeClass: SlopeClass): boolean {
  return slopeClass === 'steep';
}

/** The profile type of a depth in a reach (uniform within `uniformBand` of normal depth). */
export function profileType(reach: ReachClass, depth: number, uniformBand: number): ProfileType {
  const yn = reach.normalDepth;
  const yc = reach.criticalDepth;
  if (yn !== null && reach.slopeClass !== 'horizontal' && reach.slopeClass !== 'adverse' && Math.abs(depth - yn) <= uniformBand) {
    return 'uniform';
  }
  const band = profileCriticalBand * yc;
  switch (reach.slopeClass) {
    case 'mild':
      if (depth < yc - band) return 'M3';
      return yn !== null && depth > yn ? 'M1' : 'M2';
    case 'steep':
      if (depth > yc + band) return 'S1';
      return yn !== null && depth < yn ? 'S3' : 'S2';
    case 'critical':
      return depth >= yc ? 'C1' : 'C3';
    case 'horizontal':
      return depth >= yc ? 'H2' : 'H3';
    case 'adverse':
      return depth >= yc ? 'A2' : 'A3';
  }
}

/**
 * The stretches of one reach's profile: each interval between consecutive stations takes the type of its
 * mean depth; equal neighbours merge. Zero-length intervals (the two sides of a jump) are skipped.
 */
export function profileStretches(
  reach: ReachClass,
  stations: readonly number[],
  depths: readonly number[],
  uniformBand: (depth: number) => number,
): ProfileStretch[] {
  return profileStretchesBy(stations, (i) => {
    const mean = 0.5 * (depths[i]! + depths[i + 1]!);
    return profileType(reach, mean, uniformBand(mean));
  });
}

/**
 * The stretches of a profile whose class changes along it: `typeOf(i)` gives the type of the interval from
 * stations[i] to stations[i + 1] (from the class and the zone at that place); equal neighbours merge and
 * zero-length intervals are skipped, as in profileStretches.
 */
export function profileStretchesBy(stations: readonly number[], typeOf: (i: number) => ProfileType): ProfileStretch[] {
  const out: ProfileStretch[] = [];
  for (let i = 0; i + 1 < stations.length; i++) {
    const from = stations[i]!;
    const to = stations[i + 1]!;
    if (to <= from) continue;
    const type = typeOf(i);
    const last = out[out.length - 1];
    if (last && last.type === type && last.to === from) last.to = to;
    else out.push({ type, from, to });
  }
  return out;
}
