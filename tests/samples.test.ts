/**
 * The golden set: every sample model (samples/NAME.json, and the model in each folder samples/NAME/) validates, runs with no warning outside its allow-list, and gives
 * the key figures stored in tests/golden/<sample>.json within stated tolerances. Stored figures are gvf's own
 * results when they were last reviewed (a regression guard, not an outside check); the outside checks below
 * hold for every sample whatever was stored:
 * - the two depths of every hydraulic jump have equal specific force M = Q²/(gA) + Aȳ (the momentum
 *   balance that defines sequent depths; Bélanger 1828, Chow 1959 §3-5, from memory), to 0.1 %;
 * - every reported normal depth of a prismatic Manning reach satisfies Manning's equation
 *   Q = (k/n)·A·R^(2/3)·√S0 (Manning 1891; Chow 1959 §6-3, from memory), to 0.1 %;
 * - every reported critical depth has Froude number 1 with α (Chow 1959 §4-2, from memory), to 0.1 %.
 *
 * Tolerances: depths and water levels within the accuracy goal of the profile engine (1 mm SI, 0.003 ft US,
 * or 0.1 % of the depth where larger); jump toe stations within 0.5 % of the channel length (a toe moves
 * along a nearly flat force difference, so its station is less certain than the depths).
 *
 * To accept new figures after a reviewed change, or to add a sample: GVF_GOLDEN_UPDATE=1 npx vitest run
 * tests/samples.test.ts (tests/golden/regenerate.sh). The allow-list of warnings in each golden file is kept
 * as written: a new warning fails until someone reads it and adds a pattern for it.
 */
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { accuracyFor } from '../src/core/tolerances.js';
import { specificForce } from '../src/hydraulics/specificForce.js';
import { readModelFile } from '../src/input/model/parse.js';
import type { FlowResult, RunResult } from '../src/results/types.js';
import { type ModelRun, runModel } from '../src/run.js';

const root = join(import.meta.dirname, '..');
const samplesDir = join(root, 'samples');
const goldenDir = join(root, 'tests', 'golden');
const update = process.env.GVF_GOLDEN_UPDATE === '1';
/**
 * The sample models: samples/NAME.json, and the model files of sample folders (JSON files in samples/NAME/, a model
 * with its survey files beside it). Golden name: NAME, or NAME-FILE when a folder holds several models.
 */
function sampleFiles(): { file: string; name: string }[] {
  const out: { file: string; name: string }[] = [];
  for (const e of readdirSync(samplesDir, { withFileTypes: true })) {
    if (e.isFile() && e.name.endsWith('.json')) out.push({ file: e.name, name: basename(e.name, '.json') });
    if (e.isDirectory()) {
      const models = readdirSync(join(samplesDir, e.name)).filter((f) => f.endsWith('.json'));
      for (const m of models) out.push({ file: `${e.name}/${m}`, name: models.length === 1 ? e.name : `${e.name}-${basename(m, '.json')}` });
    }
  }
  return out.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
}
const samples = sampleFiles();

interface GoldenStation {
  station: number;
  depth: number;
  wsel: number;
}
interface GoldenFlow {
  id: string;
  discharge: number;
  reaches: { id: string; slopeClass: string; normalDepth: number | null; criticalDepth: number; profiles: string[] }[];
  stations: GoldenStation[];
  jumps: { station: number; upstreamDepth: number; downstreamDepth: number }[];
  warnings: number;
}
interface Golden {
  sample: string;
  /** regular expressions a warning may match (reviewed by hand; kept when the figures are regenerated) */
  allowedWarnings: string[];
  units: 'SI' | 'US';
  flows: GoldenFlow[];
}

/**
 * A few stations per reach: both ends and the middle (the nearest output station to each). A jump toe is never
 * picked: its station moves with the toe search (checked separately, within its own tolerance).
 */
