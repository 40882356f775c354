/** The integration methods as a registry: an unimplemented method cannot be selected. */
import { directStep } from './directStep.js';
import { odeProfile, odeReference } from './ode.js';
import { standardStep } from './standardStep.js';
import { type ProfileIntegrator, settleOnCriticalSlope } from './stretch.js';
import type { ProfileMethod } from './types.js';

const settled =
  (integrator: ProfileIntegrator): ProfileIntegrator =>
  (spec) =>
    settleOnCriticalSlope(spec, integrator(spec));

export const integrators: Readonly<Record<ProfileMethod, ProfileIntegrator>> = {
  'standard-step': settled(standardStep),
  'direct-step': settled(directStep),
  ode: settled(odeProfile),
};

/** The ODE method at a tight tolerance, the yardstick of compareMethods. */
export const referenceIntegrator: ProfileIntegrator = settled(odeReference);
