/**
 * The zod pieces of the surveyed-reach and freeboard keys (survey.ts holds their types). Kept apart from
 * schema.ts so the survey keys read as one unit; schema.ts joins them into the model.
 */
import * as z from 'zod';
import { SurveyStationing, surveyDefaults } from './survey.js';

const lossCoefficient = (what: string, fallback: number) =>
  z.number().min(0).max(1).optional().describe(`${what} loss coefficient for stations that give none (default ${fallback}, usual for gradual transitions)`);

export const surveySchema = z
  .strictObject({
    stations: z
      .string()
      .describe('CSV file of stations (station, bed elevation, section; optional n, left and right bank, reach length, contraction, expansion), relative to the model file'),
    crossSections: z
      .string()
      .optional()
      .describe('CSV file of cross-section points (section id, offset, elevation; optional n where it changes), relative to the model file'),
    stationing: z
      .enum(Object.keys(SurveyStationing) as [SurveyStationing, ...SurveyStationing[]])
      .describe('which way the station numbers increase; results are reported in these numbers'),
    contraction: lossCoefficient('contraction', surveyDefaults.contraction),
    expansion: lossCoefficient('expansion', surveyDefaults.expansion),
  })
  .describe('a surveyed reach: stations and cross-sections read from CSV files beside the model');

export const surveyReachSchema = z.strictObject({
  id: z.string().min(1).describe('a name for the reach, unique in the model'),
  survey: surveySchema,
});

export const freeboardSchema = z
  .strictObject({
    fixed: z.number().nonnegative().describe('a fixed height required between the water surface and the bank (or lining) top'),
    velocityHeadFraction: z
      .number()
      .nonnegative()
      .default(surveyDefaults.velocityHeadFraction)
      .describe('a multiple of the velocity head αV²/2g added to the fixed height (default 0)'),
  })
  .describe('the freeboard required at every station: fixed + velocityHeadFraction × αV²/2g');
