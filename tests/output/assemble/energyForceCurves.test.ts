/**
 * energyForceSamples: the curves and marked depths of the energy–force diagram, checked against closed forms
 * for a rectangular channel (published):
 * - critical depth yc = (q²/g)^(1/3) (Chow 1959, Open-Channel Hydraulics, §3-2; from memory);
 * - specific energy E = y + q²/(2gy²) and specific force per unit width M/b = q²/(gy) + y²/2 (Chow 1959 ch. 3);
 * - Bélanger's sequent-depth equation y2/y1 = ½(√(1 + 8Fr1²) − 1) (Bélanger 1828; Chow 1959 eq. 3-23, from memory).
 */
import { describe, expect, it } from 'vitest';
import { SI } from '../../../src/core/units.js';
import { rectangular } from '../../../src/geometry/shapes/rectangular.js';
import { hydraulicSection } from '../../../src/hydraulics/hydraulicSection.js';
import { circular } from '../../../src/geometry/shapes/circular.js';
import { energyForceSamples } from '../../../src/output/assemble/energyForceCurves.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

const b = 3;
const Q = 11;
const q = Q / b;
const g = SI.g;
const hs = hydraulicSection(rectangular({ bottomWidth: b, roughness: 0.014 }), 'manning', SI);

describe('energyForceSamples(rectangular)', () => {
  it('energyForceSamples(rectangular) marks yc = (q²/g)^(1/3), the Bélanger sequent depth and the equal-energy alternate depth', () => {
    const y1 = 0.627;
    const out = energyForceSamples({ hs, discharge: Q, depth: y1, flow: 'f', station: 65 });
    assertRelative(out.criticalDepth!, Math.cbrt((q * q) / g), 1e-9, 'critical depth');
    const fr1 = q / Math.sqrt(g * y1 ** 3);
    assertRelative(out.sequentDepth!, (y1 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1), 1e-6, 'Bélanger sequent depth');
    const E = (y: number) => y + (q * q) / (2 * g * y * y);
    assertInDelta(E(out.alternateDepth!), E(y1), 1e-6, 'alternate depth has the same specific energy');
    expect(out.alternateDepth!).toBeGreaterThan(out.criticalDepth!);
    expect(out.flowDepth).toBe(y1);
  });

  it('energyForceSamples(rectangular) samples E(y) = y + q²/(2gy²) and M(y) = b(q²/(gy) + y²/2) across every marked depth', () => {
    const out = energyForceSamples({ hs, discharge: Q, depth: 0.627 });
    expect(out.energy.length).toBeGreaterThan(50);
    expect(out.force.length).toBeGreaterThan(50);
    for (const p of out.energy) assertRelative(p.value, p.depth + (q * q) / (2 * g * p.depth ** 2), 1e-9, `E at ${p.depth}`);
    for (const p of out.force) assertRelative(p.value, b * ((q * q) / (g * p.depth) + (p.depth * p.depth) / 2), 1e-9, `M at ${p.depth}`);
    const depths = out.energy.map((p) => p.depth);
    for (const y of [out.flowDepth!, out.criticalDepth!, out.alternateDepth!]) {
      expect(Math.min(...depths)).toBeLessThan(y);
      expect(Math.max(...depths)).toBeGreaterThan(y);
    }
    // the curve is cut where it runs far off, so its knee stays readable
    const largest = Math.max(...out.energy.map((p) => p.value));
    expect(largest).toBeLessThan(2 * Math.max(...[out.flowDepth!, out.alternateDepth!].map((y) => y + (q * q) / (2 * g * y * y))));
  });

  it('energyForceSamples(circular) stays inside the conduit and gives null where the sequent depth would lie above the crown', () => {
    const pipe = hydraulicSection(circular({ diameter: 1.2, roughness: 0.013 }), 'manning', SI);
    // a fast shallow flow in a pipe: its sequent depth would be above the crown (common practice: a jump fills the barrel)
    const out = energyForceSamples({ hs: pipe, discharge: 1.5, depth: 0.3 });
    for (const p of [...out.energy, ...out.force]) {
      expect(p.depth).toBeGreaterThan(0);
      expect(p.depth).toBeLessThanOrEqual(1.2);
      expect(Number.isFinite(p.value)).toBe(true);
    }
    expect(out.sequentDepth == null || out.sequentDepth <= 1.2).toBe(true);
  });
});
