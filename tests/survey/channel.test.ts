/**
 * runModel on surveyed reaches: the survey files become the engine's nodes, coarse surveys get interpolated
 * sections until step halving confirms the accuracy goal, and results come back in the user's stationing.
 *
 * The reference is the prismatic engine's ODE method at its tight reference tolerance (the integration of the
 * gradually varied flow equation, Chow 1959 §9-1): a survey of one trapezoid at every station is a prismatic
 * channel, so its profile must agree within the accuracy goal (1 mm or 0.1 % of depth; issue 3).
 */
import { describe, expect, it } from 'vitest';
import { accuracyFor } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { computeProfile } from '../../src/profile/engine.js';
import { runModel } from '../../src/run.js';
import { assertInDelta } from '../helpers/assert.js';
import { modelFolder } from './folder.js';

const Q = 12;
const S0 = 0.001;
const length = 1200;
const downstreamBed = 50;

/** The prismatic profile at the tight ODE tolerance, every 100 m. */
function prismaticReference() {
  const hs = hydraulicSection(trapezoidal({ bottomWidth: 4, sideSlopeLeft: 1.5, roughness: 0.025 }), 'manning', SI);
  return computeProfile(
    {
      units: SI,
      reaches: [{ id: 'p', section: hs, length, slope: S0 }],
      discharge: Q,
      flowId: 'q',
      boundaries: { downstream: { type: 'depth', depth: 2.5 } },
      method: 'ode',
      outputSpacing: 100,
      downstreamBedElevation: downstreamBed,
    },
    { reference: true },
  );
}

/** A survey of the same trapezoid every `spacing` m, numbered as `stationing` says (origin `origin`). */
function trapezoidSurvey(spacing: number, stationing: 'increasing-downstream' | 'increasing-upstream', origin = 0, interpolate = true) {
  const lines = ['station,bed_elevation,section'];
  for (let x = 0; x <= length; x += spacing) {
    const user = stationing === 'increasing-downstream' ? origin + x : origin + (length - x);
    lines.push(`${user},${downstreamBed + S0 * (length - x)},trap`);
  }
  const folder = modelFolder(
    {
      units: 'SI',
      sections: { trap: { shape: 'trapezoidal', bottomWidth: 4, sideSlope: 1.5, n: 0.025 } },
      // no eddy losses: a prismatic channel has no transitions (the defaults would charge the velocity-head change)
      reaches: [{ id: 's', survey: { stations: 'stations.csv', stationing, contraction: 0, expansion: 0 } }],
      flows: [{ id: 'q', discharge: Q }],
      boundaries: { downstream: { type: 'depth', depth: 2.5 } },
    },
    { 'stations.csv': `${lines.join('\n')}\n` },
  );
  return runModel(readModelFile(folder.model), { modelFile: folder.model, interpolate });
}

describe('runModel with a surveyed reach', () => {
  it('runModel: a trapezoid surveyed every 100 m gives the prismatic profile within the accuracy goal (interpolated where needed)', () => {
    const reference = prismaticReference();
    const run = trapezoidSurvey(100, 'increasing-downstream');
    const flow = run.result.flows[0]!;
    for (const p of reference.stations) {
      const s = flow.stations.find((t) => Math.abs(t.station - p.station) < 1e-9);
      expect(s, `station ${p.station}`).toBeDefined();
      assertInDelta(s!.bedElevation, p.bedElevation, 1e-9, `bed at ${p.station}`);
      assertInDelta(s!.depth, p.depth, accuracyFor('SI', p.depth), `depth at ${p.station}`);
    }
    expect(flow.warnings).toEqual([]);
    expect(flow.reaches[0]!.profiles.map((p) => p.type)).toContain('M1');
  });

  it('runModel: --no-interpolate computes from surveyed section to surveyed section only, and says so', () => {
    const run = trapezoidSurvey(100, 'increasing-downstream', 0, false);
    const flow = run.result.flows[0]!;
    expect(flow.stations).toHaveLength(13);
    expect(flow.stations.some((s) => s.interpolated)).toBe(false);
    expect(flow.notes?.some((n) => n.includes('Interpolation between surveyed sections is off'))).toBe(true);
  });

  it('runModel: a coarse survey (300 m apart) is interpolated, and the interpolated stations are marked', () => {
    const reference = prismaticReference();
    const run = trapezoidSurvey(300, 'increasing-downstream');
    const flow = run.result.flows[0]!;
    expect(flow.stations.some((s) => s.interpolated)).toBe(true);
    // without the interpolated sections the same survey misses the goal somewhere (so the check above can fail)
    const bare = trapezoidSurvey(300, 'increasing-downstream', 0, false).result.flows[0]!;
    const worst = Math.max(
      ...bare.stations.map((s) => Math.abs(s.depth - reference.stations.find((r) => Math.abs(r.station - s.station) < 1e-9)!.depth) / accuracyFor('SI', s.depth)),
    );
    expect(worst).toBeGreaterThan(1);
    expect(flow.notes?.some((n) => n.startsWith('Interpolated sections'))).toBe(true);
    for (const p of reference.stations.filter((r) => r.station % 300 === 0)) {
      const s = flow.stations.find((t) => Math.abs(t.station - p.station) < 1e-9)!;
      assertInDelta(s.depth, p.depth, accuracyFor('SI', p.depth), `depth at ${p.station}`);
    }
  });

  it('runModel: stations increasing upstream come back in the survey\'s numbers (upstream end 1200 + 500), the table upstream first', () => {
    const reference = prismaticReference();
    const run = trapezoidSurvey(100, 'increasing-upstream', 500);
    const flow = run.result.flows[0]!;
    expect(run.result.stationing?.direction).toBe('increasing-upstream');
    // engine station x (from the upstream end) is user station 500 + (1200 − x)
    expect(flow.stations[0]!.station).toBe(1700);
    expect(flow.stations[flow.stations.length - 1]!.station).toBe(500);
    expect(flow.reaches[0]!.from).toBe(1700);
    expect(flow.reaches[0]!.to).toBe(500);
    for (const p of reference.stations) {
      const s = flow.stations.find((t) => Math.abs(t.station - (500 + length - p.station)) < 1e-9)!;
      assertInDelta(s.depth, p.depth, accuracyFor('SI', p.depth), `depth at user station ${500 + length - p.station}`);
    }
    // station numbers written in the control records follow the user's numbers too
    const downstream = flow.controls?.find((c) => c.kind === 'downstream boundary');
    expect(downstream?.station).toBe(500);
  });
});
