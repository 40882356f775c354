/**
 * The accepted ranges of model and flag values, in one place so messages, validation and README agree.
 * These are plausibility limits of practice, not physics: `--force` lifts the roughness limits.
 */

/** Manning's n of channels and conduits in practice lies well inside this (Chow 1959, Table 5-6 spans about 0.008–0.15). */
export const manningRange = { min: 0.005, max: 0.2 } as const;

/** α is at least 1 by definition (mean of v³ over V³); compound natural sections reach about 2 (Chow 1959 §2-7). */
export const alphaRange = { min: 1, max: 3 } as const;

/** A bed slope is a fraction; a value of 1 or more is a 45° bed, outside gradually varied flow (common practice). */
export const slopeLimit = 1;

/** An irregular section needs at least this many points to enclose an area. */
export const minimumPoints = 3;

/**
 * A number of larger magnitude in a model file or a flag is a typing or unit mistake, not a channel: 10⁷ m is
 * 10,000 km (10⁷ m³/s some fifty times the largest river's flood). The CSV readers use the same bound.
 */
export const largestMagnitude = 1e7;

/**
 * The smallest discharge accepted, in m³/s or ft³/s: a millilitre a second (0.03 ml/s in US units). Less is a trickle
 * a fraction of a millimetre deep even in a gutter, held together by surface tension, not open-channel flow
 * (common practice; gvf computes smaller flows, but none has the physics its methods assume).
 */
export const smallestDischarge = 1e-6;

/**
 * The smallest bottom width of a rectangular or trapezoidal channel (a trapezoid may also have 0: a triangle) and the
 * smallest conduit diameter, in m or ft: a millimetre (0.3 mm in US units). A narrower channel is a capillary, where
 * surface tension and laminar flow rule and none of the friction laws here apply (common practice); a value below it
 * is a unit mistake (mm typed as m).
 */
export const smallestWidth = 1e-3;

/** The largest conduit diameter, in m or ft: the largest tunnels are some 20 m across (from memory); beyond a kilometre
 *  a diameter is a unit mistake, and the shallowest flows in it fall below the depths the solvers resolve. */
export const largestDiameter = 1000;

/** At most this many output stations per flow (10 km every 0.1 m): a bound on memory and time, not physics. */
export const maxOutputStations = 100_000;

/** Lists and objects nest at most this deep in a model file (a model needs five or six levels; the checks recurse). */
export const maxNesting = 64;
