/** Channels for the structure-control tests: invented rectangular and trapezoidal channels, SI unless said. */
import { SI, type Units } from '../../../src/core/units.js';
import { rectangular } from '../../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../../src/geometry/shapes/trapezoidal.js';
import { type HydraulicSection, hydraulicSection } from '../../../src/hydraulics/hydraulicSection.js';
import type { StructureSpec } from '../../../src/input/model/types.js';
import type { Boundary, InternalControl, PrismaticReachInput } from '../../../src/profile/types.js';
import { structureControl } from '../../../src/structures/controls/index.js';
import { computeStructuredFlow, type StructuredFlowInput } from '../../../src/structures/controls/flow.js';
import type { FlowResult, StructureResult } from '../../../src/results/types.js';

export function rect(width: number, n = 0.015, units: Units = SI): HydraulicSection {
  return hydraulicSection(rectangular({ bottomWidth: width, roughness: n }), 'manning', units);
}

export function trap(width: number, side: number, n: number, units: Units = SI): HydraulicSection {
  return hydraulicSection(trapezoidal({ bottomWidth: width, sideSlopeLeft: side, sideSlopeRight: side, roughness: n }), 'manning', units);
}

/** Two reaches of one section, a structure at their junction. */
export function channelWith(
  spec: StructureSpec | null,
  options: {
    section: HydraulicSection;
    below?: HydraulicSection;
    upstreamLength?: number;
    downstreamLength?: number;
    slope?: number;
    slopeBelow?: number;
    discharge: number;
    downstream?: Boundary;
    upstream?: Boundary;
    bed?: number;
    spacing?: number;
    units?: Units;
    extra?: Partial<StructuredFlowInput>;
  },
): StructuredFlowInput {
  const units = options.units ?? SI;
  const up = options.upstreamLength ?? 200;
  const reaches: PrismaticReachInput[] = [
    { id: 'above', section: options.section, length: up, slope: options.slope ?? 0.001 },
    { id: 'below', section: options.below ?? options.section, length: options.downstreamLength ?? 200, slope: options.slopeBelow ?? options.slope ?? 0.001 },
  ];
  const controls: InternalControl[] = spec ? [structureControl(spec, 'structures[0]', units)] : [];
  return {
    units,
    reaches,
    discharge: options.discharge,
    flowId: 'test',
    boundaries: { ...(options.downstream ? { downstream: options.downstream } : {}), ...(options.upstream ? { upstream: options.upstream } : {}) },
    method: 'standard-step',
    outputSpacing: options.spacing ?? 5,
    downstreamBedElevation: options.bed ?? 100,
    controls,
    ...(options.extra ?? {}),
  };
}

export function run(input: StructuredFlowInput): FlowResult {
  return computeStructuredFlow(input, input.units);
}

export function structureOf(flow: FlowResult, id = 's'): StructureResult {
  const found = (flow.structures ?? []).find((s) => s.id === id);
  if (!found) throw new Error(`no structure ${id} in the result`);
  return found;
}

export function value(result: StructureResult, key: string): number {
  const v = result.values[key];
  if (typeof v !== 'number') throw new Error(`value ${key} is ${String(v)}`);
  return v;
}

/** Every number in a result is finite (no NaN or Infinity escapes). */
export function allFinite(flow: FlowResult): boolean {
  const walk = (v: unknown): boolean =>
    typeof v === 'number' ? Number.isFinite(v) : Array.isArray(v) ? v.every(walk) : v !== null && typeof v === 'object' ? Object.values(v).every(walk) : true;
  return walk(flow.stations) && walk(flow.jumps);
}
