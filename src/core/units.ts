/**
 * The two consistent unit systems. Every computation runs in one of them; nothing is mixed.
 * g is the standard value (CGPM 1901: 9.80665 m/s²; 32.174 ft/s²).
 * The Manning factor 1.486 = (3.2808 ft/m)^(1/3) makes Manning's n the same number in both systems.
 */
export const UnitSystem = { SI: 'SI', US: 'US' } as const;
export type UnitSystem = keyof typeof UnitSystem;

export interface Units {
  readonly system: UnitSystem;
  /** gravitational acceleration, length/s² */
  readonly g: number;
  /** k in V = (k/n) R^(2/3) S^(1/2) */
  readonly manningFactor: number;
  /** kinematic viscosity of water near 20 °C, length²/s (for Darcy–Weisbach with Colebrook–White) */
  readonly kinematicViscosity: number;
  readonly length: 'm' | 'ft';
  readonly area: 'm²' | 'ft²';
  readonly discharge: 'm³/s' | 'ft³/s';
  readonly velocity: 'm/s' | 'ft/s';
}

export const SI: Units = Object.freeze({
  system: 'SI',
  g: 9.80665,
  manningFactor: 1.0,
  kinematicViscosity: 1.004e-6,
  length: 'm',
  area: 'm²',
  discharge: 'm³/s',
  velocity: 'm/s',
});

export const US: Units = Object.freeze({
  system: 'US',
  g: 32.174,
  manningFactor: 1.486,
  kinematicViscosity: 1.081e-5,
  length: 'ft',
  area: 'ft²',
  discharge: 'ft³/s',
  velocity: 'ft/s',
});

export function unitsOf(system: UnitSystem): Units {
  return system === 'US' ? US : SI;
}

export function isUnitSystem(value: unknown): value is UnitSystem {
  return value === 'SI' || value === 'US';
}
