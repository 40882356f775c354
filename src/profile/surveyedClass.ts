/**
 * Slope class and profile zone along a surveyed (non-prismatic) reach, interval by interval between its nodes.
 *
 * A reach surveyed as many sections may be steep in one part and mild in another, so it is not given one class
 * from its first section and its mean slope: each interval (nodes j, j+1) has its own bed slope
 * S0 = (z_j − z_{j+1}) / L_j (L_j its flow length) and is classed against the critical slope of its sections for
 * the discharge, Sc = (Q/K(yc))² (the slope whose normal depth is the critical depth; Chow 1959 §9-2, from
 * memory), the mean of its two sections': S0 < Sc mild, S0 > Sc steep, |S0 − Sc| ≤ criticalSlopeRelativeBand·Sc
 * critical, S0 = 0 horizontal, S0 < 0 adverse. Where conveyance rises with depth this says the same as comparing
 * normal with critical depth (yn > yc ⇔ S0 < Sc), without a normal-depth search at every node.
 *
 * The zone of a depth y against normal depth is likewise the sign of S0 − Sf(y) (y > yn ⇔ Sf(y) < S0, Sf = (Q/K)²
 * falling with depth; Chow 1959 §9-1), and where the distance matters (the uniform band of a few millimetres) it
 * is the Newton estimate y − yn ≈ ln(Sf(y)/S0) / (d ln Sf/dy), d ln Sf/dy = −2·d ln K/dy, whose error is of the
 * second order in that distance.
 *
 * Internal controls: where an interval that is not steep (mild, critical, horizontal, adverse) is followed by a
 * steep one, the flow passes through critical depth at the node between them unless the profile from downstream
 * drowns it, as at a break between two prismatic reaches (Chow 1959 §9-3, Henderson 1966 §4.3).
 */
import { criticalSlopeRelativeBand, horizontalSlope, normalEstimateStep } from '../core/tolerances.js';
import { conveyance, conveyanceSlopesInto, type HydraulicSection, SlopeSlot } from '../hydraulics/hydraulicSection.js';
import type { SlopeClass } from '../results/types.js';
import { flowLength } from './surveyed.js';
import type { SurveyNode } from './types.js';

/** The bed slope of interval j (nodes j and j + 1) over its flow length. */
export function intervalSlope(nodes: readonly SurveyNode[], j: number): number {
  return (nodes[j]!.bedElevation - nodes[j + 1]!.bedElevation) / flowLength(nodes, j);
}

/** Sc = (Q/K(yc))² of a section at its critical depth yc. */
export function criticalSlopeOf(hs: HydraulicSection, criticalDepth: number, discharge: number): number {
  return (discharge / conveyance(hs, criticalDepth, discharge)) ** 2;
}

/** The class of a bed slope against a critical slope (see the module comment). */
export function slopeClassAgainst(slope: number, criticalSlope: number): SlopeClass {
  if (Math.abs(slope) <= horizontalSlope) return 'horizontal';
  if (slope < 0) return 'adverse';
  if (Math.abs(slope - criticalSlope) <= criticalSlopeRelativeBand * criticalSlope) return 'critical';
  return slope < criticalSlope ? 'mild' : 'steep';
}

/** Each interval's slope class, from its bed slope and the mean critical slope of its two sections. */
export function intervalClasses(nodes: readonly SurveyNode[], critical: (node: number) => number, discharge: number): SlopeClass[] {
  const sc = nodes.map((n, j) => criticalSlopeOf(n.section, critical(j), discharge));
  const out: SlopeClass[] = [];
  for (let j = 0; j + 1 < nodes.length; j++) out.push(slopeClassAgainst(intervalSlope(nodes, j), 0.5 * (sc[j]! + sc[j + 1]!)));
  return out;
}

/** A run of intervals of one class: nodes first … last (last > first). */
export interface SurveyPart {
  readonly first: number;
  readonly last: number;
  readonly slopeClass: SlopeClass;
}

/** The intervals' classes gathered into runs of one class, upstream first. */
export function surveyParts(classes: readonly SlopeClass[]): SurveyPart[] {
  const parts: SurveyPart[] = [];
  let first = 0;
  for (let j = 1; j <= classes.length; j++) {
    if (j === classes.length || classes[j] !== classes[first]) {
      parts.push({ first, last: j, slopeClass: classes[first]! });
      first = j;
    }
  }
  return parts;
}

/** The nodes where a steep interval follows one that is not steep: the flow passes through critical depth there. */
export function controlBreaks(classes: readonly SlopeClass[]): number[] {
  const out: number[] = [];
  for (let k = 1; k < classes.length; k++) if (classes[k] === 'steep' && classes[k - 1] !== 'steep') out.push(k);
  return out;
}

const slopes = new Float64Array(6);

/** K and d(ln K)/dy at a depth: what the distance from normal depth needs, whatever the bed slope. */
export interface ConveyanceGrowth {
  readonly conveyance: number;
  readonly logSlope: number;
}

/** K and d(ln K)/dy at a depth: from the subsections' perimeter rates where the section reports them, else by a central difference. */
export function conveyanceGrowth(hs: HydraulicSection, depth: number, discharge: number): ConveyanceGrowth {
  if (conveyanceSlopesInto(hs, depth, slopes)) {
    // K and dK/dy from the subsections' perimeter rates, in one evaluation
    const k = slopes[SlopeSlot.conveyance]!;
    return { conveyance: k, logSlope: slopes[SlopeSlot.conveyanceSlope]! / k };
  }
  // a central difference of ln K, kept inside the section (one-sided at its top)
  const k = conveyance(hs, depth, discharge);
  const h = normalEstimateStep * depth;
  const up = Math.min(depth + h, hs.section.maxDepth);
  const down = depth - h;
  return { conveyance: k, logSlope: Math.log(conveyance(hs, up, discharge) / conveyance(hs, down, discharge)) / (up - down) };
}

/** y − yn on bed slope S0 from K and d(ln K)/dy at y (the Newton estimate of the module comment); null where S0 ≤ 0. */
export function distanceFromNormal(growth: ConveyanceGrowth, discharge: number, slope: number): number | null {
  if (!(slope > 0)) return null;
  const logRatio = 2 * Math.log(discharge / growth.conveyance) - Math.log(slope);
  if (!(growth.logSlope > 0)) return logRatio < 0 ? Infinity : logRatio > 0 ? -Infinity : 0;
  return logRatio / (-2 * growth.logSlope);
}

/**
 * y − yn at depth y in a section on bed slope S0 > 0, by the Newton estimate of the module comment (exact in sign);
 * null where S0 ≤ 0 (no normal depth).
 */
export function aboveNormal(hs: HydraulicSection, depth: number, discharge: number, slope: number): number | null {
  if (!(slope > 0)) return null;
  return distanceFromNormal(conveyanceGrowth(hs, depth, discharge), discharge, slope);
}
