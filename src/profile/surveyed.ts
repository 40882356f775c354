/**
 * The standard step node to node through a surveyed (non-prismatic) reach (Chow 1959 §10-3 and §10-4;
 * Henderson 1966 §4.4): between sections 1 and 2 the energy equation
 *   z2 + y2 + α2V2²/2g = z1 + y1 + α1V1²/2g ± (S̄f·L + he),
 * with each section's own geometry, α and bed elevation, S̄f from the chosen mean of the two sections' friction
 * slopes, L the flow length, and the eddy loss he = C·|Δ(αV²/2g)|: the contraction coefficient when the
 * velocity head increases downstream, the expansion coefficient when it decreases. Defaults 0.1 and 0.3, the
 * usual values for gradual transitions (common practice; e.g. Chow 1959 §10-4 discusses such values).
 *
 * Where no depth on the flow's branch balances a step, the section is set to its critical depth, as careful
 * practice does, and the run stops there (the engine decides from the other regime's profile what lies beyond:
 * a jump, or a control; where nothing does, it warns).
 */
import { HydraulicError } from '../core/errors.js';
import type { FrictionAveraging, SurveyNode } from './types.js';
import { pointState, type PointState } from './energy.js';
import { energyStep } from './standardStep.js';
import type { FlowRegime, StretchSpec } from './stretch.js';

/**
 * The energy balance into a surveyed section needs a water surface above the section's lower end point: the
 * section must be extended (it is never extrapolated). `station` is the node's, in the engine's stationing.
 */
export class SectionTopReached extends HydraulicError {
  readonly station: number;
  /** the depth of the section's lower end point above its lowest point */
  readonly maxDepth: number;
  constructor(station: number, maxDepth: number) {
    super(
      `the water surface at station ${station} would rise above the lower end point of its section (depth ${maxDepth} above the lowest point): ` +
        'the section must be extended',
    );
    this.station = station;
    this.maxDepth = maxDepth;
  }
}

export const defaultContraction = 0.1;
export const defaultExpansion = 0.3;

export interface SurveyedRun {
  /** depths at the nodes in the order given, up to and including a node set to critical depth */
  readonly depths: number[];
  /** the balanced state at each depth (the start's too), so results need not evaluate them again; none for a node set to critical depth */
  readonly states: PointState[];
  /** the node set to critical depth because no depth on the branch balanced the step into it */
  readonly setToCritical?: number;
  readonly steps: number;
}

/** Flow length from node u to the next node downstream. */
export function flowLength(nodes: readonly SurveyNode[], u: number): number {
  const a = nodes[u]!;
  return a.reachLength ?? nodes[u + 1]!.station - a.station;
}

/** The eddy loss between an upstream and a downstream state, with the upstream node's coefficients. */
export function eddyLoss(node: SurveyNode, upstream: PointState, downstream: PointState): number {
  const dh = downstream.velocityHead - upstream.velocityHead;
  return dh > 0 ? (node.contraction ?? defaultContraction) * dh : (node.expansion ?? defaultExpansion) * -dh;
}

/** The energy balance into node `node` from its neighbour, as a StretchSpec of two stations 0 and `delta`. */
class NodeStep implements StretchSpec {
  hs: StretchSpec['hs'];
  slope = 0;
  readonly stations: [number, number] = [0, 0];
  startDepth = 0;
  tolerance = 0;
  readonly normalDepth = null;
  readonly lazyCritical: boolean;
  private node = 0;
  /** the upstream node of the current interval, and whether the step runs downstream (the eddy loss needs both) */
  private upstream: SurveyNode;
  private downstreamward = false;
  /** the eddy loss between the known state and a trial one, for the current interval (one function for the run) */
  readonly eddy = (known: PointState, trial: PointState): number =>
    this.downstreamward ? eddyLoss(this.upstream, known, trial) : eddyLoss(this.upstream, trial, known);
  constructor(
    private readonly nodes: readonly SurveyNode[],
    private readonly critical: (node: number) => number,
    readonly regime: FlowRegime,
    readonly discharge: number,
    readonly averaging: FrictionAveraging,
  ) {
    this.hs = nodes[0]!.section;
    this.upstream = nodes[0]!;
    this.lazyCritical = regime === 'subcritical';
  }
  moveTo(node: number, upstream: number, slope: number, delta: number, startDepth: number, tolerance: number): void {
    this.node = node;
    this.upstream = this.nodes[upstream]!;
    this.downstreamward = delta > 0;
    this.hs = this.nodes[node]!.section;
    this.slope = slope;
    this.stations[1] = delta;
    this.startDepth = startDepth;
    this.tolerance = tolerance;
  }
  /** worked out on first read (see energyStep), kept by the caller's critical(node) */
  get criticalDepth(): number {
    return this.critical(this.node);
  }
}

/**
 * Run through the nodes `order` (indices, each next to the previous one), from `startDepth` at the first.
 * Subcritical runs go upstream (decreasing index), supercritical downstream. `critical(j)` gives node j's critical
 * depth; it is asked only where a step needs it (a step whose solution is not clearly on its branch, and a node
 * set to critical depth), so a long run computes few critical depths.
 */
export function surveyedStretch(
  nodes: readonly SurveyNode[],
  critical: (node: number) => number,
  order: readonly number[],
  startDepth: number,
  regime: FlowRegime,
  discharge: number,
  averaging: FrictionAveraging,
  tolerance: (node: number) => number,
): SurveyedRun {
  const first = order[0]!;
  let known = pointState(nodes[first]!.section, startDepth, discharge);
  const depths = [startDepth];
  const states = [known];
  const subcritical = regime === 'subcritical';
  // one spec for the whole run, moved from step to step (a new object per step, with critical depth read through
  // an accessor, cost more than the step's own arithmetic on a long survey)
  const spec = new NodeStep(nodes, critical, regime, discharge, averaging);
  for (let k = 1; k < order.length; k++) {
    const a = order[k - 1]!;
    const b = order[k]!;
    const u = Math.min(a, b);
    const d = Math.max(a, b);
    const length = flowLength(nodes, u);
    const delta = b > a ? length : -length;
    spec.moveTo(b, u, (nodes[u]!.bedElevation - nodes[d]!.bedElevation) / length, delta, known.depth, tolerance(b));
    // the next depth guessed by carrying on the last change (a survey's nodes are close: the change is smooth). Only
    // on the subcritical branch: in a compound section the supercritical residual need not be monotone (α varies),
    // and a bracket near a carried-on guess can then find a depth the whole-branch search rules out, so that run
    // keeps the known depth as its guess (and the search it always had)
    const guess = subcritical && k >= 2 ? Math.max(known.depth + (known.depth - depths[k - 2]!), 0.5 * known.depth) : known.depth;
    const outcome = energyStep(spec, 0, known, delta, guess, spec.eddy);
    if (outcome.stop?.reason === 'full') throw new SectionTopReached(nodes[b]!.station, nodes[b]!.section.section.maxDepth);
    if (!outcome.state) {
      depths.push(critical(b));
      return { depths, states, setToCritical: b, steps: k };
    }
    known = outcome.state;
    depths.push(known.depth);
    states.push(known);
  }
  return { depths, states, steps: order.length - 1 };
}
