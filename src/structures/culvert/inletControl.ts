/**
 * Culvert inlet control by the FHWA equations (Schall, Thompson, Zerges, Kilgore and Morris, Hydraulic
 * Design of Highway Culverts, FHWA HDS-5, 3rd ed., 2012, Appendix A; from the NBS tests of French and the
 * synthesis of Bossy 1961). With the discharge intensity X = Ku·Q/(A·D^0.5), A the full barrel area and
 * D the barrel rise, Ku = 1.0 (US) or 1.811 (SI):
 *   unsubmerged, form 1:  HW/D = Hc/D + K·X^M + Ks·S      (Hc: specific head at critical depth)
 *   unsubmerged, form 2:  HW/D = K·X^M
 *   submerged:            HW/D = c·X² + Y + Ks·S
 * Ks = −0.5, or +0.7 for mitered inlets. The unsubmerged forms hold up to X = 3.5 and the submerged form
 * from X = 4.0; HDS-5 draws a transition curve between them, here a linear interpolation in X between the
 * two end values (the usual computational stand-in).
 */
import type { Units } from '../../core/units.js';
import type { HandValues } from '../types.js';
import { type Barrel, barrelCriticalDepth, barrelCriticalHead } from './barrel.js';

/** Ku: 1.0 in US customary units, 1.811 in SI (HDS-5 App. A). */
export function inletUnitFactor(units: Units): number {
  return units.system === 'US' ? 1.0 : 1.811;
}

/** Upper limit of the unsubmerged equations and lower limit of the submerged one in X = Ku·Q/(A·D^0.5). */
export const unsubmergedLimit = 3.5;
export const submergedLimit = 4.0;

export const InletType = {
  'concrete-pipe-square-edge-headwall': 'concrete-pipe-square-edge-headwall',
  'concrete-pipe-groove-end-headwall': 'concrete-pipe-groove-end-headwall',
  'concrete-pipe-groove-end-projecting': 'concrete-pipe-groove-end-projecting',
  'corrugated-pipe-projecting': 'corrugated-pipe-projecting',
  'corrugated-pipe-mitered': 'corrugated-pipe-mitered',
  'box-wingwalls-30-75': 'box-wingwalls-30-75',
  'box-wingwalls-90-15': 'box-wingwalls-90-15',
} as const;
export type InletType = keyof typeof InletType;

export interface InletCoefficients {
  readonly barrel: 'circular' | 'box';
  readonly description: string;
  readonly form: 1 | 2;
  readonly K: number;
  readonly M: number;
  readonly c: number;
  readonly Y: number;
  readonly Ks: number;
  /** entrance loss coefficient ke for outlet control (HDS-5 Table, confirmed) */
  readonly ke: number;
  /** how sure the coefficients are */
  readonly provenance: string;
}

const reproduced = 'HDS-5 Table A.1 as reproduced in secondary sources; two reproductions agree (original not seen)';

/**
 * HDS-5 Table A.1 coefficients (English-unit form; Ku converts SI). Two entries are disputed between
 * reproductions: the groove-end K (0.0018 vs 0.0078) and the 30°–75° box c (0.0347 vs 0.0385). The values
 * kept are those recalled and found in the majority of reproductions seen; they are marked from memory.
 */