function keyStations(flow: FlowResult): GoldenStation[] {
  const picked: GoldenStation[] = [];
  const toes = new Set(flow.jumps.map((j) => j.station));
  const candidates = flow.stations.filter((s) => !toes.has(s.station));
  for (const r of flow.reaches) {
    for (const target of [r.from, (r.from + r.to) / 2, r.to]) {
      let best = candidates[0];
      for (const s of candidates) if (best === undefined || Math.abs(s.station - target) < Math.abs(best.station - target)) best = s;
      if (best && !picked.some((p) => p.station === best!.station)) picked.push({ station: best.station, depth: best.depth, wsel: best.wsel });
    }
  }
  return picked;
}

function goldenOf(sample: string, result: RunResult, allowedWarnings: string[]): Golden {
  return {
    sample,
    allowedWarnings,
    units: result.units,
    flows: result.flows.map((f) => ({
      id: f.id,
      discharge: f.discharge,
      reaches: f.reaches.map((r) => ({ id: r.id, slopeClass: r.slopeClass, normalDepth: r.normalDepth, criticalDepth: r.criticalDepth, profiles: r.profiles.map((p) => p.type) })),
      stations: keyStations(f),
      jumps: f.jumps.map((j) => ({ station: j.station, upstreamDepth: j.upstreamDepth, downstreamDepth: j.downstreamDepth })),
      warnings: f.warnings.length,
    })),
  };
}

/** The prismatic reach input of a reach id (null for surveyed reaches). */
function prismatic(run: ModelRun, flowIndex: number, reachId: string) {
  const reach = run.stages.inputs[flowIndex]?.reaches.find((r) => r.id === reachId);
  return reach && reach.kind !== 'surveyed' ? reach : null;
}

