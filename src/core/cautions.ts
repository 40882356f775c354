/**
 * The cautions gvf's results carry, worded once (original wording). Every output that sizes or checks a
 * channel, conduit or structure takes its caution from here, so the words cannot drift apart.
 */

/** The caution on every result: a screening aid, deferring to licensed engineers and local codes. */
export const screeningCaution =
  'Results are a screening aid: channels, conduits and structures that protect people or property must be designed and checked by a licensed engineer under local codes and agency criteria.';

/** The further caution on every structure result (weirs, gates, culverts, drops, spillways). */
export const structureCaution =
  'Screening aid only: these structure figures come from simplified published methods under the assumptions ' +
  'stated with them. Weirs, gates, culverts, drops and spillways whose failure, overtopping or backwater could ' +
  'harm people or property must be designed and checked by a licensed engineer under local codes and agency criteria.';
