/**
 * The caution that travels with every structure result. Original wording for gvf; every function in
 * structures/ puts it on its result so no output that sizes or checks a structure can lose it.
 */
export const structureCaution =
  'Screening aid only: these structure figures come from simplified published methods under the assumptions ' +
  'stated with them. Weirs, gates, culverts, drops and spillways whose failure, overtopping or backwater could ' +
  'harm people or property must be designed and checked by a licensed engineer under local codes and agency criteria.';

/** The cautions list for a run that contains structures (for RunResult.cautions). */
export function structureCautions(): string[] {
  return [structureCaution];
}