export const inletCoefficients: Record<InletType, InletCoefficients> = {
  'concrete-pipe-square-edge-headwall': {
    barrel: 'circular', description: 'concrete pipe, square edge with headwall', form: 1,
    K: 0.0098, M: 2.0, c: 0.0398, Y: 0.67, Ks: -0.5, ke: 0.5, provenance: reproduced,
  },
  'concrete-pipe-groove-end-headwall': {
    barrel: 'circular', description: 'concrete pipe, groove end with headwall', form: 1,
    K: 0.0018, M: 2.0, c: 0.0292, Y: 0.74, Ks: -0.5, ke: 0.2,
    provenance: 'K = 0.0018 from memory and one reproduction (another gives 0.0078: disputed); M, c, Y agree',
  },
  'concrete-pipe-groove-end-projecting': {
    barrel: 'circular', description: 'concrete pipe, groove end projecting', form: 1,
    K: 0.0045, M: 2.0, c: 0.0317, Y: 0.69, Ks: -0.5, ke: 0.2, provenance: reproduced,
  },
  'corrugated-pipe-projecting': {
    barrel: 'circular', description: 'corrugated metal pipe, projecting', form: 1,
    K: 0.034, M: 1.5, c: 0.0553, Y: 0.54, Ks: -0.5, ke: 0.9, provenance: reproduced,
  },
  'corrugated-pipe-mitered': {
    barrel: 'circular', description: 'corrugated metal pipe, mitered to slope', form: 1,
    K: 0.021, M: 1.33, c: 0.0463, Y: 0.75, Ks: 0.7, ke: 0.7, provenance: reproduced,
  },
  'box-wingwalls-30-75': {
    barrel: 'box', description: 'concrete box, 30° to 75° wingwall flares', form: 1,
    K: 0.026, M: 1.0, c: 0.0347, Y: 0.81, Ks: -0.5, ke: 0.4,
    provenance: 'c = 0.0347 from memory and two of three reproductions (one gives 0.0385: disputed); K, M, Y agree',
  },
  'box-wingwalls-90-15': {
    barrel: 'box', description: 'concrete box, 90° and 15° wingwall flares', form: 1,
    K: 0.061, M: 0.75, c: 0.04, Y: 0.8, Ks: -0.5, ke: 0.5, provenance: reproduced,
  },
};

export type InletRegime = 'unsubmerged' | 'transition' | 'submerged';

export interface InletControlResult {
  /** headwater depth above the inlet invert */
  readonly headwaterDepth: number;
  readonly regime: InletRegime;
  /** X = Ku·Q/(A·D^0.5) */
  readonly dischargeIntensity: number;
  readonly values: HandValues;
}

function unsubmergedRatio(co: InletCoefficients, x: number, hcOverD: number, slope: number): number {
  const weir = co.K * Math.pow(x, co.M);
  return co.form === 1 ? hcOverD + weir + co.Ks * slope : weir;
}

function submergedRatio(co: InletCoefficients, x: number, slope: number): number {
  return co.c * x * x + co.Y + co.Ks * slope;
}

/** Inlet-control headwater of one barrel carrying `discharge` on `slope`. */
export function inletControl(b: Barrel, coefficients: InletCoefficients, discharge: number, slope: number, units: Units): InletControlResult {
  const D = b.rise;
  const ku = inletUnitFactor(units);
  const x = (ku * discharge) / (b.fullArea * Math.sqrt(D));
  const dc = barrelCriticalDepth(b, discharge, units);
  const hcOverD = barrelCriticalHead(b, dc) / D;
  // The critical head at X = 3.5 is needed for the transition end point (form 1).
  const atLimit = (xLimit: number) => {
    const q = (xLimit * b.fullArea * Math.sqrt(D)) / ku;
    return barrelCriticalHead(b, barrelCriticalDepth(b, q, units)) / D;
  };
  let ratio: number;
  let regime: InletRegime;
  if (x <= unsubmergedLimit) {
    ratio = unsubmergedRatio(coefficients, x, hcOverD, slope);
    regime = 'unsubmerged';
  } else if (x >= submergedLimit) {
    ratio = submergedRatio(coefficients, x, slope);
    regime = 'submerged';
  } else {
    const low = unsubmergedRatio(coefficients, unsubmergedLimit, atLimit(unsubmergedLimit), slope);
    const high = submergedRatio(coefficients, submergedLimit, slope);
    const t = (x - unsubmergedLimit) / (submergedLimit - unsubmergedLimit);
    ratio = low + t * (high - low);
    regime = 'transition';
  }
  const headwaterDepth = Math.max(ratio * D, 0);
  return {
    headwaterDepth,
    regime,
    dischargeIntensity: x,
    values: {
      inletRegime: regime,
      dischargeIntensity: x,
      unitFactorKu: ku,
      inletEquationForm: coefficients.form,
      K: coefficients.K,
      M: coefficients.M,
      c: coefficients.c,
      Y: coefficients.Y,
      Ks: coefficients.Ks,
      barrelCriticalDepth: dc,
      criticalHeadOverRise: hcOverD,
      inletHeadwaterOverRise: headwaterDepth / D,
      inletCoefficientProvenance: coefficients.provenance,
    },
  };
}
