/**
 * A free overfall (a drop) as a control. At the downstream end of the channel it is the downstream boundary:
 * critical depth at the brink starts the subcritical profile upstream, as usual practice does, and the brink
 * depth is reported by Rouse's ratio (../drop.ts). Inside the channel (a vertical drop of `bedDrop`), it is an
 * internal control: critical depth at the brink unless the tailwater below stands above it (then the drop is
 * drowned and the water surface is taken level across it); the falling jet is issued as the supercritical
 * depth on the lower bed with the brink's energy (no loss in the plunge pool: the fastest, shallowest jet).
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import { criticalDepth } from '../../hydraulics/criticalDepth.js';
import type { HydraulicSection } from '../../hydraulics/hydraulicSection.js';
import { flowState } from '../../hydraulics/state.js';
import type { FreeOverfallSpec } from '../../input/model/types.js';
import type { InternalControl } from '../../profile/types.js';
import type { StructureResult } from '../../results/types.js';
import { freeOverfall } from '../drop.js';
import { toStructureResult } from '../types.js';
import { jetDepth, responseOf, tailwaterStageOf } from './context.js';

function shapeOf(hs: HydraulicSection): 'rectangular' | 'other' {
  return hs.section.shape === 'rectangular' && !hs.section.closed ? 'rectangular' : 'other';
}

/** The structure result of a free overfall at the downstream end (after the run: the engine used critical depth there). */
export function endOverfallResult(spec: FreeOverfallSpec, hs: HydraulicSection, brinkElevation: number, discharge: number, units: Units): StructureResult {
  const yc = criticalDepth(hs, discharge);
  const outcome = freeOverfall({ brinkElevation, shape: shapeOf(hs) }, discharge, yc, units, flowState(hs, yc, discharge).velocityHead);
  return toStructureResult(spec.id, spec.station, outcome);
}

export function freeOverfallControl(spec: FreeOverfallSpec, where: string, units: Units): InternalControl {
  requireInput((spec.bedDrop ?? 0) > 0, `${where}.bedDrop`, 'a free overfall inside the channel needs the height of the drop, "bedDrop" > 0', spec.bedDrop);
  return {
    id: spec.id,
    kind: 'free overfall',
    station: spec.station,
    bedDrop: spec.bedDrop!,
    respond(ctx) {
      const hs = ctx.upstreamSection;
      const yc = criticalDepth(hs, ctx.discharge);
      const vh = flowState(hs, yc, ctx.discharge).velocityHead;
      const brink = ctx.upstreamBedElevation;
      const outcome = freeOverfall({ brinkElevation: brink, shape: shapeOf(hs) }, ctx.discharge, yc, units, vh);
      const tail = tailwaterStageOf(ctx);
      if (tail !== null && tail > brink + yc) {
        return {
          ...responseOf(spec.id, spec.station, ctx, { ...outcome, condition: 'submerged', headwaterStage: tail, headwaterEnergy: tail, tailwaterStage: tail }, {
            notes: ['drowned: the tailwater stands above critical depth at the brink; the water surface is taken level across the drop (its loss neglected)'],
          }),
        };
      }
      return responseOf(spec.id, spec.station, ctx, { ...outcome, tailwaterStage: tail }, {
        downstreamDepth: jetDepth(ctx, outcome.headwaterEnergy),
        values: { dropHeight: spec.bedDrop! },
        notes: ['the falling jet is issued on the lower bed with the brink energy (plunge-pool loss neglected); the engine places the jump below'],
      });
    },
  };
}
