/**
 * A section's elements sampled at evenly spaced depths, for the scans that bracket extrema and roots in
 * sections whose curves may have several (irregular and compound sections, closed conduits).
 *
 * Geometry, conveyance and α do not depend on the discharge for Manning and Chézy, so the table is kept per
 * section (and friction law, unit system and fixed α) and reused for every discharge (a profile asks for
 * critical depth at every station and flow). Sections are immutable, so a kept table never goes stale. Darcy–Weisbach conveyance depends on the discharge (Reynolds number): that table is
 * built for the discharge asked and not kept.
 */
import { scanSamples } from '../core/tolerances.js';
import { conveyanceAndAlpha, type HydraulicSection } from './hydraulicSection.js';
import { smallestDepth } from './depthSearch.js';

export interface DepthTable {
  readonly depth: Float64Array;
  readonly area: Float64Array;
  readonly topWidth: Float64Array;
  readonly firstMoment: Float64Array;
  readonly conveyance: Float64Array;
  readonly alpha: Float64Array;
  /** α/(2gA²) at each depth (Infinity where dry): specific energy is depth + Q²·energyWeight */
  readonly energyWeight: Float64Array;
  /** 1/(gA) at each depth (Infinity where dry): specific force is Q²·forceWeight + firstMoment */
  readonly forceWeight: Float64Array;
}

const kept = new WeakMap<HydraulicSection['section'], Map<string, DepthTable>>();

function build(hs: HydraulicSection, top: number, discharge: number | undefined): DepthTable {
  const n = scanSamples + 1;
  const lo = smallestDepth(hs.section);
  const table: DepthTable = {
    depth: new Float64Array(n),
    area: new Float64Array(n),
    topWidth: new Float64Array(n),
    firstMoment: new Float64Array(n),
    conveyance: new Float64Array(n),
    alpha: new Float64Array(n),
    energyWeight: new Float64Array(n),
    forceWeight: new Float64Array(n),
  };
  const g = hs.units.g;
  for (let i = 0; i < n; i++) {
    const y = i === n - 1 ? top : lo + ((top - lo) * i) / scanSamples;
    const e = hs.section.elements(y);
    const k = conveyanceAndAlpha(hs, y, discharge);
    table.depth[i] = y;
    table.area[i] = e.area;
    table.topWidth[i] = e.topWidth;
    table.firstMoment[i] = e.firstMoment;
    table.conveyance[i] = k.conveyance;
    table.alpha[i] = k.alpha;
    // the discharge-free factors of the scans' curves, so a scan for one discharge is one multiply-add per depth
    table.energyWeight[i] = e.area > 0 ? k.alpha / (2 * g * e.area * e.area) : Infinity;
    table.forceWeight[i] = e.area > 0 ? 1 / (g * e.area) : Infinity;
  }
  return table;
}

/**
 * The table from the smallest depth up to `top` (finite), for this discharge. Only a table up to the
 * section's own limit is kept (an unbounded section's range depends on the discharge).
 */
export function depthTable(hs: HydraulicSection, top: number, discharge: number): DepthTable {
  if (hs.law === 'darcy-weisbach' || top !== hs.section.maxDepth) return build(hs, top, discharge);
  let byLaw = kept.get(hs.section);
  if (!byLaw) {
    byLaw = new Map();
    kept.set(hs.section, byLaw);
  }
  const key = `${hs.law}|${hs.units.system}|${hs.alpha ?? ''}`;
  let table = byLaw.get(key);
  if (!table) {
    table = build(hs, top, undefined);
    byLaw.set(key, table);
  }
  return table;
}
