/**
 * Surveyed (non-prismatic) reaches through the node-to-node standard step (Chow 1959 §10-3, §10-4; published
 * method): the same trapezoid at every surveyed station reproduces the prismatic profile; eddy losses follow
 * C·|Δ(αV²/2g)| with the contraction coefficient where the velocity head rises downstream (common practice).
 */
import { describe, expect, it } from 'vitest';
import { accuracyFor } from '../../src/core/tolerances.js';
import { SI } from '../../src/core/units.js';
import { rectangular } from '../../src/geometry/shapes/rectangular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { computeProfile } from '../../src/profile/engine.js';
import { pointState } from '../../src/profile/energy.js';
import { eddyLoss } from '../../src/profile/surveyed.js';
import type { SurveyNode } from '../../src/profile/types.js';
import { assertInDelta } from '../helpers/assert.js';

const trapezoid = hydraulicSection(trapezoidal({ bottomWidth: 4, sideSlopeLeft: 1.5, roughness: 0.025 }), 'manning', SI);
const Q = 12;
const S0 = 0.001;
const length = 1200;
const spacing = 10;

function survey(coefficients: { contraction?: number; expansion?: number }): SurveyNode[] {
  const n = length / spacing;
  return Array.from({ length: n + 1 }, (_, i) => ({
    station: i * spacing,
    bedElevation: 50 + S0 * (length - i * spacing),
    section: trapezoid,
    ...coefficients,
  }));
}

describe('computeProfile with a surveyed reach', () => {
  it('computeProfile: a prismatic trapezoid described as a survey gives the prismatic profile within the accuracy goal', () => {
    const prismatic = computeProfile(
      {
        units: SI,
        reaches: [{ id: 'p', section: trapezoid, length, slope: S0 }],
        discharge: Q,
        flowId: 'q',
        boundaries: { downstream: { type: 'depth', depth: 2.5 } },
        method: 'ode',
        outputSpacing: spacing,
        downstreamBedElevation: 50,
      },
      { reference: true },
    );
    const surveyed = computeProfile({
      units: SI,
      reaches: [{ kind: 'surveyed', id: 's', nodes: survey({ contraction: 0, expansion: 0 }) }],
      discharge: Q,
      flowId: 'q',
      boundaries: { downstream: { type: 'depth', depth: 2.5 } },
      method: 'standard-step',
    });
    expect(surveyed.stations).toHaveLength(prismatic.stations.length);
    surveyed.stations.forEach((s, i) => {
      const p = prismatic.stations[i]!;
      expect(s.station).toBeCloseTo(p.station, 9);
      assertInDelta(s.bedElevation, p.bedElevation, 1e-9, 'bed');
      assertInDelta(s.depth, p.depth, accuracyFor('SI', p.depth), `station ${s.station}`);
    });
    expect(surveyed.reaches[0]!.profiles.map((p) => p.type)).toContain('M1');
  });

  it('eddyLoss: contraction coefficient times the rise of velocity head downstream, expansion coefficient times the fall', () => {
    const node: SurveyNode = { station: 0, bedElevation: 0, section: trapezoid, contraction: 0.1, expansion: 0.3 };
    const deep = pointState(trapezoid, 2, Q);
    const shallow = pointState(trapezoid, 1.2, Q);
    assertInDelta(eddyLoss(node, deep, shallow), 0.1 * (shallow.velocityHead - deep.velocityHead), 1e-15, 'contraction');
    assertInDelta(eddyLoss(node, shallow, deep), 0.3 * (shallow.velocityHead - deep.velocityHead), 1e-15, 'expansion');
  });

  it('computeProfile: a gradual expansion balances the energy equation with its expansion loss at every step', () => {
    // an invented transition: bottom width from 3 m to 6 m over 100 m, then 6 m
    const nodes: SurveyNode[] = Array.from({ length: 21 }, (_, i) => {
      const b = i <= 10 ? 3 + 0.3 * i : 6;
      return {
        station: i * 10,
        bedElevation: 10 + 0.0005 * (200 - i * 10),
        section: hydraulicSection(trapezoidal({ bottomWidth: b, sideSlopeLeft: 1, roughness: 0.02 }), 'manning', SI),
      };
    });
    const result = computeProfile({
      units: SI,
      reaches: [{ kind: 'surveyed', id: 'transition', nodes }],
      discharge: Q,
      flowId: 'q',
      boundaries: { downstream: { type: 'depth', depth: 1.8 } },
      method: 'standard-step',
    });
    expect(result.warnings).toEqual([]);
    for (let i = 0; i + 1 < nodes.length; i++) {
      const up = pointState(nodes[i]!.section, result.stations[i]!.depth, Q);
      const down = pointState(nodes[i + 1]!.section, result.stations[i + 1]!.depth, Q);
      const hf = (Q / ((up.conveyance + down.conveyance) / 2)) ** 2 * 10;
      const he = down.velocityHead > up.velocityHead ? 0.1 * (down.velocityHead - up.velocityHead) : 0.3 * (up.velocityHead - down.velocityHead);
      const balance = nodes[i]!.bedElevation + up.energy - (nodes[i + 1]!.bedElevation + down.energy) - hf - he;
      expect(Math.abs(balance), `step ${i}`).toBeLessThan(1e-7);
    }
  });
});

describe('computeProfile: mixed flow through a surveyed reach', () => {
  it('computeProfile: a surveyed steep chute into a prismatic mild channel: the jump sits where the prismatic engine puts it', () => {
    const rect = hydraulicSection(rectangular({ bottomWidth: 5, roughness: 0.015 }), 'manning', SI);
    const nodes: SurveyNode[] = Array.from({ length: 61 }, (_, i) => ({ station: i * 5, bedElevation: 20 - 0.02 * i * 5, section: rect, contraction: 0, expansion: 0 }));
    const tail = { downstream: { type: 'depth' as const, depth: 2.6 } };
    const surveyed = computeProfile({
      units: SI,
      reaches: [{ kind: 'surveyed', id: 'chute', nodes }, { id: 'channel', section: rect, length: 600, slope: 0.0005 }],
      discharge: 20,
      flowId: 'f',
      boundaries: tail,
      method: 'standard-step',
      downstreamBedElevation: 14 - 0.3,
    });
    const prismatic = computeProfile({
      units: SI,
      reaches: [{ id: 'chute', section: rect, length: 300, slope: 0.02 }, { id: 'channel', section: rect, length: 600, slope: 0.0005 }],
      discharge: 20,
      flowId: 'f',
      boundaries: tail,
      method: 'ode',
    });
    expect(surveyed.jumps).toHaveLength(1);
    // the toe between surveyed sections 5 m apart comes from linear interpolation of the specific-force difference
    assertInDelta(surveyed.jumps[0]!.station, prismatic.jumps[0]!.station, 0.5, 'toe station');
    assertInDelta(surveyed.jumps[0]!.downstreamDepth, prismatic.jumps[0]!.downstreamDepth, 0.005, 'sequent depth');
    expect(surveyed.warnings).toEqual([]);
  });
});
