/**
 * Roughness multipliers on surveyed reaches (RunOptions.roughnessMultiplier → survey/sites.ts): the multiplier
 * scales every surveyed section's roughness zones before the sections are built, and so every section
 * interpolated between them. Checked on an invented surveyed channel that is in fact prismatic (one trapezoid
 * at every station, trapezoidSurvey.ts): in uniform flow against Manning's normal depth for n·m (a closed form,
 * Manning 1891, solved independently in the test), and in a backwater against the prismatic engine under the
 * same multipliers.
 */
import { describe, expect, it } from 'vitest';
import { wselAt } from '../../src/analysis/sample.js';
import type { SurveyedReachInput } from '../../src/profile/types.js';
import { runModel } from '../../src/run.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { surveyedTrapezoid, trapezoid, trapezoidNormalDepth } from './trapezoidSurvey.js';

/** The accuracy goal of a profile in SI units, 1 mm (src/core/tolerances.ts: accuracyFor). */
const goal = 1e-3;

describe('runModel(surveyed reach, roughnessMultiplier)', () => {
  it('runModel(surveyed trapezoid in uniform flow, n×m) gives Manning\'s normal depth for n·m at every station', () => {
    // normal depth at both ends of a 1 km reach surveyed every 100 m: uniform flow, y = yn(Q, n·m, S) everywhere
    const channel = surveyedTrapezoid(['drain'], 1000, 100, [{ id: 'q', discharge: 4 }], { upstream: { type: 'normal' }, downstream: { type: 'normal' } });
    for (const m of [0.8, 1.3]) {
      const expected = trapezoidNormalDepth(4, trapezoid.n * m);
      const flow = runModel(channel.model, { modelFile: channel.file, roughnessMultiplier: () => m }).result.flows[0]!;
      expect(flow.stations.length).toBeGreaterThan(10);
      for (const s of flow.stations) assertInDelta(s.depth, expected, 1e-6, `m ${m}, station ${s.station}`);
      // and the prismatic engine under the same multiplier gives the same depth
      const prismatic = runModel(channel.prismatic, { roughnessMultiplier: () => m }).result.flows[0]!;
      for (const s of prismatic.stations) assertInDelta(s.depth, expected, 1e-6, `prismatic, m ${m}, station ${s.station}`);
    }
    // the multiplier moves the depth well beyond the tolerance: yn ∝ n^(3/5) for a wide channel (Manning)
    expect(trapezoidNormalDepth(4, trapezoid.n * 1.3) - trapezoidNormalDepth(4, trapezoid.n * 0.8)).toBeGreaterThan(0.2);
  });

  it('runModel(surveyed backwater, a multiplier per reach) matches the prismatic engine, interpolated sections included', () => {
    // two surveyed reaches of 1 km (stations every 250 m, so interpolation inserts sections) behind a fixed stage:
    // an M1 backwater. Eddy losses are set to 0, which the prismatic engine does not have; both runs must agree
    // within the accuracy goal, and the interpolated sections must carry their reach's multiplier
    const channel = surveyedTrapezoid(['upper', 'lower'], 1000, 250, [{ id: 'q', discharge: 4 }], { downstream: { type: 'stage', elevation: 9.6 } });
    const truth: Record<string, number> = { upper: 0.8, lower: 1.25 };
    const of = (id: string) => truth[id]!;
    const run = runModel(channel.model, { modelFile: channel.file, roughnessMultiplier: of });
    const surveyed = run.result.flows[0]!;
    const prismatic = runModel(channel.prismatic, { roughnessMultiplier: of }).result.flows[0]!;
    const plain = runModel(channel.model, { modelFile: channel.file }).result.flows[0]!;
    for (const s of surveyed.stations) assertInDelta(s.wsel, wselAt(prismatic, s.station)!, goal, `station ${s.station}`);
    // the multipliers matter here: at the reach junction the water stands centimetres above the unscaled run
    expect(wselAt(surveyed, 1000)! - wselAt(plain, 1000)!).toBeGreaterThan(0.05);

    const reaches = run.stages.inputs[0]!.reaches as SurveyedReachInput[];
    for (const reach of reaches) {
      const interpolated = reach.nodes.filter((node) => node.interpolated === true);
      expect(interpolated.length, reach.id).toBeGreaterThan(0);
      for (const node of reach.nodes) {
        for (const sub of node.section.section.subsections(0.8)) assertRelative(sub.roughness, trapezoid.n * of(reach.id), 1e-12, `${reach.id} at ${node.station}`);
      }
    }
  });
});
