/**
 * Free overfall (a drop at the end of a channel). Upstream the profile starts from critical depth, placed at
 * the brink as usual practice does (it actually occurs some 3–4·yc upstream); the depth at the brink itself
 * is lower: yb ≈ 0.715·yc in a rectangular channel on a horizontal or mild bed (H. Rouse, "Discharge
 * characteristics of the free overfall", Civil Engineering 6(4), 1936; the ratio from memory).
 * For other shapes gvf uses the same ratio as an approximation and says so; published ratios for other
 * shapes differ by some percent (e.g. larger for triangular channels).
 */
import { requireInput } from '../core/errors.js';
import type { Units } from '../core/units.js';
import { structureCaution } from './cautions.js';
import type { StructureOutcome } from './types.js';

/** yb/yc for a rectangular channel (Rouse 1936; from memory). */
export const rectangularBrinkRatio = 0.715;

/** Critical depth in a rectangular channel, (q²/g)^(1/3). */
export function rectangularCriticalDepth(unitDischarge: number, units: Units): number {
  return Math.cbrt((unitDischarge * unitDischarge) / units.g);
}

export interface FreeOverfallSpec {
  readonly brinkElevation: number;
  /** the channel shape at the brink: only 'rectangular' has the published ratio */
  readonly shape: 'rectangular' | 'other';
  readonly where?: string;
}

/**
 * The free overfall as an end control. `criticalDepth` comes from the hydraulics layer for the section at the
 * brink (the engine has it); `criticalVelocityHead` (αVc²/2g) likewise, defaulting to yc/2 (exact for a rectangle).
 */
export function freeOverfall(
  spec: FreeOverfallSpec,
  discharge: number,
  criticalDepth: number,
  units: Units,
  criticalVelocityHead?: number,
): StructureOutcome {
  const where = spec.where ?? 'structure';
  requireInput(Number.isFinite(spec.brinkElevation), `${where}.brinkElevation`, 'the brink elevation must be a number', spec.brinkElevation);
  requireInput(criticalDepth > 0 && Number.isFinite(criticalDepth), `${where}.criticalDepth`, 'the critical depth must be a positive number', criticalDepth);
  const ratio = rectangularBrinkRatio;
  const velocityHead = criticalVelocityHead ?? criticalDepth / 2;
  const notes = [
    'the upstream profile starts from critical depth at the brink (usual practice)',
    spec.shape === 'rectangular'
      ? 'brink depth 0.715·yc (Rouse 1936; ratio from memory)'
      : 'brink depth 0.715·yc: the rectangular ratio used as an approximation for this shape',
  ];
  if (criticalVelocityHead === undefined && spec.shape !== 'rectangular') notes.push('velocity head at critical depth taken as yc/2 (exact only for a rectangle)');
  return {
    kind: 'free-overfall',
    method: 'free overfall: critical depth upstream of the brink, brink depth by Rouse (1936)',
    units: units.system,
    discharge,
    condition: 'critical-at-brink',
    headwaterStage: spec.brinkElevation + criticalDepth,
    headwaterEnergy: spec.brinkElevation + criticalDepth + velocityHead,
    tailwaterStage: null,
    downstreamSupercriticalDepth: null,
    values: {
      criticalDepth,
      brinkDepthRatio: ratio,
      brinkDepth: ratio * criticalDepth,
      brinkRatioIsApproximation: spec.shape !== 'rectangular',
    },
    notes,
    caution: structureCaution,
  };
}
