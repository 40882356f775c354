/**
 * A sluice gate as an internal control (Henderson 1966 §6.3, in ../gate.ts): the upstream depth for the
 * discharge and tailwater; when the tailwater does not drown the vena contracta (it stands below the
 * sequent depth of Cc·a), the vena contracta depth Cc·a is issued as the upstream control of the supercritical
 * profile below the gate, and the engine places the jump by specific force; drowned, the upstream depth comes
 * from momentum below the gate and energy above it.
 */
import { HydraulicError, InputError } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import { criticalDepth } from '../../hydraulics/criticalDepth.js';
import type { SluiceGateSpec } from '../../input/model/types.js';
import type { ControlContext, InternalControl } from '../../profile/types.js';
import { structureCaution } from '../cautions.js';
import { sluiceGate } from '../gate.js';
import { responseOf, tailwaterStageOf } from './context.js';

/** The gate width: given, or the bottom width of a rectangular channel at the gate. */
function gateWidth(spec: SluiceGateSpec, where: string, ctx: ControlContext): number {
  if (spec.width !== undefined) return spec.width;
  const section = ctx.upstreamSection.section;
  const width = section.describe()['bottomWidth'];
  if (section.shape === 'rectangular' && !section.closed && typeof width === 'number') return width;
  throw new InputError({ where: `${where}.width`, message: `a sluice gate in a ${section.shape} channel needs its "width" (the default comes only from a rectangular channel)` });
}

export function sluiceGateControl(spec: SluiceGateSpec, where: string, units: Units): InternalControl {
  return {
    id: spec.id,
    kind: 'sluice gate',
    station: spec.station,
    ...(spec.bedDrop === undefined ? {} : { bedDrop: spec.bedDrop }),
    respond(ctx) {
      const width = gateWidth(spec, where, ctx);
      try {
        const outcome = sluiceGate(
          {
            opening: spec.opening,
            width,
            floorElevation: ctx.upstreamBedElevation,
            ...(spec.contractionCoefficient === undefined ? {} : { contractionCoefficient: spec.contractionCoefficient }),
            where,
          },
          ctx.discharge,
          // the tailwater over the gate floor: the bed just below may lie lower (a drop), the floor is the gate's
          tailwaterStageOf(ctx),
          units,
        );
        const y2 = outcome.downstreamSupercriticalDepth;
        const notes = spec.bedDrop ? ['the vena contracta is placed on the lower bed below the gate (the drop itself is not modelled)'] : [];
        return responseOf(spec.id, spec.station, ctx, outcome, { downstreamDepth: y2, values: { gateWidth: width }, notes });
      } catch (error) {
        if (!(error instanceof HydraulicError) || !/does not touch the flow/.test(error.message)) throw error;
        // the water upstream does not reach the gate lip: the gate is out of the flow at this discharge
        const yc = criticalDepth(ctx.upstreamSection, ctx.discharge);
        const depth = Math.max(ctx.tailwaterDepth ?? 0, yc);
        return {
          upstreamDepth: depth,
          result: {
            id: spec.id,
            type: 'sluice-gate',
            station: spec.station,
            values: {
              condition: 'clear of the flow',
              discharge: ctx.discharge,
              opening: spec.opening,
              gateWidth: width,
              upstreamDepth: depth,
              headwaterDepth: depth,
              headwaterStage: ctx.upstreamBedElevation + depth,
              downstreamSupercriticalDepth: null,
            },
            notes: [`at this discharge the water does not reach the gate lip (opening ${spec.opening}): the gate does not act; the channel flows open through it`, structureCaution],
          },
        };
      }
    },
  };
}
