/**
 * Weirs as internal controls of the profile: the headwater for the tailwater the engine computed below
 * (free, or submerged by Villemonte's correction), with the approach section's velocity head, by the published
 * laws in ../weirs/ (Kindsvater–Carter or Rehbock, Kindsvater–Shen, broad-crested, road overflow). Unless the
 * tailwater stands above the crest, the weir also issues the jet depth below it, so a steep or low channel
 * below gets its supercritical start and a jump where the tailwater holds one.
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { BroadCrestedWeirSpec, RoadOverflowSpec, SharpCrestedWeirSpec, VNotchWeirSpec } from '../../input/model/types.js';
import type { ControlContext, InternalControl } from '../../profile/types.js';
import type { ApproachArea, StructureOutcome } from '../types.js';
import { broadCrested } from '../weirs/broadCrested.js';
import { roadOverflow } from '../weirs/roadOverflow.js';
import { sharpCrestedRectangular, triangularNotch } from '../weirs/sharpCrested.js';
import { approachAreaOf, jetDepth, responseOf, tailwaterStageOf } from './context.js';

/** What every weir law of ../weirs/ is handed besides its own parameters: the approach section and the place. */
interface ApproachOf {
  readonly approachArea: ApproachArea;
  readonly where: string;
}

/** A weir law of ../weirs/: its parameters, the discharge and the tailwater stage → the outcome. */
type WeirLawCall<P> = (params: P & ApproachOf, discharge: number, tailwaterStage: number | null, units: Units) => StructureOutcome;

/**
 * The internal control of one weir: at each call, the law's own parameters for this context (`paramsOf`, which
 * may refuse the spec there) with the approach section and the place added, the discharge and the tailwater stage.
 */
function weirControl<P>(
  spec: { id: string; station: number; bedDrop?: number },
  kind: string,
  where: string,
  units: Units,
  law: WeirLawCall<P>,
  paramsOf: (ctx: ControlContext) => P,
): InternalControl {
  return {
    id: spec.id,
    kind,
    station: spec.station,
    ...(spec.bedDrop === undefined ? {} : { bedDrop: spec.bedDrop }),
    respond(ctx) {
      const outcome = law({ ...paramsOf(ctx), approachArea: approachAreaOf(ctx), where }, ctx.discharge, tailwaterStageOf(ctx), units);
      const submerged = outcome.condition === 'submerged';
      return responseOf(spec.id, spec.station, ctx, outcome, {
        downstreamDepth: submerged ? null : jetDepth(ctx, outcome.headwaterEnergy),
        ...(submerged ? {} : { notes: ['free overflow: the jet below starts a supercritical profile unless the tailwater drowns it (energy losses over the weir neglected)'] }),
      });
    },
  };
}

export function sharpCrestedWeirControl(spec: SharpCrestedWeirSpec, where: string, units: Units): InternalControl {
  return weirControl(spec, 'sharp-crested weir', where, units, sharpCrestedRectangular, (ctx) => {
    const height = spec.crestElevation - ctx.upstreamBedElevation;
    requireInput(height > 0, `${where}.crestElevation`, `the crest must lie above the channel bed upstream (${ctx.upstreamBedElevation})`, spec.crestElevation);
    return {
      method: spec.coefficientMethod ?? 'kindsvater-carter',
      crestLength: spec.crestLength,
      ...(spec.approachWidth === undefined ? {} : { approachWidth: spec.approachWidth }),
      crestHeight: height,
      crestElevation: spec.crestElevation,
    };
  });
}

export function vNotchWeirControl(spec: VNotchWeirSpec, where: string, units: Units): InternalControl {
  return weirControl(spec, 'v-notch weir', where, units, triangularNotch, (ctx) => {
    requireInput(spec.vertexElevation > ctx.upstreamBedElevation, `${where}.vertexElevation`, `the notch must lie above the channel bed upstream (${ctx.upstreamBedElevation})`, spec.vertexElevation);
    return {
      angleDegrees: spec.notchAngle,
      crestElevation: spec.vertexElevation,
      ...(spec.coefficient === undefined ? {} : { coefficient: spec.coefficient }),
      ...(spec.headCorrection === undefined ? {} : { headCorrection: spec.headCorrection }),
    };
  });
}

export function broadCrestedWeirControl(spec: BroadCrestedWeirSpec, where: string, units: Units): InternalControl {
  return weirControl(spec, 'broad-crested weir', where, units, broadCrested, () => ({
    crestWidth: spec.crestWidth,
    crestElevation: spec.crestElevation,
    ...(spec.coefficient === undefined ? {} : { coefficient: spec.coefficient }),
  }));
}

export function roadOverflowControl(spec: RoadOverflowSpec, where: string, units: Units): InternalControl {
  return weirControl(spec, 'road overflow', where, units, roadOverflow, () => ({
    length: spec.overtoppedLength,
    crestElevation: spec.crestElevation,
    ...(spec.roadWidth === undefined ? {} : { crestWidth: spec.roadWidth }),
    ...(spec.coefficient === undefined ? {} : { coefficient: spec.coefficient }),
  }));
}
