/**
 * The specific-energy curve E(y) = y + Q²·α/(2gA²) of a section, sampled evenly and at the section's break depths, in its
 * discharge-free parts, for the critical-depth and alternate-depth searches of irregular and compound sections:
 * the weight α/(2gA²) (E = y + Q²·weight), the slope weight (dE/dy = 1 + Q²·slopeWeight, with dα/dy from the
 * subsections' perimeter rates, hydraulicSection.ts conveyanceSlopesInto) and the index of the sampled curve's
 * extrema (extremaIndex.ts). Kept per section like the depth table (depthTable.ts keptTable), and lean (three
 * numbers per sample): a long survey keeps one per cross-section.
 */
import { conveyanceAndAlpha, conveyanceSlopesInto, type HydraulicSection, SlopeSlot } from './hydraulicSection.js';
import { energyCurveSamples } from '../core/tolerances.js';
import { smallestDepth } from './depthSearch.js';
import { keptTable, sampleDepths, tableStore } from './depthTable.js';
import { type ExtremaIndex, extremaIndex } from './extremaIndex.js';

export interface EnergyCurve {
  readonly depth: Float64Array;
  /** α/(2gA²) at each depth (Infinity where dry) */
  readonly weight: Float64Array;
  /**
   * −(αT/(gA³) − (dα/dy)/(2gA²)) at each depth. NaN where dα/dy has no analytic form here (Darcy–Weisbach, or a
   * section that reports no perimeter rates): the extrema are then located by minimising E itself.
   */
  readonly slopeWeight: Float64Array;
  /** where the sampled curve has extrema for any discharge (undefined: scan) */
  readonly index: ExtremaIndex | undefined;
}

/**
 * The curve's sample depths: energyCurveSamples even intervals from the smallest depth to `top`, and every break
 * depth of the section in between (merged in order; a break within a rounding distance of a sample is that sample).
 * Without break depths, the depth table's scanSamples intervals.
 */
export function curveDepths(hs: HydraulicSection, top: number): Float64Array {
  const breaks = hs.section.breakDepths;
  if (breaks === undefined) return sampleDepths(hs, top);
  const lo = smallestDepth(hs.section);
  const merged: number[] = [];
  const gap = 1e-9 * (top - lo);
  let b = 0;
  for (let i = 0; i <= energyCurveSamples; i++) {
    const y = i === energyCurveSamples ? top : lo + ((top - lo) * i) / energyCurveSamples;
    while (b < breaks.length && breaks[b]! < y) {
      const d = breaks[b++]!;
      if (d > lo && d - merged[merged.length - 1]! > gap && y - d > gap) merged.push(d);
    }
    merged.push(y);
  }
  return Float64Array.from(merged);
}

function build(hs: HydraulicSection, top: number, discharge: number | undefined): EnergyCurve {
  const depth = curveDepths(hs, top);
  const n = depth.length;
  const weight = new Float64Array(n);
  const slopeWeight = new Float64Array(n);
  const g = hs.units.g;
  const alphaVaries = hs.alpha === undefined && hs.section.compound;
  const slopes = new Float64Array(6);
  for (let i = 0; i < n; i++) {
    const y = depth[i]!;
    // with α varying, one look-up gives the subsections, whose sums are the area and top width
    let area: number;
    let topWidth: number;
    let alpha = hs.alpha ?? 1;
    let alphaSlope = 0;
    if (alphaVaries && discharge === undefined && conveyanceSlopesInto(hs, y, slopes)) {
      area = slopes[SlopeSlot.area]!;
      topWidth = slopes[SlopeSlot.topWidth]!;
      alpha = slopes[SlopeSlot.alpha]!;
      alphaSlope = slopes[SlopeSlot.alphaSlope]!;
    } else {
      ({ area, topWidth } = hs.section.elements(y));
      if (alphaVaries) {
        alpha = conveyanceAndAlpha(hs, y, discharge).alpha;
        alphaSlope = NaN;
      }
    }
    const a2 = area * area;
    weight[i] = area > 0 ? alpha / (2 * g * a2) : Infinity;
    slopeWeight[i] = area > 0 ? alphaSlope / (2 * g * a2) - (alpha * topWidth) / (g * a2 * area) : NaN;
  }
  return { depth, weight, slopeWeight, index: extremaIndex(depth, weight) };
}

const kept = tableStore<EnergyCurve>();

/** The curve from the smallest depth up to `top` (finite), for this discharge (kept as depthTable's tables are). */
export function energyCurve(hs: HydraulicSection, top: number, discharge: number): EnergyCurve {
  return keptTable(kept, hs, top, discharge, build);
}
