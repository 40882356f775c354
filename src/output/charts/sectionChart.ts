/**
 * A cross-section chart as a Vega-Lite spec: the ground line over an earth fill, the water surface of each
 * flow across its wetted width with a pale water body below it, the bank stations, and the boundaries and
 * roughness of the subsections. The caller gives the surveyed points; the only geometry here is finding
 * where a level water surface meets the ground line (straight-line interpolation between points).
 */
import type { TopLevelSpec } from 'vega-lite';
import type { UnitSystem } from '../../core/units.js';
import { chartConfig, dash, font, palette, pick, size, stroke, words, lengthUnit } from './style.js';
import { SeriesKey, extent, interpolate, isFiniteNumber, padded, r } from './series.js';

/** A roughness subsection across the section, between two offsets. */
export interface SectionZone {
  from: number;
  to: number;
  n?: number;
  /** words for the zone (default "n = …") */
  label?: string;
}

export interface SectionChartInput {
  units: UnitSystem;
  /** surveyed ground points, [offset across the section, elevation], offsets not decreasing */
  ground: readonly (readonly [number, number])[];
  /** water-surface elevation per flow */
  waterLevels: readonly { flow: string; wsel: number }[];
  /** offsets of the bank stations */
  banks?: { left?: number; right?: number };
  /** roughness subsections (their inner boundaries are drawn) */
  zones?: readonly SectionZone[];
  /** the station the section stands at, and the section's name, for the title */
  station?: number;
  sectionId?: string;
  title?: string;
  width?: number;
  height?: number;
}

/** One wetted stretch under a level surface: the points of the water body from edge to edge. */
export interface WettedStretch {
  left: number;
  right: number;
  /** [offset, ground elevation] from the left edge to the right edge, edges included (ground = wsel there) */
  points: [number, number][];
}

/**
 * Where the ground is below `wsel`: each wetted stretch with its edge points. A stretch that reaches an end
 * of the survey stops there (the section would need extending; the results layer reports that).
 */
export function wettedStretches(ground: readonly (readonly [number, number])[], wsel: number): WettedStretch[] {
  const pts = ground.filter((p) => isFiniteNumber(p[0]) && isFiniteNumber(p[1]));
  const out: WettedStretch[] = [];
  if (!isFiniteNumber(wsel) || pts.length === 0) return out;
  let current: [number, number][] | null = null;
  const close = () => {
    if (current && current.length >= 2) out.push({ left: current[0]![0], right: current[current.length - 1]![0], points: current });
    current = null;
  };
  for (let i = 0; i < pts.length; i++) {
    const [x, z] = pts[i] as readonly [number, number];
    const wet = z < wsel;
    if (i > 0) {
      const [x0, z0] = pts[i - 1] as readonly [number, number];
      const wasWet = z0 < wsel;
      if (wet !== wasWet && z !== z0) {
        // the surface crosses the ground between the two points
        const xc = x0 + ((wsel - z0) * (x - x0)) / (z - z0);
        if (wet) current = [[xc, wsel]];
        else if (current) {
          current.push([xc, wsel]);
          close();
        }
      }
    }
    if (wet) {
      if (!current) current = [];
      current.push([x, z]);
    }
  }
  close();
  return out;
}

/** Water levels for the subtitle, two to a line, so several flows are listed in full rather than cut off. */
function subtitleLines(parts: readonly string[], lead: string): string | string[] {
  if (parts.length === 0) return ' ';
  const lines: string[] = [];
  for (let i = 0; i < parts.length; i += 2) lines.push(`${i === 0 ? lead : ''}${parts.slice(i, i + 2).join('; ')}`);
  return lines.length === 1 ? lines[0]! : lines;
}

/** Key names longer than this (characters) get two columns instead of three. */
const legendLongName = 28;

