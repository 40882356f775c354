import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { specificForce } from '../../../src/hydraulics/specificForce.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';
import { allFinite, channelWith, rect, run, structureOf, value } from './support.js';

// Henderson 1966 (as reproduced in Novak et al., Hydraulic Structures): free flow q = Cd·a·√(2g·y1),
// Cd = Cc/√(1 + Cc·a/y1), Cc = 0.61. Computed check: y1 = 2 m, a = 0.5 m → q = 1.7797 m²/s, vena contracta 0.305 m.
const henderson = { y1: 2, a: 0.5, q: 1.7797, y2: 0.305 };

describe('sluiceGateControl', () => {
  it('sluiceGateControl: free flow gives the upstream depth of Henderson’s computed check and issues the vena contracta below', () => {
    const cd = 0.61 / Math.sqrt(1 + (0.61 * 0.5) / 2);
    const q = cd * 0.5 * Math.sqrt(2 * SI.g * 2);
    assertInDelta(q, henderson.q, 5e-4, 'q of the check (the check rounds g to 9.81)');
    const flow = run(channelWith({ id: 's', type: 'sluice-gate', station: 100, opening: henderson.a }, { section: rect(1), discharge: q, slope: 0.0005, slopeBelow: 0.005, upstreamLength: 100, downstreamLength: 300, downstream: { type: 'normal' } }));
    const r = structureOf(flow);
    expect(r.values['condition']).toBe('free');
    assertInDelta(value(r, 'upstreamDepth'), henderson.y1, 1e-9, 'y1');
    assertInDelta(value(r, 'venaContractaDepth'), henderson.y2, 1e-9, 'Cc·a');
    // the supercritical profile below starts from the vena contracta
    const below = flow.stations.filter((s) => s.station === 100);
    expect(below.some((s) => Math.abs(s.depth - henderson.y2) < 1e-9)).toBe(true);
    expect(allFinite(flow)).toBe(true);
  });

  it('sluiceGateControl: the jump below a free gate obeys the specific-force balance to solver tolerance', () => {
    const hs = rect(4);
    const flow = run(channelWith({ id: 's', type: 'sluice-gate', station: 100, opening: 0.4 }, { section: hs, discharge: 6, slope: 0.0012, upstreamLength: 100, downstreamLength: 400, downstream: { type: 'normal' } }));
    expect(flow.jumps).toHaveLength(1);
    const j = flow.jumps[0]!;
    // momentum balance across the jump (Chow 1959 §3-9): M(y1) = M(y2)
    assertRelative(specificForce(hs, j.upstreamDepth, 6), specificForce(hs, j.downstreamDepth, 6), 1e-6, 'M1 = M2');
    const r = structureOf(flow);
    assertInDelta(value(r, 'jumpToeStation'), j.station, 1e-12, 'toe reported with the gate');
    expect(value(r, 'jumpToeDistanceBelowStructure')).toBeGreaterThan(0);
  });

  it('sluiceGateControl: a tailwater above the sequent depth drowns the gate, solved by momentum', () => {
    const flow = run(channelWith({ id: 's', type: 'sluice-gate', station: 100, opening: 0.5 }, { section: rect(1), discharge: 1.7797, slope: 0, upstreamLength: 100, downstreamLength: 100, downstream: { type: 'depth', depth: 1.6 } }));
    const r = structureOf(flow);
    expect(r.values['condition']).toBe('submerged');
    expect(Math.abs(value(r, 'momentumResidual'))).toBeLessThan(1e-9);
    // drowned, the gate needs more head than free flow for the same discharge
    expect(value(r, 'upstreamDepth')).toBeGreaterThan(value(r, 'freeFlowUpstreamDepth'));
    expect(flow.jumps).toHaveLength(0);
  });
});

describe('sluiceGateControl in a whole-channel run', () => {
  it('sluiceGateControl: the headwater rises with discharge, free and drowned', () => {
    let previous = -Infinity;
    for (const q of [1, 2, 4, 6, 8]) {
      const hw = value(structureOf(run(channelWith({ id: 's', type: 'sluice-gate', station: 100, opening: 0.4 }, { section: rect(4), discharge: q, slope: 0.0008, downstream: { type: 'normal' } }))), 'headwaterStage');
      expect(hw).toBeGreaterThan(previous);
      previous = hw;
    }
  });
});
