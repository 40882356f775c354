/**
 * What every structure adapter shares: reading the engine's ControlContext in the structures' terms
 * (stages, approach areas), the supercritical depth a structure issues below it, and the response.
 */
import { brentRoot } from '../../core/roots.js';
import { criticalDepth } from '../../hydraulics/criticalDepth.js';
import type { HydraulicSection } from '../../hydraulics/hydraulicSection.js';
import { smallestDepth } from '../../hydraulics/depthSearch.js';
import { specificEnergy } from '../../hydraulics/specificEnergy.js';
import type { ControlContext, ControlResponse } from '../../profile/types.js';
import { structureTolerance } from '../invert.js';
import type { ApproachArea, StructureOutcome } from '../types.js';
import { toStructureResult } from '../types.js';

/** The tailwater as a stage (null: no subcritical flow below, free outflow). */
export function tailwaterStageOf(ctx: ControlContext): number | null {
  return ctx.tailwaterDepth === null ? null : ctx.downstreamBedElevation + ctx.tailwaterDepth;
}

/** The approach section's flow area at a stage (the channel just upstream of the structure). */
export function approachAreaOf(ctx: ControlContext): ApproachArea {
  const section = ctx.upstreamSection.section;
  return (stage) => {
    const depth = Math.min(Math.max(stage - ctx.upstreamBedElevation, 0), section.maxDepth);
    return section.elements(depth).area;
  };
}

/**
 * The supercritical depth with specific energy E in a section (the lower alternate depth), or critical depth
 * where E is not above the least specific energy (the flow cannot leave faster than critical).
 * E(y) falls from +∞ at y → 0 to its minimum at critical depth: one root, bracketed.
 */
export function supercriticalDepthForEnergy(hs: HydraulicSection, discharge: number, energy: number): number {
  const yc = criticalDepth(hs, discharge);
  const f = (y: number) => specificEnergy(hs, y, discharge) - energy;
  if (!(f(yc) < 0)) return yc;
  const lo = smallestDepth(hs.section);
  if (!(f(lo) > 0)) return lo;
  return brentRoot(f, lo, yc, { xTolerance: structureTolerance(yc), what: 'supercritical depth below a structure' });
}

/** The engine response of a structure outcome: headwater depth above the upstream bed, the result with its caution. */
export function responseOf(
  id: string,
  station: number,
  ctx: ControlContext,
  outcome: StructureOutcome,
  extra: { downstreamDepth?: number | null; values?: Record<string, number | string | boolean | null>; notes?: readonly string[] } = {},
): ControlResponse {
  const base = toStructureResult(id, station, outcome);
  const notes = [...(extra.notes ?? [])];
  const result = {
    ...base,
    values: {
      ...base.values,
      headwaterDepth: outcome.headwaterStage - ctx.upstreamBedElevation,
      // the depth actually issued below the structure (the jet on the bed below), null where none is
      downstreamSupercriticalDepth: extra.downstreamDepth ?? null,
      ...(extra.values ?? {}),
    },
    // the caution stays the last note
    notes: [...base.notes.slice(0, -1), ...notes, base.notes[base.notes.length - 1]!],
  };
  const downstream = extra.downstreamDepth;
  return {
    upstreamDepth: outcome.headwaterStage - ctx.upstreamBedElevation,
    ...(downstream !== null && downstream !== undefined ? { downstreamDepth: downstream } : {}),
    result,
  };
}

/**
 * The depth a free-flowing structure issues below it: the supercritical depth on the lower bed with the
 * headwater's energy (energy losses at the structure neglected, which gives the faster, shallower jet; the
 * engine then places the jump by specific force or finds it drowned by the tailwater).
 */
export function jetDepth(ctx: ControlContext, headwaterEnergy: number): number {
  return supercriticalDepthForEnergy(ctx.downstreamSection, ctx.discharge, headwaterEnergy - ctx.downstreamBedElevation);
}
