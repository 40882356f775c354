/**
 * compareMethods over a grid of invented channels (three shapes, five slopes from adverse to steep, one or two
 * reaches, five boundary sets, both unit systems): every method within the accuracy goal of the tight ODE at
 * every compared station, no non-finite number anywhere, and the same jumps. The goal itself is the
 * project's (1 mm / 0.003 ft or 0.1 % of depth; core/tolerances.ts accuracyFor); the reference is the
 * gradually varied flow equation (Chow 1959 eq. 9-8) integrated by odex at a tolerance 1000 times tighter.
 */
import { describe, expect, it } from 'vitest';
import { SI, US, type Units } from '../../src/core/units.js';
import { circular } from '../../src/geometry/shapes/circular.js';
import { trapezoidal } from '../../src/geometry/shapes/trapezoidal.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { compareMethods } from '../../src/profile/compare.js';
import type { Boundary, ReachInput } from '../../src/profile/types.js';

const shapes: Record<string, (u: Units) => HydraulicSection> = {
  trapezoid: (u) => hydraulicSection(trapezoidal({ bottomWidth: 3, sideSlopeLeft: 2, roughness: 0.02 }), 'manning', u),
  triangle: (u) => hydraulicSection(trapezoidal({ bottomWidth: 0, sideSlopeLeft: 1.5, roughness: 0.015 }), 'manning', u),
  pipe: (u) => hydraulicSection(circular({ diameter: 2, roughness: 0.013 }), 'manning', u),
};
const slopes = [0.0002, 0.003, 0.03, 0, -0.001];
const boundarySets: Array<{ upstream?: Boundary; downstream?: Boundary }> = [
  {},
  { downstream: { type: 'critical' } },
  { upstream: { type: 'depth', depth: 0.25 } },
  { upstream: { type: 'depth', depth: 0.3 }, downstream: { type: 'depth', depth: 1.6 } },
  { downstream: { type: 'depth', depth: 1.9 } },
];

describe('compareMethods on a grid of channels', () => {
  for (const units of [SI, US]) {
    it(`compareMethods (${units.system}): all methods within the accuracy goal, finite results and the same jumps on 150 channels`, () => {
      let cases = 0;
      for (const [name, make] of Object.entries(shapes)) {
        const hs = make(units);
        for (const s1 of slopes) {
          for (const s2 of [null, 0.04]) {
            for (const boundaries of boundarySets) {
              const reaches: ReachInput[] = [{ id: 'a', section: hs, length: 400, slope: s1 }];
              if (s2 !== null) reaches.push({ id: 'b', section: hs, length: 300, slope: s2 });
              const label = `${name} S0 = ${s1}${s2 === null ? '' : ` then ${s2}`} ${JSON.stringify(boundaries)}`;
              const c = compareMethods({ units, reaches, discharge: 2.5, flowId: 'grid', boundaries, method: 'ode' });
              for (const m of c.methods) expect(m.worstRatio, `${label}: ${m.method} off by ${m.maxDifference} at ${m.station}`).toBeLessThanOrEqual(1);
              const results = Object.values(c.results);
              for (const r of results) {
                for (const s of r.stations) {
                  for (const v of [s.depth, s.wsel, s.energyElevation, s.velocity, s.froude]) expect(Number.isFinite(v), label).toBe(true);
                }
              }
              expect(new Set(results.map((r) => r.jumps.length)).size, label).toBe(1);
              cases++;
            }
          }
        }
      }
      expect(cases).toBe(150);
    });
  }
});
