/**
 * Sharp-crested (thin-plate) weirs: a rectangular notch by Kindsvater–Carter or Rehbock, and a triangular
 * (V) notch by Kindsvater–Shen. Headwater from discharge by bracketed inversion (../invert.ts); submergence by
 * Villemonte (./submergence.ts).
 *
 * Kindsvater–Carter (C. E. Kindsvater and R. W. Carter, "Discharge characteristics of rectangular thin-plate
 * weirs", Trans. ASCE 124, 1959; as given in USBR Water Measurement Manual, 3rd ed. 2001, ch. 7 §6, eq. 7-1):
 *   Q = Ce·(2/3)·√(2g)·Le·he^1.5,  Le = L + kb,  he = h1 + kh,  Ce = a(L/B) + b(L/B)·h1/p.
 *   kh = 0.003 ft (USBR WMM, confirmed); 0.001 m in SI (ISO 1438 value, from memory).
 *   The Ce lines and the kb curve against L/B are from memory of the tables in Bos (1989), Discharge
 *   Measurement Structures, ILRI Publ. 20, §5.1, which reproduce the Georgia Tech curves of WMM figs. 7-4/7-5;
 *   intermediate L/B are interpolated linearly.
 * Rehbock (T. Rehbock, 1929): Cd = 0.611 + 0.08·h/p in Q = (2/3)·Cd·√(2g)·b·h^1.5, for a full-width
 *   (suppressed) weir; coefficient line from memory.
 * Kindsvater–Shen V-notch (USBR WMM 2001 ch. 7 §7, eq. 7-3, after Kulin and Compton 1975):
 *   Q = Ce·(8/15)·√(2g)·tan(θ/2)·he^2.5,  he = h1 + kh, for fully contracted notches of 25°–100°.
 *   Ce and kh against θ are read from WMM figs. 7-6a/b, here from memory (90°: Ce = 0.578, kh = 0.85 mm);
 *   pass your own Ce and kh where a calibration or the figure is at hand.
 */
import { requireInput } from '../../core/errors.js';
import type { Units } from '../../core/units.js';
import type { ApproachArea, StructureOutcome } from '../types.js';
import { interpolate } from './table.js';
import { type WeirLaw, weirControl } from './weirControl.js';

const metresPerFoot = 0.3048;

/** Kindsvater–Carter Ce = intercept + slope·h/p against L/B (Bos 1989 §5.1; from memory). */
export const kindsvaterCarterCe = {
  ratio: [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0],
  intercept: [0.587, 0.588, 0.589, 0.59, 0.591, 0.592, 0.593, 0.595, 0.597, 0.599, 0.602],
  slope: [-0.0023, -0.002, -0.0018, 0.002, 0.0058, 0.011, 0.018, 0.03, 0.045, 0.064, 0.075],
} as const;

/** Kindsvater–Carter width correction kb in metres against L/B (Bos 1989 fig. 5.3 / WMM fig. 7-4; from memory). */
export const kindsvaterCarterKb = {
  ratio: [0, 0.2, 0.4, 0.6, 0.7, 0.8, 0.9, 1.0],
  metres: [0.0024, 0.0024, 0.0027, 0.0036, 0.0041, 0.0042, 0.0029, -0.0009],
} as const;

/** kh: 0.003 ft (USBR WMM ch. 7, confirmed); 0.001 m (ISO 1438, from memory). */
export function kindsvaterCarterKh(units: Units): number {
  return units.system === 'US' ? 0.003 : 0.001;
}

/** Kindsvater–Shen Ce and kh (mm) against notch angle in degrees (WMM figs. 7-6a/b; from memory, about ±0.003 in Ce). */
export const kindsvaterShenTable = {
  angle: [25, 40, 60, 80, 90, 100],
  ce: [0.591, 0.584, 0.577, 0.576, 0.578, 0.58],
  khMillimetres: [2.6, 1.8, 1.2, 0.95, 0.85, 0.8],
} as const;

export type RectangularWeirMethod = 'kindsvater-carter' | 'rehbock';

