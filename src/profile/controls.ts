/**
 * Controls: which depth starts which profile (Chow 1959, §9-3 "control sections"; Henderson 1966, §4.3).
 * Subcritical flow is controlled from downstream and computed upstream; supercritical flow is controlled
 * from upstream and computed downstream, whatever order the boundaries were written in. A boundary the
 * regime does not need is ignored with a note; one that cannot hold is replaced, with the reason.
 * Internally, a break from a mild, critical, horizontal or adverse reach into a steep one passes the flow
 * through critical depth, unless the subcritical profile from downstream drowns the break.
 */
import { InputError } from '../core/errors.js';
import type { ControlRecord, SlopeClass } from '../results/types.js';
import type { ReachClass } from './classify.js';
import type { Boundary } from './types.js';

export interface EndInfo {
  readonly reach: ReachClass;
  readonly bedElevation: number;
  readonly station: number;
  /** the section's depth limit (crown), Infinity when open */
  readonly maxDepth: number;
  /** formats a length for messages */
  readonly show: (value: number) => string;
}

export interface EndStart {
  /** the depth the profile starts with (null: this end does not start one) */
  readonly depth: number | null;
  readonly record: ControlRecord;
  readonly notes: string[];
  readonly warnings: string[];
}

const where = { upstream: 'boundaries.upstream', downstream: 'boundaries.downstream' } as const;

function describe(boundary: Boundary): string {
  switch (boundary.type) {
    case 'depth':
      return `depth ${boundary.depth}`;
    case 'stage':
      return `stage ${boundary.elevation}`;
    case 'normal':
      return 'normal depth';
    case 'critical':
      return 'critical depth';
  }
}

/** The depth a boundary asks for at an end, checked against the section. */
export function boundaryDepth(boundary: Boundary, end: EndInfo, side: 'upstream' | 'downstream'): number {
  const path = where[side];
  switch (boundary.type) {
    case 'depth': {
      const y = boundary.depth;
      if (!(Number.isFinite(y) && y > 0)) throw new InputError({ where: `${path}.depth`, message: 'the depth must be a number > 0', value: y });
      if (y > end.maxDepth) {
        throw new InputError({ where: `${path}.depth`, message: `the depth is above the top of the section (${end.show(end.maxDepth)})`, value: y });
      }
      return y;
    }
    case 'stage': {
      const y = boundary.elevation - end.bedElevation;
      if (!Number.isFinite(y) || y <= 0) {
        throw new InputError({
          where: `${path}.elevation`,
          message: `the stage must lie above the bed elevation there (${end.show(end.bedElevation)})`,
          value: boundary.elevation,
        });
      }
      if (y > end.maxDepth) {
        throw new InputError({ where: `${path}.elevation`, message: `the stage is above the top of the section there`, value: boundary.elevation });
      }
      return y;
    }
    case 'normal': {
      if (end.reach.normalDepth === null) {
        throw new InputError({
          where: path,
          message: `normal depth does not exist on a ${end.reach.slopeClass} reach; give a depth, a stage or critical depth`,
          value: 'normal',
        });
      }
      return end.reach.normalDepth;
    }
    case 'critical':
      return end.reach.criticalDepth;
  }
}

const nonSteep: ReadonlySet<SlopeClass> = new Set(['mild', 'critical', 'horizontal', 'adverse']);