export function sectionChart(input: SectionChartInput): TopLevelSpec {
  const width = input.width ?? size.section.width;
  const height = input.height ?? size.section.height;
  const u = lengthUnit(input.units);
  const key = new SeriesKey();
  const ground = input.ground.filter((p) => isFiniteNumber(p[0]) && isFiniteNumber(p[1])).map(([x, z], order) => ({ offset: r(x), elevation: r(z), order }));
  const groundPts = ground.map((g) => ({ x: g.offset, y: g.elevation }));

  const levels = input.waterLevels.filter((w) => isFiniteNumber(w.wsel));
  levels.forEach((w, i) => key.add(words.water(w.flow), pick(palette.water, i), dash.solid));
  key.add(words.ground, palette.bed, dash.solid);
  const hasBanks = input.banks && (isFiniteNumber(input.banks.left) || isFiniteNumber(input.banks.right));
  if (hasBanks) key.add(words.bankStation, palette.bank, dash.solid);
  const zones = (input.zones ?? []).filter((z) => isFiniteNumber(z.from) && isFiniteNumber(z.to));
  // rounded as the ground offsets are, so a zone ending at the end of the ground is not drawn as a boundary
  const boundaries = [...new Set(zones.flatMap((z) => [r(z.from), r(z.to)]))].sort((a, b) => a - b);
  const xr = extent(ground.map((g) => g.offset)) ?? [0, 1];
  const inner = boundaries.filter((b) => b > xr[0] && b < xr[1]);
  if (inner.length) key.add(words.zoneBoundary, palette.zone, dash.zone);

  const water: { offset: number; wsel: number; ground: number; flow: string; piece: string; series: string }[] = [];
  const surfaces: { left: number; right: number; elevation: number; flow: string; series: string }[] = [];
  levels.forEach((w, i) => {
    const series = words.water(w.flow);
    wettedStretches(input.ground, w.wsel).forEach((s, j) => {
      for (const [x, z] of s.points) water.push({ offset: r(x), wsel: r(w.wsel), ground: r(z), flow: w.flow, piece: `${i}:${j}`, series });
      surfaces.push({ left: r(s.left), right: r(s.right), elevation: r(w.wsel), flow: w.flow, series });
    });
  });

  const yr = extent([...ground.map((g) => g.elevation), ...levels.map((w) => w.wsel)]) ?? [0, 1];
  const [yLow, yHigh] = padded(yr, 0.1, 0.18);
  const groundRows = ground.map((g) => ({ ...g, base: r(yLow), series: words.ground }));
  const bankRows = hasBanks
    ? (['left', 'right'] as const)
        .filter((side) => isFiniteNumber(input.banks?.[side]))
        .map((side) => {
          const x = input.banks![side] as number;
          return { offset: r(x), bottom: r(interpolate(groundPts, x) ?? yLow), top: r(yHigh - 0.03 * (yHigh - yLow)), label: side === 'left' ? 'left bank' : 'right bank', series: words.bankStation };
        })
    : [];
  const zoneRows = inner.map((b) => ({ offset: r(b), bottom: r(yLow), top: r(yHigh), series: words.zoneBoundary }));
  const zoneLabels = zones.map((z) => ({
    offset: r((z.from + z.to) / 2),
    elevation: r(yHigh - 0.03 * (yHigh - yLow)),
    label: z.label ?? (isFiniteNumber(z.n) ? `n = ${z.n}` : ''),
  })).filter((z) => z.label !== '');

  // three columns of key entries, or two when the names are long (several flows, both sides of a structure)
  const longest = Math.max(0, ...key.series.map((e) => [...e.name].length));
  const columns = longest > legendLongName ? 2 : 3;
  const colour = key.colour(words.legendTitle, { orient: 'bottom', columns, direction: 'horizontal', labelLimit: Math.floor((width - 20) / columns) - 20 });
  const strokeDash = key.strokeDash(words.legendTitle);
  const x = { field: 'offset', type: 'quantitative', title: words.offsetAxis(input.units), scale: { domain: [r(xr[0]), r(xr[1])], nice: false, zero: false } } as const;
  const xPlain = { field: 'offset', type: 'quantitative' } as const;
  const where = [input.sectionId ? `section ${input.sectionId}` : '', isFiniteNumber(input.station) ? `station ${input.station} ${u}` : ''].filter(Boolean).join(', ');
  const title = input.title ?? (where ? `${words.sectionTitle} at ${where}` : words.sectionTitle);

  const layer: unknown[] = [
    {
      name: 'ground-fill',
      data: { name: 'ground' },
      mark: { type: 'area', color: palette.groundFill, opacity: palette.groundFillOpacity },
      encoding: { x, y: { field: 'elevation', type: 'quantitative', title: words.elevationAxis(input.units), scale: { domain: [r(yLow), r(yHigh)], nice: false, zero: false } }, y2: { field: 'base' } },
    },
    {
      name: 'water',
      data: { name: 'water' },
      mark: { type: 'area', color: palette.waterBody, opacity: palette.waterBodyOpacity },
      encoding: { x: xPlain, y: { field: 'wsel', type: 'quantitative' }, y2: { field: 'ground' }, detail: { field: 'piece' } },
    },
    {
      name: 'ground-line',
      data: { name: 'ground' },
      mark: { type: 'line', strokeWidth: stroke.ground },
      encoding: { x: xPlain, y: { field: 'elevation', type: 'quantitative' }, color: colour, strokeDash, order: { field: 'order' } },
    },
    {
      name: 'water-surfaces',
      data: { name: 'surfaces' },
      mark: { type: 'rule', strokeWidth: stroke.water },
      encoding: { x: { field: 'left', type: 'quantitative' }, x2: { field: 'right' }, y: { field: 'elevation', type: 'quantitative' }, color: colour, strokeDash },
    },
  ];
  if (bankRows.length) {
    layer.push(
      {
        name: 'banks',
        data: { name: 'banks' },
        mark: { type: 'rule', strokeWidth: stroke.bank },
        encoding: { x: xPlain, y: { field: 'bottom', type: 'quantitative' }, y2: { field: 'top' }, color: colour, strokeDash },
      },
      {
        name: 'bank-labels',
        data: { name: 'banks' },
        mark: { type: 'text', baseline: 'bottom', dy: -2, fontSize: font.annotationSize, color: palette.bank },
        encoding: { x: xPlain, y: { field: 'top', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  if (zoneRows.length) {
    layer.push({
      name: 'zone-boundaries',
      data: { name: 'zones' },
      mark: { type: 'rule', strokeWidth: stroke.zone },
      encoding: { x: xPlain, y: { field: 'bottom', type: 'quantitative' }, y2: { field: 'top' }, color: colour, strokeDash },
    });
  }
  if (zoneLabels.length) {
    layer.push({
      name: 'zone-labels',
      data: { name: 'zoneLabels' },
      mark: { type: 'text', baseline: 'top', dy: 2, fontSize: font.annotationSize, color: palette.zone },
      encoding: { x: xPlain, y: { field: 'elevation', type: 'quantitative' }, text: { field: 'label' } },
    });
  }
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: 'gvf cross-section',
    title: { text: title, limit: width - 10, subtitle: subtitleLines(levels.map((w) => `${w.flow} ${w.wsel.toFixed(3)} ${u}`), 'Water surface: ') },
    width,
    height,
    autosize: { type: 'fit', contains: 'padding' },
    config: chartConfig(),
    datasets: { ground: groundRows, water, surfaces, banks: bankRows, zones: zoneRows, zoneLabels },
    layer,
  };
  return spec as unknown as TopLevelSpec;
}
