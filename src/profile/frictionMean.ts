/**
 * The mean friction slope over a step between two states (Chow 1959, §10-3, who compares these forms;
 * Henderson 1966, §4.4). Average conveyance is the default: Sf = (Q / ((K1 + K2)/2))².
 */
import type { PointState } from './energy.js';
import type { FrictionAveraging } from './types.js';

type Mean = (a: PointState, b: PointState, discharge: number) => number;

const means: Record<FrictionAveraging, Mean> = {
  conveyance: (a, b, q) => {
    const k = 0.5 * (a.conveyance + b.conveyance);
    return (q * q) / (k * k);
  },
  arithmetic: (a, b) => 0.5 * (a.frictionSlope + b.frictionSlope),
  geometric: (a, b) => Math.sqrt(a.frictionSlope * b.frictionSlope),
  harmonic: (a, b) => (2 * a.frictionSlope * b.frictionSlope) / (a.frictionSlope + b.frictionSlope),
};

export function meanFrictionSlope(averaging: FrictionAveraging, a: PointState, b: PointState, discharge: number): number {
  return means[averaging](a, b, discharge);
}
