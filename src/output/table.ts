/**
 * Text tables for the terminal: aligned columns, the unit in each header, fixed decimals per column.
 * A value that does not exist (null, undefined, or a non-finite number) prints as "—", never as NaN.
 */
import { structureLines } from './structures.js';
import { unitsOf } from '../core/units.js';
import type { FlowResult, JumpResult, ReachResult, RunResult, StationResult } from '../results/types.js';
import type { MethodComparison } from '../run.js';
import type { SectionRunResult, SectionState } from '../runSection.js';

export interface Column<Row> {
  /** header words, e.g. "depth" */
  readonly header: string;
  /** unit shown in the header as "depth (m)" */
  readonly unit?: string;
  /** the cell value of a row */
  readonly value: (row: Row) => number | string | boolean | null | undefined;
  /** decimals for numbers (default 3) */
  readonly decimals?: number;
  /** numbers align right, text left, unless set */
  readonly align?: 'left' | 'right';
}

export const missingValue = '—';

/** A number with fixed decimals; −0 prints as 0; non-finite values print as "—". */
export function formatNumber(value: number, decimals = 3): string {
  if (!Number.isFinite(value)) return missingValue;
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** A number to `significant` significant digits without trailing zeros (slopes, roughness, side slopes). */
export function formatSignificant(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return missingValue;
  return String(Number(value.toPrecision(significant)));
}

function cell(value: number | string | boolean | null | undefined, decimals: number): string {
  if (value === null || value === undefined) return missingValue;
  if (typeof value === 'number') return formatNumber(value, decimals);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return value;
}

/** Characters as the terminal counts them (combining marks and superscripts count as one each). */
function width(text: string): number {
  return [...text].length;
}

function pad(text: string, size: number, align: 'left' | 'right'): string {
  const fill = ' '.repeat(Math.max(0, size - width(text)));
  return align === 'right' ? fill + text : text + fill;
}

/** An aligned table with a header row and a rule under it. */
export function formatTable<Row>(columns: readonly Column<Row>[], rows: readonly Row[]): string {
  const headers = columns.map((c) => (c.unit ? `${c.header} (${c.unit})` : c.header));
  const body = rows.map((row) => columns.map((c) => cell(c.value(row), c.decimals ?? 3)));
  const aligns = columns.map((c, j) => c.align ?? (rows.length > 0 && typeof c.value(rows[0]!) === 'number' ? 'right' : body.every((r) => /^[-\d.—]/.test(r[j]!)) ? 'right' : 'left'));
  const widths = columns.map((_, j) => Math.max(width(headers[j]!), ...body.map((r) => width(r[j]!))));
  const line = (cells: readonly string[]) => cells.map((text, j) => pad(text, widths[j]!, aligns[j]!)).join('  ').trimEnd();
  return [line(headers), widths.map((w) => '─'.repeat(w)).join('  '), ...body.map(line)].join('\n');
}

/** Label–value lines ("normal depth   1.234 m"), labels aligned. */
export function formatPairs(pairs: ReadonlyArray<readonly [label: string, value: string]>): string {
  const size = Math.max(0, ...pairs.map(([label]) => width(label)));
  return pairs.map(([label, value]) => `${pad(label, size, 'left')}  ${value}`.trimEnd()).join('\n');
}

/** A value with its unit, or "—" with a reason-free blank unit when it does not exist. */
export function withUnit(value: number | null | undefined, unit: string, decimals = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return missingValue;
  return unit === '' ? formatNumber(value, decimals) : `${formatNumber(value, decimals)} ${unit}`;
}

// ---- reports -------------------------------------------------------------------------------------------


const dimensionWords: Record<string, string> = {
  bottomWidth: 'bottom width',
  sideSlopeLeft: 'left side slope (H:1V)',
  sideSlopeRight: 'right side slope (H:1V)',
  sideSlope: 'side slope (H:1V)',
  diameter: 'diameter',
};

const frictionWords: Record<string, string> = { manning: "Manning's n", chezy: 'Chézy C', 'darcy-weisbach': 'sand roughness ks' };

/** The readable form of `gvf section`: the depths and slope class, then the elements at each depth. */
export function sectionReport(r: SectionRunResult): string {
  const u = r.unitLabels;
  const lengthKeys = new Set(['bottomWidth', 'diameter']);
  const pairs: Array<[string, string]> = [['units', `${r.units} (lengths in ${u.length}, discharge in ${u.discharge})`]];
  pairs.push(['shape', String(r.section.shape)]);
  for (const [key, value] of Object.entries(r.section)) {
    if (key === 'shape' || key === 'roughness' || typeof value !== 'number') continue;
    pairs.push([dimensionWords[key] ?? key, lengthKeys.has(key) ? withUnit(value, u.length, 3) : formatSignificant(value)]);
  }
  if (typeof r.section.roughness === 'number') {
    const unit = r.friction === 'darcy-weisbach' ? ` ${u.length}` : '';
    pairs.push([frictionWords[r.friction] ?? 'roughness', `${formatSignificant(r.section.roughness)}${unit}`]);
  }
  pairs.push(['discharge', withUnit(r.discharge, u.discharge, 3)]);
  pairs.push(['bed slope', formatSignificant(r.slope)]);
  pairs.push(['', '']);
  const normal =
    r.normalDepths.length > 1
      ? `${r.normalDepths.map((y) => withUnit(y, u.length, 3)).join(' and ')} (two in a closed conduit; the lower one governs)`
      : r.normalDepth === null
        ? r.fullFlow
          ? 'none: the conduit flows full'
          : 'none'
        : withUnit(r.normalDepth, u.length, 3);
  pairs.push(['normal depth', normal]);
  pairs.push([
    'critical depth',
    r.criticalDepths.length > 1
      ? `${r.criticalDepths.map((y) => withUnit(y, u.length, 3)).join(', ')} (least energy at ${withUnit(r.criticalDepth, u.length, 3)})`
      : withUnit(r.criticalDepth, u.length, 3),
  ]);
  pairs.push(['critical slope', r.criticalSlope === null ? missingValue : formatSignificant(r.criticalSlope)]);
  pairs.push(['slope class', r.slopeClass]);
  if (r.atNormalDepth) {
    pairs.push(['velocity at normal depth', withUnit(r.atNormalDepth.velocity, u.velocity, 3)]);
    pairs.push(['Froude at normal depth', formatNumber(r.atNormalDepth.froude, 3)]);
  } else {
    pairs.push(['velocity at normal depth', missingValue]);
    pairs.push(['Froude at normal depth', missingValue]);
  }

  const states: Array<[string, SectionState]> = [];
  if (r.atNormalDepth) states.push(['at normal depth', r.atNormalDepth]);
  states.push(['at critical depth', r.atCriticalDepth]);
  if (r.atDepth) states.push([`at depth ${formatNumber(r.atDepth.depth, 3)}`, r.atDepth]);
  const elements: Array<[string, string, (s: SectionState) => number | string | null, number]> = [
    ['depth y', u.length, (s) => s.depth, 4],
    ['flow area A', u.area, (s) => s.area, 4],
    ['wetted perimeter P', u.length, (s) => s.wettedPerimeter, 4],
    ['top width T', u.length, (s) => s.topWidth, 4],
    ['hydraulic radius R', u.length, (s) => s.hydraulicRadius, 4],
    ['hydraulic depth D', u.length, (s) => s.hydraulicDepth, 4],
    ['conveyance K', u.conveyance, (s) => s.conveyance, 3],
    ['energy coefficient α', '', (s) => s.alpha, 4],
    ['velocity V', u.velocity, (s) => s.velocity, 4],
    ['velocity head αV²/2g', u.length, (s) => s.velocityHead, 4],
    ['specific energy E', u.length, (s) => s.specificEnergy, 4],
    ['specific force M', u.force, (s) => s.specificForce, 4],
    ['Froude number F', '', (s) => s.froude, 4],
    ['friction slope Sf', '', (s) => s.frictionSlope, 6],
    ['regime', '', (s) => (s.full ? `${s.regime}, full` : s.regime), 0],
  ];
  type Line = (typeof elements)[number];
  const columns: Column<Line>[] = [
    { header: 'element', value: (e) => e[0], align: 'left' },
    { header: 'unit', value: (e) => e[1], align: 'left' },
    ...states.map(
      ([title, state]): Column<Line> => ({
        header: title,
        value: (e) => {
          const v = e[2](state);
          return typeof v === 'number' ? formatNumber(v, e[3]) : v;
        },
        align: 'right',
      }),
    ),
  ];
  const parts = [formatPairs(pairs), '', formatTable(columns, elements)];
  if (r.notes.length > 0) parts.push('', ...r.notes.map((n) => `note: ${n}`));
  parts.push('', ...r.cautions.map((c) => `caution: ${c}`));
  return parts.join('\n');
}

/** The readable form of a run: per flow a summary (reaches, profile types, jumps, warnings) and the station table. */
export function runReport(run: RunResult, comparison?: MethodComparison): string {
  const u = unitsOf(run.units);
  const parts: string[] = [];
  parts.push(`${run.title ?? 'gvf'} — ${run.units} units (lengths in ${u.length}, discharge in ${u.discharge}), method ${run.method}`);
  for (const flow of run.flows) {
    parts.push('', `flow ${flow.id}: discharge ${withUnit(flow.discharge, u.discharge, 3)}`);
    parts.push(
      formatTable<ReachResult>(
        [
          { header: 'reach', value: (r) => r.id, align: 'left' },
          { header: 'from', unit: u.length, value: (r) => r.from, decimals: 2 },
          { header: 'to', unit: u.length, value: (r) => r.to, decimals: 2 },
          { header: 'slope class', value: (r) => r.slopeClass, align: 'left' },
          { header: 'normal depth', unit: u.length, value: (r) => r.normalDepth, decimals: 3 },
          { header: 'critical depth', unit: u.length, value: (r) => r.criticalDepth, decimals: 3 },
          {
            header: 'profiles',
            value: (r) => r.profiles.map((p) => `${p.type} ${formatNumber(p.from, 1)}–${formatNumber(p.to, 1)}`).join(', ') || missingValue,
            align: 'left',
          },
        ],
        flow.reaches,
      ),
    );
    parts.push(...structureLines(flow, run.units));
    if (flow.jumps.length > 0) {
      parts.push('', 'hydraulic jumps:');
      parts.push(
        formatTable<JumpResult>(
          [
            { header: 'toe station', unit: u.length, value: (j) => j.station, decimals: 2 },
            { header: 'upstream depth', unit: u.length, value: (j) => j.upstreamDepth, decimals: 3 },
            { header: 'sequent depth', unit: u.length, value: (j) => j.downstreamDepth, decimals: 3 },
            { header: 'Froude', value: (j) => j.froude, decimals: 2 },
            { header: 'type', value: (j) => j.type, align: 'left' },
            { header: 'roller length', unit: u.length, value: (j) => j.length, decimals: 2 },
            { header: 'energy loss', unit: u.length, value: (j) => j.energyLoss, decimals: 3 },
          ],
          flow.jumps,
        ),
      );
    }
    parts.push('', 'stations:');
    parts.push(
      formatTable<StationResult>(
        [
          { header: 'station', unit: u.length, value: (s) => s.station, decimals: 2 },
          { header: 'bed', unit: u.length, value: (s) => s.bedElevation, decimals: 3 },
          { header: 'depth', unit: u.length, value: (s) => s.depth, decimals: 3 },
          { header: 'water surface', unit: u.length, value: (s) => s.wsel, decimals: 3 },
          { header: 'energy', unit: u.length, value: (s) => s.energyElevation, decimals: 3 },
          { header: 'velocity', unit: u.velocity, value: (s) => s.velocity, decimals: 3 },
          { header: 'Froude', value: (s) => s.froude, decimals: 3 },
          { header: 'regime', value: (s) => s.regime, align: 'left' },
        ],
        flow.stations,
      ),
    );
    if (flow.controls !== undefined && flow.controls.length > 0) {
      parts.push('', 'controls:');
      parts.push(
        formatTable<NonNullable<FlowResult['controls']>[number]>(
          [
            { header: 'station', unit: u.length, value: (c) => c.station, decimals: 2 },
            { header: 'control', value: (c) => c.kind, align: 'left' },
            { header: 'depth', unit: u.length, value: (c) => c.depth, decimals: 3 },
            { header: 'status', value: (c) => c.status, align: 'left' },
            { header: 'why', value: (c) => c.reason, align: 'left' },
          ],
          flow.controls,
        ),
      );
    }
    for (const stop of flow.stops ?? []) if (!stop.resolved) parts.push(`stop: ${stop.message}`);
    for (const n of flow.notes ?? []) parts.push(`note: ${n}`);
    for (const w of flow.warnings) parts.push(`warning: ${w}`);
  }
  if (comparison !== undefined) {
    parts.push('', `method comparison against ${comparison.reference}:`);
    for (const flow of comparison.flows) {
      parts.push(`flow ${flow.id}: largest depth difference ${formatSignificant(flow.largestDifference, 3)} ${u.length}, ${flow.withinGoal ? 'within' : 'OUTSIDE'} the accuracy goal`);
      parts.push(
        formatTable<MethodComparison['flows'][number]['methods'][number]>(
          [
            { header: 'method', value: (m) => m.method, align: 'left' },
            { header: 'largest difference', unit: u.length, value: (m) => m.largestDifference, decimals: 5 },
            { header: 'at station', unit: u.length, value: (m) => m.station, decimals: 2 },
            { header: 'goal there', unit: u.length, value: (m) => m.accuracyGoal, decimals: 4 },
            { header: 'within goal', value: (m) => m.withinGoal },
            { header: 'jump-toe shift', unit: u.length, value: (m) => m.toeShift, decimals: 3 },
          ],
          flow.methods,
        ),
      );
    }
  }
  parts.push('', ...run.cautions.map((c) => `caution: ${c}`));
  return parts.join('\n');
}
