/** Test channels for the profile engine (invented, round numbers; not from any source unless a test says so). */
import { SI, US, type Units } from '../../src/core/units.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import type { Section } from '../../src/geometry/section.js';
import type { FrictionLaw } from '../../src/hydraulics/friction.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import type { Boundary, ProfileInput, ProfileMethod, ReachInput } from '../../src/profile/types.js';

/** A 5 m wide concrete-lined rectangular channel, n = 0.015, carrying 20 m³/s (yc = 1.177 m). */
export const rect5: HydraulicSection = hydraulicSection(rectangular({ bottomWidth: 5, roughness: 0.015 }), 'manning', SI);
export const rect5Discharge = 20;

/** Chow 1959, Example 10-1 (inputs from memory): trapezoid b = 20 ft, z = 2, n = 0.025, α = 1.10. */
export const chowTrapezoid: HydraulicSection = hydraulicSection(
  trapezoidal({ bottomWidth: 20, sideSlopeLeft: 2, roughness: 0.025 }),
  'manning',
  US,
  1.1,
);

/**
 * The wide-channel idealisation (Chow 1959 §10-5, Bresse): per unit width, no side walls, so R = y exactly.
 * Implemented here as a Section with wetted perimeter equal to the width; Chézy's C by default, or Manning's n.
 */
export function wideChannel(width: number, roughness: number, units: Units = SI, law: FrictionLaw = 'chezy'): HydraulicSection {
  const section: Section = {
    shape: 'rectangular',
    closed: false,
    maxDepth: Infinity,
    lengthScale: width,
    compound: false,
    elements: (y) => ({ area: width * y, wettedPerimeter: width, topWidth: width, firstMoment: (width * y * y) / 2 }),
    subsections: (y) => [{ area: width * y, wettedPerimeter: width, topWidth: width, roughness }],
    describe: () => ({ shape: 'wide', width }),
  };
  return hydraulicSection(section, law, units);
}

export function channel(
  reaches: ReachInput[],
  boundaries: { upstream?: Boundary; downstream?: Boundary },
  extra: Partial<ProfileInput> = {},
  method: ProfileMethod = 'standard-step',
): ProfileInput {
  return { units: SI, reaches, discharge: rect5Discharge, flowId: 'test', boundaries, method, ...extra };
}
