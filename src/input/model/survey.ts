/**
 * The model keys of surveyed reaches and freeboard, as types (no runtime code beyond named defaults, so light
 * commands can import them). A surveyed reach reads its stations and cross-sections from CSV files beside the
 * model; see src/input/csv for the file formats and src/survey for how they become the engine's nodes.
 */

/** How the user's station numbers run along the channel. */
export const SurveyStationing = {
  'increasing-downstream': 'increasing-downstream',
  'increasing-upstream': 'increasing-upstream',
} as const;
export type SurveyStationing = keyof typeof SurveyStationing;

export interface SurveySpec {
  /** the stations file (station, bed elevation, section, optional n, banks, reach length, loss coefficients) */
  stations: string;
  /** the cross-section points file (section id, offset, elevation, optional n); optional when every station names a model section */
  crossSections?: string;
  /** which way the station numbers increase */
  stationing: SurveyStationing;
  /** contraction loss coefficient for stations that give none (default 0.1) */
  contraction?: number;
  /** expansion loss coefficient for stations that give none (default 0.3) */
  expansion?: number;
}

/** A reach described by a survey: its sections, beds and lengths come from the survey files. */
export interface SurveyReachSpec {
  id: string;
  survey: SurveySpec;
  /** not a key of a surveyed reach (declared so code may read `reach.section` on any reach) */
  section?: never;
}

/** The freeboard a station needs: fixed + velocityHeadFraction × αV²/2g. */
export interface FreeboardSpec {
  /** a fixed height above the water surface */
  fixed: number;
  /** a multiple of the velocity head added to the fixed height (default 0) */
  velocityHeadFraction: number;
}

/**
 * Loss coefficients where neither the station row nor the survey gives one: 0.1 for a contraction and 0.3 for
 * an expansion, the values usual for gradual transitions (common practice; see Chow 1959 §10-4 on eddy losses).
 */
export const surveyDefaults = { contraction: 0.1, expansion: 0.3, velocityHeadFraction: 0 } as const;

/** True for a reach given by a survey. */
export function isSurveyReach(reach: object): reach is SurveyReachSpec {
  return 'survey' in reach && (reach as { survey?: unknown }).survey !== undefined;
}
