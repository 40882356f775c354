/**
 * A reservoir or pond at the upstream end: the pool elevation is given and the discharge the channel draws
 * from it is found (Chow 1959 §11-2 "flow from a reservoir", from memory; Henderson 1966 §4.4, from memory).
 *
 * At the entrance the energy equation from the still pool (velocity head zero) to the first section gives
 *   pool − z0 = y0 + (α + ke)·V0²/2g,     ke the entrance loss coefficient (default 0).
 * - Entrance control: the most the pool can push into the channel passes the entrance at critical depth,
 *   Qc from  pool − z0 = yc + (α + ke)·Vc²/2g  (a bracketed root in Q). When the profile computed at Qc does
 *   not stand above critical depth at the entrance (a steep channel, or a free fall close below), critical
 *   depth at the entrance is the control and Q = Qc. In a rectangular channel with ke = 0 this is the closed
 *   form Q = b·√g·(2/3·E)^1.5, E = pool − z0.
 * - Downstream control: where the profile at Qc stands above critical depth at the entrance (a mild channel,
 *   or a structure or tailwater backing up to it), the downstream control sets the discharge: the Q < Qc
 *   whose computed entrance depth satisfies the energy equation above, by Brent's method on
 *   f(Q) = y0(Q) + (α + ke)·V0(Q)²/2g − (pool − z0), each f a whole-channel profile run.
 */
import { InputError, NumericalError } from '../core/errors.js';
import { brentRoot, expandUpward } from '../core/roots.js';
import { reservoirDischargeTolerance, reservoirBracketHalvings } from '../core/tolerances.js';
import { criticalDepth } from '../hydraulics/criticalDepth.js';
import { flowState } from '../hydraulics/state.js';
import type { ControlRecord, FlowResult } from '../results/types.js';
import { type ChannelInput, channelEntrance, computeChannelProfile } from './channelFlow.js';
import type { EngineOptions } from './engine.js';

export interface ReservoirSpec {
  readonly poolElevation: number;
  /** entrance loss coefficient ke, a multiple of the entrance velocity head (default 0) */
  readonly entranceLoss?: number;
}

export interface ReservoirSolution {
  readonly poolElevation: number;
  readonly entranceLoss: number;
  readonly discharge: number;
  /** 'entrance': critical depth at the entrance; 'downstream': the downstream control sets it */
  readonly fixedBy: 'entrance' | 'downstream';
  readonly criticalEntranceDischarge: number;
  readonly entranceDepth: number;
  readonly entranceVelocity: number;
  readonly entranceBedElevation: number;
  /** profile runs used by the search */
  readonly runs: number;
  /** energy residual pool − (z0 + y0 + (α + ke)V0²/2g) at the solution */
  readonly residual: number;
  readonly explanation: string;
}

