/**
 * The look of every gvf chart, defined once: palette, line styles, fonts, sizes and legend wording.
 *
 * Chosen from what the lines mean, not from any other program:
 * - water is blue (one shade per flow, dark to light so the first flow stands out), its body a pale wash;
 * - the ground is an earthy brown fill under a darker brown bed line;
 * - the energy grade line is amber and dashed: it is not a surface you could see, so it must not look like water;
 * - the critical-depth line is a dotted brick red: a warning colour for the depth the flow must not linger at;
 * - the normal-depth line is dash-dot in muted violet: a reference, quieter than the computed surfaces;
 * - bank and lining tops are dark green (vegetated banks), solid for left and long-dashed for right;
 * - structures are slate rules; jumps are magenta, the one colour nothing else uses.
 * Dash arrays are in pixels. All legend words are plain language, built by the functions at the end.
 */
import type { UnitSystem } from '../../core/units.js';

/** Fonts: DejaVu Sans is installed with most Linux systems and resvg finds it; the rest are fallbacks for browsers. */
export const font = {
  family: 'DejaVu Sans, Verdana, Helvetica, Arial, sans-serif',
  /** what the PNG renderer is told to use when a family in the list is missing */
  renderFamily: 'DejaVu Sans',
  titleSize: 15,
  subtitleSize: 11,
  axisTitleSize: 12,
  labelSize: 11,
  legendSize: 10,
  annotationSize: 10,
} as const;

/** Chart sizes in CSS pixels: the whole chart (axes, legend and title included) is exactly this big. */
export const size = {
  profile: { width: 900, height: 480 },
  section: { width: 640, height: 380 },
  energyForcePanel: { width: 300, height: 320 },
  rating: { width: 560, height: 380 },
  /** PNG pixels per CSS pixel: 2 gives a sharp figure for a printed report */
  pngScale: 2,
} as const;

export const palette = {
  background: '#ffffff',
  text: '#1d2731',
  axis: '#4a5561',
  grid: '#e4e8ec',
  /** water surfaces, one per flow (cycled): deep to light blue */
  water: ['#0b4f8a', '#2f7fc1', '#5aa6dc', '#1b6f9e', '#86c1e8', '#0e3560'],
  waterBody: '#9fcbee',
  waterBodyOpacity: 0.28,
  groundFill: '#b59a78',
  groundFillOpacity: 0.55,
  bed: '#6b4f32',
  energy: ['#c77d00', '#e0a030', '#a36200', '#f0bd60', '#8a5200', '#d89a40'],
  critical: ['#b33a2e', '#d0604f', '#8f2a20', '#e08a7c', '#6f1f18', '#c24e3f'],
  normal: ['#6d5a9c', '#8f7fbd', '#55457e', '#b0a4d4', '#3f335e', '#7e6bac'],
  bank: '#285e2b',
  structure: '#39474f',
  jump: '#b0237a',
  zone: '#7c8791',
  profileLabel: '#1d2731',
} as const;

/** stroke widths (px) */
export const stroke = {
  water: 2.2,
  bed: 1.8,
  energy: 1.5,
  critical: 1.4,
  normal: 1.4,
  bank: 1.6,
  structure: 2,
  jumpRoller: 5,
  jumpFace: 2,
  zone: 1,
  ground: 1.8,
} as const;

/** dash arrays (px); an empty array is a solid line */
export const dash = {
  solid: [] as number[],
  energy: [9, 4],
  critical: [2, 3],
  normal: [10, 3, 2, 3],
  leftBank: [] as number[],
  rightBank: [14, 4],
  zone: [4, 4],
} as const;

export function pick(colours: readonly string[], index: number): string {
  const n = colours.length;
  return colours[((index % n) + n) % n] as string;
}

export function lengthUnit(units: UnitSystem): string {
  return units === 'US' ? 'ft' : 'm';
}

export function dischargeUnit(units: UnitSystem): string {
  return units === 'US' ? 'ft³/s' : 'm³/s';
}

/** Legend and axis wording in plain words. */
export const words = {
  stationAxis: (u: UnitSystem) => `Station (${lengthUnit(u)})`,
  elevationAxis: (u: UnitSystem) => `Elevation (${lengthUnit(u)})`,
  offsetAxis: (u: UnitSystem) => `Distance across the section (${lengthUnit(u)})`,
  depthAxis: (u: UnitSystem) => `Depth (${lengthUnit(u)})`,
  energyAxis: (u: UnitSystem) => `Specific energy (${lengthUnit(u)})`,
  forceAxis: (u: UnitSystem) => `Specific force (${lengthUnit(u)}³)`,
  dischargeAxis: (u: UnitSystem) => `Discharge (${dischargeUnit(u)})`,
  stageAxis: (u: UnitSystem) => `Stage (${lengthUnit(u)})`,
  legendTitle: 'Key',
  bed: 'Channel bed',
  water: (flow: string) => `Water surface, ${flow}`,
  energy: (flow: string) => `Energy line, ${flow}`,
  critical: (flow: string) => `Critical depth, ${flow}`,
  normal: (flow: string) => `Normal depth, ${flow}`,
  leftBank: 'Left bank top',
  rightBank: 'Right bank top',
  structure: 'Structure',
  jump: 'Jump toe and roller',
  ground: 'Ground',
  bankStation: 'Bank station',
  zoneBoundary: 'Roughness boundary',
  alternate: 'Alternate depths (equal energy)',
  sequent: 'Sequent depths (equal force)',
  criticalPoint: 'Critical depth',
  flowDepth: 'Flow depth',
  profileTitle: 'Longitudinal profile',
  sectionTitle: 'Cross-section',
  energyForceTitle: 'Specific energy and specific force',
  ratingTitle: 'Rating curve',
} as const;

/** The Vega-Lite `config` block every gvf chart shares. */
export function chartConfig(): Record<string, unknown> {
  return {
    background: palette.background,
    font: font.family,
    view: { stroke: palette.axis, strokeWidth: 0.6 },
    title: { fontSize: font.titleSize, color: palette.text, anchor: 'start', subtitleFontSize: font.subtitleSize, subtitleColor: palette.axis, offset: 10 },
    axis: {
      labelFontSize: font.labelSize,
      titleFontSize: font.axisTitleSize,
      titleFontWeight: 'normal',
      labelColor: palette.axis,
      titleColor: palette.text,
      gridColor: palette.grid,
      domainColor: palette.axis,
      tickColor: palette.axis,
    },
    legend: {
      labelFontSize: font.legendSize,
      titleFontSize: font.legendSize,
      titleFontWeight: 'bold',
      labelColor: palette.text,
      titleColor: palette.text,
      symbolStrokeWidth: 2,
      symbolSize: 260,
      labelLimit: 300,
    },
  };
}
