/**
 * The longitudinal profile as a Vega-Lite spec: the channel bed over a ground fill, the water surface of each
 * flow over a pale water body, the energy grade line, the critical-depth and normal-depth lines per reach
 * (elevation = bed + depth), bank or lining tops, structures at their stations, each hydraulic jump marked at
 * its toe with its roller length as a bar, and the profile type written on each stretch that can hold it.
 *
 * Pure: the data go inline as named datasets (`datasets.lines`, `.ground`, `.water`, `.structures`,
 * `.jumps`, `.labels`; `.unlabelled` lists the stretches whose label did not fit), so a user can restyle the
 * saved spec without the run.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { FlowResult, ReachResult, RunResult, StationResult } from '../../results/types.js';
import { dash, palette, pick, size, stroke, words, font, chartConfig } from './style.js';
import { SeriesKey, extent, interpolate, isFiniteNumber, padded, r } from './series.js';
import { type LabelStretch, estimatedPlot, labelFontSize, placeProfileLabels } from './profileLabels.js';

export interface ProfileStructureMark {
  id: string;
  type: string;
  station: number;
}

export interface ProfileChartOptions {
  /** whole chart size in CSS pixels (axes, legend and title included) */
  width?: number;
  height?: number;
  /** flows to draw, by id, in this order (default: every flow of the run) */
  flows?: string[];
  /** flows whose energy, critical-depth and normal-depth lines are drawn (default: every drawn flow) */
  guideFlows?: string[];
  energy?: boolean;
  critical?: boolean;
  normal?: boolean;
  banks?: boolean;
  /** structures to draw in addition to those in the flows' results (deduplicated by id) */
  structures?: ProfileStructureMark[];
  /** title above the chart, one line or several (default: the run's title and "longitudinal profile") */
  title?: string | string[];
  /** draw stations decreasing to the right (for stationing that increases upstream) */
  reverseStations?: boolean;
  /** ranges of water surface drawn as pale bands (e.g. a sensitivity envelope), in the colour of their flow */
  bands?: ProfileBand[];
  /** observed water levels (e.g. high-water marks) drawn as filled diamonds */
  observations?: ProfileObservations;
}

/** A band from `low` to `high` along the stations, for one flow; `label` is its legend words. */
export interface ProfileBand {
  flow: string;
  label: string;
  rows: { station: number; low: number; high: number }[];
}

/** Observed points with one legend entry. */
export interface ProfileObservations {
  label: string;
  points: { station: number; elevation: number; flow?: string }[];
}

export interface LineRow {
  station: number;
  elevation: number;
  series: string;
  /** one continuous piece of one line: lines never join across a gap or a reach break */
  segment: string;
  /** drawing order along the piece */
  order: number;
  flow?: string;
  reach?: string;
}

interface Piece {
  rows: LineRow[];
}

/** Splits (station, value|null) points into continuous pieces of line rows. */
function pieces(
  points: readonly { station: number; elevation: number | null | undefined }[],
  series: string,
  key: string,
  extra: { flow?: string; reach?: string },
  out: LineRow[],
): void {
  let piece = 0;
  let order = 0;
  let open = false;
  for (const p of points) {
    if (!isFiniteNumber(p.station) || !isFiniteNumber(p.elevation)) {
      if (open) piece++;
      open = false;
      continue;
    }
    open = true;
    out.push({ station: r(p.station), elevation: r(p.elevation), series, segment: `${key}#${piece}`, order: order++, ...extra });
  }
}

function stationsOfReach(flow: FlowResult, reach: ReachResult): StationResult[] {
  const lo = Math.min(reach.from, reach.to);
  const hi = Math.max(reach.from, reach.to);
  return flow.stations.filter((s) => s.station >= lo && s.station <= hi);
}

