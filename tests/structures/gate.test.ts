import { describe, expect, it } from 'vitest';
import { HydraulicError, InputError } from '../../src/core/errors.js';
import { SI, US } from '../../src/core/units.js';
import {
  freeGateUnitDischarge,
  gateDischargeCoefficient,
  rectangularSequentDepth,
  rectangularSpecificForce,
  sluiceGate,
  submergedGateState,
} from '../../src/structures/gate.js';
import { structureTolerance } from '../../src/structures/invert.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';

const spec = { opening: 0.5, width: 3, floorElevation: 10 };
/** The published check values were computed with the textbook g = 9.81 m/s². */
const SI981 = { ...SI, g: 9.81 };

describe('sluice gate', () => {
  it('gateDischargeCoefficient(0.61, a = 0.5, y1 = 2) is 0.5682 and q = 1.7797 m²/s', () => {
    // Henderson (1966) Cd = Cc/√(1 + Cc·a/y1), q = Cd·a·√(2g·y1) (confirmed in Novak et al.); values computed
    // with g = 9.81 (q = 1.77938 with g = 9.80665).
    assertInDelta(gateDischargeCoefficient(0.61, 0.5, 2), 0.5682, 5e-5, 'Cd');
    assertInDelta(freeGateUnitDischarge(0.61, 0.5, 2, SI981), 1.7797, 5e-5, 'q');
    assertInDelta(freeGateUnitDischarge(0.61, 0.5, 2, SI), 1.77938, 5e-6, 'q, standard g');
  });

  it('sluiceGate() free flow returns y1 = 2 m and the vena contracta 0.305 m as the supercritical start', () => {
    const q = freeGateUnitDischarge(0.61, 0.5, 2, SI);
    const out = sluiceGate(spec, q * 3, null, SI);
    assertInDelta(out.headwaterStage - 10, 2, 1e-9, 'y1');
    assertInDelta(out.downstreamSupercriticalDepth ?? NaN, 0.305, 1e-12, 'Cc·a');
    expect(out.condition).toBe('free');
    assertInDelta(Number(out.values['dischargeCoefficient']), 0.5682, 5e-5, 'Cd');
  });

  it('sluiceGate() free flow conserves energy from y1 to the vena contracta', () => {
    // Henderson's Cd is the energy equation between y1 and Cc·a: check it independently.
    const out = sluiceGate(spec, 4, null, SI);
    const q = 4 / 3;
    const y1 = out.headwaterStage - 10;
    const y2 = 0.61 * 0.5;
    assertInDelta(y1 + (q * q) / (2 * SI.g * y1 * y1), y2 + (q * q) / (2 * SI.g * y2 * y2), 1e-9, 'E');
  });

  it('sluiceGate() stays free while the tailwater is below the sequent depth of the vena contracta', () => {
    const q = 4 / 3;
    const seq = rectangularSequentDepth(0.305, q, SI);
    expect(sluiceGate(spec, 4, 10 + seq * 0.99, SI).condition).toBe('free');
    expect(sluiceGate(spec, 4, 10 + seq * 1.01, SI).condition).toBe('submerged');
  });

  it('submergedGateState() balances momentum below the gate and energy above it to solver tolerance', () => {
    // Henderson (1966): momentum vena contracta → tailwater, energy upstream → vena contracta.
    const q = 4 / 3;
    const y2 = 0.305;
    const y3 = 1.6;
    const s = submergedGateState(q, y2, y3, SI);
    const left = (s.rollerDepth ** 2) / 2 + (q * q) / (SI.g * y2);
    assertInDelta(left, rectangularSpecificForce(y3, q, SI), 1e-12, 'momentum');
    expect(Math.abs(s.momentumResidual)).toBeLessThan(1e-12);
    const e1 = s.upstreamDepth + (q * q) / (2 * SI.g * s.upstreamDepth ** 2);
    const ev = s.rollerDepth + (q * q) / (2 * SI.g * y2 * y2);
    // a depth error δ moves E by (1 − F²)·δ < δ, so the energy residual is within the depth tolerance
    expect(Math.abs(e1 - ev)).toBeLessThan(structureTolerance(ev) * 10);
    expect(s.upstreamDepth).toBeGreaterThan(s.rollerDepth);
  });

  it('sluiceGate() submerged headwater joins the free one at the sequent depth and rises with tailwater', () => {
    const q = 4 / 3;
    const seq = rectangularSequentDepth(0.305, q, SI);
    const free = sluiceGate(spec, 4, null, SI).headwaterStage;
    const justDrowned = sluiceGate(spec, 4, 10 + seq * (1 + 1e-9), SI).headwaterStage;
    assertInDelta(justDrowned, free, 1e-6, 'continuity');
    let last = free;
    for (const f of [1.05, 1.2, 1.5, 2]) {
      const stage = sluiceGate(spec, 4, 10 + seq * f, SI).headwaterStage;
      expect(stage).toBeGreaterThan(last);
      last = stage;
    }
  });

  it('sluiceGate() headwater rises with discharge, free and submerged', () => {
    for (const tw of [null, 11.8]) {
      let last = -Infinity;
      for (const q of [3, 4, 6, 8]) {
        const stage = sluiceGate(spec, q, tw, SI).headwaterStage;
        expect(stage).toBeGreaterThan(last);
        last = stage;
      }
    }
  });

  it('sluiceGate() in US units gives the same depths as in SI', () => {
    // unit conversion, 1 ft = 0.3048 m
    const ft = 0.3048;
    const si = sluiceGate(spec, 4, null, SI);
    const us = sluiceGate({ opening: 0.5 / ft, width: 3 / ft, floorElevation: 10 / ft }, 4 / ft ** 3, null, US);
    assertRelative((us.headwaterStage - 10 / ft) * ft, si.headwaterStage - 10, 1e-4, 'y1');
  });

  it('sluiceGate() refuses a gate that does not touch the flow and a bad opening', () => {
    expect(() => sluiceGate({ ...spec, opening: 3 }, 0.5, null, SI)).toThrow(HydraulicError);
    expect(() => sluiceGate({ ...spec, opening: 0, where: 'structures[2]' }, 1, null, SI)).toThrow(/structures\[2\]\.opening/);
    expect(() => sluiceGate(spec, -1, null, SI)).toThrow(InputError);
  });
});
