/**
 * Structures: weirs, gates, culverts, drops, spillways and rating curves as controls of the profile.
 *
 * For the profile engine: every structure is a pure function
 *   (spec, discharge, tailwaterStage | null, units[, …]) → StructureOutcome
 * (types.ts). Compute the subcritical profile downstream of the structure first (or take the downstream
 * boundary), pass its stage just below the structure as tailwaterStage, then
 *   - start the upstream subcritical profile from outcome.headwaterStage (energy: outcome.headwaterEnergy);
 *   - where outcome.downstreamSupercriticalDepth is not null (free gate, spillway toe, steep culvert
 *     outlet), start a supercritical profile downstream from that depth and place the jump by specific force.
 * Weirs and spillways take an optional approachArea(stage) (the engine's upstream section) to split the
 * approach velocity head. culvert() takes options.barrelProfile, the engine's part-full barrel profile
 * (culvert/outletControl.ts: BarrelProfileInputs → BarrelProfileResult), injected so structures need not
 * import the engine. freeOverfall() takes the critical depth the engine already has. toStructureResult()
 * turns an outcome into the results layer's StructureResult (caution kept as the last note).
 *
 * controls/ builds the engine's InternalControl objects from model structures on top of these functions
 * (structureControl), injects the engine's barrel profile into culvert(), places the jump below gates and
 * spillways after the run, and runs one flow with a rating curve, a reservoir or an end overfall
 * (computeStructuredFlow). It is exported from controls/index.ts, not from here, so this index stays free of
 * the engine.
 */
export * from './types.js';
export * from './cautions.js';
export * from './invert.js';
export * from './approach.js';
export * from './weirs/submergence.js';
export * from './weirs/weirControl.js';
export * from './weirs/sharpCrested.js';
export * from './weirs/broadCrested.js';
export * from './weirs/roadOverflow.js';
export * from './gate.js';
export * from './culvert/barrel.js';
export * from './culvert/inletControl.js';
export * from './culvert/outletControl.js';
export * from './culvert/culvert.js';
export * from './drop.js';
export * from './spillway.js';
export * from './rating.js';
