/**
 * The run report: one self-contained HTML file (inline CSS and SVG, no network, prints on A4 or Letter).
 *
 *   header band (title, units, method, version) → caution strip → summary per flow → charts →
 *   [sensitivity of the water surface, after a sensitivity run] → inputs echoed → station tables → warnings →
 *   method and accuracy → cautions → footer   (parts numbered in this order)
 *
 * Pure: buildReport takes the run, the inputs as label/value rows (the results layer fills them), the charts
 * as SVG strings, and returns the page as a string. All user text is escaped.
 */
import { screeningCaution } from '../../core/cautions.js';
import type { FlowResult, FreeboardRow, ReachResult, RunResult, StationResult, StructureResult } from '../../results/types.js';
import { accuracyGoal } from '../../core/tolerances.js';
import { escapeHtml as h, checkedSvg } from './escape.js';
import { reportCss, type Paper } from './css.js';
import { labelOf, unitOf } from './quantities.js';

/** One echoed input value: "Bottom width | 3 m". */
export interface ReportValue {
  label: string;
  value: string | number | boolean | null;
  unit?: string;
}

/** One echoed input object (a section, a reach, a structure, a boundary, a flow) with its values. */
export interface ReportItem {
  id: string;
  rows: ReportValue[];
}

/** The model's inputs as the results layer echoes them, grouped as a drainage report lists them. */
export interface ReportInputs {
  sections: ReportItem[];
  reaches: ReportItem[];
  structures: ReportItem[];
  boundaries: ReportItem[];
  flows: ReportItem[];
  /** anything else worth echoing (survey files, freeboard rule, settings), each group under its own heading */
  other?: { heading: string; items: ReportItem[] }[];
}

export interface ReportChart {
  /** short name, e.g. "profile" */
  id: string;
  /** words under the figure */
  caption: string;
  /** the chart as SVG (from render.ts) */
  svg: string;
}

/** A control of a flow (a boundary depth, critical depth at a break, a structure), in words. */
export interface ReportControl {
  /** flow id; absent means every flow */
  flow?: string;
  station?: number;
  description: string;
}

/** The widest water-surface range of one reach in a sensitivity run, at its station. */
export interface ReportRange {
  reach: string;
  station: number;
  /** water surface of the base case */
  base: number;
  low: number;
  high: number;
  range: number;
  /** the cases that gave the lowest and the highest water surface */
  lowCase: string;
  highCase: string;
}

/** A sensitivity run as the report shows it (numbers from src/analysis/sensitivity.ts, picked by assembleReport). */
export interface ReportSensitivity {
  /** what was varied, in words: "n ±20 %, Q ±10 %" */
  varied: string;
  /** cases computed, of all cases run */
  computed: number;
  cases: number;
  flows: {
    id: string;
    /** the widest range of each reach, in station order (at most a few reaches: the widest) */
    widest: ReportRange[];
    /** reaches of the flow (more than `widest` lists when some were left out) */
    reaches: number;
    /** where the jump toe lies over every case, when some case has a jump */
    jumpToeRange: { lowest: number; highest: number } | null;
    /** profile types or jumps that change between cases, in words */
    notes: string[];
  }[];
  /** cases that could not be computed, and why */
  warnings: string[];
}

export interface ReportInput {
  run: RunResult;
  inputs: ReportInputs;
  charts?: ReportChart[];
  program: { name: string; version: string };
  controls?: ReportControl[];
  method?: { description?: string; accuracy?: string; settings?: ReportValue[] };
  /** the model file as the user named it */
  modelFile?: string;
  /** page size for printing; 'auto' (default) fits both A4 and Letter */
  paper?: Paper;
  /** the range of water surface over a sensitivity run's cases, when one was made */
  sensitivity?: ReportSensitivity;
}

/** The caution every report carries, whatever the run adds. */
export const standardCaution = screeningCaution;

