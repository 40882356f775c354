/**
 * Words and units for named quantities (model keys, a structure's hand-check values): "headwaterStage" →
 * "Headwater stage" in m. The unit follows from the name's last word (…Depth, …Stage, …Velocity, …Discharge);
 * ratios (…ToRise, …OverRise) and coefficients carry none.
 */
import type { UnitSystem } from '../../core/units.js';

export type QuantityKind = 'length' | 'discharge' | 'area' | 'velocity';

/** Words for keys whose camelCase name does not read well on its own. */
const labels: Record<string, string> = {
  n: "Manning's n",
  chezy: 'Chézy C',
  ks: 'Sand roughness ks',
  alpha: 'Energy coefficient α',
  sideSlope: 'Side slope (H:1V)',
  sideSlopeRight: 'Right side slope (H:1V)',
  slope: 'Bed slope (fraction)',
};

const unitWords: Record<UnitSystem, Record<QuantityKind, string>> = {
  SI: { length: 'm', discharge: 'm³/s', area: 'm²', velocity: 'm/s' },
  US: { length: 'ft', discharge: 'ft³/s', area: 'ft²', velocity: 'ft/s' },
};

/** The physical kind of a quantity, recognised from its name; null for pure numbers (ratios, coefficients). */
export function kindOf(key: string): QuantityKind | null {
  if (key === 'ks') return 'length';
  // a ratio of two quantities ("headwaterToRise", "criticalHeadOverRise") has no unit
  if (/[a-z](To|Over)[A-Z]/.test(key)) return null;
  const k = key.toLowerCase();
  if (/(coefficient|factor|ratio|number|froude|count|barrels)$/.test(k)) return null;
  if (/area$/.test(k)) return 'area';
  if (/velocity$/.test(k)) return 'velocity';
  if (/(^|[a-z])discharge$|^dischargeper|inflowrate$|^q$/.test(k)) return 'discharge';
  if (/(width|length|depth|diameter|elevation|height|station|opening|crest|head|headwater|tailwater|freeboard|offset|rise|span|drop|stage|invert|loss|fall|energy)$/.test(k)) return 'length';
  return null;
}

export function unitOf(key: string, units: UnitSystem): string | undefined {
  const kind = kindOf(key);
  return kind === null ? undefined : unitWords[units][kind];
}

export function unitWord(kind: QuantityKind, units: UnitSystem): string {
  return unitWords[units][kind];
}

/** "bottomWidth" → "Bottom width", "downstreamBedElevation" → "Downstream bed elevation"; one- or two-letter symbols (K, Ks) kept. */
export function labelOf(key: string): string {
  const known = labels[key];
  if (known !== undefined) return known;
  if (key.length <= 2) return key;
  const words = key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .toLowerCase()
    .trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}
