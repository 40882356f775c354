/**
 * Small pure helpers shared by the chart builders: finite-only data, extents, linear interpolation along
 * stations, and the one legend that lists every named series (a shared colour and dash scale, so
 * Vega-Lite draws a single key in plain words).
 */

/** A named series: its legend words, colour and dash. */
export interface SeriesStyle {
  name: string;
  colour: string;
  dash: readonly number[];
}

/** Keeps a series list free of repeats (first wins), in drawing order. */
export class SeriesKey {
  private readonly list: SeriesStyle[] = [];
  add(name: string, colour: string, dash: readonly number[]): string {
    if (!this.list.some((s) => s.name === name)) this.list.push({ name, colour, dash });
    return name;
  }
  get series(): readonly SeriesStyle[] {
    return this.list;
  }
  /** colour encoding on the `series` field, with the whole key as its domain */
  colour(legendTitle: string | null, legend: Record<string, unknown> = {}): Record<string, unknown> {
    return {
      field: 'series',
      type: 'nominal',
      title: legendTitle,
      scale: { domain: this.list.map((s) => s.name), range: this.list.map((s) => s.colour) },
      legend: legendTitle === null ? null : legend,
    };
  }
  /** dash encoding on the same field; solid is [1, 0] because Vega reads an empty array as "no dash set" */
  strokeDash(legendTitle: string | null): Record<string, unknown> {
    return {
      field: 'series',
      type: 'nominal',
      title: legendTitle,
      scale: { domain: this.list.map((s) => s.name), range: this.list.map((s) => (s.dash.length ? [...s.dash] : [1, 0])) },
      legend: legendTitle === null ? null : {},
    };
  }
}

export function isFiniteNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/** [min, max] of the finite values, or null when there are none. */
export function extent(values: Iterable<number | null | undefined>): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!isFiniteNumber(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return lo <= hi ? [lo, hi] : null;
}

/** A domain padded below and above by fractions of its range (a flat range gets a unit span). */
export function padded(range: [number, number], below: number, above: number): [number, number] {
  const span = range[1] - range[0] > 0 ? range[1] - range[0] : Math.max(1, Math.abs(range[0]) * 0.1);
  return [range[0] - below * span, range[1] + above * span];
}

/**
 * Linear interpolation of y(x) through points sorted by x (repeated x allowed: the later point wins on the
 * downstream side). Outside the range, the end value. Null when there are no finite points.
 */
export function interpolate(points: readonly { x: number; y: number }[], x: number): number | null {
  const pts = points.filter((p) => isFiniteNumber(p.x) && isFiniteNumber(p.y));
  if (pts.length === 0 || !isFiniteNumber(x)) return null;
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (x <= first.x) return first.y;
  if (x >= last.x) return last.y;
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1]!;
    const b = pts[i]!;
    if (x >= a.x && x <= b.x) {
      if (b.x === a.x) return b.y;
      return a.y + ((b.y - a.y) * (x - a.x)) / (b.x - a.x);
    }
  }
  return last.y;
}

/** Rounds for data written into a spec: enough digits for any chart, fewer bytes, identical output for identical input. */
export function r(x: number): number {
  return Number(x.toPrecision(10));
}