describe('samples/*.json (the golden set)', () => {
  it('samples/ holds at least one sample', () => {
    expect(samples.length).toBeGreaterThan(0);
  });

  for (const { file, name } of samples) {
    describe(`samples/${file}`, () => {
      const goldenPath = join(goldenDir, `${name}.json`);
      const stored: Golden | null = existsSync(goldenPath) ? (JSON.parse(readFileSync(goldenPath, 'utf8')) as Golden) : null;
      let run: ModelRun;

      it(`runModel(samples/${file}) validates and runs, with only allow-listed warnings`, () => {
        const path = join(samplesDir, file);
        const model = readModelFile(path);
        const said = `${model.title ?? ''} ${(model as { description?: string }).description ?? ''}`;
        expect(said, 'a sample says it is invented (title or description)').toMatch(/invented/i);
        run = runModel(model, { modelFile: path });
        const allowed = (stored?.allowedWarnings ?? []).map((p) => new RegExp(p));
        const unexpected = run.result.flows.flatMap((f) => f.warnings.filter((w) => !allowed.some((re) => re.test(w))).map((w) => `${f.id}: ${w}`));
        expect(unexpected, 'warnings not on the allow-list').toEqual([]);
        if (update) {
          writeFileSync(goldenPath, `${JSON.stringify(goldenOf(name, run.result, stored?.allowedWarnings ?? []), null, 2)}\n`);
        }
      });

      it.skipIf(update)(`runModel(samples/${file}) gives the stored key figures within the accuracy goal`, () => {
        expect(stored, `no golden file ${goldenPath}: run tests/golden/regenerate.sh after reviewing the sample's results`).not.toBeNull();
        const golden = stored!;
        const result = run.result;
        expect(result.flows.map((f) => f.id)).toEqual(golden.flows.map((f) => f.id));
        const length = Math.max(...result.flows.flatMap((f) => f.stations.map((s) => s.station))) - Math.min(...result.flows.flatMap((f) => f.stations.map((s) => s.station)));
        golden.flows.forEach((g, i) => {
          const f = result.flows[i]!;
          expect(f.discharge).toBeCloseTo(g.discharge, 9);
          expect(f.reaches.map((r) => ({ id: r.id, slopeClass: r.slopeClass, profiles: r.profiles.map((p) => p.type) }))).toEqual(g.reaches.map((r) => ({ id: r.id, slopeClass: r.slopeClass, profiles: r.profiles })));
          g.reaches.forEach((gr, j) => {
            const r = f.reaches[j]!;
            if (gr.normalDepth === null) expect(r.normalDepth).toBeNull();
            else expect(Math.abs(r.normalDepth! - gr.normalDepth), `${g.id} ${gr.id} normal depth`).toBeLessThanOrEqual(accuracyFor(golden.units, gr.normalDepth));
            expect(Math.abs(r.criticalDepth - gr.criticalDepth), `${g.id} ${gr.id} critical depth`).toBeLessThanOrEqual(accuracyFor(golden.units, gr.criticalDepth));
          });
          for (const gs of g.stations) {
            const s = f.stations.find((x) => Math.abs(x.station - gs.station) <= 1e-6 * Math.max(1, length));
            expect(s, `${g.id}: station ${gs.station}`).toBeDefined();
            expect(Math.abs(s!.depth - gs.depth), `${g.id}: depth at ${gs.station}`).toBeLessThanOrEqual(accuracyFor(golden.units, gs.depth));
            expect(Math.abs(s!.wsel - gs.wsel), `${g.id}: water surface at ${gs.station}`).toBeLessThanOrEqual(accuracyFor(golden.units, gs.depth));
          }
          expect(f.jumps.length, `${g.id}: number of jumps`).toBe(g.jumps.length);
          g.jumps.forEach((gj, k) => {
            const j = f.jumps[k]!;
            expect(Math.abs(j.station - gj.station), `${g.id}: jump toe`).toBeLessThanOrEqual(0.005 * length);
            expect(Math.abs(j.upstreamDepth - gj.upstreamDepth), `${g.id}: jump upstream depth`).toBeLessThanOrEqual(Math.max(accuracyFor(golden.units, gj.upstreamDepth), 0.01 * gj.upstreamDepth));
            expect(Math.abs(j.downstreamDepth - gj.downstreamDepth), `${g.id}: jump sequent depth`).toBeLessThanOrEqual(Math.max(accuracyFor(golden.units, gj.downstreamDepth), 0.01 * gj.downstreamDepth));
          });
          expect(f.warnings.length, `${g.id}: number of warnings`).toBe(g.warnings);
        });
      });

      it(`runModel(samples/${file}): jump depths have equal specific force, normal depths satisfy Manning, critical depths Fr = 1`, () => {
        const result = run.result;
        result.flows.forEach((f, i) => {
          for (const j of f.jumps) {
            const reach = f.reaches.find((r) => j.station >= Math.min(r.from, r.to) && j.station <= Math.max(r.from, r.to));
            const input = reach ? prismatic(run, i, reach.id) : null;
            if (!input || j.atControl) continue;
            // the discharge where the jump stands (it may change along the channel)
            const q = f.stations.find((s) => s.station === j.station)?.discharge ?? reach!.discharge ?? f.discharge;
            const m1 = specificForce(input.section, j.upstreamDepth, q);
            const m2 = specificForce(input.section, j.downstreamDepth, q);
            expect(Math.abs(m1 - m2) / m2, `${f.id}: jump at ${j.station}`).toBeLessThanOrEqual(1e-3);
          }
          for (const r of f.reaches) {
            const input = prismatic(run, i, r.id);
            // closed forms for one roughness across the section (α = 1); compound sections are checked elsewhere
            if (!input || input.section.section.compound || input.section.alpha !== undefined) continue;
            const { section, units } = input.section;
            const g = units.g;
            const q = r.discharge ?? f.discharge;
            if (r.normalDepth !== null && input.section.law === 'manning' && input.slope > 0) {
              const n = section.describe().roughness as number;
              const e = section.elements(r.normalDepth);
              const capacity = (units.manningFactor / n) * e.area * (e.area / e.wettedPerimeter) ** (2 / 3) * Math.sqrt(input.slope);
              expect(Math.abs(capacity - q) / q, `${f.id} ${r.id}: Manning at normal depth`).toBeLessThanOrEqual(1e-3);
            }
            const c = section.elements(r.criticalDepth);
            const froude = Math.sqrt((q ** 2 * c.topWidth) / (g * c.area ** 3));
            expect(Math.abs(froude - 1), `${f.id} ${r.id}: Fr at critical depth`).toBeLessThanOrEqual(1e-3);
          }
        });
      });
    });
  }
});
