/**
 * INVENTED test fixtures for the output layer. Nothing here is computed by gvf or taken from a real place:
 * the numbers are made up to look like a two-reach channel (a steep lined chute onto a mild reach) with a
 * hydraulic jump on the chute and a culvert at the downstream end, so every chart layer has something to draw.
 * Depth curves are simple invented functions, not solutions of the flow equations.
 */
import type { FlowResult, RunResult, StationResult } from '../../src/results/types.js';
import type { ReportInputs } from '../../src/output/report/html.js';

const G = 9.80665;
const WIDTH = 3; // invented rectangular channel, 3 m wide
const BED_AT_BREAK = 50.224; // invented
const STEEP = 0.012;
const MILD = 0.0008;

function bedAt(x: number): number {
  return x <= 120 ? BED_AT_BREAK + (120 - x) * STEEP : BED_AT_BREAK - (x - 120) * MILD;
}

/** invented depth shape: a drawdown on the chute, a jump at 80 m, a rise to the break, then a backwater curve */
function depthAt(x: number, side: 'up' | 'down', scale: number): number {
  if (x < 80 || (x === 80 && side === 'up')) return scale * (0.46 + 0.282 * Math.exp(-x / 15));
  if (x <= 120) return scale * (1.12 + 0.9 * (x - 80) * STEEP);
  return scale * (1.2 + 0.7 * Math.exp(-(400 - x) / 407));
}

function station(x: number, side: 'up' | 'down', q: number, scale: number, yc: number, yn: number | null): StationResult {
  const depth = depthAt(x, side, scale);
  const bed = bedAt(x);
  const v = q / (WIDTH * depth);
  const froude = v / Math.sqrt(G * depth);
  return {
    station: x,
    bedElevation: bed,
    depth,
    wsel: bed + depth,
    energyElevation: bed + depth + (v * v) / (2 * G),
    velocity: v,
    froude,
    regime: froude > 1 ? 'supercritical' : 'subcritical',
    reach: x < 120 ? 'chute' : 'lower',
    criticalDepth: yc,
    normalDepth: yn,
    leftBank: bed + 2.2,
    rightBank: x < 300 ? bed + 2.2 : bed + 1.95,
  };
}

function flow(id: string, q: number, scale: number): FlowResult {
  const yc = Math.cbrt((q / WIDTH) ** 2 / G);
  const ynChute = 0.46 * scale;
  const ynLower = 1.2 * scale;
  const stations: StationResult[] = [];
  for (let x = 0; x <= 400; x += 10) {
    const yn = x < 120 ? ynChute : ynLower;
    if (x === 80) stations.push(station(x, 'up', q, scale, yc, yn));
    stations.push(station(x, 'down', q, scale, yc, yn));
  }
  const y1 = depthAt(80, 'up', scale);
  const y2 = depthAt(80, 'down', scale);
  const fr1 = q / WIDTH / Math.sqrt(G * y1 ** 3);
  return {
    id,
    discharge: q,
    stations,
    reaches: [
      { id: 'chute', from: 0, to: 120, slopeClass: 'steep', normalDepth: ynChute, criticalDepth: yc, profiles: [{ type: 'S2', from: 0, to: 80 }, { type: 'S1', from: 80, to: 120 }] },
      { id: 'lower', from: 120, to: 400, slopeClass: 'mild', normalDepth: ynLower, criticalDepth: yc, profiles: [{ type: 'M1', from: 120, to: 400 }] },
    ],
    jumps: [{ station: 80, upstreamDepth: y1, downstreamDepth: y2, froude: fr1, type: 'weak', length: 6.1 * y2, energyLoss: (y2 - y1) ** 3 / (4 * y1 * y2) }],
    structures: [
      { id: 'C1', type: 'culvert', station: 400, values: { controllingCase: 'inlet', headwater: 50 + depthAt(400, 'down', scale), barrelDiameter: 1.2 }, notes: ['invented result'] },
    ],
    freeboard: stations.map((s) => {
      const fl = (s.leftBank ?? 0) - s.wsel;
      const fr = (s.rightBank ?? 0) - s.wsel;
      return { station: s.station, wsel: s.wsel, energyElevation: s.energyElevation, leftBank: s.leftBank, rightBank: s.rightBank, freeboardLeft: fl, freeboardRight: fr, required: 0.3, pass: Math.min(fl, fr) >= 0.3, overtopped: Math.min(fl, fr) < 0 };
    }),
    warnings: id === '100-year' ? ['invented warning: the right bank is overtopped near the culvert'] : [],
  };
}

