/**
 * Invented test channels for the analysis layer (round numbers, no real place), as validated model files,
 * plus a seeded random generator for noisy marks and an independent Manning normal-depth solver.
 */
import { brentRoot } from '../../src/core/roots.js';
import type { Model } from '../../src/input/model/types.js';
import { validateModel } from '../../src/input/model/validate.js';

/** Two mild earthen reaches (trapezoid b = 3 m, z = 2, n = 0.03) ending at a fixed stage: an M1 backwater. */
export function twoReachModel(extra: Record<string, unknown> = {}): Model {
  return validateModel(
    {
      title: 'Invented two-reach drain',
      units: 'SI',
      sections: {
        earth: { shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2, n: 0.03 },
        grass: { shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2, n: 0.04 },
      },
      reaches: [
        { id: 'upper', section: 'grass', length: 600, slope: 0.001 },
        { id: 'lower', section: 'earth', length: 800, slope: 0.0006 },
      ],
      flows: [
        { id: 'minor', discharge: 8 },
        { id: 'major', discharge: 15 },
      ],
      boundaries: { downstream: { type: 'stage', elevation: 2.2 } },
      ...extra,
    },
    'two-reach.json',
  );
}

/** A mild rectangular reach (b = 4 m, n = 0.025) falling into a steep one: critical depth at the break (station 1000). */
export function mildToSteepModel(): Model {
  return validateModel(
    {
      title: 'Invented chute inlet',
      units: 'SI',
      sections: { concrete: { shape: 'rectangular', bottomWidth: 4, n: 0.025 } },
      reaches: [
        { id: 'approach', section: 'concrete', length: 1000, slope: 0.0005 },
        { id: 'chute', section: 'concrete', length: 300, slope: 0.02 },
      ],
      flows: [{ id: 'design', discharge: 10 }],
      boundaries: { upstream: { type: 'normal' }, downstream: { type: 'normal' } },
    },
    'chute.json',
  );
}

/** A steep rectangular reach into a mild one ending at normal depth: a hydraulic jump on the mild reach. */
export function steepToMildModel(): Model {
  return validateModel(
    {
      title: 'Invented spillway tailrace',
      units: 'SI',
      sections: { concrete: { shape: 'rectangular', bottomWidth: 5, n: 0.015 } },
      reaches: [
        { id: 'chute', section: 'concrete', length: 100, slope: 0.03 },
        { id: 'tailrace', section: 'concrete', length: 600, slope: 0.0008 },
      ],
      flows: [{ id: 'design', discharge: 20 }],
      boundaries: { upstream: { type: 'critical' }, downstream: { type: 'normal' } },
    },
    'tailrace.json',
  );
}

/** A long rectangular channel (b = 6 m, n = 0.02, S = 0.001) with normal depth at both ends: uniform flow. */
export function uniformModel(): Model {
  return validateModel(
    {
      title: 'Invented uniform canal',
      units: 'SI',
      sections: { canal: { shape: 'rectangular', bottomWidth: 6, n: 0.02 } },
      reaches: [{ id: 'canal', section: 'canal', length: 2000, slope: 0.001 }],
      flows: [{ id: 'q', discharge: 12 }],
      boundaries: { upstream: { type: 'normal' }, downstream: { type: 'normal' } },
    },
    'canal.json',
  );
}

/**
 * Normal depth of a rectangular channel from Manning's equation (Manning 1891), Q = (k/n)·A·R^(2/3)·√S,
 * solved here by bisection-safe Brent on depth, independent of the engine's solvers.
 */
export function manningRectangleDepth(q: number, width: number, n: number, slope: number, k = 1): number {
  const f = (y: number) => (k / n) * width * y * Math.pow((width * y) / (width + 2 * y), 2 / 3) * Math.sqrt(slope) - q;
  return brentRoot(f, 1e-6, 100, { xTolerance: 1e-12, what: 'test normal depth' });
}

/** mulberry32: a small seeded generator (public-domain algorithm by Tommy Ettinger), uniform on [0, 1). */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Normal deviates by the Box–Muller transform (Box & Muller 1958). */
export function gaussian(random: () => number): () => number {
  return () => {
    const u = 1 - random();
    const v = random();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}
