/**
 * The surveyed-reach benchmark: 2,000 surveyed sections of 60 points with three roughness zones each, 50 flows,
 * standard step with mixed-flow checks.
 *
 * Real path: computeProfile with one surveyed reach (issue 4's non-prismatic standard step), used as soon as
 * the engine accepts surveyed reaches.
 *
 * Stand-in (while the engine refuses surveyed reaches): the same work built from the engine's exported pieces,
 * so the figure measures the costs the real path will have. Per flow:
 *   1. critical depth at every station (hydraulics criticalDepth, the least-energy one);
 *   2. a subcritical sweep upstream from the downstream depth, one energy balance per pair of stations with the
 *      profile's own energyStep (Brent on the energy residual, average-conveyance friction, α from the subsections
 *      and dα/dy; bed fall from the surveyed bed elevations); a station where no subcritical solution exists is
 *      set to critical depth, as careful practice does;
 *   3. a supercritical sweep downstream from critical depth at the upstream end, the same way on the other branch;
 *   4. at every station the specific force of the two profiles compared (the jump check), the larger winning.
 * Not in the stand-in: contraction and expansion losses (a few multiplications per step) and interpolated
 * intermediate sections (the survey here is dense: 5 m spacing).
 */
import { HydraulicError } from '../src/core/errors.js';
import { accuracyFor } from '../src/core/tolerances.js';
import { SI } from '../src/core/units.js';
import { criticalDepth } from '../src/hydraulics/criticalDepth.js';
import type { HydraulicSection } from '../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../src/hydraulics/normalDepth.js';
import { computeProfile } from '../src/profile/engine.js';
import { pointState } from '../src/profile/energy.js';
import { energyStep } from '../src/profile/standardStep.js';
import type { StretchSpec } from '../src/profile/stretch.js';
import type { ProfileInput, SurveyNode } from '../src/profile/types.js';
import { surveySection } from './channels.js';

export const surveyCount = 2000;
export const flowCount = 50;
const spacing = 5;
const slope = 0.0008;

export interface Survey {
  readonly nodes: SurveyNode[];
  readonly flows: number[];
  /** downstream depth per flow: 1.2 × normal depth of the last section */
  readonly tailwater: number[];
}

export function buildSurvey(): Survey {
  const nodes: SurveyNode[] = [];
  for (let i = 0; i < surveyCount; i++) {
    const station = i * spacing;
    const section = surveySection(i / surveyCount);
    // bed elevation of the survey's lowest point: the invert of this section plus a falling datum
    const fall = slope * (surveyCount - 1 - i) * spacing;
    nodes.push({ station, bedElevation: fall, section, contraction: 0.1, expansion: 0.3 });
  }
  const flows = Array.from({ length: flowCount }, (_, k) => 20 + (280 * k) / (flowCount - 1));
  const last = nodes[nodes.length - 1]!.section;
  const tailwater = flows.map((q) => 1.2 * (normalDepth(last, q, slope) ?? criticalDepth(last, q)));
  return { nodes, flows, tailwater };
}

function surveyedInput(survey: Survey, k: number): ProfileInput {
  return {
    units: SI,
    reaches: [{ kind: 'surveyed', id: 'survey', nodes: survey.nodes }],
    discharge: survey.flows[k]!,
    flowId: `flow ${k + 1}`,
    boundaries: { downstream: { type: 'depth', depth: survey.tailwater[k]! }, upstream: { type: 'critical' } },
    method: 'standard-step',
  };
}

/**
 * Whether computeProfile computes a surveyed reach (the real path exists): a three-node probe must give a
 * finite depth at every node. Otherwise the reason, printed with the stand-in's figure.
 */
