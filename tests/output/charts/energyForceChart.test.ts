/**
 * Spec tests of the specific-energy and specific-force diagram, on curves of a rectangle from the closed forms
 * E = y + q²/(2gy²) and M = b(q²/(gy) + y²/2) (Chow 1959, Open-Channel Hydraulics, §3-2, §3-6): alternate depths
 * share one specific energy and sequent depths one specific force, so each pair is drawn on one vertical line.
 * Bélanger's equation y2/y1 = (√(1 + 8 Fr1²) − 1)/2 (Bélanger 1828; Chow 1959 eq. 3-20) checks the fixture.
 */
import { describe, expect, it } from 'vitest';
import { energyForceChart } from '../../../src/output/charts/energyForceChart.js';
import { compileChart } from '../../../src/output/render.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';
import { rectangleEnergyForce } from '../fixtures.js';

type Panel = { name: string; layer: { name: string; data: { values: any[] }; encoding: Record<string, any> }[] };

describe('energyForceChart(input)', () => {
  const input = rectangleEnergyForce();
  const spec = energyForceChart(input) as unknown as { hconcat: Panel[] };

  it('energyForceChart(input) fixture: the sequent depth obeys Bélanger’s equation', () => {
    const q = 2; // 6 m³/s over 3 m
    const fr1 = q / Math.sqrt(9.80665 * 0.5 ** 3);
    assertRelative(input.sequentDepth!, (0.5 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1)) / 2, 1e-9, 'Bélanger');
  });

  it('energyForceChart(input) draws both curves with depth upwards and marks yc, the alternate and the sequent depth', () => {
    expect(spec.hconcat.map((p) => p.name)).toEqual(['energy', 'force']);
    const [energy, force] = spec.hconcat as [Panel, Panel];
    const curve = energy.layer.find((l) => l.name === 'energy-curve')!;
    expect(curve.encoding.y.field).toBe('depth');
    expect(curve.encoding.x.title).toBe('Specific energy (m)');
    expect(force.layer.find((l) => l.name === 'force-curve')!.encoding.x.title).toBe('Specific force (m³)');
    expect(curve.data.values.length).toBe(input.energy.length);
    const critical = energy.layer.find((l) => l.name === 'energy-critical')!;
    assertInDelta(critical.data.values[0].depth, input.criticalDepth!, 1e-9, 'yc');
    const ePair = energy.layer.find((l) => l.name === 'energy-pair')!.data.values[0];
    assertInDelta(ePair.depth, 0.5, 1e-9, 'flow depth');
    assertInDelta(ePair.depth2, input.alternateDepth!, 1e-9, 'alternate depth');
    const mPair = force.layer.find((l) => l.name === 'force-pair')!.data.values[0];
    assertInDelta(mPair.depth2, input.sequentDepth!, 1e-9, 'sequent depth');
    // the vertical line sits at the curve's value at the flow depth, read off the sampled curve
    const q = 2;
    const e1 = 0.5 + (q * q) / (2 * 9.80665 * 0.25);
    assertRelative(ePair.value, e1, 2e-3, 'E(y1) read off the sampled curve');
    const labels = energy.layer.find((l) => l.name === 'energy-labels')!.data.values.map((v: any) => v.label);
    expect(labels[0]).toBe('y = 0.500 m');
    expect(labels[1]).toMatch(/^alternate = \d\.\d{3} m$/);
  });

  it('energyForceChart(input) without partner depths draws no pair line', () => {
    const s = energyForceChart({ ...input, alternateDepth: null, sequentDepth: null }) as unknown as { hconcat: Panel[] };
    for (const p of s.hconcat) expect(p.layer.some((l) => l.name.endsWith('-pair'))).toBe(false);
  });

  it('energyForceChart(input) compiles without a Vega-Lite warning', async () => {
    expect((await compileChart(energyForceChart(input))).warnings).toEqual([]);
  });
});
