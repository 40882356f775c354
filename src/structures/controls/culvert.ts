/**
 * A culvert as an internal control (FHWA HDS-5, 2012, in ../culvert/): the headwater is the larger of inlet
 * control and outlet control. Outlet control is computed by running this project's own profile engine
 * through the barrel (`engineBarrelProfile`, injected as the culvert's barrelProfile): a prismatic circular or
 * box reach of the barrel's length, slope and roughness, part full, from the outlet depth max(TW, dc) upstream
 * with the crown as the limit. Where the free-surface profile reaches the crown, the barrel runs full from
 * there to the inlet and full-flow friction (Manning, Sf = (Q/K_full)²) carries the pressure head on to the
 * inlet. The culvert's stations are a point of the channel (its barrel length is not channel length); the bed
 * falls by length × slope across it unless `bedDrop` says otherwise.
 */
import type { Units } from '../../core/units.js';
import { conveyance } from '../../hydraulics/hydraulicSection.js';
import type { CulvertSpec } from '../../input/model/types.js';
import { computeProfile } from '../../profile/engine.js';
import type { InternalControl } from '../../profile/types.js';
import { barrelSection } from '../culvert/barrel.js';
import { type CulvertOutcome, culvert } from '../culvert/culvert.js';
import type { InletType } from '../culvert/inletControl.js';
import type { BarrelProfile, BarrelProfileResult } from '../culvert/outletControl.js';
import { jetDepth, responseOf, tailwaterStageOf } from './context.js';

/** Output intervals along the barrel profile. */
const barrelIntervals = 40;

/** The part-full barrel profile by the profile engine (standard step), with the crown as the limit. */
export const engineBarrelProfile: BarrelProfile = (inputs) => {
  const b = inputs.barrel;
  const D = b.rise;
  const hs = barrelSection(b, inputs.roughness, inputs.units);
  const start = Math.min(inputs.outletControlDepth, D);
  const run = computeProfile({
    units: inputs.units,
    reaches: [{ id: 'barrel', section: hs, length: inputs.length, slope: inputs.slope }],
    discharge: inputs.discharge,
    flowId: 'barrel',
    boundaries: { downstream: { type: 'depth', depth: start } },
    method: 'standard-step',
    outputSpacing: inputs.length / barrelIntervals,
  });
  const full = (run.stops ?? []).find((s) => s.reason === 'full' && s.direction === 'upstream');
  const L = inputs.length;
  const stations = run.stations.map((s) => ({
    distanceFromOutlet: L - s.station,
    depth: full && s.station <= full.station ? D : s.depth,
  }));
  const outletDepth = run.stations[run.stations.length - 1]!.depth;
  if (!full) return { inletDepth: run.stations[0]!.depth, outletDepth, stations, fullLength: 0 };
  // full from the inlet to where the profile reached the crown: the pressure head rises upstream by (Sf − S)
  const fullLength = full.station;
  const sf = (inputs.discharge / conveyance(hs, D, inputs.discharge)) ** 2;
  const result: BarrelProfileResult = {
    inletDepth: D,
    outletDepth,
    stations,
    fullLength,
    inletPressureHead: Math.max(D, D + (sf - inputs.slope) * fullLength),
  };
  return result;
};

export function culvertControl(spec: CulvertSpec, where: string, units: Units): InternalControl {
  const bedDrop = spec.bedDrop ?? Math.max(spec.length * spec.slope, 0);
  return {
    id: spec.id,
    kind: 'culvert',
    station: spec.station,
    bedDrop,
    respond(ctx) {
      const outcome: CulvertOutcome = culvert(
        {
          barrel: spec.barrel.shape === 'circular' ? { shape: 'circular', diameter: spec.barrel.diameter } : { shape: 'box', span: spec.barrel.span, rise: spec.barrel.rise },
          length: spec.length,
          slope: spec.slope,
          roughness: spec.n,
          inlet: spec.inlet as InletType,
          ...(spec.entranceLoss === undefined ? {} : { entranceLoss: spec.entranceLoss }),
          inletInvert: ctx.upstreamBedElevation,
          ...(spec.barrels === undefined ? {} : { barrels: spec.barrels }),
          where,
        },
        ctx.discharge,
        tailwaterStageOf(ctx),
        units,
        { barrelProfile: engineBarrelProfile },
      );
      const notes = ['headwater taken as the water surface just upstream (approach velocity neglected, as HDS-5 does)'];
      if (Math.abs(ctx.upstreamBedElevation - bedDrop - ctx.downstreamBedElevation) > 1e-9 * Math.max(1, Math.abs(ctx.downstreamBedElevation))) {
        notes.push('the channel bed below differs from the outlet invert (inlet invert − length × slope)');
      }
      // supercritical outflow: carry the outlet's specific energy into the channel below
      const out = outcome.downstreamSupercriticalDepth;
      const downstreamDepth =
        out === null ? null : jetDepth(ctx, ctx.downstreamBedElevation + outcome.outletDepth + outcome.outletVelocity ** 2 / (2 * units.g));
      const response = responseOf(spec.id, spec.station, ctx, outcome, { downstreamDepth, notes });
      const profile = outcome.barrelStations;
      return {
        ...response,
        result: {
          ...response.result!,
          ...(profile ? { barrelProfile: profile.map((p) => ({ distanceFromOutlet: p.distanceFromOutlet, depth: p.depth })) } : {}),
        },
      };
    },
  };
}