/** Depth of a guide line at a station: the station's own value when it belongs to this reach, else the reach's. */
function guideDepth(s: StationResult, reach: ReachResult, which: 'critical' | 'normal'): number | null {
  const own = s.reach === undefined || s.reach === reach.id;
  if (which === 'critical') {
    const v = own && isFiniteNumber(s.criticalDepth) ? s.criticalDepth : reach.criticalDepth;
    return isFiniteNumber(v) ? v : null;
  }
  if (own && s.normalDepth !== undefined) return isFiniteNumber(s.normalDepth) ? s.normalDepth : null;
  return isFiniteNumber(reach.normalDepth) ? reach.normalDepth : null;
}

/** Where a station sits across the chart, 0 at the left edge and 1 at the right. */
function visualFraction(station: number, domain: [number, number], reversed: boolean): number {
  const f = (station - domain[0]) / (domain[1] - domain[0] || 1);
  return reversed ? 1 - f : f;
}

function selectFlows(run: RunResult, ids: string[] | undefined): FlowResult[] {
  if (!ids) return run.flows;
  const out: FlowResult[] = [];
  for (const id of ids) {
    const f = run.flows.find((x) => x.id === id);
    if (f) out.push(f);
  }
  return out;
}

/** The key's left inset and the room each entry needs besides its words (symbol, gaps), CSS px. */
const legendInset = 40;
const legendEntryExtra = 40;

/** A jump label's height and width as fractions of the elevation range and the station range (10 px text, 900 px chart). */
const jumpLabelLine = 0.05;
const jumpLabelWidth = 0.1;

