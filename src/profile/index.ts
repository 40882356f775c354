/** The profile engine: gradually varied flow profiles with mixed flow, three methods, and their comparison. */
export * from './types.js';
export { computeProfile, type EngineOptions } from './engine.js';
export { compareMethods, type ComparisonResult, type MethodComparison } from './compare.js';
export { classifyReach, profileType, profileStretches, type ReachClass } from './classify.js';
export { jumpAt, jumpLength, jumpType, locateToe } from './jump.js';
export { boundaryDepth, breakStart, downstreamStart, upstreamStart } from './controls.js';
export { integrators, referenceIntegrator } from './methods.js';
export { standardStep, energyStep } from './standardStep.js';
export { directStep } from './directStep.js';
export { odeProfile, odeReference } from './ode.js';
export { surveyedStretch, eddyLoss, flowLength, defaultContraction, defaultExpansion, type SurveyedRun } from './surveyed.js';
export { pointState, depthGradient, type PointState } from './energy.js';
export { meanFrictionSlope } from './frictionMean.js';
export type { StretchSpec, StretchProfile, StretchStop, ProfileIntegrator, FlowRegime } from './stretch.js';
