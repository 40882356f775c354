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

/** Conveyance and α with their rates of change with depth. */
export interface ConveyanceSlopes extends ConveyanceResult {
  /** the flow area and top width as the sums of the subsections' (equal to the section's elements up to round-off) */
  area: number;
  topWidth: number;
  /** dK/dy */
  conveyanceSlope: number;
  /** dα/dy (0 where α is fixed or the section has one subsection) */
  alphaSlope: number;
}

/** d(ln K)/dy of one subsection per friction law, from dA/dy = T and dP/dy: K ∝ A^a·P^−b (Manning a = 5/3, b = 2/3; Chézy 3/2, 1/2). */
const logConveyanceExponents: Partial<Record<HydraulicSection['law'], readonly [number, number]>> = {
  manning: [5 / 3, 2 / 3],
  chezy: [3 / 2, 1 / 2],
};

let rateScratch = new Float64Array(8);
let slopeScratch = new Float64Array(4 * 8);

/** Where conveyanceSlopesInto writes each value. */
export const SlopeSlot = { conveyance: 0, alpha: 1, area: 2, topWidth: 3, conveyanceSlope: 4, alphaSlope: 5 } as const;

/**
 * conveyanceAndAlpha at a depth together with dK/dy and dα/dy, worked out from the subsections' areas, top widths
 * (dA/dy) and perimeter rates (dP/dy) rather than by differencing: with Si = Ki³/Ai², S = ΣSi and α = S·A²/K³,
 *   dα/dy = α·(S′/S + 2T/A − 3K′/K),  Si′ = Si·(3Ki′/Ki − 2Ti/Ai),  Ki′ = Ki·(a·Ti/Ai − b·Pi′/Pi)
 * (the logarithmic derivative of α = Σ(Ki³/Ai²)/(K³/A²), Chow 1959 §6-4's definition). The conveyance and α are
 * the same sums in the same order as conveyanceAndAlpha's, so energies agree to the last bit. Written into `out` at
 * the SlopeSlot places (no allocation: the tables call it at every sample); false where the rates cannot be formed
 * this way: Darcy–Weisbach (K depends on the discharge), or a section that does not report perimeter rates.
 */
export function conveyanceSlopesInto(hs: HydraulicSection, depth: number, result: Float64Array): boolean {
  const section = hs.section;
  const exponents = logConveyanceExponents[hs.law];
  if (exponents === undefined || section.subsectionsInto === undefined || section.subsectionLimit === undefined) return false;
  const limit = section.subsectionLimit;
  if (slopeScratch.length < 4 * limit) slopeScratch = new Float64Array(4 * limit);
  if (rateScratch.length < limit) rateScratch = new Float64Array(limit);
  const out = slopeScratch;
  const rates = rateScratch;
  rates.fill(NaN, 0, limit);
  const count = section.subsectionsInto(depth, out, rates);
  const a = exponents[0];
  const b = exponents[1];
  const manning = hs.law === 'manning';
  const factor = hs.units.manningFactor;
  let totalArea = 0;
  let totalWidth = 0;
  for (let i = 0; i < count; i++) {
    totalArea += out[4 * i]!;
    totalWidth += out[4 * i + 2]!;
  }
  let k = 0;
  let kSlope = 0;
  let sum = 0;
  let sumSlope = 0;
  for (let i = 0; i < count; i++) {
    const area = out[4 * i]!;
    const perimeter = out[4 * i + 1]!;
    // conveyanceOf's Manning and Chézy forms, written out (this runs at every sample of every table)
    const r = area > 0 && perimeter > 0 ? area / perimeter : 0;
    const ki = r === 0 ? 0 : manning ? (factor / out[4 * i + 3]!) * area * Math.cbrt(r * r) : out[4 * i + 3]! * area * Math.sqrt(r);
    k += ki;
    if (ki > 0) {
      const width = out[4 * i + 2]!;
      const logSlope = (a * width) / area - (b * rates[i]!) / perimeter;
      kSlope += ki * logSlope;
      const si = (ki * ki * ki) / (area * area);
      sum += si;
      sumSlope += si * (3 * logSlope - (2 * width) / area);
    } else if (area > 0) sum += (ki * ki * ki) / (area * area);
  }
  let alpha = 1;
  let alphaSlope = 0;
  if (hs.alpha !== undefined) alpha = hs.alpha;
  else if (count > 1 && k > 0 && totalArea > 0) {
    alpha = sum / ((k * k * k) / (totalArea * totalArea));
    alphaSlope = alpha * (sumSlope / sum + (2 * totalWidth) / totalArea - (3 * kSlope) / k);
  }
  // a section that left a rate unwritten, or a subsection too thin for the ratios: no analytic rates here
  if (!Number.isFinite(kSlope) || !Number.isFinite(alphaSlope)) return false;
  result[SlopeSlot.conveyance] = k;
  result[SlopeSlot.alpha] = alpha;
  result[SlopeSlot.area] = totalArea;
  result[SlopeSlot.topWidth] = totalWidth;
  result[SlopeSlot.conveyanceSlope] = kSlope;
  result[SlopeSlot.alphaSlope] = alphaSlope;
  return true;
}

const slopeResult = new Float64Array(6);

/** conveyanceSlopesInto as an object; undefined where the rates cannot be formed analytically. */
export function conveyanceWithSlopes(hs: HydraulicSection, depth: number): ConveyanceSlopes | undefined {
  if (!conveyanceSlopesInto(hs, depth, slopeResult)) return undefined;
  const r = slopeResult;
  return {
    conveyance: r[SlopeSlot.conveyance]!,
    alpha: r[SlopeSlot.alpha]!,
    area: r[SlopeSlot.area]!,
    topWidth: r[SlopeSlot.topWidth]!,
    conveyanceSlope: r[SlopeSlot.conveyanceSlope]!,
    alphaSlope: r[SlopeSlot.alphaSlope]!,
  };
}

export function conveyance(hs: HydraulicSection, depth: number, discharge?: number): number {
  return conveyanceAndAlpha(hs, depth, discharge).conveyance;
}

export function energyCoefficient(hs: HydraulicSection, depth: number, discharge?: number): number {
  return conveyanceAndAlpha(hs, depth, discharge).alpha;
}
