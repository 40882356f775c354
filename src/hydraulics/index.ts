/** The hydraulics layer: friction laws, conveyance and α, and the depth solvers of a section. */
export * from './friction.js';
export * from './hydraulicSection.js';
export * from './state.js';
export * from './normalDepth.js';
export * from './criticalDepth.js';
export * from './specificEnergy.js';
export * from './specificForce.js';
export * from './froude.js';
export * from './slopeClass.js';