export interface RectangularWeirSpec {
  readonly method?: RectangularWeirMethod;
  /** crest length L */
  readonly crestLength: number;
  /** average width B of the approach channel (default L: a full-width weir) */
  readonly approachWidth?: number;
  /** crest height p above the approach bed */
  readonly crestHeight: number;
  readonly crestElevation: number;
  readonly approachArea?: ApproachArea;
  /** JSON path of this structure for messages */
  readonly where?: string;
}

function lengthFromMetres(metres: number, units: Units): number {
  return units.system === 'US' ? metres / metresPerFoot : metres;
}

function checkRectangular(spec: RectangularWeirSpec): string {
  const where = spec.where ?? 'structure';
  requireInput(spec.crestLength > 0 && Number.isFinite(spec.crestLength), `${where}.crestLength`, 'the crest length must be a positive number', spec.crestLength);
  requireInput(spec.crestHeight > 0 && Number.isFinite(spec.crestHeight), `${where}.crestHeight`, 'the crest height above the approach bed must be a positive number', spec.crestHeight);
  requireInput(Number.isFinite(spec.crestElevation), `${where}.crestElevation`, 'the crest elevation must be a number', spec.crestElevation);
  if (spec.approachWidth !== undefined) {
    requireInput(
      spec.approachWidth >= spec.crestLength && Number.isFinite(spec.approachWidth),
      `${where}.approachWidth`,
      `the approach width must be at least the crest length (${spec.crestLength})`,
      spec.approachWidth,
    );
  }
  return where;
}

/** The free-flow law of a rectangular thin-plate weir. */
export function rectangularWeirLaw(spec: RectangularWeirSpec, units: Units): WeirLaw {
  const where = checkRectangular(spec);
  const method = spec.method ?? 'kindsvater-carter';
  const L = spec.crestLength;
  const B = spec.approachWidth ?? L;
  const p = spec.crestHeight;
  const root2g = Math.sqrt(2 * units.g);
  if (method === 'rehbock') {
    requireInput(B === L, `${where}.approachWidth`, 'Rehbock’s coefficient is for a full-width (suppressed) weir: leave the approach width out or use kindsvater-carter', B);
    const cd = (h: number) => 0.611 + (0.08 * h) / p;
    return {
      kind: 'sharp-crested-rectangular',
      method: 'Rehbock (1929), Cd = 0.611 + 0.08·h/p',
      discharge: (h) => (h <= 0 ? 0 : (2 / 3) * cd(h) * root2g * L * Math.pow(h, 1.5)),
      headExponent: 1.5,
      headIs: 'water-surface',
      values: (h) => ({ dischargeCoefficient: cd(h), headToCrestHeight: h / p, crestLength: L }),
      notes: ['Rehbock coefficient line recalled from the literature (from memory); valid for a ventilated full-width nappe'],
      scale: Math.max(p, L / 4),
    };
  }
  const ratio = L / B;
  const a = interpolate(kindsvaterCarterCe.ratio, kindsvaterCarterCe.intercept, ratio);
  const b = interpolate(kindsvaterCarterCe.ratio, kindsvaterCarterCe.slope, ratio);
  const kb = lengthFromMetres(interpolate(kindsvaterCarterKb.ratio, kindsvaterCarterKb.metres, ratio), units);
  const kh = kindsvaterCarterKh(units);
  const Le = L + kb;
  const ce = (h: number) => a + (b * h) / p;
  return {
    kind: 'sharp-crested-rectangular',
    method: 'Kindsvater–Carter (1959), USBR Water Measurement Manual ch. 7 eq. 7-1',
    discharge: (h) => (h < 0 ? 0 : ce(h) * (2 / 3) * root2g * Le * Math.pow(h + kh, 1.5)),
    headExponent: 1.5,
    headIs: 'water-surface',
    values: (h) => ({
      effectiveCoefficient: ce(h),
      crestToApproachWidth: ratio,
      widthCorrection: kb,
      effectiveLength: Le,
      headCorrection: kh,
      effectiveHead: h + kh,
      headToCrestHeight: h / p,
    }),
    notes: ['Kindsvater–Carter Ce lines and kb curve from memory of Bos (1989); check against USBR WMM figs. 7-4 and 7-5'],
    scale: Math.max(p, L / 4),
  };
}

