/**
 * A typed door to the odex package (E. Hairer & G. Wanner's ODEX: Gragg–Bulirsch–Stoer extrapolation with
 * dense output, Hairer, Nørsett & Wanner, Solving Ordinary Differential Equations I, 2nd ed., 1993, §II.9),
 * for one scalar equation dy/dx = f(x, y) with output at chosen stations.
 *
 * The package itself is loaded through src/core/odex.ts.
 */
import { NumericalError } from '../../core/errors.js';
import { Outcome, Solver } from '../../core/odex.js';

const converged = Outcome.Converged;
const maxStepsExceeded = Outcome.MaxStepsExceeded;

export interface ScalarIntegration {
  /** y at each requested station reached, in the order given */
  outputs: Array<{ x: number; y: number }>;
  /** the last accepted point */
  end: { x: number; y: number };
  /** set when `accept` refused a step: the last good point is `end`, the refused one is `refusedAt` */
  stopped?: { reason: string; refusedAt: number };
  steps: number;
  evaluations: number;
}

export interface ScalarIntegrationOptions {
  relativeTolerance: number;
  absoluteTolerance: number;
  maxSteps: number;
  /** stations to report, ordered in the direction of integration, each between x0 and xEnd */
  stations: readonly number[];
  /** called at every accepted step; a string stops the integration with that reason */
  accept?: (x: number, y: number) => string | undefined;
  what: string;
}

/** Integrate dy/dx = f(x, y) from (x0, y0) to xEnd (either direction) with dense output at the stations. */
export function integrateScalar(
  f: (x: number, y: number) => number,
  x0: number,
  y0: number,
  xEnd: number,
  options: ScalarIntegrationOptions,
): ScalarIntegration {
  const solver = new Solver(1);
  solver.denseOutput = true;
  solver.relativeTolerance = options.relativeTolerance;
  solver.absoluteTolerance = options.absoluteTolerance;
  solver.maxSteps = options.maxSteps;
  const direction = xEnd >= x0 ? 1 : -1;
  const outputs: Array<{ x: number; y: number }> = [];
  let next = 0;
  const stations = options.stations;
  let end = { x: x0, y: y0 };
  let stopped: ScalarIntegration['stopped'];
  let badValue: string | undefined;
  const run = solver.solve(
    (x, y) => {
      const value = f(x, y[0]!);
      if (!Number.isFinite(value)) {
        badValue ??= `${options.what}: the slope is not finite at x = ${x}, y = ${y[0]}`;
        return [0];
      }
      return [value];
    },
    x0,
    [y0],
    xEnd,
    (nr, xOld, x, y, dense) => {
      const yNew = y[0]!;
      if (badValue !== undefined) return false;
      const refusal = nr === 1 ? undefined : options.accept?.(x, yNew);
      if (refusal !== undefined || !Number.isFinite(yNew)) {
        stopped = { reason: refusal ?? `${options.what}: the depth is not finite`, refusedAt: x };
        return false;
      }
      while (next < stations.length && (stations[next]! - x) * direction <= 0) {
        const xs = stations[next]!;
        const ys = xs === x || dense === undefined || nr === 1 ? yNew : dense(0, xs);
        outputs.push({ x: xs, y: ys });
        next++;
      }
      end = { x, y: yNew };
      return undefined;
    },
  );
  if (badValue !== undefined) throw new NumericalError(badValue);
  if (stopped === undefined && run.outcome === maxStepsExceeded) {
    throw new NumericalError(`${options.what}: odex took more than ${options.maxSteps} steps between ${x0} and ${xEnd}, stopping at x = ${end.x}`);
  }
  if (stopped === undefined && run.outcome !== converged) {
    throw new NumericalError(`${options.what}: odex stopped early (outcome ${run.outcome}) at x = ${end.x}`);
  }
  return { outputs, end, ...(stopped ? { stopped } : {}), steps: run.nStep, evaluations: run.nEval };
}
