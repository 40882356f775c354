/**
 * Benchmark channels. All invented: round numbers chosen to exercise the engine, not taken from any site
 * or publication.
 */
import { SI } from '../src/core/units.js';
import { points, type StationElevation } from '../src/geometry/shapes/points.js';
import { trapezoidal } from '../src/geometry/shapes/trapezoidal.js';
import { type HydraulicSection, hydraulicSection } from '../src/hydraulics/hydraulicSection.js';
import type { ProfileInput, ProfileMethod } from '../src/profile/types.js';

/** A 5 m trapezoid, side slopes 2:1, n = 0.015, S0 = 0.0005, 30 m³/s: a mild reach (yn ≈ 1.43 m, yc ≈ 1.06 m). */
export const prismaticSection: HydraulicSection = hydraulicSection(
  trapezoidal({ bottomWidth: 5, sideSlopeLeft: 2, sideSlopeRight: 2, roughness: 0.015 }),
  'manning',
  SI,
);

/** 10 km of that reach with a 4 m tailwater (an M1 backwater over the whole length), output every 1 m. */
export function prismaticInput(method: ProfileMethod): ProfileInput {
  return {
    units: SI,
    reaches: [{ id: 'reach', section: prismaticSection, length: 10_000, slope: 0.0005 }],
    discharge: 30,
    flowId: 'bench',
    boundaries: { downstream: { type: 'depth', depth: 4 } },
    method,
    outputSpacing: 1,
  };
}

/**
 * A 60-point natural section: a main channel between banks at offsets 70 and 130 with floodplains rising to
 * the end points, three roughness zones (left floodplain 0.06, main channel 0.035, right floodplain 0.05).
 * `variant` (0…1) widens and deepens the main channel a little, so a survey of such sections is not prismatic.
 */
export function surveyPoints(variant: number): StationElevation[] {
  const out: StationElevation[] = [];
  const depth = 3 + 0.6 * Math.sin(variant * 7.1);
  const wobble = 0.15 * Math.cos(variant * 13.3);
  for (let i = 0; i < 60; i++) {
    const x = (200 * i) / 59;
    let z: number;
    if (x < 70) z = 3.2 + (2.8 * (70 - x)) / 70 + 0.1 * Math.sin(i * 1.3);
    else if (x > 130) z = 3.0 + (3 * (x - 130)) / 70 + 0.1 * Math.cos(i * 0.7);
    else z = 3.1 - depth * Math.sin((Math.PI * (x - 70)) / 60) + wobble * Math.sin(i * 2.1);
    out.push([x, z]);
  }
  out[0] = [0, 6.5];
  out[59] = [200, 6.5];
  return out;
}

export const surveyRoughness = [
  [0, 0.06],
  [70, 0.035],
  [130, 0.05],
] as const;

export function surveySection(variant: number): HydraulicSection {
  return hydraulicSection(points({ points: surveyPoints(variant), roughness: surveyRoughness }), 'manning', SI);
}
