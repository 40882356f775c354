/**
 * Friction laws: the conveyance K of one roughness subsection, so that Q = K·√Sf.
 *
 * - Manning (1891): K = (k/n)·A·R^(2/3), k = 1 (SI) or 1.486 (US).
 * - Chézy (1775): K = C·A·√R, C in the unit system's own units (m^½/s or ft^½/s).
 * - Darcy–Weisbach with Colebrook–White (1939): K = A·√(8gR/f), with f from
 *   1/√f = −2·log10(ks/(14.8R) + 2.51/(Re·√f)), Re = 4RV/ν (the pipe formula with D = 4R, as used for
 *   open channels, e.g. Chow 1959 ch. 8 (chapter from memory) and Chadwick & Morfett, Hydraulics in Civil Engineering).
 *   Without a discharge the fully rough limit (Re → ∞) is used.
 */
import { brentRoot } from '../core/roots.js';
import { colebrookWhiteBounds, colebrookWhiteTolerance } from '../core/tolerances.js';
import type { Units } from '../core/units.js';
import type { SubsectionElements } from '../geometry/section.js';

export const FrictionLaw = { manning: 'manning', chezy: 'chezy', 'darcy-weisbach': 'darcy-weisbach' } as const;
export type FrictionLaw = keyof typeof FrictionLaw;

/** The name of the roughness value each law takes, for messages and tables. */
export const roughnessName: Record<FrictionLaw, string> = {
  manning: "Manning's n",
  chezy: 'Chézy C',
  'darcy-weisbach': 'equivalent sand roughness ks',
};

/**
 * Darcy friction factor from Colebrook–White for hydraulic radius R, roughness ks and Reynolds number Re
 * (Infinity: fully rough). The equation has a root only while ks/(14.8R) < 1; where the roughness is as
 * large as the flow depth the factor is held at its largest value (core/tolerances.ts colebrookWhiteBounds),
 * so the conveyance of such a thin sheet of flow is tiny but positive. Colebrook–White describes turbulent
 * flow; gvf applies it at every Reynolds number (no laminar branch: open channels of practical size are turbulent).
 */
export function colebrookWhiteFactor(hydraulicRadius: number, ks: number, reynolds: number): number {
  const relative = ks / (14.8 * hydraulicRadius);
  const { low, high } = colebrookWhiteBounds;
  // x = 1/√f solves x + 2·log10(relative + 2.51·x/Re) = 0; the residual is increasing in x.
  const residual = Number.isFinite(reynolds)
    ? (x: number) => x + 2 * Math.log10(relative + (2.51 * x) / reynolds)
    : (x: number) => x + 2 * Math.log10(relative);
  let x: number;
  if (residual(low) >= 0) x = low;
  else if (residual(high) <= 0) x = high;
  else if (!Number.isFinite(reynolds)) x = -2 * Math.log10(relative);
  else x = brentRoot(residual, low, high, { xTolerance: colebrookWhiteTolerance, what: 'Colebrook–White friction factor' });
  return 1 / (x * x);
}

/** Conveyance of one subsection. `velocity` (mean velocity of the flow) matters only for Darcy–Weisbach. */
export function subsectionConveyance(sub: SubsectionElements, law: FrictionLaw, units: Units, velocity?: number): number {
  return conveyanceOf(sub.area, sub.wettedPerimeter, sub.roughness, law, units, velocity);
}

/** subsectionConveyance from the subsection's area, wetted perimeter and roughness (no object needed). */
export function conveyanceOf(
  area: number,
  wettedPerimeter: number,
  roughness: number,
  law: FrictionLaw,
  units: Units,
  velocity?: number,
): number {
  if (area <= 0 || wettedPerimeter <= 0) return 0;
  const r = area / wettedPerimeter;
  switch (law) {
    case 'manning':
      return (units.manningFactor / roughness) * area * Math.cbrt(r * r);
    case 'chezy':
      return roughness * area * Math.sqrt(r);
    case 'darcy-weisbach': {
      const reynolds = velocity === undefined || velocity <= 0 ? Infinity : (4 * r * velocity) / units.kinematicViscosity;
      const f = colebrookWhiteFactor(r, roughness, reynolds);
      return area * Math.sqrt((8 * units.g * r) / f);
    }
  }
}
