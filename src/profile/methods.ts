/** The integration methods as a registry: an unimplemented method cannot be selected. */
import { directStep } from './directStep.js';
import { odeProfile, odeReference } from './ode.js';
import { standardStep } from './standardStep.js';
import type { ProfileIntegrator } from './stretch.js';
import type { ProfileMethod } from './types.js';

export const integrators: Readonly<Record<ProfileMethod, ProfileIntegrator>> = {
  'standard-step': standardStep,
  'direct-step': directStep,
  ode: odeProfile,
};

/** The ODE method at a tight tolerance, the yardstick of compareMethods. */
export const referenceIntegrator: ProfileIntegrator = odeReference;
