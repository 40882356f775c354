/**
 * Specific-energy and specific-force diagrams side by side for one station and flow, depth upwards on both.
 * The caller samples the curves (the hydraulics layer computes them); this module only draws them and reads
 * values off them by straight-line interpolation in depth, so the output layer stays free of hydraulics.
 * Marked: critical depth, the flow depth with its alternate depth (equal energy, left panel) and its sequent
 * depth (equal force, right panel).
 */
import type { TopLevelSpec } from 'vega-lite';
import type { UnitSystem } from '../../core/units.js';
import { chartConfig, dash, font, palette, size, stroke, words, lengthUnit } from './style.js';
import { extent, interpolate, isFiniteNumber, padded, r } from './series.js';

export interface CurvePoint {
  depth: number;
  value: number;
}

export interface EnergyForceInput {
  units: UnitSystem;
  /** specific energy E(y), sampled in depth */
  energy: readonly CurvePoint[];
  /** specific force M(y), sampled in depth */
  force: readonly CurvePoint[];
  criticalDepth?: number;
  flowDepth?: number;
  alternateDepth?: number | null;
  sequentDepth?: number | null;
  flow?: string;
  station?: number;
  discharge?: number;
  title?: string;
  /** size of each of the two panels, CSS pixels */
  panelWidth?: number;
  panelHeight?: number;
}

function valueAt(curve: readonly CurvePoint[], depth: number): number | null {
  const pts = [...curve].filter((p) => isFiniteNumber(p.depth) && isFiniteNumber(p.value)).sort((a, b) => a.depth - b.depth);
  if (pts.length === 0 || depth < pts[0]!.depth || depth > pts[pts.length - 1]!.depth) return null;
  return interpolate(pts.map((p) => ({ x: p.depth, y: p.value })), depth);
}

interface Mark {
  depth: number;
  value: number;
  label: string;
  kind: 'flow' | 'partner' | 'critical';
}

function panel(
  name: 'energy' | 'force',
  curve: readonly CurvePoint[],
  input: EnergyForceInput,
  partner: number | null | undefined,
  partnerWord: string,
  axisTitle: string,
  yDomain: [number, number],
  width: number,
  height: number,
): unknown {
  const u = lengthUnit(input.units);
  const rows = curve.filter((p) => isFiniteNumber(p.depth) && isFiniteNumber(p.value)).map((p) => ({ depth: r(p.depth), value: r(p.value) }));
  rows.sort((a, b) => a.depth - b.depth);
  const xr = extent(rows.map((p) => p.value)) ?? [0, 1];
  const xDomain: [number, number] = [r(Math.max(0, xr[0] - 0.05 * (xr[1] - xr[0]))), r(xr[1])];
  const marks: Mark[] = [];
  const add = (depth: number | null | undefined, label: string, kind: Mark['kind']) => {
    if (!isFiniteNumber(depth)) return;
    const v = valueAt(curve, depth);
    if (v !== null) marks.push({ depth: r(depth), value: r(v), label: `${label} ${depth.toFixed(3)} ${u}`, kind });
  };
  add(input.flowDepth, 'y =', 'flow');
  add(partner, `${partnerWord} =`, 'partner');
  add(input.criticalDepth, 'yc =', 'critical');
  const pair = marks.filter((m) => m.kind !== 'critical');
  const layer: unknown[] = [
    {
      name: `${name}-curve`,
      data: { values: rows },
      mark: { type: 'line', strokeWidth: stroke.water, color: palette.water[0], strokeCap: 'round' },
      encoding: {
        x: { field: 'value', type: 'quantitative', title: axisTitle, scale: { domain: xDomain, nice: false, zero: false } },
        y: { field: 'depth', type: 'quantitative', title: words.depthAxis(input.units), scale: { domain: yDomain, nice: false, zero: false } },
        order: { field: 'depth' },
      },
    },
  ];
  if (isFiniteNumber(input.criticalDepth)) {
    layer.push({
      name: `${name}-critical`,
      data: { values: [{ depth: r(input.criticalDepth) }] },
      mark: { type: 'rule', color: palette.critical[0], strokeDash: [...dash.critical], strokeWidth: stroke.critical },
      encoding: { y: { field: 'depth', type: 'quantitative' } },
    });
  }
  if (pair.length === 2) {
    // equal energy (or force) at both depths: the pair lies on one vertical line
    layer.push({
      name: `${name}-pair`,
      data: { values: [{ value: pair[0]!.value, depth: pair[0]!.depth, depth2: pair[1]!.depth }] },
      mark: { type: 'rule', color: palette.jump, strokeDash: [5, 3], strokeWidth: 1.4 },
      encoding: { x: { field: 'value', type: 'quantitative' }, y: { field: 'depth', type: 'quantitative' }, y2: { field: 'depth2' } },
    });
  }
  if (marks.length) {
    layer.push(
      {
        name: `${name}-points`,
        data: { values: marks },
        mark: { type: 'point', filled: true, size: 60, color: palette.jump },
        encoding: { x: { field: 'value', type: 'quantitative' }, y: { field: 'depth', type: 'quantitative' } },
      },
      {
        name: `${name}-labels`,
        data: { values: marks },
        mark: { type: 'text', align: 'left', dx: 7, dy: -7, fontSize: font.annotationSize, color: palette.text },
        encoding: { x: { field: 'value', type: 'quantitative' }, y: { field: 'depth', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  return {
    name,
    title: { text: name === 'energy' ? words.alternate : words.sequent, fontSize: font.axisTitleSize },
    width,
    height,
    layer,
  };
}

export function energyForceChart(input: EnergyForceInput): TopLevelSpec {
  const pw = input.panelWidth ?? size.energyForcePanel.width;
  const ph = input.panelHeight ?? size.energyForcePanel.height;
  const depths = extent([...input.energy.map((p) => p.depth), ...input.force.map((p) => p.depth)]) ?? [0, 1];
  const yDomain = padded([Math.max(0, depths[0]), depths[1]], 0, 0.02).map((v, i) => (i === 0 ? Math.max(0, v) : v)) as [number, number];
  const where = [input.flow ? `flow ${input.flow}` : '', isFiniteNumber(input.station) ? `station ${input.station} ${lengthUnit(input.units)}` : ''].filter(Boolean).join(', ');
  const title = input.title ?? (where ? `${words.energyForceTitle}, ${where}` : words.energyForceTitle);
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: 'gvf specific energy and specific force',
    title: { text: title, limit: 2 * pw + 120, subtitle: isFiniteNumber(input.discharge) ? `Discharge ${input.discharge} ${input.units === 'US' ? 'ft³/s' : 'm³/s'}` : ' ' },
    config: chartConfig(),
    autosize: { type: 'pad' },
    spacing: 36,
    hconcat: [
      panel('energy', input.energy, input, input.alternateDepth, 'alternate', words.energyAxis(input.units), [r(yDomain[0]), r(yDomain[1])], pw, ph),
      panel('force', input.force, input, input.sequentDepth, 'sequent', words.forceAxis(input.units), [r(yDomain[0]), r(yDomain[1])], pw, ph),
    ],
  };
  return spec as unknown as TopLevelSpec;
}
