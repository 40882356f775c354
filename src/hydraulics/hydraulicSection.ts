/**
 * A section with its friction law and unit system: everything the depth solvers need.
 * Conveyance and the kinetic-energy coefficient α come from the roughness subsections
 * (Chow 1959, ch. 2 and 6, chapters from memory: α = Σ(Ki³/Ai²) / (K³/A²)).
 */
import type { Units } from '../core/units.js';
import type { Section } from '../geometry/section.js';
import { conveyanceOf, type FrictionLaw, subsectionConveyance } from './friction.js';

export interface HydraulicSection {
  readonly section: Section;
  readonly law: FrictionLaw;
  readonly units: Units;
  /** a fixed α set by the user; when absent α comes from the subsections (1 for a uniform-roughness shape) */
  readonly alpha?: number;
}

export function hydraulicSection(section: Section, law: FrictionLaw, units: Units, alpha?: number): HydraulicSection {
  return alpha === undefined ? { section, law, units } : { section, law, units, alpha };
}

export interface ConveyanceResult {
  /** total conveyance K = ΣKi */
  conveyance: number;
  /** kinetic-energy coefficient α */
  alpha: number;
}

/** Scratch for sections with subsectionsInto (the solvers' inner loop allocates nothing but the result). */
let scratch = new Float64Array(4 * 8);

/** Conveyance and α at a depth. `discharge` is used only by Darcy–Weisbach (for the Reynolds number). */
export function conveyanceAndAlpha(hs: HydraulicSection, depth: number, discharge?: number): ConveyanceResult {
  const section = hs.section;
  if (section.subsectionsInto !== undefined && section.subsectionLimit !== undefined) {
    if (scratch.length < 4 * section.subsectionLimit) scratch = new Float64Array(4 * section.subsectionLimit);
    return fromBuffer(hs, scratch, section.subsectionsInto(depth, scratch), discharge);
  }
  const subs = section.subsections(depth);
  let totalArea = 0;
  for (const s of subs) totalArea += s.area;
  const velocity = discharge !== undefined && totalArea > 0 ? Math.abs(discharge) / totalArea : undefined;
  let k = 0;
  let sum = 0;
  for (const s of subs) {
    const ki = subsectionConveyance(s, hs.law, hs.units, velocity);
    k += ki;
    if (s.area > 0) sum += (ki * ki * ki) / (s.area * s.area);
  }
  let alpha = 1;
  if (hs.alpha !== undefined) alpha = hs.alpha;
  else if (subs.length > 1 && k > 0 && totalArea > 0) alpha = sum / ((k * k * k) / (totalArea * totalArea));
  return { conveyance: k, alpha };
}

/** conveyanceAndAlpha over subsections written by Section.subsectionsInto: the same sums in the same order. */
function fromBuffer(hs: HydraulicSection, out: Float64Array, count: number, discharge?: number): ConveyanceResult {
  let totalArea = 0;
  for (let i = 0; i < count; i++) totalArea += out[4 * i]!;
  const velocity = discharge !== undefined && totalArea > 0 ? Math.abs(discharge) / totalArea : undefined;
  let k = 0;
  let sum = 0;
  for (let i = 0; i < count; i++) {
    const area = out[4 * i]!;
    const ki = conveyanceOf(area, out[4 * i + 1]!, out[4 * i + 3]!, hs.law, hs.units, velocity);
    k += ki;
    if (area > 0) sum += (ki * ki * ki) / (area * area);
  }
  let alpha = 1;
  if (hs.alpha !== undefined) alpha = hs.alpha;
  else if (count > 1 && k > 0 && totalArea > 0) alpha = sum / ((k * k * k) / (totalArea * totalArea));
  return { conveyance: k, alpha };
}

export function conveyance(hs: HydraulicSection, depth: number, discharge?: number): number {
  return conveyanceAndAlpha(hs, depth, discharge).conveyance;
}

export function energyCoefficient(hs: HydraulicSection, depth: number, discharge?: number): number {
  return conveyanceAndAlpha(hs, depth, discharge).alpha;
}
