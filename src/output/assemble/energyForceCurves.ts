/**
 * Samples of specific energy E(y) = y + αQ²/(2gA²) and specific force M(y) = Q²/(gA) + Aȳ at one section and
 * discharge (hydraulics/specificEnergy.ts, specificForce.ts; Chow 1959 ch. 3), with the flow depth, its
 * alternate and sequent depths and critical depth marked: the input of the energy–force diagram.
 *
 * The depth range covers every marked depth with a margin; each curve is cut where it rises far beyond its
 * marked values (E and M grow without bound as y → 0), so the curve's knee stays readable.
 */
import { HydraulicError } from '../../core/errors.js';
import type { HydraulicSection } from '../../hydraulics/hydraulicSection.js';
import { criticalDepth } from '../../hydraulics/criticalDepth.js';
import { alternateDepth, specificEnergy } from '../../hydraulics/specificEnergy.js';
import { sequentDepth, specificForce } from '../../hydraulics/specificForce.js';
import type { CurvePoint, EnergyForceInput } from '../charts/energyForceChart.js';

/** Samples per curve: enough for a smooth line in a 300 px panel. */
const samples = 160;
/** The depth range runs from this fraction of the smallest marked depth ... */
const lowFraction = 0.45;
/** ... to this multiple of the largest. */
const highFactor = 1.35;
/** A curve is cut where its value exceeds this multiple of the largest value at a marked depth. */
const valueCap = 1.8;
/** Closed or bounded sections are sampled up to this fraction of their full depth. */
const fullDepthFraction = 0.999;

/** A conjugate depth, or null where it does not exist (above a crown, or beyond a surveyed section). */
function orNull(find: () => number | null): number | null {
  try {
    const d = find();
    return d !== null && Number.isFinite(d) ? d : null;
  } catch (error) {
    if (error instanceof HydraulicError) return null;
    throw error;
  }
}

export interface EnergyForceSampleInput {
  hs: HydraulicSection;
  discharge: number;
  /** the flow depth at the station */
  depth: number;
  flow?: string;
  station?: number;
}

export function energyForceSamples(input: EnergyForceSampleInput): EnergyForceInput {
  const { hs, discharge, depth } = input;
  const yc = criticalDepth(hs, discharge);
  const alternate = orNull(() => alternateDepth(hs, depth, discharge));
  const sequent = orNull(() => sequentDepth(hs, depth, discharge));
  const marked = [depth, yc, ...(alternate === null ? [] : [alternate]), ...(sequent === null ? [] : [sequent])];
  const top = Number.isFinite(hs.section.maxDepth) ? hs.section.maxDepth * fullDepthFraction : Infinity;
  const lo = lowFraction * Math.min(...marked);
  const hi = Math.min(top, highFactor * Math.max(...marked));
  const energyCap = valueCap * Math.max(...marked.map((y) => specificEnergy(hs, Math.min(y, top), discharge)));
  const forceCap = valueCap * Math.max(...marked.map((y) => specificForce(hs, Math.min(y, top), discharge)));
  const energy: CurvePoint[] = [];
  const force: CurvePoint[] = [];
  for (let i = 0; i <= samples; i++) {
    const y = lo + ((hi - lo) * i) / samples;
    const e = specificEnergy(hs, y, discharge);
    const m = specificForce(hs, y, discharge);
    if (Number.isFinite(e) && e <= energyCap) energy.push({ depth: y, value: e });
    if (Number.isFinite(m) && m <= forceCap) force.push({ depth: y, value: m });
  }
  return {
    units: hs.units.system,
    energy,
    force,
    criticalDepth: yc,
    flowDepth: depth,
    alternateDepth: alternate,
    sequentDepth: sequent,
    discharge,
    ...(input.flow === undefined ? {} : { flow: input.flow }),
    ...(input.station === undefined ? {} : { station: input.station }),
  };
}