export function surveyedEngineAvailable(survey: Survey): { available: boolean; reason: string } {
  const small: Survey = { nodes: survey.nodes.slice(0, 3), flows: survey.flows.slice(0, 1), tailwater: survey.tailwater.slice(0, 1) };
  try {
    const result = computeProfile(surveyedInput(small, 0));
    const ok = result.stations.length >= 3 && result.stations.every((s) => Number.isFinite(s.depth) && s.depth > 0);
    return ok ? { available: true, reason: '' } : { available: false, reason: 'the engine returned no usable surveyed profile' };
  } catch (error) {
    return { available: false, reason: error instanceof Error ? error.message.split('\n')[0]! : String(error) };
  }
}

/** The real path: every flow through computeProfile. Returns the number of stations computed. */
export function runSurveyedEngine(survey: Survey): number {
  let count = 0;
  for (let k = 0; k < survey.flows.length; k++) count += computeProfile(surveyedInput(survey, k)).stations.length;
  return count;
}

function spec(node: SurveyNode, next: SurveyNode, q: number, yc: number, regime: StretchSpec['regime'], tolerance: number): StretchSpec {
  return {
    hs: node.section,
    // S0 with z(x1) − z(x2) = S0·(x2 − x1), from the surveyed beds (x1 = next, the known station)
    slope: (next.bedElevation - node.bedElevation) / (node.station - next.station),
    discharge: q,
    stations: [next.station, node.station],
    startDepth: yc,
    regime,
    criticalDepth: yc,
    normalDepth: null,
    averaging: 'conveyance',
    tolerance,
  };
}

/** The stand-in: see the module comment. Returns a checksum (sum of depths) so nothing is optimised away. */
export function runSurveyedStandIn(survey: Survey): number {
  const nodes = survey.nodes;
  const n = nodes.length;
  const yc = new Float64Array(n);
  const sub = new Float64Array(n);
  const sup = new Float64Array(n);
  let checksum = 0;
  for (let k = 0; k < survey.flows.length; k++) {
    const q = survey.flows[k]!;
    for (let i = 0; i < n; i++) yc[i] = criticalDepth(nodes[i]!.section, q);
    // subcritical sweep, downstream to upstream
    sub[n - 1] = Math.max(survey.tailwater[k]!, yc[n - 1]!);
    let state = pointState(nodes[n - 1]!.section, sub[n - 1]!, q);
    for (let i = n - 2; i >= 0; i--) {
      const tolerance = accuracyFor('SI', yc[i]!);
      const s = spec(nodes[i]!, nodes[i + 1]!, q, yc[i]!, 'subcritical', tolerance);
      const outcome = energyStep(s, nodes[i + 1]!.station, state, nodes[i]!.station, Math.max(sub[i + 1]!, yc[i]! * 1.001));
      sub[i] = outcome.state ? outcome.state.depth : yc[i]!;
      state = outcome.state ?? pointState(nodes[i]!.section, yc[i]!, q);
    }
    // supercritical sweep, upstream to downstream, from critical depth at the upstream end
    sup[0] = yc[0]!;
    state = pointState(nodes[0]!.section, sup[0]!, q);
    for (let i = 1; i < n; i++) {
      const tolerance = accuracyFor('SI', yc[i]!);
      const s = spec(nodes[i]!, nodes[i - 1]!, q, yc[i]!, 'supercritical', tolerance);
      const outcome = energyStep(s, nodes[i - 1]!.station, state, nodes[i]!.station, Math.min(sup[i - 1]!, yc[i]! * 0.999));
      sup[i] = outcome.state ? outcome.state.depth : yc[i]!;
      state = outcome.state ?? pointState(nodes[i]!.section, yc[i]!, q);
    }
    // the jump check: the profile with the larger specific force holds at each station
    for (let i = 0; i < n; i++) {
      const hs: HydraulicSection = nodes[i]!.section;
      const depth = pointState(hs, sub[i]!, q).force >= pointState(hs, sup[i]!, q).force ? sub[i]! : sup[i]!;
      checksum += depth;
    }
  }
  if (!Number.isFinite(checksum)) throw new HydraulicError('surveyed stand-in: a depth is not finite');
  return checksum;
}
