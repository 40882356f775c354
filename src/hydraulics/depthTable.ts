/**
 * A section's elements sampled at evenly spaced depths, for the scans that bracket extrema and roots in
 * sections whose curves may have several (irregular and compound sections, closed conduits): conveyance for
 * normal depth, specific force for sequent depths. Specific energy has its own leaner table (energyCurve.ts).
 *
 * Geometry, conveyance and α do not depend on the discharge for Manning and Chézy, so the table is kept per
 * section (and friction law, unit system and fixed α) and reused for every discharge (a profile asks for
 * these at every station and flow). Sections are immutable, so a kept table never goes stale. Darcy–Weisbach
 * conveyance depends on the discharge (Reynolds number): that table is built for the discharge asked and not kept.
 */
import { scanSamples } from '../core/tolerances.js';
import { conveyanceAndAlpha, type HydraulicSection } from './hydraulicSection.js';
import { smallestDepth } from './depthSearch.js';
import { type ExtremaIndex, extremaIndex } from './extremaIndex.js';

export interface DepthTable {
  readonly depth: Float64Array;
  readonly area: Float64Array;
  readonly firstMoment: Float64Array;
  readonly conveyance: Float64Array;
  /** 1/(gA) at each depth (Infinity where dry): specific force is Q²·forceWeight + firstMoment */
  readonly forceWeight: Float64Array;
  /** −T/(gA²) at each depth: the slope of the specific-force curve is dM/dy = A + Q²·forceSlopeWeight */
  readonly forceSlopeWeight: Float64Array;
  /** where the sampled specific-force curve has extrema for any discharge (undefined: scan) */
  readonly forceIndex: ExtremaIndex | undefined;
}

/** The sample depths: scanSamples intervals from the smallest depth to `top` (the last one exactly `top`). */
export function sampleDepths(hs: HydraulicSection, top: number): Float64Array {
  const n = scanSamples + 1;
  const lo = smallestDepth(hs.section);
  const depth = new Float64Array(n);
  for (let i = 0; i < n; i++) depth[i] = i === n - 1 ? top : lo + ((top - lo) * i) / scanSamples;
  return depth;
}

/** Where one kind of table is kept: per section and key, and per HydraulicSection that asked (the fast path). */
export interface TableStore<T> {
  readonly bySection: WeakMap<HydraulicSection['section'], Map<string, T>>;
  /** the usual case first: this very HydraulicSection asked before (a profile asks at every station and flow) */
  readonly byHydraulicSection: WeakMap<HydraulicSection, T>;
}

export function tableStore<T>(): TableStore<T> {
  return { bySection: new WeakMap(), byHydraulicSection: new WeakMap() };
}

/**
 * A table kept per section, friction law, unit system and fixed α, up to the section's own limit; built anew
 * (not kept) for Darcy–Weisbach, whose conveyance depends on the discharge, and for a range below `top` other
 * than the section's limit (an unbounded section's range depends on the discharge).
 */
export function keptTable<T>(
  store: TableStore<T>,
  hs: HydraulicSection,
  top: number,
  discharge: number,
  build: (hs: HydraulicSection, top: number, discharge: number | undefined) => T,
): T {
  if (hs.law === 'darcy-weisbach' || top !== hs.section.maxDepth) return build(hs, top, discharge);
  const known = store.byHydraulicSection.get(hs);
  if (known !== undefined) return known;
  let byLaw = store.bySection.get(hs.section);
  if (!byLaw) {
    byLaw = new Map();
    store.bySection.set(hs.section, byLaw);
  }
  const key = `${hs.law}|${hs.units.system}|${hs.alpha ?? ''}`;
  let table = byLaw.get(key);
  if (!table) {
    table = build(hs, top, undefined);
    byLaw.set(key, table);
  }
  store.byHydraulicSection.set(hs, table);
  return table;
}

function build(hs: HydraulicSection, top: number, discharge: number | undefined): DepthTable {
  const depth = sampleDepths(hs, top);
  const n = depth.length;
  const area = new Float64Array(n);
  const firstMoment = new Float64Array(n);
  const conveyance = new Float64Array(n);
  const forceWeight = new Float64Array(n);
  const forceSlopeWeight = new Float64Array(n);
  const g = hs.units.g;
  for (let i = 0; i < n; i++) {
    const y = depth[i]!;
    const e = hs.section.elements(y);
    area[i] = e.area;
    firstMoment[i] = e.firstMoment;
    conveyance[i] = conveyanceAndAlpha(hs, y, discharge).conveyance;
    // the discharge-free factors of the curves, so a scan for one discharge is one multiply-add per depth
    forceWeight[i] = e.area > 0 ? 1 / (g * e.area) : Infinity;
    forceSlopeWeight[i] = e.area > 0 ? -e.topWidth / (g * e.area * e.area) : NaN;
  }
  return { depth, area, firstMoment, conveyance, forceWeight, forceSlopeWeight, forceIndex: extremaIndex(firstMoment, forceWeight) };
}

const kept = tableStore<DepthTable>();

/** The table from the smallest depth up to `top` (finite), for this discharge (see keptTable). */
export function depthTable(hs: HydraulicSection, top: number, discharge: number): DepthTable {
  return keptTable(kept, hs, top, discharge, build);
}
