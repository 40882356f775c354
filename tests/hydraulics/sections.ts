/**
 * Sections shared by the hydraulics tests. The compound section is an invented test case: a main channel
 * (10 m bed, 1:1 banks, 2 m deep, n = 0.03) between two floodplains 100 m wide (n = 0.05) that rise
 * 0.05 m to vertical outer walls 4 m above the bed.
 */
import { SI, US, type Units } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { points } from '../../src/geometry/shapes/points.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { type FrictionLaw } from '../../src/hydraulics/friction.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';

export function rect(bottomWidth: number, n = 0.015, units: Units = SI, law: FrictionLaw = 'manning'): HydraulicSection {
  return hydraulicSection(rectangular({ bottomWidth, roughness: n }), law, units);
}

export function trap(b: number, z: number, n: number, units: Units = SI, alpha?: number): HydraulicSection {
  return hydraulicSection(trapezoidal({ bottomWidth: b, sideSlopeLeft: z, roughness: n }), 'manning', units, alpha);
}

export function pipe(diameter: number, n = 0.013, units: Units = SI): HydraulicSection {
  return hydraulicSection(circular({ diameter, roughness: n }), 'manning', units);
}

export function compound(): HydraulicSection {
  const section = points({
    points: [[0, 4], [0, 2.05], [100, 2], [102, 0], [112, 0], [114, 2], [214, 2.05], [214, 4]],
    roughness: [[0, 0.05], [100, 0.03], [114, 0.05]],
  });
  return hydraulicSection(section, 'manning', SI);
}

export { SI, US };
