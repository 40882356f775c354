import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { assertInDelta } from '../../helpers/assert.js';
import { allFinite, channelWith, rect, run, structureOf, value } from './support.js';

describe('sharpCrestedWeirControl', () => {
  it('sharpCrestedWeirControl(rehbock) in a channel gives the head of Rehbock’s equation for Q = 0.6162 m³/s', () => {
    // computed check: H = 0.3 m, P = 1 m, b = 2 m → Q = (2/3)(0.611 + 0.08·0.3)√(2g)·2·0.3^1.5 = 0.6162 m³/s
    // (Rehbock 1929, Cd = 0.611 + 0.08 H/P; coefficient line from memory)
    const q = (2 / 3) * (0.611 + 0.08 * 0.3) * Math.sqrt(2 * SI.g) * 2 * Math.pow(0.3, 1.5);
    assertInDelta(q, 0.6162, 1e-4, 'Rehbock Q (rounded to 4 places in the check)');
    const flow = run(channelWith({ id: 's', type: 'sharp-crested-weir', station: 200, crestElevation: 100.2 + 1, crestLength: 2, coefficientMethod: 'rehbock' }, { section: rect(2), discharge: q }));
    const r = structureOf(flow);
    expect(value(r, 'headOverCrest')).toBeCloseTo(0.3, 6);
    expect(r.values['condition']).toBe('free');
    // the upstream profile starts from the headwater: the depth just above the weir is crest height + head
    const atWeir = flow.stations.filter((s) => s.station === 200)[0]!;
    expect(atWeir.depth).toBeCloseTo(1.3, 6);
    expect(r.notes[r.notes.length - 1]).toMatch(/licensed engineer/);
    expect(allFinite(flow)).toBe(true);
  });

  it('sharpCrestedWeirControl(kindsvater-carter) passes 0.6088 m³/s at a head of 0.3 m over a 1 m crest height', () => {
    // computed check of Kindsvater–Carter (USBR Water Measurement Manual ch. 7 eq. 7-1; Ce = 0.602 + 0.075 h/p for L/B = 1
    // and kb = −0.0009 m, kh = 0.001 m: Ce and kb from memory of Bos 1989): Q = 0.6088 m³/s
    const flow = run(channelWith({ id: 's', type: 'sharp-crested-weir', station: 200, crestElevation: 101.2, crestLength: 2 }, { section: rect(2), discharge: 0.6088 }));
    expect(value(structureOf(flow), 'headOverCrest')).toBeCloseTo(0.3, 3);
  });

  it('sharpCrestedWeirControl under a high tailwater is submerged by Villemonte’s correction', () => {
    // Villemonte 1947: Q/Q1 = (1 − (H2/H1)^1.5)^0.385
    const flow = run(
      channelWith({ id: 's', type: 'sharp-crested-weir', station: 200, crestElevation: 101.2, crestLength: 2, coefficientMethod: 'rehbock' }, {
        section: rect(2),
        discharge: 0.6,
        downstream: { type: 'stage', elevation: 101.45 },
      }),
    );
    const r = structureOf(flow);
    expect(r.values['condition']).toBe('submerged');
    const ratio = value(r, 'submergenceRatio');
    expect(value(r, 'submergenceFactor')).toBeCloseTo(Math.pow(1 - Math.pow(ratio, 1.5), 0.385), 12);
    expect(value(r, 'headOverCrest')).toBeGreaterThan(value(r, 'freeFlowHead'));
  });
});

describe('vNotchWeirControl', () => {
  it('vNotchWeirControl(90°) gives the head of the Kindsvater–Shen equation', () => {
    // USBR WMM ch. 7 eq. 7-3: Q = Ce·(8/15)·√(2g)·tan(θ/2)·(h + kh)^2.5, 90°: Ce = 0.578, kh = 0.85 mm (from memory of WMM fig. 7-6)
    const h = 0.25;
    const q = 0.578 * (8 / 15) * Math.sqrt(2 * SI.g) * Math.pow(h + 0.00085, 2.5);
    const flow = run(channelWith({ id: 's', type: 'v-notch-weir', station: 200, vertexElevation: 100.2 + 0.6, notchAngle: 90 }, { section: rect(1.2), discharge: q }));
    expect(value(structureOf(flow), 'headOverCrest')).toBeCloseTo(h, 6);
  });
});

describe('broadCrestedWeirControl', () => {
  it('broadCrestedWeirControl(Cd = 1) gives the energy head of the ideal law Q = 1.705·b·H^1.5', () => {
    // ideal broad-crested weir: critical depth on the crest, Q = (2/3)^1.5·√g·b·H^1.5 (Henderson 1966 §6.6; computed 1.705 in SI)
    const H = 0.5;
    const q = Math.pow(2 / 3, 1.5) * Math.sqrt(SI.g) * 3 * Math.pow(H, 1.5);
    const flow = run(channelWith({ id: 's', type: 'broad-crested-weir', station: 200, crestElevation: 100.2 + 0.8, crestWidth: 3, coefficient: 1 }, { section: rect(3), discharge: q }));
    const r = structureOf(flow);
    expect(value(r, 'headOverCrest')).toBeCloseTo(H, 6);
    // the water surface upstream lies below the energy grade by the approach velocity head
    expect(value(r, 'headwaterStage')).toBeLessThan(value(r, 'headwaterEnergy'));
  });
});

describe('roadOverflowControl', () => {
  it('roadOverflowControl(US) gives the head of Q = 3.0·L·H^1.5 for a paved road', () => {
    // FHWA HDS-1 (Bradley 1978) embankment-overflow curves, paved road Cr = 3.0 ft^½/s (from memory)
    const H = 1.2;
    const q = 3.0 * 40 * Math.pow(H, 1.5);
    const flow = run(
      channelWith({ id: 's', type: 'road-overflow', station: 600, crestElevation: 100.6 + 5, overtoppedLength: 40, roadWidth: 6 }, {
        section: rect(40, 0.03, US),
        discharge: q,
        units: US,
        upstreamLength: 600,
        downstreamLength: 600,
      }),
    );
    expect(value(structureOf(flow), 'headOverCrest')).toBeCloseTo(H, 6);
  });
});

describe('weir controls in a whole-channel run', () => {
  it('every weir control: the headwater rises with discharge (free and, at the higher flows, submerged)', () => {
    const specs = [
      { id: 's', type: 'sharp-crested-weir', station: 200, crestElevation: 101.2, crestLength: 3 },
      { id: 's', type: 'v-notch-weir', station: 200, vertexElevation: 100.8, notchAngle: 90 },
      { id: 's', type: 'broad-crested-weir', station: 200, crestElevation: 101.0, crestWidth: 3 },
      { id: 's', type: 'road-overflow', station: 200, crestElevation: 101.0, overtoppedLength: 3 },
    ] as const;
    for (const spec of specs) {
      let previous = -Infinity;
      for (const q of [0.05, 0.2, 0.5, 1, 2, 4]) {
        const hw = value(structureOf(run(channelWith(spec, { section: rect(3), discharge: q, downstream: { type: 'normal' } }))), 'headwaterStage');
        expect(hw, `${spec.type} at Q = ${q}`).toBeGreaterThan(previous);
        previous = hw;
      }
    }
  });
});