/** Free discharge over a rectangular thin-plate weir at head h1 (water surface above the crest). */
export function rectangularWeirDischarge(spec: RectangularWeirSpec, head: number, units: Units): number {
  return rectangularWeirLaw(spec, units).discharge(head);
}

/** Headwater of a rectangular thin-plate weir for a discharge (and tailwater, for submergence). */
export function sharpCrestedRectangular(
  spec: RectangularWeirSpec,
  discharge: number,
  tailwaterStage: number | null,
  units: Units,
): StructureOutcome {
  const law = rectangularWeirLaw(spec, units);
  requireInput(discharge >= 0 && Number.isFinite(discharge), `${spec.where ?? 'structure'}.discharge`, 'the discharge must be a number ≥ 0', discharge);
  return weirControl(law, spec.approachArea ? { crestElevation: spec.crestElevation, approachArea: spec.approachArea } : { crestElevation: spec.crestElevation }, discharge, tailwaterStage, units);
}

export interface TriangularNotchSpec {
  /** notch angle θ in degrees (25–100 for the built-in coefficients) */
  readonly angleDegrees: number;
  readonly crestElevation: number;
  /** effective coefficient Ce (default: from the angle) */
  readonly coefficient?: number;
  /** head correction kh in the unit system's length (default: from the angle) */
  readonly headCorrection?: number;
  readonly approachArea?: ApproachArea;
  readonly where?: string;
}

export function triangularNotchLaw(spec: TriangularNotchSpec, units: Units): WeirLaw {
  const where = spec.where ?? 'structure';
  const theta = spec.angleDegrees;
  const own = spec.coefficient !== undefined && spec.headCorrection !== undefined;
  requireInput(
    Number.isFinite(theta) && (own ? theta > 0 && theta < 180 : theta >= 25 && theta <= 100),
    `${where}.angleDegrees`,
    own ? 'the notch angle must lie between 0 and 180 degrees' : 'the built-in Kindsvater–Shen coefficients cover notch angles of 25 to 100 degrees; give coefficient and headCorrection for others',
    theta,
  );
  const t = kindsvaterShenTable;
  const ce = spec.coefficient ?? interpolate(t.angle, t.ce, theta);
  const kh = spec.headCorrection ?? lengthFromMetres(interpolate(t.angle, t.khMillimetres, theta) / 1000, units);
  requireInput(ce > 0 && ce < 1, `${where}.coefficient`, 'the effective coefficient must lie between 0 and 1', ce);
  requireInput(kh >= 0, `${where}.headCorrection`, 'the head correction must be ≥ 0', kh);
  const factor = ce * (8 / 15) * Math.sqrt(2 * units.g) * Math.tan(((theta / 2) * Math.PI) / 180);
  return {
    kind: 'triangular-notch',
    method: 'Kindsvater–Shen, USBR Water Measurement Manual ch. 7 eq. 7-3',
    discharge: (h) => (h < 0 ? 0 : factor * Math.pow(h + kh, 2.5)),
    headExponent: 2.5,
    headIs: 'water-surface',
    values: (h) => ({ effectiveCoefficient: ce, headCorrection: kh, effectiveHead: h + kh, notchAngleDegrees: theta }),
    notes: spec.coefficient === undefined ? ['Ce and kh against notch angle from memory of USBR WMM figs. 7-6a/b (about ±0.003 in Ce)'] : [],
    scale: lengthFromMetres(0.3, units),
  };
}

export function triangularNotchDischarge(spec: TriangularNotchSpec, head: number, units: Units): number {
  return triangularNotchLaw(spec, units).discharge(head);
}

/** Headwater of a fully contracted triangular notch for a discharge (and tailwater, for submergence). */
export function triangularNotch(spec: TriangularNotchSpec, discharge: number, tailwaterStage: number | null, units: Units): StructureOutcome {
  const law = triangularNotchLaw(spec, units);
  requireInput(discharge >= 0 && Number.isFinite(discharge), `${spec.where ?? 'structure'}.discharge`, 'the discharge must be a number ≥ 0', discharge);
  return weirControl(law, spec.approachArea ? { crestElevation: spec.crestElevation, approachArea: spec.approachArea } : { crestElevation: spec.crestElevation }, discharge, tailwaterStage, units);
}
