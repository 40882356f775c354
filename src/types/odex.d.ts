/**
 * Type declarations for the odex package (E. Hairer's ODEX extrapolation solver, Gragg–Bulirsch–Stoer).
 * The package ships its TypeScript source beside the JavaScript, which does not compile under this
 * project's strict settings; tsconfig's `paths` points `odex` here instead. Only what gvf uses is declared.
 */
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
  export type OutputFunction = (
    step: number,
    xOld: number,
    x: number,
    y: number[],
    dense?: (component: number, x: number) => number,
  ) => boolean | void;
  export enum Outcome {
    Converged = 0,
    MaxStepsExceeded = 1,
    EarlyReturn = 2,
  }
  export interface Solution {
    y: number[];
    outcome: Outcome;
    nStep: number;
    xEnd: number;
    nAccept: number;
    nReject: number;
    nEval: number;
  }
  export class Solver {
    constructor(n: number);
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
    grid(dt: number, out: (x: number, y: number[]) => boolean | void): OutputFunction;
  }
}