/** An invented run: two flows through the invented two-reach channel. */
export function twoReachRun(title = 'Invented test channel (not a real place)'): RunResult {
  return {
    title,
    units: 'SI',
    method: 'standard-step',
    flows: [flow('10-year', 6, 1), flow('100-year', 9, 1.2)],
    cautions: ['Invented fixture caution: results are a screening aid.'],
  };
}

/** Inputs echoed in the report, matching the invented run. */
export function twoReachInputs(): ReportInputs {
  return {
    sections: [{ id: 'lined-rect', rows: [{ label: 'Shape', value: 'rectangular' }, { label: 'Bottom width', value: 3, unit: 'm' }, { label: "Manning's n", value: 0.015 }] }],
    reaches: [
      { id: 'chute', rows: [{ label: 'Section', value: 'lined-rect' }, { label: 'Length', value: 120, unit: 'm' }, { label: 'Slope', value: 0.012 }] },
      { id: 'lower', rows: [{ label: 'Section', value: 'lined-rect' }, { label: 'Length', value: 280, unit: 'm' }, { label: 'Slope', value: 0.0008 }] },
    ],
    structures: [{ id: 'C1', rows: [{ label: 'Type', value: 'culvert' }, { label: 'Station', value: 400, unit: 'm' }, { label: 'Barrel', value: 'circular, 1.2 m' }] }],
    boundaries: [
      { id: 'upstream', rows: [{ label: 'Type', value: 'critical' }] },
      { id: 'downstream', rows: [{ label: 'Type', value: 'structure C1' }] },
    ],
    flows: [
      { id: '10-year', rows: [{ label: 'Discharge', value: 6, unit: 'm³/s' }] },
      { id: '100-year', rows: [{ label: 'Discharge', value: 9, unit: 'm³/s' }] },
    ],
  };
}

/** An invented compound earthen section (offsets and elevations made up), with floodplain zones. */
export function inventedCompoundSection(): import('../../src/output/charts/sectionChart.js').SectionChartInput {
  return {
    units: 'SI',
    sectionId: 'XS-7 (invented)',
    station: 250,
    ground: [[0, 53.2], [6, 52.6], [14, 52.3], [18, 51.1], [20, 50.2], [24, 50.1], [26, 51.0], [30, 52.2], [40, 52.5], [46, 53.4]],
    waterLevels: [{ flow: '10-year', wsel: 51.85 }, { flow: '100-year', wsel: 52.45 }],
    banks: { left: 18, right: 26 },
    zones: [{ from: 0, to: 18, n: 0.05 }, { from: 18, to: 26, n: 0.03 }, { from: 26, to: 46, n: 0.045 }],
  };
}

/**
 * Specific energy and specific force curves of the invented 3 m rectangle at 6 m³/s, from the closed forms
 * E = y + q²/(2 g y²) and M = b (q²/(g y) + y²/2) (Chow 1959, Open-Channel Hydraulics, §3-2 and §3-6),
 * sampled in depth, with the critical depth (q²/g)^(1/3) and the alternate and sequent depths of y = 0.5 m
 * found by bisection on the closed forms.
 */
export function rectangleEnergyForce(): import('../../src/output/charts/energyForceChart.js').EnergyForceInput {
  const q = 6 / WIDTH;
  const E = (y: number) => y + (q * q) / (2 * G * y * y);
  const M = (y: number) => WIDTH * ((q * q) / (G * y) + (y * y) / 2);
  const yc = Math.cbrt((q * q) / G);
  const bisect = (f: (y: number) => number, lo: number, hi: number) => {
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (Math.sign(f(mid)) === Math.sign(f(lo))) lo = mid;
      else hi = mid;
    }
    return (lo + hi) / 2;
  };
  const y1 = 0.5;
  const alt = bisect((y) => E(y) - E(y1), yc, 10);
  const seq = bisect((y) => M(y) - M(y1), yc, 10);
  const depths = Array.from({ length: 120 }, (_, i) => 0.3 + (i * 2.2) / 119);
  return {
    units: 'SI',
    flow: '10-year',
    station: 80,
    discharge: 6,
    energy: depths.map((y) => ({ depth: y, value: E(y) })),
    force: depths.map((y) => ({ depth: y, value: M(y) })),
    criticalDepth: yc,
    flowDepth: y1,
    alternateDepth: alt,
    sequentDepth: seq,
  };
}
