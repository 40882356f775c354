/**
 * The caution that travels with every structure result (worded in src/core/cautions.ts); every function in
 * structures/ puts it on its result so no output that sizes or checks a structure can lose it.
 */
import { structureCaution } from '../core/cautions.js';

export { structureCaution };

/** The cautions list for a run that contains structures (for RunResult.cautions). */
export function structureCautions(): string[] {
  return [structureCaution];
}
