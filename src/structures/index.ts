/** Structures: weirs, gates, culverts, drops, spillways and rating curves as controls of the profile. */
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
