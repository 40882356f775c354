/**
 * Rating tables: stage (water-surface elevation) and velocity at chosen stations for a list of discharges,
 * each discharge computed as a flow of the model through the profile engine with the model's own controls.
 * The stations are read off each profile by straight lines between output stations (sample.ts).
 *
 * With a fixed-stage downstream control the stage there does not change with discharge (it is imposed);
 * a rating that means something comes from a control that follows the flow (normal or critical depth, a
 * structure or a downstream rating curve).
 */
import { InputError, type Problem } from '../core/errors.js';
import type { Model } from '../input/model/types.js';
import type { Regime } from '../results/types.js';
import { type ModelRun, type RunOptions, runModel } from '../run.js';
import * as say from './messages.js';
import { sampleProfile, stationRange } from './sample.js';

export interface RatingValue {
  station: number;
  stage: number;
  depth: number;
  velocity: number;
  regime: Regime;
}

export interface RatingRow {
  discharge: number;
  values: RatingValue[];
}

export interface RatingTable {
  units: Model['units'];
  stations: number[];
  rows: RatingRow[];
  /** the model's downstream control, in words, for the table's heading */
  downstreamControl: string;
  warnings: string[];
  run: ModelRun;
}

export interface RatingOptions {
  readonly run?: Omit<RunOptions, 'adjustInput' | 'compare'>;
  /** where the stations came from, for messages (default "--stations") */
  readonly stationsWhere?: string;
}

/** The id a discharge's flow gets in the rating run. */
export const ratingFlowId = (discharge: number) => `Q=${discharge}`;

function controlWords(model: Model): string {
  const d = model.boundaries.downstream;
  if (d === undefined) return 'left to the engine';
  switch (d.type) {
    case 'stage':
      return `stage ${d.elevation}`;
    case 'depth':
      return `depth ${d.depth}`;
    default:
      return `${d.type} depth`;
  }
}

/** Stage and velocity at `stations` for each of `discharges` (in the order given). */
export function ratingTable(model: Model, stations: readonly number[], discharges: readonly number[], options: RatingOptions = {}): RatingTable {
  const flows = discharges.map((q) => ({ id: ratingFlowId(q), discharge: q }));
  const run = runModel({ ...model, flows }, { ...options.run });
  const where = options.stationsWhere ?? '--stations';
  const problems: Problem[] = [];
  const first = run.result.flows[0];
  const range = first === undefined ? null : stationRange(first);
  for (const x of stations) {
    if (range !== null && (x < range[0] || x > range[1])) problems.push({ where, message: say.stationOutside(x, range[0], range[1]), value: x });
  }
  if (problems.length > 0) throw new InputError(problems);
  const warnings: string[] = [];
  if (model.boundaries.downstream?.type === 'stage' || model.boundaries.downstream?.type === 'depth') {
    warnings.push(`the downstream control is a fixed ${model.boundaries.downstream.type} for every discharge: stages near the downstream end reflect it, not the channel`);
  }
  const rows = run.result.flows.map((flow): RatingRow => ({
    discharge: flow.discharge,
    values: stations.flatMap((x) => {
      const s = sampleProfile(flow, x);
      return s === null ? [] : [{ station: x, stage: s.wsel, depth: s.depth, velocity: s.velocity, regime: s.regime }];
    }),
  }));
  for (const flow of run.result.flows) for (const w of flow.warnings) warnings.push(`${flow.id}: ${w}`);
  return { units: model.units, stations: [...stations], rows, downstreamControl: controlWords(model), warnings, run };
}
