import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { specificForce } from '../../../src/hydraulics/specificForce.js';
import type { SpillwaySpec } from '../../../src/input/model/types.js';
import type { PrismaticReachInput } from '../../../src/profile/types.js';
import { structureControl } from '../../../src/structures/controls/index.js';
import type { StructuredFlowInput } from '../../../src/structures/controls/flow.js';
import { usbrOgeeCoefficientAt } from '../../../src/structures/spillway.js';
import { assertRelative } from '../../helpers/assert.js';
import { allFinite, rect, run, structureOf, value } from './support.js';

const spec: SpillwaySpec = { id: 's', type: 'spillway', station: 40, crestElevation: 104, crestLength: 20, bedDrop: 4, apronLength: 30, chuteLoss: 0.1 };

/** Approach pool, spillway, horizontal apron and an outlet channel to a tailwater stage (invented). */
function basin(discharge: number, tailwaterStage: number): StructuredFlowInput {
  const reaches: PrismaticReachInput[] = [
    { id: 'approach', section: rect(20, 0.02), length: 40, slope: 0 },
    { id: 'apron', section: rect(20, 0.014), length: 30, slope: 0 },
    { id: 'outlet', section: rect(20, 0.025), length: 300, slope: 0.0005 },
  ];
  return {
    units: SI,
    reaches,
    discharge,
    flowId: 'test',
    boundaries: { downstream: { type: 'stage', elevation: tailwaterStage } },
    method: 'standard-step',
    outputSpacing: 2,
    downstreamBedElevation: 95.85,
    controls: [structureControl(spec, 'structures[0]', SI)],
    apronLengths: new Map([['s', 30]]),
  };
}

describe('spillwayControl', () => {
  it('spillwayControl: crest Q = C·L·He^1.5 with the USBR coefficient and the toe depth by the energy equation', () => {
    // USBR Design of Small Dams (1987) ch. 9: Q = C·L·He^1.5, C against P/Hd (curve from memory); toe by energy
    // crest → apron: y1 + (1 + k)·q²/(2g·y1²) = E0 (Chow 1959 ch. 14, common practice for the toe of a chute)
    const flow = run(basin(80, 98.85));
    const r = structureOf(flow);
    const he = value(r, 'energyHeadOverCrest');
    const c = usbrOgeeCoefficientAt(4 / he, SI);
    assertRelative(c * 20 * Math.pow(he, 1.5), 80, 1e-8, 'crest law');
    const y1 = value(r, 'toeDepth');
    const q = 4;
    assertRelative(y1 + (1.1 * q * q) / (2 * SI.g * y1 * y1), value(r, 'energyAboveApron'), 1e-9, 'energy crest → toe');
    expect(allFinite(flow)).toBe(true);
  });

  it('spillwayControl: a jump on the apron obeys the specific-force balance to solver tolerance, and its position matches the sign of tailwater − sequent', () => {
    const hs = rect(20, 0.014);
    const swept = run(basin(80, 98.85));
    const r = structureOf(swept);
    expect(value(r, 'tailwaterMinusSequent')).toBeLessThan(0);
    expect(swept.jumps).toHaveLength(1);
    const j = swept.jumps[0]!;
    assertRelative(specificForce(hs, j.upstreamDepth, 80), specificForce(hs, j.downstreamDepth, 80), 1e-6, 'M1 = M2');
    expect(value(r, 'jumpToeDistanceBelowStructure')).toBeGreaterThan(0);
    expect(r.values['jumpStaysOnApron']).toBe(value(r, 'jumpToeDistanceBelowStructure') + j.length <= 30);
    // a higher tailwater drowns the jump at the toe: positive margin, no jump downstream
    const drowned = structureOf(run(basin(80, 99.6)));
    expect(value(drowned, 'tailwaterMinusSequent')).toBeGreaterThan(0);
    expect(drowned.values['jumpToeDistanceBelowStructure']).toBe(0);
    expect(drowned.values['jumpStaysOnApron']).toBe(true);
  });

  it('spillwayControl: the headwater rises with discharge', () => {
    let previous = -Infinity;
    for (const q of [10, 30, 50, 70, 90]) {
      const hw = value(structureOf(run(basin(q, 99.3))), 'headwaterStage');
      expect(hw).toBeGreaterThan(previous);
      previous = hw;
    }
  });
});
