/**
 * Interval-by-interval classes of a surveyed reach (src/profile/surveyedClass.ts) and the profile zone near
 * critical depth (src/profile/classify.ts), against closed forms for a wide rectangular channel with Manning
 * friction (per metre of width, R = y):
 * - normal depth yn = (n·q/√S0)^(3/5) (Manning 1891; Chow 1959 §6-3, from memory);
 * - critical depth yc = (q²/g)^(1/3) (Chow 1959 §4-3, from memory), so the critical slope, where yn = yc, is
 *   Sc = g·n²/yc^(1/3) (follows from the two);
 * - the zones of Chow 1959 §9-2 and fig. 9-1 (published; from memory): on a steep slope S2 lies between normal and
 *   critical depth, on a mild slope M2; critical depth is their common boundary.
 * The channel is invented.
 */
import { describe, expect, it } from 'vitest';
import { SI } from '../../src/core/units.js';
import { points } from '../../src/geometry/shapes/points.js';
import { hydraulicSection, type HydraulicSection } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../src/hydraulics/normalDepth.js';
import { profileType } from '../../src/profile/classify.js';
import { aboveNormal, controlBreaks, criticalSlopeOf, intervalClasses, slopeClassAgainst, surveyParts } from '../../src/profile/surveyedClass.js';
import { computeProfile } from '../../src/profile/engine.js';
import type { SurveyNode } from '../../src/profile/types.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { wideChannel } from './channels.js';

/** A wide channel with Manning friction: wetted perimeter equal to the width, so R = y exactly. */
const wideManning = (width: number, roughness: number): HydraulicSection => wideChannel(width, roughness, SI, 'manning');

const n = 0.03;
const q = 1.5; // m²/s on a 1 m strip
const hs = wideManning(1, n);
const yc = Math.cbrt((q * q) / SI.g);
const sc = (SI.g * n * n) / Math.cbrt(yc);
const ynOf = (slope: number) => ((n * q) / Math.sqrt(slope)) ** 0.6;

describe('surveyedClass against the wide-channel closed forms', () => {
  it('criticalSlopeOf equals g·n²/yc^(1/3) of a wide Manning channel', () => {
    assertRelative(criticalSlopeOf(hs, yc, q), sc, 1e-12, 'Sc');
    // and at that slope normal depth is critical depth (Manning's closed form)
    assertRelative(ynOf(sc), yc, 1e-12, 'yn(Sc)');
  });

  it('slopeClassAgainst: below Sc mild, above steep, within the band critical, 0 horizontal, < 0 adverse', () => {
    expect(slopeClassAgainst(0.5 * sc, sc)).toBe('mild');
    expect(slopeClassAgainst(2 * sc, sc)).toBe('steep');
    expect(slopeClassAgainst(sc * (1 + 1e-4), sc)).toBe('critical');
    expect(slopeClassAgainst(0, sc)).toBe('horizontal');
    expect(slopeClassAgainst(-0.001, sc)).toBe('adverse');
    // the same as comparing Manning's normal depth with critical depth
    for (const s of [0.3 * sc, 0.9 * sc, 1.1 * sc, 4 * sc]) expect(slopeClassAgainst(s, sc)).toBe(ynOf(s) > yc ? 'mild' : 'steep');
  });

  it('aboveNormal: y − yn from the closed form (n·q/√S0)^(3/5) to second order near normal depth, and its sign far from it', () => {
    for (const slope of [0.0005, 0.02]) {
      const yn = ynOf(slope);
      for (const offset of [-0.005, -0.001, -0.0002, 0.0002, 0.001, 0.005]) {
        const y = yn + offset;
        const estimate = aboveNormal(hs, y, q, slope)!;
        // with K ∝ y^(5/3) the Newton step in ln Sf is y·ln(y/yn) exactly (differs from y − yn by about (y − yn)²/2y)
        assertInDelta(estimate, y * Math.log(y / yn), 1e-9, `S0 ${slope}, y − yn ${offset}: Newton step`);
        assertInDelta(estimate, offset, (offset * offset) / y, `S0 ${slope}, y − yn ${offset}`);
      }
      expect(Math.sign(aboveNormal(hs, 0.3 * yn, q, slope)!)).toBe(-1);
      expect(Math.sign(aboveNormal(hs, 3 * yn, q, slope)!)).toBe(1);
    }
    expect(aboveNormal(hs, 1, q, 0)).toBeNull();
    expect(aboveNormal(hs, 1, q, -0.001)).toBeNull();
  });

  it('aboveNormal: on a points section (dK/dy from its perimeter rates) y − yn agrees with normalDepth to second order', () => {
    // an invented earth channel drawn as points with three roughness zones; normalDepth is checked against Manning's
    // closed forms in tests/hydraulics
    const earth = hydraulicSection(
      points({ points: [[0, 3], [4, 1.5], [6, 0], [10, 0], [12, 1.5], [16, 3]], roughness: [[0, 0.05], [4, 0.03], [12, 0.05]] }),
      'manning',
      SI,
    );
    const discharge = 12;
    for (const slope of [0.0008, 0.01]) {
      const yn = normalDepth(earth, discharge, slope)!;
      for (const offset of [-0.004, -0.0005, 0.0005, 0.004]) {
        const y = yn + offset;
        assertInDelta(aboveNormal(earth, y, discharge, slope)!, offset, (offset * offset) / y + 1e-9, `S0 ${slope}, y − yn ${offset}`);
      }
    }
  });

  it('intervalClasses, surveyParts and controlBreaks: each interval by its own slope, a control where steep follows mild', () => {
    // bed slopes per interval: mild, mild, steep, steep, mild, steep (an invented survey 10 m apart)
    const slopes = [0.3 * sc, 0.5 * sc, 3 * sc, 2 * sc, 0.4 * sc, 5 * sc];
    let bed = 100;
    const nodes: SurveyNode[] = [{ station: 0, bedElevation: bed, section: hs }];
    slopes.forEach((s, i) => {
      bed -= s * 10;
      nodes.push({ station: (i + 1) * 10, bedElevation: bed, section: hs });
    });
    const classes = intervalClasses(nodes, () => yc, q);
    expect(classes).toEqual(['mild', 'mild', 'steep', 'steep', 'mild', 'steep']);
    expect(surveyParts(classes)).toEqual([
      { first: 0, last: 2, slopeClass: 'mild' },
      { first: 2, last: 4, slopeClass: 'steep' },
      { first: 4, last: 5, slopeClass: 'mild' },
      { first: 5, last: 6, slopeClass: 'steep' },
    ]);
    expect(controlBreaks(classes)).toEqual([2, 5]);
  });
});

