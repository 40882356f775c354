/**
 * Chart rendering, headless: Vega-Lite spec → Vega spec (vega-lite's compile) → SVG (a vega View with no
 * renderer, toSVG) → PNG (resvg, which ships its own rasteriser, so no system libraries are needed).
 *
 *   TopLevelSpec ──compile──▶ Vega spec ──View.toSVG──▶ SVG ──resvg──▶ PNG
 *
 * The three libraries are loaded with import() on first use, so a command that draws no chart never pays
 * for them (the CLI's cold start stays fast).
 */
import { existsSync } from 'node:fs';
import type { TopLevelSpec } from 'vega-lite';
import { font, size } from './charts/style.js';

export interface RenderOptions {
  /** PNG pixels per SVG pixel (default from the style: 2) */
  scale?: number;
  /** skip the PNG (a report needs only the SVG) */
  png?: boolean;
}

export interface RenderedChart {
  /** the Vega-Lite spec, as given (users restyle this) */
  spec: TopLevelSpec;
  /** the compiled Vega spec */
  vega: unknown;
  svg: string;
  /** PNG bytes (empty when `png: false`) */
  png: Uint8Array;
  /** SVG size in CSS pixels */
  width: number;
  height: number;
  /** PNG size in pixels (0 × 0 when `png: false`) */
  pngWidth: number;
  pngHeight: number;
  /** Vega-Lite's warnings while compiling (an empty list for every gvf chart) */
  warnings: string[];
}

/** Font files for the PNG renderer; missing ones are simply left out (the system fonts are loaded too). */
const fontFiles = [
  '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf',
  '/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf',
];

/** A Vega-Lite logger that keeps warnings as data instead of printing them. */
function recordingLogger(warnings: string[]) {
  let lvl = 0;
  const logger = {
    level(v?: number): any {
      if (v === undefined) return lvl;
      lvl = v;
      return logger;
    },
    error(...args: readonly unknown[]) {
      warnings.push(args.map(String).join(' '));
      return logger;
    },
    warn(...args: readonly unknown[]) {
      warnings.push(args.map(String).join(' '));
      return logger;
    },
    info() {
      return logger;
    },
    debug() {
      return logger;
    },
  };
  return logger;
}

/** Compiles a Vega-Lite spec to Vega, collecting warnings. */
export async function compileChart(spec: TopLevelSpec): Promise<{ vega: unknown; warnings: string[] }> {
  const vl = await import('vega-lite');
  const warnings: string[] = [];
  const out = vl.compile(spec, { logger: recordingLogger(warnings) as never });
  return { vega: out.spec, warnings };
}

/** Renders an SVG string to PNG bytes at `scale` pixels per SVG pixel. */
export async function svgToPng(svg: string, scale: number = size.pngScale): Promise<{ png: Uint8Array; width: number; height: number }> {
  if (!(Number.isFinite(scale) && scale > 0 && scale <= 16)) throw new RangeError(`PNG scale must be a number in (0, 16], got ${scale}`);
  const { Resvg } = await import('@resvg/resvg-js');
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'zoom', value: scale },
    background: '#ffffff',
    font: {
      loadSystemFonts: true,
      fontFiles: fontFiles.filter((f) => existsSync(f)),
      defaultFontFamily: font.renderFamily,
      sansSerifFamily: font.renderFamily,
    },
    logLevel: 'off',
  });
  const image = resvg.render();
  return { png: new Uint8Array(image.asPng()), width: image.width, height: image.height };
}

/** Spec → {spec, vega, svg, png} with sizes. */
export async function renderChart(spec: TopLevelSpec, options: RenderOptions = {}): Promise<RenderedChart> {
  const { vega: vegaSpec, warnings } = await compileChart(spec);
  const vega = await import('vega');
  const view = new vega.View(vega.parse(vegaSpec as never), { renderer: 'none' });
  let svg: string;
  try {
    svg = await view.toSVG();
  } finally {
    view.finalize();
  }
  const m = /^<svg[^>]*\swidth="([\d.]+)"[^>]*\sheight="([\d.]+)"/.exec(svg);
  const width = m ? Number(m[1]) : 0;
  const height = m ? Number(m[2]) : 0;
  if (options.png === false) {
    return { spec, vega: vegaSpec, svg, png: new Uint8Array(0), width, height, pngWidth: 0, pngHeight: 0, warnings };
  }
  const png = await svgToPng(svg, options.scale ?? size.pngScale);
  return { spec, vega: vegaSpec, svg, png: png.png, width, height, pngWidth: png.width, pngHeight: png.height, warnings };
}
