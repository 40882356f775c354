/**
 * An overflow spillway as an internal control (../spillway.ts): the headwater from the crest law (the
 * approach section's velocity head included), the toe depth on the apron from the energy equation with the
 * chute loss, issued as the supercritical start of the profile along the apron; the stilling-basin check
 * (tailwater minus sequent depth, jump type and length) against the tailwater the engine computed there.
 * Where the jump actually forms comes from the engine's specific-force balance; ./apron.ts adds it to the
 * result after the run.
 */
import type { Units } from '../../core/units.js';
import type { SpillwaySpec } from '../../input/model/types.js';
import type { InternalControl } from '../../profile/types.js';
import { spillway } from '../spillway.js';
import { approachAreaOf, responseOf, supercriticalDepthForEnergy, tailwaterStageOf } from './context.js';

export function spillwayControl(spec: SpillwaySpec, where: string, units: Units): InternalControl {
  return {
    id: spec.id,
    kind: 'spillway',
    station: spec.station,
    ...(spec.bedDrop === undefined ? {} : { bedDrop: spec.bedDrop }),
    respond(ctx) {
      const width = spec.apronWidth ?? spec.crestLength;
      const outcome = spillway(
        {
          crestElevation: spec.crestElevation,
          crestLength: spec.crestLength,
          approachBedElevation: ctx.upstreamBedElevation,
          ...(spec.coefficient === undefined ? {} : { coefficient: spec.coefficient }),
          apronElevation: ctx.downstreamBedElevation,
          apronWidth: width,
          ...(spec.apronLength === undefined ? {} : { apronLength: spec.apronLength }),
          ...(spec.chuteLoss === undefined ? {} : { toeLossCoefficient: spec.chuteLoss }),
          approachArea: approachAreaOf(ctx),
          where,
        },
        ctx.discharge,
        tailwaterStageOf(ctx),
        units,
      );
      const below = ctx.downstreamSection.section;
      const sameApron = below.shape === 'rectangular' && !below.closed && Math.abs(Number(below.describe()['bottomWidth']) - width) <= 1e-9 * width;
      const y1 = outcome.apron.toeDepth;
      const notes: string[] = ['the chute is taken as steep: the toe depth comes from the energy equation crest → apron with the chute loss'];
      let start = y1;
      if (!sameApron) {
        // the channel below is not the rectangular apron: carry the toe's specific energy into its section
        const q = ctx.discharge / width;
        start = supercriticalDepthForEnergy(ctx.downstreamSection, ctx.discharge, y1 + (q * q) / (2 * units.g * y1 * y1));
        notes.push(`the channel below is not a rectangular apron ${width} wide: its supercritical start (${start.toPrecision(4)}) has the toe's specific energy; the apron check is for the rectangular apron`);
      }
      return responseOf(spec.id, spec.station, ctx, outcome, { downstreamDepth: start, values: { apronWidth: width }, notes });
    },
  };
}
