/**
 * Where the profile-type labels (M1, S2, …) go on the longitudinal profile, so that labels of different flows
 * never sit on each other.
 *
 * Each stretch gets at most one label, just above its flow's water surface, preferably at a fraction of the
 * stretch that differs per flow (1/(n+1), 2/(n+1), … for n flows). A label is drawn only where it fits:
 * - the stretch must be at least as wide on the chart as the label's text, and the label stays inside it;
 * - its box must not overlap a label already placed; if it does, other places along the stretch are tried,
 *   nearest to the preferred one first.
 * A stretch that cannot hold its label is listed as left out, with why; its type is still in the report's
 * table of reaches. Sizes are estimated in CSS pixels from the chart size (Vega lays text out only when it
 * renders); the estimates lean towards larger text and a smaller plot, so labels judged clear are clear.
 * Pure and deterministic: flows in order, stretches in order along each flow.
 */
import { font } from './style.js';

export interface LabelStretch {
  flow: string;
  /** the flow's place among the drawn flows (0-based) */
  flowIndex: number;
  reach: string;
  /** the profile type, written as the label */
  text: string;
  from: number;
  to: number;
}

export interface PlacedLabel {
  station: number;
  elevation: number;
  text: string;
  flow: string;
  reach: string;
  from: number;
  to: number;
}

export interface LeftOutLabel {
  text: string;
  flow: string;
  reach: string;
  from: number;
  to: number;
  reason: 'stretch too short' | 'no room clear of other labels';
}

/** The chart's plot area in CSS pixels and its data domain, for turning sizes into stations and elevations. */
export interface LabelFrame {
  plotWidth: number;
  plotHeight: number;
  stations: [number, number];
  elevations: [number, number];
  /** the flow count: preferred places are 1/(n+1), 2/(n+1), … of each stretch */
  flows: number;
}

/** The label font (bold, one size above the annotations): width per character and line height, CSS px. */
export const labelFontSize = font.annotationSize + 1;
/** DejaVu Sans Bold capitals and digits are about 0.72 em wide; 0.78 leaves a margin (common practice for estimates). */
const charWidth = 0.78 * labelFontSize;
/** Cap height plus the gap between a label and its surface, and a clear gap between two labels (CSS px). */
const labelHeight = labelFontSize + 3;
const labelGap = 3;
/** Places tried along a stretch besides the preferred one. */
const placesPerStretch = 12;

/** A label's width in CSS px (its text estimated, plus a small pad). */
export function labelWidth(text: string): number {
  return [...text].length * charWidth + 4;
}

/**
 * The plot area of a profile chart of `width` × `height` CSS px (whole chart): the axes, title and key take
 * the rest. Measured on rendered gvf profiles (900 × 480 with two flows: plot 820 × 297 px) and rounded down.
 */
export function estimatedPlot(width: number, height: number, keyRows: number, titleLines: number): { width: number; height: number } {
  const yAxis = 82;
  const top = 46 + 18 * Math.max(0, titleLines - 1);
  const xAxis = 50;
  const key = 30 + 18 * keyRows;
  return { width: Math.max(50, width - yAxis), height: Math.max(40, height - top - xAxis - key) };
}

/**
 * One label per stretch where it fits and stays clear of the others; `surface(flow, station)` is the water
 * surface of that flow there (null where it is not computed).
 */
export function placeProfileLabels(
  stretches: readonly LabelStretch[],
  surface: (flowIndex: number, station: number) => number | null,
  frame: LabelFrame,
): { placed: PlacedLabel[]; leftOut: LeftOutLabel[] } {
  const xSpan = frame.stations[1] - frame.stations[0] || 1;
  const ySpan = frame.elevations[1] - frame.elevations[0] || 1;
  const pxPerStation = frame.plotWidth / xSpan;
  const pxPerElevation = frame.plotHeight / ySpan;
  const placed: PlacedLabel[] = [];
  const boxes: { x: number; y: number; w: number }[] = [];
  const leftOut: LeftOutLabel[] = [];
  for (const s of stretches) {
    const lo = Math.min(s.from, s.to);
    const hi = Math.max(s.from, s.to);
    const w = labelWidth(s.text);
    const halfStations = w / 2 / pxPerStation;
    const out = (reason: LeftOutLabel['reason']) => leftOut.push({ text: s.text, flow: s.flow, reach: s.reach, from: s.from, to: s.to, reason });
    if ((hi - lo) * pxPerStation < w) {
      out('stretch too short');
      continue;
    }
    // the label's centre may move from lo + half its width to hi − half its width
    const first = lo + halfStations;
    const last = hi - halfStations;
    const preferred = Math.min(last, Math.max(first, s.from + ((s.flowIndex + 1) / (frame.flows + 1)) * (s.to - s.from)));
    const places = [preferred];
    for (let k = 0; k <= placesPerStretch; k++) places.push(first + (k / placesPerStretch) * (last - first));
    places.sort((a, b) => Math.abs(a - preferred) - Math.abs(b - preferred) || a - b);
    let done = false;
    let computed = false;
    for (const station of places) {
      const elevation = surface(s.flowIndex, station);
      if (elevation === null || !Number.isFinite(elevation)) continue;
      computed = true;
      const x = (station - frame.stations[0]) * pxPerStation;
      const y = (elevation - frame.elevations[0]) * pxPerElevation;
      const clear = boxes.every((b) => Math.abs(b.x - x) >= (b.w + w) / 2 + labelGap || Math.abs(b.y - y) >= labelHeight + labelGap);
      if (!clear) continue;
      boxes.push({ x, y, w });
      placed.push({ station, elevation, text: s.text, flow: s.flow, reach: s.reach, from: s.from, to: s.to });
      done = true;
      break;
    }
    // a stretch with no computed surface has nothing to label (the flow's table says why)
    if (!done && computed) out('no room clear of other labels');
  }
  return { placed, leftOut };
}
