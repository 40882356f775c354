import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { assertRelative } from '../../helpers/assert.js';
import { channelWith, rect, run, structureOf, value } from './support.js';

describe('free overfall', () => {
  it('endOverfallResult: at the downstream end the profile starts at critical depth and the brink depth is 0.715·yc', () => {
    // Rouse 1936 (Civil Engineering 6(4)): yb ≈ 0.715·yc in a rectangular channel (ratio from memory);
    // critical depth (q²/g)^(1/3) exact for a rectangle
    const q = 3;
    const flow = run(
      channelWith(null, {
        section: rect(2),
        discharge: q,
        slope: 0.0005,
        extra: { endOverfall: { id: 's', type: 'free-overfall', station: 400 } },
      }),
    );
    const yc = Math.cbrt((q / 2) ** 2 / SI.g);
    const last = flow.stations[flow.stations.length - 1]!;
    assertRelative(last.depth, yc, 1e-8, 'critical depth at the brink');
    const r = structureOf(flow);
    assertRelative(value(r, 'brinkDepth'), 0.715 * yc, 1e-8, 'brink depth');
    expect(r.notes[r.notes.length - 1]).toMatch(/licensed engineer/);
  });

  it('freeOverfallControl: a drop inside the channel passes critical depth at its brink and issues the falling jet below', () => {
    const flow = run(channelWith({ id: 's', type: 'free-overfall', station: 200, bedDrop: 1.5 }, { section: rect(2), discharge: 3, slope: 0.0005, downstream: { type: 'normal' } }));
    const r = structureOf(flow);
    const yc = Math.cbrt(1.5 ** 2 / SI.g);
    assertRelative(value(r, 'headwaterDepth'), yc, 1e-8, 'critical at the brink');
    expect(value(r, 'downstreamSupercriticalDepth')).toBeLessThan(yc);
    // the falling jet carries the brink energy plus the drop: E = 1.5·yc + 1.5 on the lower bed
    const y = value(r, 'downstreamSupercriticalDepth');
    assertRelative(y + (1.5 * 1.5) / (2 * SI.g * y * y), 1.5 * yc + 1.5, 1e-8, 'energy of the jet');
  });

  it('freeOverfallControl: the headwater rises with discharge', () => {
    let previous = -Infinity;
    for (const q of [0.5, 1, 2, 4, 6]) {
      const hw = value(structureOf(run(channelWith({ id: 's', type: 'free-overfall', station: 200, bedDrop: 1.5 }, { section: rect(2), discharge: q, slope: 0.0005, downstream: { type: 'normal' } }))), 'headwaterStage');
      expect(hw).toBeGreaterThan(previous);
      previous = hw;
    }
  });
});