export function profileChart(run: RunResult, options: ProfileChartOptions = {}): TopLevelSpec {
  const width = options.width ?? size.profile.width;
  const height = options.height ?? size.profile.height;
  const flows = selectFlows(run, options.flows);
  const guideIds = new Set(options.guideFlows ?? flows.map((f) => f.id));
  const key = new SeriesKey();
  const lines: LineRow[] = [];

  // Bed and banks are the same for every flow: take them from the first flow that has stations.
  const base = flows.find((f) => f.stations.length > 0);
  const bedPoints = (base?.stations ?? []).map((s) => ({ x: s.station, y: s.bedElevation }));

  // Structures: from the results of every drawn flow, then any the caller adds; one mark per id.
  const structureList: ProfileStructureMark[] = [];
  for (const s of [...flows.flatMap((f) => f.structures ?? []), ...(options.structures ?? [])]) {
    if (isFiniteNumber(s.station) && !structureList.some((t) => t.id === s.id)) structureList.push({ id: s.id, type: s.type, station: s.station });
  }

  // The key, in reading order: one row per flow (its water surface and guide lines), then what all flows share.
  // Vega has no empty legend cells, so the key has as many columns as a flow has lines; rows line up
  // whenever every drawn flow has the same set.
  const guideKinds = (['energy', 'critical', 'normal'] as const).filter((k) => options[k] !== false);
  flows.forEach((flow, i) => {
    key.add(words.water(flow.id), pick(palette.water, i), dash.solid);
    if (!guideIds.has(flow.id)) return;
    if (guideKinds.includes('energy')) key.add(words.energy(flow.id), pick(palette.energy, i), dash.energy);
    if (guideKinds.includes('critical')) key.add(words.critical(flow.id), pick(palette.critical, i), dash.critical);
    if (guideKinds.includes('normal')) key.add(words.normal(flow.id), pick(palette.normal, i), dash.normal);
  });
  key.add(words.bed, palette.bed, dash.solid);
  if (options.banks !== false && base?.stations.some((s) => isFiniteNumber(s.leftBank))) key.add(words.leftBank, palette.bank, dash.leftBank);
  if (options.banks !== false && base?.stations.some((s) => isFiniteNumber(s.rightBank))) key.add(words.rightBank, palette.bank, dash.rightBank);
  if (structureList.length) key.add(words.structure, palette.structure, dash.solid);
  if (flows.some((f) => f.jumps.some((j) => isFiniteNumber(j.station)))) key.add(words.jump, palette.jump, dash.solid);
  const keyColumns = guideIds.size > 0 && guideKinds.length > 0 ? 1 + guideKinds.length : 3;
  if (base) {
    pieces(base.stations.map((s) => ({ station: s.station, elevation: s.bedElevation })), key.add(words.bed, palette.bed, dash.solid), 'bed', {}, lines);
    if (options.banks !== false) {
      if (base.stations.some((s) => isFiniteNumber(s.leftBank))) {
        pieces(base.stations.map((s) => ({ station: s.station, elevation: s.leftBank })), key.add(words.leftBank, palette.bank, dash.leftBank), 'left-bank', {}, lines);
      }
      if (base.stations.some((s) => isFiniteNumber(s.rightBank))) {
        pieces(base.stations.map((s) => ({ station: s.station, elevation: s.rightBank })), key.add(words.rightBank, palette.bank, dash.rightBank), 'right-bank', {}, lines);
      }
    }
  }

  const water: { station: number; wsel: number; bed: number; flow: string; order: number }[] = [];
  flows.forEach((flow, i) => {
    const name = key.add(words.water(flow.id), pick(palette.water, i), dash.solid);
    pieces(flow.stations.map((s) => ({ station: s.station, elevation: s.wsel })), name, `water:${i}`, { flow: flow.id }, lines);
    flow.stations.forEach((s, order) => {
      if (isFiniteNumber(s.station) && isFiniteNumber(s.wsel) && isFiniteNumber(s.bedElevation)) {
        water.push({ station: r(s.station), wsel: r(s.wsel), bed: r(s.bedElevation), flow: flow.id, order });
      }
    });
  });

  flows.forEach((flow, i) => {
    if (!guideIds.has(flow.id)) return;
    if (options.energy !== false) {
      const name = key.add(words.energy(flow.id), pick(palette.energy, i), dash.energy);
      pieces(flow.stations.map((s) => ({ station: s.station, elevation: s.energyElevation })), name, `energy:${i}`, { flow: flow.id }, lines);
    }
    for (const which of ['critical', 'normal'] as const) {
      if (options[which] === false) continue;
      const name =
        which === 'critical'
          ? key.add(words.critical(flow.id), pick(palette.critical, i), dash.critical)
          : key.add(words.normal(flow.id), pick(palette.normal, i), dash.normal);
      flow.reaches.forEach((reach, j) => {
        const along = stationsOfReach(flow, reach);
        const depths = along.map((s) => guideDepth(s, reach, which));
        // A station at a reach end may carry the next reach's value (a break, or a flow change splitting one
        // reach in two): where the reach's inside stations all agree (a prismatic reach at one discharge),
        // the line keeps that value to both ends instead of bending to the neighbour's.
        const lo = Math.min(reach.from, reach.to);
        const hi = Math.max(reach.from, reach.to);
        const inside = depths.filter((_, k) => along[k]!.station > lo && along[k]!.station < hi);
        const common = inside.length > 0 && inside.every((d) => d !== null && d === inside[0]) ? inside[0]! : null;
        const pts = along.map((s, k) => {
          const d = common !== null && (s.station === lo || s.station === hi) ? common : depths[k]!;
          return { station: s.station, elevation: d === null ? null : s.bedElevation + d };
        });
        pieces(pts, name, `${which}:${i}:${j}`, { flow: flow.id, reach: reach.id }, lines);
      });
    }
  });

  const jumps = flows.flatMap((flow, i) =>
    flow.jumps
      .filter((j) => isFiniteNumber(j.station))
      .map((j) => {
        const bed = interpolate(bedPoints, j.station) ?? 0;
        const length = isFiniteNumber(j.length) && j.length > 0 ? j.length : 0;
        return {
          flow: flow.id,
          flowIndex: i,
          station: r(j.station),
          end: r(j.station + length),
          toeElevation: r(bed + j.upstreamDepth),
          sequentElevation: r(bed + j.downstreamDepth),
          length: r(length),
          froude: r(j.froude),
          type: j.type,
          label: `jump, Fr ${j.froude.toFixed(1)}`,
          labelElevation: r(bed + j.upstreamDepth),
        };
      }),
  );

  // Bands and observations (optional): in the flow's water colour, and in the text colour for observations.
  const bandRows = (options.bands ?? []).flatMap((band) => {
    const index = Math.max(0, flows.findIndex((f) => f.id === band.flow));
    const series = key.add(band.label, pick(palette.water, index), dash.solid);
    return band.rows
      .filter((b) => isFiniteNumber(b.station) && isFiniteNumber(b.low) && isFiniteNumber(b.high))
      .map((b, order) => ({ station: r(b.station), low: r(b.low), high: r(b.high), series, flow: band.flow, order }));
  });
  const observed = options.observations;
  const observationRows = (observed?.points ?? [])
    .filter((o) => isFiniteNumber(o.station) && isFiniteNumber(o.elevation))
    .map((o) => ({ station: r(o.station), elevation: r(o.elevation), series: observed!.label, flow: o.flow ?? '' }));
  if (observationRows.length) key.add(observed!.label, palette.text, dash.solid);

  const xr = extent(lines.map((l) => l.station)) ?? [0, 1];
  const yr = extent([
    ...bandRows.flatMap((b) => [b.low, b.high]),
    ...observationRows.map((o) => o.elevation),
    ...lines.map((l) => l.elevation),
    ...jumps.flatMap((j) => [j.toeElevation, j.sequentElevation]),
  ]) ?? [0, 1];
  const [yLow, yHigh] = padded(yr, 0.08, 0.16);
  const ground = (base?.stations ?? [])
    .filter((s) => isFiniteNumber(s.station) && isFiniteNumber(s.bedElevation))
    .map((s, order) => ({ station: r(s.station), bed: r(s.bedElevation), base: r(yLow), order }));
  const structures = structureList.map((s) => ({
    id: s.id,
    type: s.type,
    station: r(s.station),
    bed: r(interpolate(bedPoints, s.station) ?? yLow),
    top: r(yHigh - 0.04 * (yHigh - yLow)),
    label: `${s.id} (${s.type})`,
    series: words.structure,
    // a label near the right edge goes on the rule's left so it stays inside the chart
    side: visualFraction(s.station, xr, options.reverseStations === true) > 0.85 ? 'left' : 'right',
  }));
  if (structures.length) key.add(words.structure, palette.structure, dash.solid);
  // Labels of jumps of different flows at one toe are stacked downwards, one line each.
  // Jump labels sit just below each toe; a label that would overlap one already placed (near in station and
  // in height, whichever flow it belongs to) moves down a line until it is clear.
  const lineHeight = jumpLabelLine * (yHigh - yLow);
  const labelReach = jumpLabelWidth * (xr[1] - xr[0] || 1);
  const placed: { station: number; elevation: number }[] = [];
  const jumpRows = jumps.map((j) => {
    const clear = (e: number) => !placed.some((p) => Math.abs(p.station - j.station) < labelReach && Math.abs(p.elevation - e) < lineHeight);
    const inside = (e: number) => e - lineHeight >= yLow && e + lineHeight <= yHigh;
    // below the toe first, then above it, one line at a time, staying inside the plot
    const candidates = [j.labelElevation];
    for (let k = 1; k <= jumps.length; k++) candidates.push(j.labelElevation - k * lineHeight, j.labelElevation + k * lineHeight);
    const elevation = candidates.find((e) => inside(e) && clear(e)) ?? candidates.find(inside) ?? j.labelElevation;
    placed.push({ station: j.station, elevation });
    return { ...j, series: words.jump, labelElevation: r(elevation) };
  });
  if (jumps.length) key.add(words.jump, palette.jump, dash.solid);

  const x = {
    field: 'station',
    type: 'quantitative',
    title: words.stationAxis(run.units),
    scale: { domain: [r(xr[0]), r(xr[1])], nice: false, zero: false, reverse: options.reverseStations === true },
  } as const;
  const y = {
    field: 'elevation',
    type: 'quantitative',
    title: words.elevationAxis(run.units),
    scale: { domain: [r(yLow), r(yHigh)], nice: false, zero: false },
  } as const;
  const xPlain = { field: 'station', type: 'quantitative' } as const;
  // Vega lays the key out from estimated text widths (0.8 × font size per character): fewer columns when
  // long flow names would push the last column past the chart's right edge.
  const longest = Math.max(0, ...key.series.map((e) => [...e.name].length));
  const entryWidth = Math.ceil(0.8 * font.legendSize * longest) + legendEntryExtra;
  const fittedColumns = Math.max(1, Math.min(keyColumns, Math.floor((width - legendInset) / entryWidth)));
  const colour = key.colour(words.legendTitle, {
    orient: 'bottom',
    columns: fittedColumns,
    direction: 'horizontal',
    labelLimit: Math.floor((width - legendInset) / fittedColumns) - legendEntryExtra,
    // bands and observations add area and point marks; the key keeps drawing every entry as a line
    ...(bandRows.length || observationRows.length ? { symbolType: 'stroke', symbolOpacity: 1 } : {}),
  });
  const strokeDash = key.strokeDash(words.legendTitle);

  // Profile type of each stretch, just above that flow's water surface, at a place along the stretch that
  // differs per flow; labels that would not fit their stretch or would overlap another are left out
  // (profileLabels.ts), and listed in the `unlabelled` dataset.
  const title = options.title ?? (run.title ? `${run.title}: ${words.profileTitle.toLowerCase()}` : words.profileTitle);
  const plot = estimatedPlot(width, height, Math.ceil(key.series.length / fittedColumns), Array.isArray(title) ? title.length : 1);
  const surfaces = flows.map((flow) => flow.stations.map((s) => ({ x: s.station, y: s.wsel })));
  const stretches: LabelStretch[] = flows.flatMap((flow, i) =>
    flow.reaches.flatMap((reach) =>
      reach.profiles
        .filter((p) => isFiniteNumber(p.from) && isFiniteNumber(p.to))
        .map((p) => ({ flow: flow.id, flowIndex: i, reach: reach.id, text: p.type, from: p.from, to: p.to })),
    ),
  );
  const labelling = placeProfileLabels(stretches, (i, station) => interpolate(surfaces[i] ?? [], station), {
    plotWidth: plot.width,
    plotHeight: plot.height,
    stations: xr,
    elevations: [yLow, yHigh],
    flows: flows.length,
  });
  const labels = labelling.placed.map((l) => ({ station: r(l.station), elevation: r(l.elevation), text: l.text, flow: l.flow, reach: l.reach, from: r(l.from), to: r(l.to) }));
  const unlabelled = labelling.leftOut.map((l) => ({ text: l.text, flow: l.flow, reach: l.reach, from: r(l.from), to: r(l.to), reason: l.reason }));

  const layer: unknown[] = [
    {
      name: 'ground',
      data: { name: 'ground' },
      mark: { type: 'area', color: palette.groundFill, opacity: palette.groundFillOpacity },
      encoding: { x, y: { ...y, field: 'bed' }, y2: { field: 'base' } },
    },
    {
      name: 'water',
      data: { name: 'water' },
      mark: { type: 'area', color: palette.waterBody, opacity: palette.waterBodyOpacity },
      encoding: { x: xPlain, y: { field: 'wsel', type: 'quantitative' }, y2: { field: 'bed' }, detail: { field: 'flow' } },
    },
    ...(bandRows.length
      ? [
          {
            name: 'bands',
            data: { name: 'bands' },
            mark: { type: 'area', opacity: 0.3 },
            encoding: { x: xPlain, y: { field: 'low', type: 'quantitative' }, y2: { field: 'high' }, color: colour, detail: { field: 'series' } },
          },
        ]
      : []),
    {
      name: 'lines',
      data: { name: 'lines' },
      mark: { type: 'line', strokeWidth: stroke.water, strokeCap: 'round', strokeJoin: 'round' },
      encoding: {
        x: xPlain,
        y: { field: 'elevation', type: 'quantitative' },
        color: colour,
        strokeDash,
        detail: { field: 'segment' },
        order: { field: 'order' },
      },
    },
  ];
  if (structures.length) {
    layer.push(
      {
        name: 'structures',
        data: { name: 'structures' },
        mark: { type: 'rule', strokeWidth: stroke.structure },
        encoding: { x: xPlain, y: { field: 'bed', type: 'quantitative' }, y2: { field: 'top' }, color: colour, strokeDash },
      },
      ...(['right', 'left'] as const).map((side) => ({
        name: `structure-labels-${side}`,
        data: { name: 'structures' },
        transform: [{ filter: { field: 'side', equal: side } }],
        mark: { type: 'text', align: side === 'right' ? 'left' : 'right', baseline: 'top', dx: side === 'right' ? 4 : -4, dy: 2, fontSize: font.annotationSize, color: palette.structure },
        encoding: { x: xPlain, y: { field: 'top', type: 'quantitative' }, text: { field: 'label' } },
      })),
    );
  }
  if (jumps.length) {
    layer.push(
      {
        name: 'jump-rollers',
        data: { name: 'jumps' },
        mark: { type: 'rule', strokeWidth: stroke.jumpRoller, strokeCap: 'butt' },
        encoding: { x: xPlain, x2: { field: 'end' }, y: { field: 'sequentElevation', type: 'quantitative' }, color: colour, strokeDash },
      },
      {
        name: 'jump-faces',
        data: { name: 'jumps' },
        mark: { type: 'rule', strokeWidth: stroke.jumpFace, color: palette.jump },
        encoding: { x: xPlain, y: { field: 'toeElevation', type: 'quantitative' }, y2: { field: 'sequentElevation' } },
      },
      {
        name: 'jump-toes',
        data: { name: 'jumps' },
        mark: { type: 'point', shape: 'triangle-up', filled: true, size: 70, color: palette.jump },
        encoding: { x: xPlain, y: { field: 'toeElevation', type: 'quantitative' } },
      },
      {
        name: 'jump-labels',
        data: { name: 'jumps' },
        mark: { type: 'text', align: 'left', baseline: 'top', dx: 6, dy: 2, fontSize: font.annotationSize, color: palette.jump },
        encoding: { x: xPlain, y: { field: 'labelElevation', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  if (observationRows.length) {
    layer.push({
      name: 'observations',
      data: { name: 'observations' },
      mark: { type: 'point', shape: 'diamond', filled: true, size: 60, opacity: 1 },
      encoding: { x: xPlain, y: { field: 'elevation', type: 'quantitative' }, color: colour },
    });
  }
  if (labels.length) {
    layer.push({
      name: 'profile-labels',
      data: { name: 'labels' },
      mark: { type: 'text', baseline: 'bottom', dy: -5, fontSize: labelFontSize, fontWeight: 'bold', color: palette.profileLabel },
      encoding: { x: xPlain, y: { field: 'elevation', type: 'quantitative' }, text: { field: 'text' } },
    });
  }
  // The first layer carries the full axis definitions; later layers share its scales.
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: 'gvf longitudinal profile',
    title: { text: title, limit: width - 10, subtitle: `Units ${run.units}; method ${run.method}; flows ${flows.map((f) => f.id).join(', ')}` },
    width,
    height,
    autosize: { type: 'fit', contains: 'padding' },
    config: chartConfig(),
    datasets: {
      lines,
      ground,
      water,
      structures,
      jumps: jumpRows,
      labels,
      unlabelled,
      ...(bandRows.length ? { bands: bandRows } : {}),
      ...(observationRows.length ? { observations: observationRows } : {}),
    },
    layer,
  };
  return spec as unknown as TopLevelSpec;
}
