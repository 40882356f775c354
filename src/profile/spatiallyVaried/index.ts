/** Spatially varied flow with lateral inflow: the public surface of this folder. */
export { spatiallyVariedFlow, spatiallyVariedCautions } from './spatiallyVariedFlow.js';
export { spatiallyVariedSlope, spatiallyVariedTerms, momentumFunction, lateralCriticalDepth, type SpatiallyVariedTerms } from './equation.js';
export { inflowLayout, type InflowLayout, type LateralInflowStretch } from './lateralInflow.js';
export { locateControl, singularPointSlope, criticalConditionResidual, stepOffCriticalEnd, depthForMomentum, type ControlLocation, type ControlKind, type SingularPointSlope } from './controlSection.js';
export { spatiallyVariedReach, type SpatiallyVariedReach } from './context.js';
export { integrateBranch, type Branch, type BranchPoint, type BranchResult } from './branch.js';
export type * from './types.js';
