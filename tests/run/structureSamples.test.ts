import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readModelFile } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';

const samples = join(import.meta.dirname, '..', '..', 'samples');
const load = (name: string) => {
  const file = join(samples, `${name}.json`);
  return runModel(readModelFile(file), { modelFile: file }).result;
};
const finite = (v: unknown): boolean =>
  typeof v === 'number' ? Number.isFinite(v) : Array.isArray(v) ? v.every(finite) : v !== null && typeof v === 'object' ? Object.values(v).every(finite) : true;

describe('structure samples (invented scenarios)', () => {
  it('runModel(samples/culvert-backwater.json): the culvert backs water up the drain above normal depth (M1), with the caution', () => {
    const run = load('culvert-backwater');
    expect(run.cautions.some((c) => /licensed engineer/.test(c))).toBe(true);
    for (const flow of run.flows) {
      expect(finite(flow.stations)).toBe(true);
      const culvert = flow.structures!.find((s) => s.type === 'culvert')!;
      expect(culvert.barrelProfile!.length).toBeGreaterThan(2);
      const upper = flow.reaches.filter((r) => r.id === 'upper drain');
      const justAbove = flow.stations.filter((s) => s.station < 450).pop()!;
      expect(justAbove.depth).toBeGreaterThan(upper[upper.length - 1]!.normalDepth!);
      expect(upper[upper.length - 1]!.profiles.map((p) => p.type)).toContain('M1');
      expect(culvert.notes[culvert.notes.length - 1]).toMatch(/licensed engineer/);
    }
  });

  it('runModel(samples/spillway-apron.json): the jump forms on the apron for both floods, tailwater below the sequent depth', () => {
    const run = load('spillway-apron');
    for (const flow of run.flows) {
      const s = flow.structures!.find((r) => r.type === 'spillway')!;
      expect(s.values['jumpStaysOnApron']).toBe(true);
      expect(Number(s.values['tailwaterMinusSequent'])).toBeLessThan(0);
      expect(flow.jumps.length).toBe(1);
    }
  });

  it('runModel(samples/gate-jump.json): free flow under the gate at the high flow, with a jump below it', () => {
    const run = load('gate-jump');
    const high = run.flows.find((f) => f.id === 'high')!;
    const gate = high.structures![0]!;
    expect(gate.values['condition']).toBe('free');
    expect(high.jumps.length).toBe(1);
    expect(high.jumps[0]!.station).toBeGreaterThan(120);
  });
});