function show(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

/** The energy head above the entrance bed a depth and discharge need, y + (α + ke)·V²/2g. */
function entranceHead(input: ChannelInput, depth: number, discharge: number, ke: number): number {
  const { section } = channelEntrance(input);
  const state = flowState(section, depth, discharge);
  return depth + state.velocityHead + (ke * state.velocity * state.velocity) / (2 * section.units.g);
}

/** The discharge that passes the entrance at critical depth with the pool's head. */
export function criticalEntranceDischarge(input: ChannelInput, head: number, ke: number): number {
  const { section } = channelEntrance(input);
  const f = (q: number) => entranceHead(input, criticalDepth(section, q), q, ke) - head;
  const scale = section.section.lengthScale;
  const guess = Math.sqrt(section.units.g) * scale * Math.pow(head, 1.5);
  const lo = guess * 1e-9;
  const bracket = expandUpward(f, lo, guess);
  if (!bracket) throw new NumericalError(`reservoir entrance: no discharge up to ${guess}·2^60 passes critical depth with the pool head ${head}`);
  return brentRoot(f, bracket[0], bracket[1], { xTolerance: reservoirDischargeTolerance * bracket[1], what: 'discharge at critical depth in the entrance' });
}

/**
 * The profile of a channel drawing from a pool: the discharge found as described above; the flow's own
 * `discharge` is ignored (it is the unknown). Flow changes downstream are added to the found discharge.
 */
export function computeReservoirProfile(
  input: ChannelInput,
  reservoir: ReservoirSpec,
  options: EngineOptions = {},
  runChannel: (input: ChannelInput) => FlowResult = (trial) => computeChannelProfile(trial, options),
): { result: FlowResult; solution: ReservoirSolution } {
  const entrance = channelEntrance(input);
  const ke = reservoir.entranceLoss ?? 0;
  if (!(Number.isFinite(ke) && ke >= 0 && ke <= 2)) {
    throw new InputError({ where: 'boundaries.upstream.entranceLoss', message: 'the entrance loss coefficient must lie between 0 and 2 (0.5 for a square edge is usual practice)', value: ke });
  }
  const head = reservoir.poolElevation - entrance.bedElevation;
  if (!(Number.isFinite(head) && head > 0)) {
    throw new InputError({
      where: 'boundaries.upstream.poolElevation',
      message: `the pool elevation must lie above the channel bed at the entrance (${show(entrance.bedElevation)})`,
      value: reservoir.poolElevation,
    });
  }
  const maxDepth = entrance.section.section.maxDepth;
  if (Number.isFinite(maxDepth) && entrance.section.section.closed && head > 1.5 * maxDepth) {
    throw new InputError({ where: 'boundaries.upstream.poolElevation', message: 'the pool would submerge the conduit entrance; model the entrance as a culvert', value: reservoir.poolElevation });
  }
  let runs = 0;
  const { boundaries, ...rest } = input;
  const at = (q: number, upstream: 'critical' | 'none'): FlowResult => {
    runs++;
    return runChannel({
      ...rest,
      discharge: q,
      boundaries: { ...(upstream === 'critical' ? { upstream: { type: 'critical' } } : {}), ...(boundaries.downstream ? { downstream: boundaries.downstream } : {}) },
    });
  };
  const qc = criticalEntranceDischarge(input, head, ke);
  const ycAtQc = criticalDepth(entrance.section, qc);
  const probe = at(qc, 'none');
  const y0 = probe.stations[0]!.depth;
  let q: number;
  let result: FlowResult;
  let fixedBy: ReservoirSolution['fixedBy'];
  if (!(y0 > ycAtQc * (1 + 1e-6)) || probe.stations[0]!.regime !== 'subcritical') {
    q = qc;
    fixedBy = 'entrance';
    result = at(qc, 'critical');
  } else {
    fixedBy = 'downstream';
    const f = (discharge: number) => {
      const r = at(discharge, 'none');
      return entranceHead(input, r.stations[0]!.depth, discharge, ke) - head;
    };
    let lo = qc / 2;
    let flo = f(lo);
    for (let i = 0; i < reservoirBracketHalvings && flo > 0; i++) {
      lo /= 2;
      flo = f(lo);
    }
    if (flo > 0) throw new NumericalError(`reservoir: even a discharge of ${show(lo)} needs more head at the entrance than the pool gives`);
    q = brentRoot(f, lo, qc, { xTolerance: reservoirDischargeTolerance * qc, what: 'discharge drawn from the reservoir' });
    result = at(q, 'none');
  }
  const first = result.stations[0]!;
  const residual = head - entranceHead(input, first.depth, q, ke);
  const explanation =
    fixedBy === 'entrance'
      ? `critical depth at the entrance: the channel below cannot back water up to it, so the pool drives the largest flow the entrance passes (pool − bed = yc + (α + ke)·Vc²/2g)`
      : `the downstream control backs water up to the entrance: the discharge is the one whose computed entrance depth meets the pool's energy (pool − bed = y0 + (α + ke)·V0²/2g; ${runs} profile runs, Brent's method)`;
  const solution: ReservoirSolution = {
    poolElevation: reservoir.poolElevation,
    entranceLoss: ke,
    discharge: q,
    fixedBy,
    criticalEntranceDischarge: qc,
    entranceDepth: first.depth,
    entranceVelocity: first.velocity,
    entranceBedElevation: entrance.bedElevation,
    runs,
    residual,
    explanation,
  };
  const record: ControlRecord = {
    station: entrance.station,
    kind: 'reservoir',
    depth: first.depth,
    regime: fixedBy === 'entrance' ? 'critical' : 'subcritical',
    status: 'used',
    reason: `pool at ${show(reservoir.poolElevation)}, entrance loss ke = ${show(ke)}: discharge ${show(q)} fixed by ${explanation}`,
  };
  const controls = (result.controls ?? []).filter((c) => c.kind !== 'upstream boundary');
  return {
    result: {
      ...result,
      discharge: q,
      controls: [record, ...controls],
      notes: [`Reservoir upstream (pool ${show(reservoir.poolElevation)}): the channel draws ${show(q)}, fixed by ${explanation}.`, ...(result.notes ?? []).filter((n) => !n.startsWith('No upstream boundary'))],
    },
    solution,
  };
}