const methodWords: Record<string, string> = {
  'standard-step':
    'Standard step: the energy equation is balanced between neighbouring stations, each step solved by a bracketed iteration, with the friction slope averaged between the two stations.',
  'direct-step': 'Direct step: on prismatic reaches, depth is stepped in small increments and the distance of each increment is computed from the energy equation.',
  ode: 'The gradually varied flow equation dy/dx = (S0 − Sf) / (1 − Fr²) integrated with an adaptive Gragg–Bulirsch–Stoer extrapolation method (the odex package), with dense output at the output stations.',
};

function lengthUnit(run: RunResult): string {
  return run.units === 'US' ? 'ft' : 'm';
}
function dischargeUnit(run: RunResult): string {
  return run.units === 'US' ? 'ft³/s' : 'm³/s';
}

/** A number for a table cell (fixed decimals; −0 shows as 0), or "—" when it does not exist or is not finite. */
function num(x: number | null | undefined, decimals = 3): string {
  if (typeof x !== 'number' || !Number.isFinite(x)) return '—';
  const text = x.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

function valueText(v: ReportValue['value'], unit?: string): string {
  if (v === null) return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  // an echoed input shows what the user wrote, to six significant digits, not a reformatted value
  const text = typeof v === 'number' ? (Number.isFinite(v) ? String(Number(v.toPrecision(6))) : '—') : v;
  return unit ? `${text} ${unit}` : text;
}

function table(head: string[], rows: string[][], opts: { numeric?: boolean[]; cls?: string } = {}): string {
  const th = head.map((c, i) => `<th${opts.numeric?.[i] ? ' class="n"' : ''}>${c}</th>`).join('');
  const body = rows
    .map((r) => `<tr>${r.map((c, i) => (c.startsWith('<td') ? c : `<td${opts.numeric?.[i] ? ' class="n"' : ''}>${c}</td>`)).join('')}</tr>`)
    .join('\n');
  return `<table${opts.cls ? ` class="${opts.cls}"` : ''}><thead><tr>${th}</tr></thead><tbody>\n${body}\n</tbody></table>`;
}

/**
 * A group of echoed inputs: one wide table when every item has the same labels in the same order (a reach
 * list), else one row per value (item | property | value).
 */
function inputGroup(title: string, items: readonly ReportItem[]): string {
  if (items.length === 0) return `<h3>${h(title)}</h3><p class="empty">None.</p>`;
  const labels = items[0]!.rows.map((r) => r.label);
  const uniform = items.every((it) => it.rows.length === labels.length && it.rows.every((r, i) => r.label === labels[i]));
  if (uniform && labels.length <= 8) {
    const units = items[0]!.rows.map((r) => r.unit);
    const sameUnits = items.every((it) => it.rows.every((r, i) => r.unit === units[i]));
    const head = ['Id', ...labels.map((l, i) => h(sameUnits && units[i] ? `${l} (${units[i]})` : l))];
    const numeric = [false, ...items[0]!.rows.map((r) => typeof r.value === 'number')];
    const rows = items.map((it) => [h(it.id), ...it.rows.map((r) => h(valueText(r.value, sameUnits ? undefined : r.unit)))]);
    return `<h3>${h(title)}</h3>${table(head, rows, { numeric })}`;
  }
  const rows = items.flatMap((it) => it.rows.map((r, i) => [i === 0 ? `<b>${h(it.id)}</b>` : '', h(r.label), h(valueText(r.value, r.unit))]));
  return `<h3>${h(title)}</h3>${table(['Id', 'Property', 'Value'], rows)}`;
}

function profileTypes(reach: ReachResult, u: string): string {
  // the reach row's own stretches (one reach id may appear twice, split where its discharge changes)
  if (reach.profiles.length === 0) return '—';
  return reach.profiles.map((p) => `<b>${h(p.type)}</b> ${num(p.from, 1)}–${num(p.to, 1)} ${h(u)}`).join('<br>');
}

function freeboardFailures(flow: FlowResult): FreeboardRow[] {
  return (flow.freeboard ?? []).filter((f) => !f.pass || f.overtopped);
}

function structureBlock(s: StructureResult, u: string, units: RunResult['units']): string {
  // a quantity in words with its unit ("Headwater stage | 43.93 m"); ratios and coefficients bare
  const rows = Object.entries(s.values).map(([k, v]) => [h(labelOf(k)), h(valueText(v, typeof v === 'number' ? unitOf(k, units) : undefined))]);
  const notes = s.notes.length ? `<ul class="plain">${s.notes.map((n) => `<li>${h(n)}</li>`).join('')}</ul>` : '';
  return `<h5 class="item">${h(s.id)}: ${h(s.type)} at station ${num(s.station, 2)} ${h(u)}</h5>${table(['Quantity', 'Value'], rows)}${notes}`;
}

function flowSummary(run: RunResult, flow: FlowResult, index: number, controls: readonly ReportControl[]): string {
  const u = lengthUnit(run);
  const failures = freeboardFailures(flow);
  const maxWsel = flow.stations.reduce((m, s) => (Number.isFinite(s.wsel) && s.wsel > m ? s.wsel : m), -Infinity);
  const cards = [
    ['Discharge', `${num(flow.discharge, 3)} ${dischargeUnit(run)}`, false],
    ['Highest water surface', Number.isFinite(maxWsel) ? `${num(maxWsel)} ${u}` : '—', false],
    ['Hydraulic jumps', String(flow.jumps.length), false],
    ['Freeboard failures', String(failures.length), failures.length > 0],
    ['Warnings', String(flow.warnings.length), flow.warnings.length > 0],
  ] as const;
  const cardHtml = `<div class="cards">${cards.map(([k, v, bad]) => `<div class="card${bad ? ' bad' : ''}"><div class="k">${h(k)}</div><div class="v">${h(v)}</div></div>`).join('')}</div>`;
  const reaches = table(
    ['Reach', `From (${h(u)})`, `To (${h(u)})`, 'Slope class', `Normal depth (${h(u)})`, `Critical depth (${h(u)})`, 'Profile types'],
    flow.reaches.map((r) => [h(r.id), num(r.from, 2), num(r.to, 2), h(r.slopeClass), r.normalDepth === null ? 'none' : num(r.normalDepth), num(r.criticalDepth), profileTypes(r, u)]),
    { numeric: [false, true, true, false, true, true, false] },
  );
  const mine = controls.filter((c) => c.flow === undefined || c.flow === flow.id);
  const controlHtml = mine.length
    ? `<ul class="plain">${mine.map((c) => `<li>${typeof c.station === 'number' ? `station ${num(c.station, 2)} ${h(u)}: ` : ''}${h(c.description)}</li>`).join('')}</ul>`
    : '<p class="empty">Controls as set by the boundaries listed under Inputs.</p>';
  const jumps = flow.jumps.length
    ? table(
        [`Toe station (${h(u)})`, `Upstream depth (${h(u)})`, `Sequent depth (${h(u)})`, 'Froude number', 'Type', `Roller length (${h(u)})`, `Energy lost (${h(u)})`],
        flow.jumps.map((j) => [num(j.station, 2), num(j.upstreamDepth), num(j.downstreamDepth), num(j.froude, 2), h(j.type), num(j.length, 2), num(j.energyLoss)]),
        { numeric: [true, true, true, true, false, true, true] },
      )
    : '<p class="empty">No hydraulic jump.</p>';
  const structures = (flow.structures ?? []).length ? (flow.structures ?? []).map((s) => structureBlock(s, u, run.units)).join('') : '<p class="empty">No structure.</p>';
  const fb = failures.length
    ? table(
        [`Station (${h(u)})`, `Water surface (${h(u)})`, `Energy line (${h(u)})`, `Left freeboard (${h(u)})`, `Right freeboard (${h(u)})`, `Required (${h(u)})`, 'Result'],
        failures.map((f) => [num(f.station, 2), num(f.wsel), num(f.energyElevation), num(f.freeboardLeft), num(f.freeboardRight), num(f.required), `<td class="fail">${f.overtopped ? 'overtopped' : 'too little'}</td>`]),
        { numeric: [true, true, true, true, true, true, false] },
      )
    : flow.freeboard
      ? '<p class="pass">Freeboard met at every station.</p>'
      : '<p class="empty">No bank or lining elevations given: freeboard not checked.</p>';
  const warnings = flow.warnings.length ? `<ul class="warnings">${flow.warnings.map((w) => `<li>${h(w)}</li>`).join('')}</ul>` : '';
  return `<div class="flow" id="flow-${index}">
<h3>Flow ${h(flow.id)}</h3>
${cardHtml}
<h4>Reaches, depths and profile types</h4>
${reaches}
<h4>Controls</h4>
${controlHtml}
<h4>Hydraulic jumps</h4>
${jumps}
<h4>Structures</h4>
${structures}
<h4>Freeboard failures</h4>
${fb}
${warnings}
</div>`;
}

function stationTable(run: RunResult, flow: FlowResult): string {
  const u = lengthUnit(run);
  const v = run.units === 'US' ? 'ft/s' : 'm/s';
  // freeboard rows by station (a jump toe appears twice in both lists, in the same order)
  const fb = new Map<number, FreeboardRow[]>();
  for (const f of flow.freeboard ?? []) fb.set(f.station, [...(fb.get(f.station) ?? []), f]);
  const seen = new Map<number, number>();
  // the note column is there only when some station was interpolated between surveyed sections
  const anyInterpolated = flow.stations.some((s) => s.interpolated === true);
  const rows = flow.stations.map((s: StationResult) => {
    const k = seen.get(s.station) ?? 0;
    seen.set(s.station, k + 1);
    const f = fb.get(s.station)?.[k];
    const fail = f && (!f.pass || f.overtopped);
    return [
      num(s.station, 2),
      h(s.reach ?? ''),
      num(s.bedElevation),
      num(s.depth),
      num(s.wsel),
      num(s.energyElevation),
      num(s.velocity, 2),
      num(s.froude, 2),
      h(s.regime),
      num(s.criticalDepth),
      f ? `<td class="n${fail ? ' fail' : ''}">${num(f.freeboardLeft)}</td>` : '<td class="n">—</td>',
      f ? `<td class="n${fail ? ' fail' : ''}">${num(f.freeboardRight)}</td>` : '<td class="n">—</td>',
      ...(anyInterpolated ? [s.interpolated ? 'interpolated' : ''] : []),
    ];
  });
  return `<h3>Flow ${h(flow.id)} (${num(flow.discharge)} ${dischargeUnit(run)})</h3>
${table(
  [`Station (${u})`, 'Reach', `Bed (${u})`, `Depth (${u})`, `Water surface (${u})`, `Energy line (${u})`, `Velocity (${v})`, 'Froude', 'Regime', `Critical depth (${u})`, `Left freeboard (${u})`, `Right freeboard (${u})`, ...(anyInterpolated ? ['Note'] : [])].map(h),
  rows,
  { numeric: [true, false, true, true, true, true, true, true, false, true, true, true, false], cls: 'stations' },
)}`;
}

/** A case label ("n −20 %, Q +10 %") that wraps only after a comma, never inside "n −20 %". */
function caseText(label: string): string {
  return label.split(', ').map((part) => h(part).replace(/ /g, '&nbsp;')).join(', ');
}

/** The sensitivity part: what was varied, then each flow's widest range per reach in one short table. */
function sensitivityPart(run: RunResult, s: ReportSensitivity): string {
  const u = lengthUnit(run);
  const fewer = s.flows.some((f) => f.widest.length < f.reaches);
  const intro = `<p>Every flow was computed again for each combination of ${h(s.varied)} about the model's values (${s.computed} of ${s.cases} cases computed, the model itself among them). At each output station the band on the profile chart reaches from the lowest to the highest water surface of these cases. The table gives the widest range in each reach${fewer ? ' (for a flow through many reaches, only the reaches where it is widest)' : ''} and the station where it occurs; the widest of each flow is in bold.</p>`;
  const rows = s.flows.flatMap((f) => {
    if (f.widest.length === 0) return [[h(f.id), '—', '—', '—', '—', '—', '—', 'no computed station', '']];
    const top = f.widest.reduce((m, w) => (w.range > m.range ? w : m), f.widest[0]!);
    return f.widest.map((w, i) => {
      const bold = (text: string) => (w === top ? `<b>${text}</b>` : text);
      return [
        i === 0 ? `<b>${h(f.id)}</b>` : '',
        h(w.reach),
        num(w.station, 2),
        num(w.base),
        num(w.low),
        num(w.high),
        `<td class="n">${bold(num(w.range))}</td>`,
        caseText(w.lowCase),
        caseText(w.highCase),
      ];
    });
  });
  const widest = table(
    ['Flow', 'Reach', `Station (${h(u)})`, `Model water surface (${h(u)})`, `Lowest (${h(u)})`, `Highest (${h(u)})`, `Range (${h(u)})`, 'Lowest in case', 'Highest in case'],
    rows,
    { numeric: [false, false, true, true, true, true, true, false, false], cls: 'sensitivity' },
  );
  const changes = s.flows.flatMap((f) => [
    ...(f.jumpToeRange ? [`<li><b>${h(f.id)}:</b> ${h(`over all cases the jump toe lies between stations ${num(f.jumpToeRange.lowest, 2)} and ${num(f.jumpToeRange.highest, 2)} ${u}`)}</li>`] : []),
    ...f.notes.map((n) => `<li><b>${h(f.id)}:</b> ${h(n)}</li>`),
  ]);
  const changeHtml = changes.length
    ? `<h4>What changes between cases</h4><ul class="plain">${changes.join('')}</ul>`
    : '<p class="empty">No case changes a profile type or a hydraulic jump.</p>';
  const warnings = s.warnings.length ? `<ul class="warnings">${s.warnings.map((w) => `<li>${h(w)}</li>`).join('')}</ul>` : '';
  return `${intro}\n${widest}\n${changeHtml}${warnings}`;
}

function part(n: number, id: string, title: string, body: string, extraClass = ''): string {
  return `<section class="part${extraClass ? ` ${extraClass}` : ''}" id="${id}"><h2><span class="num">${n}</span>${h(title)}</h2>\n${body}\n</section>`;
}

/** The whole report page as one HTML string. */
export function buildReport(input: ReportInput): string {
  const { run, inputs } = input;
  const u = lengthUnit(run);
  const title = run.title && run.title.trim() ? run.title : 'Untitled run';
  const controls = input.controls ?? [];
  const cautions = [...new Set([standardCaution, ...run.cautions])];
  const methodName = run.method;
  const description = input.method?.description ?? methodWords[methodName] ?? `Method: ${methodName}.`;
  const goal = run.units === 'US' ? `${accuracyGoal.US} ft` : `${accuracyGoal.SI * 1000} mm`;
  const accuracy =
    input.method?.accuracy ??
    `With the default settings, every reported depth agrees with a tight-tolerance integration of the gradually varied flow equation within ${goal}, or ${accuracyGoal.relative * 100} % of the depth where that is larger; reaches are subdivided internally where needed to meet this.`;

  const meta: [string, string][] = [
    ['Units', run.units === 'US' ? 'US customary (ft, ft³/s)' : 'SI (m, m³/s)'],
    ['Method', methodName],
    ['Flows', String(run.flows.length)],
    ['Program', `${input.program.name} ${input.program.version}`],
  ];
  if (input.modelFile) meta.push(['Model file', input.modelFile]);

  const charts = input.charts ?? [];
  const chartHtml = charts.length
    ? charts
        .map(
          (c, i) =>
            `<figure class="chart" id="chart-${i}" data-chart="${h(c.id)}">\n${checkedSvg(c.svg)}\n<figcaption><b>Figure ${i + 1}.</b> ${h(c.caption)}</figcaption></figure>`,
        )
        .join('\n')
    : '<p class="empty">No chart was drawn.</p>';

  const allWarnings = run.flows.flatMap((f) => f.warnings.map((w) => ({ flow: f.id, text: w })));
  const warningsHtml = allWarnings.length
    ? `<ul class="warnings">${allWarnings.map((w) => `<li><b>${h(w.flow)}:</b> ${h(w.text)}</li>`).join('')}</ul>`
    : '<p class="empty">No warnings.</p>';

  const settings = input.method?.settings?.length
    ? table(['Setting', 'Value'], input.method.settings.map((s) => [h(s.label), h(valueText(s.value, s.unit))]))
    : '';

  const sections: { id: string; title: string; body: string; cls?: string }[] = [
    { id: 'summary', title: 'Summary by flow', body: run.flows.length ? run.flows.map((f, i) => flowSummary(run, f, i, controls)).join('\n') : '<p class="empty">No flow was run.</p>' },
    { id: 'charts', title: 'Charts', body: chartHtml },
    ...(input.sensitivity ? [{ id: 'sensitivity', title: 'Sensitivity of the water surface', body: sensitivityPart(run, input.sensitivity), cls: 'sensitivity' }] : []),
    {
      id: 'inputs',
      title: 'Inputs',
      body: [
        inputGroup('Sections', inputs.sections),
        inputGroup('Reaches', inputs.reaches),
        inputGroup('Structures', inputs.structures),
        inputGroup('Boundaries', inputs.boundaries),
        inputGroup('Flows', inputs.flows),
        ...(inputs.other ?? []).map((g) => inputGroup(g.heading, g.items)),
      ].join('\n'),
    },
    { id: 'stations', title: 'Station tables', body: run.flows.map((f) => stationTable(run, f)).join('\n') || '<p class="empty">No stations.</p>', cls: 'stations' },
    { id: 'warnings', title: 'Warnings', body: warningsHtml },
    { id: 'method', title: 'Method and accuracy', body: `<p>${h(description)}</p><p>${h(accuracy)}</p>${settings}<p>Stations are in ${h(u)}, measured as given in the model; elevations and depths in ${h(u)}.</p>` },
    { id: 'cautions', title: 'Cautions', body: `<div class="cautions"><ul class="plain">${cautions.map((c) => `<li>${h(c)}</li>`).join('')}</ul></div>` },
  ];
  const parts = sections.map((p, i) => part(i + 1, p.id, p.title, p.body, p.cls));
  const toc = sections.map((p) => p.title);
  const ids = sections.map((p) => p.id);

  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${h(input.program.name)} ${h(input.program.version)}">
<title>${h(title)}: flow profile report</title>
<style>${reportCss(input.paper ?? 'auto')}</style>
</head>
<body>
<header class="band">
<p class="kicker">Open-channel flow profile report</p>
<h1>${h(title)}</h1>
<dl class="meta">${meta.map(([k, v]) => `<div><dt>${h(k)}</dt><dd>${h(v)}</dd></div>`).join('')}</dl>
</header>
<main>
<p class="caution-strip"><b>Caution.</b> ${h(standardCaution)}</p>
<nav class="toc"><ol>${toc.map((t, i) => `<li><a href="#${ids[i]}">${h(t)}</a></li>`).join('')}</ol></nav>
${parts.join('\n')}
</main>
<footer>Made by ${h(input.program.name)} ${h(input.program.version)}. Units: ${h(run.units)}. ${h(standardCaution)}</footer>
</body>
</html>
`;
}