/** The start of the subcritical profile at the downstream end of the channel. */
export function downstreamStart(boundary: Boundary | undefined, end: EndInfo): EndStart {
  const { reach, station, show } = end;
  const yc = reach.criticalDepth;
  const notes: string[] = [];
  const warnings: string[] = [];
  const record = (depth: number | null, status: ControlRecord['status'], reason: string): EndStart => ({
    depth,
    record: { station, kind: 'downstream boundary', depth, regime: depth === null ? null : depth > yc ? 'subcritical' : 'critical', status, reason },
    notes,
    warnings,
  });
  if (boundary === undefined) {
    if (reach.slopeClass === 'steep') {
      notes.push(`No downstream boundary: none is needed where supercritical flow leaves a steep reach (station ${show(station)}).`);
      return record(null, 'ignored', 'none given; not needed for supercritical outflow');
    }
    if (reach.normalDepth !== null && (reach.slopeClass === 'mild' || reach.slopeClass === 'critical')) {
      notes.push(`No downstream boundary given: normal depth ${show(reach.normalDepth)} assumed at station ${show(station)}.`);
      return record(reach.normalDepth, 'used', 'none given: normal depth assumed');
    }
    notes.push(`No downstream boundary given on a ${reach.slopeClass} reach: critical depth (a free overfall) assumed at station ${show(station)}.`);
    return record(yc, 'used', 'none given: critical depth (free overfall) assumed');
  }
  const y = boundaryDepth(boundary, end, 'downstream');
  const what = describe(boundary);
  if (reach.slopeClass === 'steep') {
    if (y > yc) return record(y, 'used', `${what}: subcritical tailwater on a steep reach (a jump may form upstream)`);
    notes.push(
      `Downstream boundary (${what}) ignored: at or below critical depth on a steep reach it is not a control; the supercritical flow leaving is set from upstream.`,
    );
    return record(null, 'ignored', `${what} is not subcritical; supercritical outflow needs no downstream control`);
  }
  if (y < yc && nonSteep.has(reach.slopeClass)) {
    warnings.push(
      `Downstream boundary (${boundary.type === 'depth' ? what : `${what}, depth ${show(y)}`}) cannot hold: it is below critical depth ${show(yc)} at the end of a ${reach.slopeClass} reach, ` +
        'so the flow passes through critical depth there (as at a free overfall); critical depth is used instead.',
    );
    return record(yc, 'replaced', `${what} lies below critical depth; critical depth used`);
  }
  return record(y, 'used', what);
}

/**
 * The start of the supercritical profile at the upstream end of the channel. `subcriticalDepth` is the depth
 * the subcritical profile from downstream gives there (null where it does not reach).
 */
export function upstreamStart(boundary: Boundary | undefined, end: EndInfo, subcriticalDepth: number | null): EndStart {
  const { reach, station, show } = end;
  const yc = reach.criticalDepth;
  const notes: string[] = [];
  const warnings: string[] = [];
  const record = (depth: number | null, status: ControlRecord['status'], reason: string): EndStart => ({
    depth,
    record: { station, kind: 'upstream boundary', depth, regime: depth === null ? null : depth < yc ? 'supercritical' : 'critical', status, reason },
    notes,
    warnings,
  });
  const computed = subcriticalDepth === null ? '' : ` (the profile from downstream gives ${show(subcriticalDepth)} there)`;
  if (boundary === undefined) {
    if (subcriticalDepth !== null) return record(null, 'ignored', 'none given; subcritical flow is controlled from downstream');
    notes.push(
      `No upstream boundary, and no subcritical profile reaches the upstream end: critical depth assumed there (inflow from a pool), station ${show(station)}.`,
    );
    return record(yc, 'used', 'none given: critical depth at the entrance assumed');
  }
  const y = boundaryDepth(boundary, end, 'upstream');
  const what = describe(boundary);
  if (y < yc) return record(y, 'used', `${what}: supercritical inflow`);
  if (boundary.type === 'critical' || boundary.type === 'normal') {
    if (reach.slopeClass === 'steep' || reach.slopeClass === 'critical') {
      return record(boundary.type === 'critical' ? yc : y, 'used', `${what} at the entrance of a ${reach.slopeClass} reach`);
    }
  }
  if (subcriticalDepth !== null) {
    notes.push(`Upstream boundary (${what}) ignored: the flow there is subcritical, so it is controlled from downstream${computed}.`);
    return record(null, 'ignored', `subcritical flow is controlled from downstream${computed}`);
  }
  warnings.push(
    `Upstream boundary (${boundary.type === 'depth' ? what : `${what}, depth ${show(y)}`}) cannot hold: it is above critical depth at the entrance of a steep reach with no backwater reaching it; ` +
      'the flow enters through critical depth, which is used instead.',
  );
  return record(yc, 'replaced', `${what} above critical depth on a steep reach without backwater; critical depth used`);
}

/**
 * The subcritical start at the downstream end of reach `upstream`, at a break, given the depth arriving from the
 * reach below (null: no subcritical flow arrives). A break from a non-steep reach passes through critical
 * depth unless the arriving profile drowns it.
 */
export function breakStart(upstream: ReachClass, arriving: number | null): { depth: number | null; critical: boolean } {
  const yc = upstream.criticalDepth;
  if (arriving !== null && arriving > yc) return { depth: arriving, critical: false };
  if (nonSteep.has(upstream.slopeClass)) return { depth: yc, critical: true };
  return { depth: null, critical: false };
}
