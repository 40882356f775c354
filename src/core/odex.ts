/**
 * A typed door to the odex package: E. Hairer's ODEX, Gragg–Bulirsch–Stoer extrapolation with dense output
 * (Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, 2nd ed., 1993, §II.9).
 *
 * The package ships TypeScript sources next to its JavaScript that do not compile under this project's
 * strict settings, and tools that follow tsconfig paths would load a declaration file at run time; so it
 * is loaded with require() and given the small interface gvf uses.
 */
import { createRequire } from 'node:module';

export type Derivative = (x: number, y: number[]) => number[];
export type OutputFunction = (
  step: number,
  xOld: number,
  x: number,
  y: number[],
  dense?: (component: number, x: number) => number,
) => boolean | void;

/** odex's outcome codes (its enum Outcome). */
export const Outcome = { Converged: 0, MaxStepsExceeded: 1, EarlyReturn: 2 } as const;
export type Outcome = (typeof Outcome)[keyof typeof Outcome];

export interface Solution {
  y: number[];
  outcome: Outcome;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}

export interface Solver {
  n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  denseComponents: number[];
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  debug: boolean;
  solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): Solution;
}

const require = createRequire(import.meta.url);
const odex = require('odex') as { Solver: new (n: number) => Solver };

/** A new ODEX solver for a system of n equations. */
export const Solver = odex.Solver as new (n: number) => Solver;
