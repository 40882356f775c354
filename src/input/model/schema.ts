/**
 * The model file schema (zod 4). Objects are strict: a key gvf does not know is an error, so a typing
 * mistake never silently drops a value. Types and shapes are checked here; plausibility and cross-references
 * (a reach naming a missing section, Manning's n out of range, duplicated ids) are checked in rules.ts and
 * validate.ts, which share their wording with the command-line flags through messages.ts.
 *
 * schema/gvf-model.schema.json is generated from this module (`npm run schema`); a test keeps them equal.
 * This module loads zod: import it lazily from light commands.
 */
import * as z from 'zod';
import * as msg from './messages.js';
import type { Model } from './types.js';
import { freeboardSchema, surveyReachSchema } from './surveySchema.js';
import { FrictionAveragingName, FrictionName, MethodName, modelDefaults } from './types.js';

const number = z.number();
const positive = z.number().positive();
const nonNegative = z.number().nonnegative();
const pair = (first: string, second: string) =>
  z.tuple([z.number(), z.number()], {
    error: (issue) => (issue.code === 'invalid_type' || issue.code === 'too_big' || issue.code === 'too_small'
      ? msg.expected(msg.pair(first, second), issue.input)
      : undefined),
  });

const roughnessTable = z
  .array(pair('fromStation', 'value'))
  .min(1)
  .describe('roughness that changes across the section: [[fromStation, value], ...], stations increasing');

const roughness = {
  friction: z
    .enum(Object.keys(FrictionName) as [keyof typeof FrictionName, ...Array<keyof typeof FrictionName>])
    .optional()
    .describe('friction law; by default it follows from the roughness key (n: manning, chezy, ks: darcy-weisbach)'),
  n: positive.optional().describe("Manning's n (0.005–0.2 unless --force)"),
  chezy: positive.optional().describe('Chézy C in the unit system\'s own units (m^½/s or ft^½/s)'),
  ks: positive.optional().describe('equivalent sand roughness ks (Darcy–Weisbach with Colebrook–White), a length'),
  alpha: number.optional().describe('fixed kinetic-energy coefficient α (1–3); by default from the roughness subsections'),
};

const sideSlope = nonNegative.describe('side slope, horizontal : 1 vertical (both sides unless sideSlopeRight is given)');
const sideSlopeRight = nonNegative.optional().describe('right side slope, horizontal : 1 vertical');

const rectangular = z.strictObject({
  shape: z.literal('rectangular'),
  bottomWidth: positive.describe('bottom width'),
  ...roughness,
});

const trapezoidal = z.strictObject({
  shape: z.literal('trapezoidal'),
  bottomWidth: nonNegative.describe('bottom width (0 makes a triangle)'),
  sideSlope,
  sideSlopeRight,
  ...roughness,
});

const triangular = z.strictObject({
  shape: z.literal('triangular'),
  sideSlope,
  sideSlopeRight,
  ...roughness,
});

const circular = z.strictObject({
  shape: z.literal('circular'),
  diameter: positive.describe('inside diameter of the conduit'),
  ...roughness,
});

const tableOrValue = (description: string) =>
  z.union([positive, roughnessTable], {
    error: (issue) => msg.expected('one positive number or a list of [fromStation, value] pairs', issue.input),
  })
    .optional()
    .describe(description);

const points = z.strictObject({
  shape: z.literal('points'),
  points: z
    .array(pair('station', 'elevation'))
    .describe('[station across the section, elevation] pairs, stations not decreasing, at least three'),
  friction: roughness.friction,
  n: tableOrValue("Manning's n: one number, or [[fromStation, n], ...] where it changes across the section"),
  chezy: tableOrValue('Chézy C: one number or [[fromStation, C], ...]'),
  ks: tableOrValue('sand roughness ks: one number or [[fromStation, ks], ...]'),
  alpha: roughness.alpha,
});

export const sectionSchema = z
  .discriminatedUnion('shape', [rectangular, trapezoidal, triangular, circular, points])
  .describe('a cross-section shape with its dimensions and roughness');

const id = z.string().min(1);

const reach = z.strictObject({
  id: id.describe('a name for the reach, unique in the model'),
  section: z.string().describe('the name of a section in "sections"'),
  length: positive.describe('length along the channel'),
  slope: number.describe('bed slope as a fraction, falling downstream (0.001 = 0.1 %); 0 horizontal, negative adverse'),
  bankHeight: positive.optional().describe('height of the bank (or lining) tops above the bed, both sides, for the freeboard check'),
});

/** A prismatic reach (section, length, slope) or a surveyed one (survey files); the keys given tell which. */
const anyReach = z
  .union([reach, surveyReachSchema], { error: () => msg.reachKind() })
  .describe('a prismatic reach (section, length, slope) or a surveyed reach (survey)');

const flow = z.strictObject({
  id: id.describe('a name for the flow, e.g. "100-year", unique in the model'),
  discharge: positive.describe('discharge Q'),
});

const boundary = z
  .discriminatedUnion('type', [
    z.strictObject({ type: z.literal('depth'), depth: positive.describe('depth above the bed') }),
    z.strictObject({ type: z.literal('stage'), elevation: number.describe('water-surface elevation') }),
    z.strictObject({ type: z.literal('normal') }),
    z.strictObject({ type: z.literal('critical') }),
  ])
  .describe('a control: a depth, a stage (water-surface elevation), normal depth, or critical depth');

const method = z
  .enum(Object.keys(MethodName) as [MethodName, ...MethodName[]])
  .default(modelDefaults.method)
  .describe('integration method');

const frictionAveraging = z
  .enum(Object.keys(FrictionAveragingName) as [FrictionAveragingName, ...FrictionAveragingName[]])
  .default(modelDefaults.frictionAveraging)
  .describe('friction-slope averaging of the standard step');

export const modelSchema = z
  .strictObject({
    $schema: z.string().optional().describe('a JSON Schema reference for editors; ignored by gvf'),
    title: z.string().optional().describe('job title, shown on results and reports'),
    units: z.enum(['SI', 'US']).describe('SI (m, m³/s) or US customary (ft, ft³/s); every number in the file is in these units'),
    sections: z.record(z.string().min(1), sectionSchema).describe('named cross-sections'),
    reaches: z.array(anyReach).min(1).describe('reaches from upstream to downstream'),
    downstreamBedElevation: number
      .default(modelDefaults.downstreamBedElevation)
      .describe('bed elevation at the downstream end of the last reach'),
    flows: z.array(flow).min(1).describe('the flows to compute, one profile each'),
    boundaries: z
      .strictObject({ upstream: boundary.optional(), downstream: boundary.optional() })
      .default({ ...modelDefaults.boundaries })
      .describe(
        'controls at the two ends; one the flow regime does not need is ignored with a note; a missing one is assumed (normal depth, or critical depth at a free overfall or pool entrance) with a note',
      ),
    method,
    frictionAveraging,
    outputSpacing: positive.optional().describe('output spacing along the channel (default at most 1/100 of its length)'),
  })
  .describe('a gvf model: channel sections, reaches, flows and controls');

/** Compile-time check that the schema produces the hand-written Model type. */
type SchemaModel = z.output<typeof modelSchema>;
const producesModel: (m: SchemaModel) => Model = (m) => m;
void producesModel;

/** The JSON Schema published for editors (schema/gvf-model.schema.json). */
export function modelJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(modelSchema, { io: 'input', target: 'draft-2020-12' }) as Record<string, unknown>;
  return { ...schema, title: 'gvf model file' };
}
    freeboard: freeboardSchema.optional(),
