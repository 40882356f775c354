/**
 * Regression (samples/survey-drain, invented data): on the steep upper reach, with the roughness multiplied by 0.85,
 * 1.1 or 1.18, the supercritical profile from the entrance ran into critical depth a few metres below it (a
 * standard step near critical depth whose energy residual, with the expansion loss, turned up towards critical depth
 * was read as "no depth balances the step"), so the jump came and went with the roughness and the profile split
 * into alternating S2 and S1 stretches of depths set to critical. Checked here for every flow of the sample:
 * - the flow enters at critical depth and leaves the steep reach through one hydraulic jump (a steep channel into a
 *   mild one under a pool: Chow 1959 §9-3 and §15-1, published; from memory), with no gap needing a control;
 * - a jump whose toe is free (not held at a control) has equal specific force M = Q²/(gA) + Aȳ on its two sides
 *   (Bélanger 1828; Chow 1959 §3-5, from memory), to 0.1 %;
 * - the profile of the steep reach is S2 falling from critical depth, uniform or S2/S3 where the sections change,
 *   then S1 below the jump: no type comes back after another has followed it (Chow 1959 §9-2 zones);
 * - the toe moves by less than one survey interval (15 m at the jump) between neighbouring multipliers: the water
 *   surface follows the roughness without jumps of its own (common practice: a model's answer should not hinge on
 *   a small change of n).
 * And the same survey read as one reach (no split at the change of slope) gives the sample's two-reach result.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { specificForce } from '../../src/hydraulics/specificForce.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { modelFolder } from './folder.js';

const file = join(import.meta.dirname, '..', '..', 'samples', 'survey-drain', 'model.json');
const model = readModelFile(file);
const multipliers = [0.85, 1, 1.1, 1.18];
const runs = multipliers.map((m) => runModel(model, { modelFile: file, roughnessMultiplier: (id) => (id === 'upper' ? m : 1) }));

describe('runModel(samples/survey-drain, roughnessMultiplier on the steep reach)', () => {
  it('runModel: every flow has one jump on the upper reach and no stretch left without a profile, at n × 0.85, 1, 1.1 and 1.18', () => {
    runs.forEach((run, r) => {
      for (const flow of run.result.flows) {
        const label = `m ${multipliers[r]}, ${flow.id}`;
        expect(flow.jumps, label).toHaveLength(1);
        const toe = flow.jumps[0]!.station;
        expect(toe, label).toBeGreaterThan(320);
        expect(toe, label).toBeLessThan(400);
        expect(flow.warnings.filter((w) => /control is needed|The supercritical profile from station/.test(w)), label).toEqual([]);
        expect(flow.stops!.filter((s) => !s.resolved), label).toEqual([]);
      }
    });
  });

  it('runModel: a free jump\'s two depths have equal specific force (Bélanger)', () => {
    let free = 0;
    runs.forEach((run, r) => {
      run.result.flows.forEach((flow, f) => {
        const jump = flow.jumps[0]!;
        if (jump.atControl) return;
        // the section at the toe: the engine's input for this flow, the node nearest the toe (user stations run upstream)
        const input = run.stages.inputs[f]!;
        const reach = input.reaches[0]!;
        if (reach.kind !== 'surveyed') throw new Error('the upper reach is surveyed');
        // between two surveyed sections of different shape the toe is placed by interpolating the force difference, so
        // the balance is checked where both sections around the toe have the same shape (above station 335)
        const engineStation = 400 - jump.station;
        const j = reach.nodes.findIndex((n, k) => k + 1 < reach.nodes.length && n.station <= engineStation && reach.nodes[k + 1]!.station >= engineStation);
        const [a, b] = [reach.nodes[j]!.section.section, reach.nodes[j + 1]!.section.section];
        const same = [jump.upstreamDepth, jump.downstreamDepth].every((y) => a.elements(y).area === b.elements(y).area && a.elements(y).firstMoment === b.elements(y).firstMoment);
        if (!same) return;
        free++;
        const hs = reach.nodes[j]!.section;
        const q = flow.discharge;
        assertRelative(specificForce(hs, jump.downstreamDepth, q), specificForce(hs, jump.upstreamDepth, q), 1e-3, `m ${multipliers[r]}, ${flow.id}`);
      });
    });
    expect(free).toBeGreaterThanOrEqual(3);
  });

  it('runModel: the steep reach\'s profile types do not alternate (no S1 before an S2, each type in one stretch)', () => {
    runs.forEach((run, r) => {
      for (const flow of run.result.flows) {
        const upper = flow.reaches.find((x) => x.id === 'upper')!;
        const types = upper.profiles.map((p) => p.type);
        const label = `m ${multipliers[r]}, ${flow.id}: ${types.join(' ')}`;
        expect(new Set(types).size, label).toBe(types.length);
        expect(types[0], label).toBe('S2');
        expect(types[types.length - 1], label).toBe('S1');
        expect(upper.profiles[upper.profiles.length - 1]!.to, label).toBe(320);
      }
    });
  });

  it('runModel: the toe moves by less than one survey interval between neighbouring multipliers', () => {
    for (let f = 0; f < model.flows.length; f++) {
      for (let r = 1; r < runs.length; r++) {
        const a = runs[r - 1]!.result.flows[f]!.jumps[0]!.station;
        const b = runs[r]!.result.flows[f]!.jumps[0]!.station;
        expect(Math.abs(b - a), `${model.flows[f]!.id}, m ${multipliers[r - 1]} → ${multipliers[r]}`).toBeLessThan(15);
      }
    }
  });
});

describe('runModel(samples/survey-drain as one surveyed reach)', () => {
  it('runModel: the whole survey as one reach finds the control and the jump the two-reach sample has, and the same water surface', () => {
    // the sample splits its survey at station 320, where the bed changes from 0.02 to 0.002; read as one reach, the
    // reach is classed interval by interval (a steep part above 320, a mild one below) and must give the same profile:
    // the same sections, beds and boundaries, only the reach break moved inside the survey
    const dir = join(import.meta.dirname, '..', '..', 'samples', 'survey-drain');
    const read = (name: string) => readFileSync(join(dir, 'survey', name), 'utf8').trim().split('\n');
    const upper = read('stations-upper.csv');
    const lower = read('stations-lower.csv');
    const stations = [...upper.slice(1, -1), ...lower.slice(2)].join('\n');
    const one = JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown>;
    delete one.$schema;
    one.reaches = [{ id: 'drain', survey: { stations: 'survey/stations.csv', crossSections: 'survey/sections.csv', stationing: 'increasing-upstream' } }];
    const folder = modelFolder(one, { 'survey/stations.csv': `${stations}\n`, 'survey/sections.csv': readFileSync(join(dir, 'survey', 'sections.csv'), 'utf8') });
    const single = runModel(readModelFile(folder.model), { modelFile: folder.model }).result;
    const split = runs[1]!.result;
    single.flows.forEach((flow, f) => {
      const reference = split.flows[f]!;
      const reach = flow.reaches[0]!;
      expect(reach.parts!.map((p) => [p.slopeClass, p.from, p.to]), flow.id).toEqual([
        ['steep', 400, 320],
        ['mild', 320, 0],
      ]);
      expect(reach.profiles.map((p) => p.type), flow.id).toEqual(reference.reaches.flatMap((r) => r.profiles.map((p) => p.type)));
      expect(flow.jumps.length, flow.id).toBe(reference.jumps.length);
      assertInDelta(flow.jumps[0]!.station, reference.jumps[0]!.station, 1e-6, `${flow.id} toe`);
      for (const s of reference.stations) {
        const t = flow.stations.find((x) => Math.abs(x.station - s.station) < 1e-6 && Math.abs(x.depth - s.depth) < 0.01);
        expect(t, `${flow.id} station ${s.station}`).toBeDefined();
        assertInDelta(t!.wsel, s.wsel, 1e-9, `${flow.id} station ${s.station}`);
      }
    });
  });
});
