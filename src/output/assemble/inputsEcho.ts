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

/** Words for keys whose camelCase name does not read well on its own. */
const labels: Record<string, string> = {
  n: "Manning's n",
  chezy: 'Chézy C',
  ks: 'Sand roughness ks',
  alpha: 'Energy coefficient α',
  sideSlope: 'Side slope (H:1V)',
  sideSlopeRight: 'Right side slope (H:1V)',
  slope: 'Bed slope (fraction)',
  type: 'Type',
  shape: 'Shape',
  section: 'Section',
  elevation: 'Elevation',
};

/** The physical kind of a key's value, recognised from its name; null for pure numbers. */
function kindOf(key: string): 'length' | 'discharge' | 'area' | 'velocity' | null {
  const k = key.toLowerCase();
  if (k === 'ks') return 'length';
  if (/area$/.test(k)) return 'area';
  if (/velocity/.test(k)) return 'velocity';
  if (/discharge|inflowrate|^q$/.test(k)) return 'discharge';
  if (/(width|length|depth|diameter|elevation|height|station|opening|crest|head|freeboard|offset|rise|span|drop|stage)$/.test(k)) return 'length';
  return null;
}

const unitWords: Record<UnitSystem, Record<'length' | 'discharge' | 'area' | 'velocity', string>> = {
  SI: { length: 'm', discharge: 'm³/s', area: 'm²', velocity: 'm/s' },
  US: { length: 'ft', discharge: 'ft³/s', area: 'ft²', velocity: 'ft/s' },
};

/** "bottomWidth" → "Bottom width", "downstreamBedElevation" → "Downstream bed elevation". */
export function labelOf(key: string): string {
  const known = labels[key];
  if (known !== undefined) return known;
  const words = key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .toLowerCase()
    .trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

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
      const kind = typeof v === 'number' ? kindOf(key) : null;
      rows.push(kind ? { label, value: v, unit: unitWords[units][kind] } : { label, value: v });
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
const grouped = new Set(['$schema', 'title', 'description', 'units', 'sections', 'reaches', 'structures', 'boundaries', 'flows', 'method', 'frictionAveraging', 'outputSpacing', 'downstreamBedElevation']);

export function reportInputsOf(model: Model, run: RunResult): ReportInputs {
  const units = model.units;
  const loose = model as unknown as Record<string, unknown>;
  const first = run.flows[0];
  const sections: ReportItem[] = Object.entries(model.sections).map(([id, spec]) => ({ id, rows: rowsOf(spec as unknown as Record<string, unknown>, units) }));
  const reaches: ReportItem[] = model.reaches.map((reach, i) => {
    const computed = first?.reaches.find((r) => r.id === reach.id) ?? first?.reaches[i];
    const rows = rowsOf(reach as unknown as Record<string, unknown>, units, ['id']);
    if (computed) rows.push({ label: 'From station', value: computed.from, unit: unitWords[units].length }, { label: 'To station', value: computed.to, unit: unitWords[units].length });
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
    rows: [{ label: 'Downstream bed elevation', value: model.downstreamBedElevation, unit: unitWords[units].length }],
  };
  const other: { heading: string; items: ReportItem[] }[] = [];
  if (typeof loose.description === 'string' && loose.description.trim() !== '') {
    other.push({ heading: 'About this model', items: [{ id: 'Description', rows: [{ label: 'Text', value: loose.description }] }] });
  }
  other.push({ heading: 'Channel', items: [channel] });
  for (const [key, v] of Object.entries(loose)) {
    if (grouped.has(key) || v === undefined) continue;
    const heading = labelOf(key);
    if (Array.isArray(v)) other.push({ heading, items: listItems(v, units, labelOf(key).toLowerCase()) });
    else if (v && typeof v === 'object') other.push({ heading, items: [{ id: heading, rows: rowsOf(v as Record<string, unknown>, units) }] });
    else other.push({ heading, items: [{ id: heading, rows: [{ label: 'Value', value: isPlain(v) ? v : String(v) }] }] });
  }
  return { sections, reaches, structures, boundaries, flows, other };
}
