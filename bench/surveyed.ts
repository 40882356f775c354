/**
 * The surveyed-reach benchmark: 2,000 surveyed sections of 60 points with three roughness zones each (invented,
 * bench/channels.ts), 50 flows, standard step node to node with the mixed-flow checks (a supercritical profile from
 * the upstream end and the specific-force comparison for jumps), contraction and expansion losses 0.1 and 0.3. The
 * survey is dense (5 m spacing), so no intermediate sections are interpolated. Each flow's results are read at every
 * station, critical depth included, as a report does.
 */
import { HydraulicError } from '../src/core/errors.js';
import { SI } from '../src/core/units.js';
import { criticalDepth } from '../src/hydraulics/criticalDepth.js';
import { normalDepth } from '../src/hydraulics/normalDepth.js';
import { computeProfile } from '../src/profile/engine.js';
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
 * Every flow through computeProfile, reading every station's results as a report does (critical depth included).
 * Returns a checksum so that nothing is optimised away.
 */
export function runSurveyedEngine(survey: Survey): number {
  let checksum = 0;
  for (let k = 0; k < survey.flows.length; k++) {
    for (const s of computeProfile(surveyedInput(survey, k)).stations) checksum += s.depth + (s.criticalDepth ?? NaN) + s.froude;
  }
  if (!Number.isFinite(checksum)) throw new HydraulicError('surveyed benchmark: a result is not finite');
  return checksum;
}
