import { describe, expect, it } from 'vitest';
import { SI } from '../../src/core/units.js';
import * as structures from '../../src/structures/index.js';
import { toStructureResult } from '../../src/structures/types.js';

describe('structure results', () => {
  it('toStructureResult() keeps the hand values, the controls and the caution', () => {
    const out = structures.sluiceGate({ opening: 0.5, width: 3, floorElevation: 10 }, 4, null, SI);
    const r = toStructureResult('gate-1', 250, out);
    expect(r.type).toBe('sluice-gate');
    expect(r.values['venaContractaDepth']).toBe(out.values['venaContractaDepth']);
    expect(r.values['headwaterStage']).toBe(out.headwaterStage);
    expect(r.notes[r.notes.length - 1]).toBe(structures.structureCaution);
  });

  it('every structure outcome carries the caution (index re-exports)', () => {
    const outcomes = [
      structures.sharpCrestedRectangular({ crestLength: 2, crestHeight: 1, crestElevation: 0 }, 0.5, null, SI),
      structures.triangularNotch({ angleDegrees: 90, crestElevation: 0 }, 0.02, null, SI),
      structures.broadCrested({ crestWidth: 3, crestElevation: 0 }, 2, null, SI),
      structures.roadOverflow({ length: 50, crestElevation: 0 }, 10, null, SI),
      structures.sluiceGate({ opening: 0.5, width: 3, floorElevation: 0 }, 4, null, SI),
      structures.culvert({ barrel: { shape: 'circular', diameter: 1 }, length: 20, slope: 0.01, roughness: 0.013, inlet: 'concrete-pipe-groove-end-headwall', inletInvert: 0 }, 1, null, SI),
      structures.freeOverfall({ brinkElevation: 0, shape: 'rectangular' }, 2, 0.5, SI),
      structures.spillway({ crestElevation: 5, crestLength: 10, approachBedElevation: 0, apronElevation: 0 }, 20, 2, SI),
    ];
    for (const o of outcomes) {
      expect(o.caution, o.kind).toBe(structures.structureCaution);
      expect(Number.isFinite(o.headwaterStage) && Number.isFinite(o.headwaterEnergy), o.kind).toBe(true);
      for (const [k, v] of Object.entries(o.values)) {
        if (typeof v === 'number') expect(Number.isFinite(v), `${o.kind}.${k}`).toBe(true);
      }
    }
  });
});
