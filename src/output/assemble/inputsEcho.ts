/**
 * The model's inputs echoed for the report, as label/value rows with units: sections, reaches, structures,
 * boundaries, flows, and any further model key under a heading of its own. Generic on purpose: a key that a
 * later feature adds to the model file is echoed with words made from its name rather than dropped, so the
 * report always shows what the run was given.
 */
import type { UnitSystem } from '../../core/units.js';
import type { Model } from '../../input/model/types.js';
import type { RunResult } from '../../results/types.js';
import type { ReportInputs, ReportItem, ReportValue } from '../report/html.js';
import { labelOf, unitOf, unitWord } from '../report/quantities.js';

export { labelOf };

type Plain = string | number | boolean | null;
const isPlain = (v: unknown): v is Plain => v === null || ['string', 'number', 'boolean'].includes(typeof v);

/** A list as words: short lists of plain values in full, longer or nested ones counted. */
function listText(key: string, list: readonly unknown[]): string {
  if (list.length > 0 && list.every((v) => Array.isArray(v))) {
    const what = key === 'points' ? 'points' : key === 'n' || key === 'chezy' || key === 'ks' ? 'zones' : 'rows';
    if (what === 'zones' && list.length <= 4) return list.map((v) => `from ${(v as unknown[])[0]}: ${(v as unknown[])[1]}`).join('; ');
    return `${list.length} ${what}`;
  }
  if (list.every(isPlain) && list.length <= 8) return list.map((v) => String(v)).join(', ');
  return `${list.length} entries`;
}

/** The rows of one input object: plain values, lists summarised, nested objects flattened ("Downstream: type"). */
export function rowsOf(value: Record<string, unknown>, units: UnitSystem, skip: readonly string[] = [], prefix = ''): ReportValue[] {
  const rows: ReportValue[] = [];
  for (const [key, v] of Object.entries(value)) {
    if (skip.includes(key) || v === undefined) continue;
    const label = prefix ? `${prefix}: ${labelOf(key).toLowerCase()}` : labelOf(key);
    if (isPlain(v)) {
      const unit = typeof v === 'number' ? unitOf(key, units) : undefined;
      rows.push(unit ? { label, value: v, unit } : { label, value: v });
    } else if (Array.isArray(v)) {
      rows.push({ label, value: listText(key, v) });
    } else if (typeof v === 'object') {
      rows.push(...rowsOf(v as Record<string, unknown>, units, [], label));
    }
  }
  return rows;
}

/** Items of a list of objects that carry an `id` (or are named by `name` or their position). */
function listItems(list: readonly unknown[], units: UnitSystem, what: string): ReportItem[] {
  return list.map((entry, i) => {
    if (!entry || typeof entry !== 'object' || Array.isArray(entry)) return { id: `${what} ${i + 1}`, rows: [{ label: 'Value', value: isPlain(entry) ? entry : listText(what, entry as unknown[]) }] };
    const o = entry as Record<string, unknown>;
    const id = typeof o.id === 'string' ? o.id : typeof o.name === 'string' ? o.name : `${what} ${i + 1}`;
    return { id, rows: rowsOf(o, units, ['id']) };
  });
}

/** Keys echoed in their own groups, or in the method settings, or not at all. */
const grouped = new Set(['$schema', 'title', 'description', 'units', 'sections', 'reaches', 'structures', 'boundaries', 'flows', 'method', 'frictionAveraging', 'outputSpacing', 'downstreamBedElevation', 'sectionChartsAt']);

/** The heading and item id under which the model's report settings are echoed. */
export const reportSettingsHeading = 'Report';
export const sectionChartsItem = 'Cross-section charts';

export function reportInputsOf(model: Model, run: RunResult): ReportInputs {
  const units = model.units;
  const loose = model as unknown as Record<string, unknown>;
  const first = run.flows[0];
  const sections: ReportItem[] = Object.entries(model.sections).map(([id, spec]) => ({ id, rows: rowsOf(spec as unknown as Record<string, unknown>, units) }));
  const reaches: ReportItem[] = model.reaches.map((reach, i) => {
    const computed = first?.reaches.find((r) => r.id === reach.id) ?? first?.reaches[i];
    const rows = rowsOf(reach as unknown as Record<string, unknown>, units, ['id']);
    if (computed) rows.push({ label: 'From station', value: computed.from, unit: unitWord('length', units) }, { label: 'To station', value: computed.to, unit: unitWord('length', units) });
    return { id: reach.id, rows };
  });
  const structures = Array.isArray(loose.structures) ? listItems(loose.structures, units, 'structure') : [];
  const boundaries: ReportItem[] = (['upstream', 'downstream'] as const).map((end) => {
    const b = model.boundaries[end];
    return { id: end === 'upstream' ? 'Upstream end' : 'Downstream end', rows: b ? rowsOf(b as unknown as Record<string, unknown>, units) : [{ label: 'Type', value: 'none given (assumed by the engine, see notes)' }] };
  });
  const flows = listItems(model.flows, units, 'flow');
  const channel: ReportItem = {
    id: 'Channel',
    rows: [{ label: 'Downstream bed elevation', value: model.downstreamBedElevation, unit: unitWord('length', units) }],
  };
  const other: { heading: string; items: ReportItem[] }[] = [];
  if (typeof loose.description === 'string' && loose.description.trim() !== '') {
    other.push({ heading: 'About this model', items: [{ id: 'Description', rows: [{ label: 'Text', value: loose.description }] }] });
  }
  other.push({ heading: 'Channel', items: [channel] });
  if (model.sectionChartsAt !== undefined) {
    const at = model.sectionChartsAt.map((x) => String(Number(x.toPrecision(6)))).join(', ');
    other.push({ heading: reportSettingsHeading, items: [{ id: sectionChartsItem, rows: [{ label: 'At stations', value: at, unit: unitWord('length', units) }] }] });
  }
  for (const [key, v] of Object.entries(loose)) {
    if (grouped.has(key) || v === undefined) continue;
    const heading = labelOf(key);
    if (Array.isArray(v)) other.push({ heading, items: listItems(v, units, labelOf(key).toLowerCase()) });
    else if (v && typeof v === 'object') other.push({ heading, items: [{ id: heading, rows: rowsOf(v as Record<string, unknown>, units) }] });
    else other.push({ heading, items: [{ id: heading, rows: [{ label: 'Value', value: isPlain(v) ? v : String(v) }] }] });
  }
  return { sections, reaches, structures, boundaries, flows, other };
}