describe('profileType at critical depth (Chow 1959 §9-2 zones)', () => {
  it('profileType: a depth within round-off of critical depth is S2 on a steep slope and M2 on a mild one, whichever side it lies', () => {
    const steep = { normalDepth: 0.8 * yc, criticalDepth: yc, slopeClass: 'steep' as const };
    const mild = { normalDepth: 1.3 * yc, criticalDepth: yc, slopeClass: 'mild' as const };
    for (const f of [1 - 1e-9, 1, 1 + 1e-9]) {
      expect(profileType(steep, yc * f, 1e-3)).toBe('S2');
      expect(profileType(mild, yc * f, 1e-3)).toBe('M2');
    }
    // clearly beyond critical depth the zones change
    expect(profileType(steep, yc * 1.01, 1e-3)).toBe('S1');
    expect(profileType(mild, yc * 0.99, 1e-3)).toBe('M3');
  });

  it('computeProfile: a surveyed wide channel steep then mild reports S1 only where the depth is above critical depth', () => {
    // an invented wide channel, 300 m at 5·Sc then 600 m at Sc/3, a tailwater 1.4·yn of the mild part: the profile's
    // types follow the zones of the depths at each interval (checked against the closed-form yn and yc)
    const nodes: SurveyNode[] = Array.from({ length: 301 }, (_, i) => {
      const x = i * 3;
      return { station: x, bedElevation: x <= 300 ? 10 + (sc / 3) * 600 + 5 * sc * (300 - x) : 10 + (sc / 3) * (900 - x), section: hs, contraction: 0, expansion: 0 };
    });
    const ynMild = ynOf(sc / 3);
    const ynSteep = ynOf(5 * sc);
    const result = computeProfile({
      units: SI,
      reaches: [{ kind: 'surveyed', id: 'w', nodes }],
      discharge: q,
      flowId: 'q',
      boundaries: { upstream: { type: 'critical' }, downstream: { type: 'depth', depth: 1.4 * ynMild } },
      method: 'standard-step',
    });
    expect(result.jumps).toHaveLength(1);
    const depthAt = (x: number) => result.stations.find((s) => Math.abs(s.station - x) < 1e-9)!.depth;
    for (const p of result.reaches[0]!.profiles) {
      const mid = 0.5 * (p.from + p.to);
      // a node inside the stretch (or its upstream end) and the zone its depth lies in
      const x = Math.min(p.to, Math.max(p.from, Math.round(mid / 3) * 3));
      const y = depthAt(x);
      const steep = mid < 300;
      const yn = steep ? ynSteep : ynMild;
      if (p.type === 'uniform') {
        assertInDelta(y, yn, 0.0011, `uniform at ${x}`);
        continue;
      }
      const expected = steep ? (y > yc ? 'S1' : y > yn ? 'S2' : 'S3') : y > yn ? 'M1' : y > yc ? 'M2' : 'M3';
      expect(p.type, `stretch ${p.from}–${p.to} (depth ${y} at ${x})`).toBe(expected);
    }
  });
});
