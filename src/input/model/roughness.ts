/**
 * Roughness multipliers on section specs (calibration and sensitivity, src/analysis): m > 1 always means a
 * rougher channel. Manning's n and the sand roughness ks are multiplied by m, Chézy's C (a smoothness) is
 * divided by it, so with Manning's equation (Manning 1891) and with Chézy's the conveyance is exactly K/m; with
 * Darcy–Weisbach the friction factor follows Colebrook–White.
 *
 * The multiplier is applied to the spec, before a section is built: a surveyed reach's sections are built from
 * their specs (the survey's n by zone, or a model section) and blended between surveyed neighbours afterwards,
 * so scaling the specs is what carries the multiplier into every surveyed and interpolated section.
 * Plain data only, like the rest of the input layer.
 */
import type { FrictionName, RoughnessTable, SectionSpec } from './types.js';
import { resolveRoughness } from './rules.js';

/** A multiplier must be a finite number greater than 0 (a programming error otherwise: options are checked first). */
export function checkMultiplier(m: number): void {
  if (!(Number.isFinite(m) && m > 0)) throw new RangeError(`a roughness multiplier must be a number greater than 0, got ${m}`);
}

/** The roughness value for multiplier m under a friction law. */
export function scaleRoughness(value: number, friction: FrictionName, m: number): number {
  return friction === 'chezy' ? value / m : value * m;
}

/** A roughness given as one value or by zones ([[from, value], ...]), scaled by m. */
export function scaleRoughnessValue<T extends number | RoughnessTable>(value: T, friction: FrictionName, m: number): T {
  if (typeof value === 'number') return scaleRoughness(value, friction, m) as T;
  return value.map(([from, v]) => [from, scaleRoughness(v, friction, m)]) as T;
}

/** Manning's n given as one value or by zones, times m (the survey files give n only). */
export function scaleManning<T extends number | RoughnessTable>(value: T, m: number): T {
  checkMultiplier(m);
  return scaleRoughnessValue(value, 'manning', m);
}

/**
 * The spec with its roughness scaled by multiplier m (m = 1 returns `spec` itself). Only the key that carries
 * the roughness changes; geometry, friction law and a fixed α are kept.
 */
export function scaledRoughnessSpec(spec: SectionSpec, m: number): SectionSpec {
  checkMultiplier(m);
  if (m === 1) return spec;
  const roughness = resolveRoughness(spec);
  if (roughness === undefined) return spec; // no roughness: the section's own check reports it
  return { ...spec, [roughness.key]: scaleRoughnessValue(roughness.value, roughness.friction, m) } as SectionSpec;
}
