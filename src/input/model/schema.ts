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
  discharge: positive.optional().describe('discharge Q entering at the upstream end (leave it out where the upstream boundary is a reservoir: it is found)'),
  poolElevation: number.optional().describe('with a reservoir upstream: this flow\'s pool elevation (default the boundary\'s)'),
});

const boundary = z
  .discriminatedUnion('type', [
    z.strictObject({ type: z.literal('depth'), depth: positive.describe('depth above the bed') }),
    z.strictObject({ type: z.literal('stage'), elevation: number.describe('water-surface elevation') }),
    z.strictObject({ type: z.literal('normal') }),
    z.strictObject({ type: z.literal('critical') }),
  ])
  .describe('a control: a depth, a stage (water-surface elevation), normal depth, or critical depth');

const ratingBoundary = z.strictObject({
  type: z.literal('rating'),
  table: z.array(pair('stage', 'discharge')).optional().describe('[[stage, discharge], ...], stage and discharge rising together; give this or file'),
  file: z.string().optional().describe('a CSV file with stage and discharge columns, relative to the model file; give this or table'),
});

const reservoirBoundary = z.strictObject({
  type: z.literal('reservoir'),
  poolElevation: number.describe('water-surface elevation of the pool (still water)'),
  entranceLoss: nonNegative.optional().describe('entrance loss coefficient ke, times the entrance velocity head (default 0)'),
});

const upstreamBoundary = z
  .discriminatedUnion('type', [...boundary.options, reservoirBoundary])
  .describe('a control at the upstream end: a depth, a stage, normal or critical depth, or a reservoir (the discharge is then found from the pool)');

const downstreamBoundary = z
  .discriminatedUnion('type', [...boundary.options, ratingBoundary])
  .describe('a control at the downstream end: a depth, a stage, normal or critical depth, or a stage–discharge rating curve');

const perFlow = (description: string, sign: 'any' | 'positive') =>
  z
    .union([sign === 'positive' ? positive : number, z.record(z.string().min(1), sign === 'positive' ? positive : number)], {
      error: (issue) => msg.expected(`one ${sign === 'positive' ? 'positive ' : ''}number for every flow, or an object of numbers by flow id`, issue.input),
    })
    .describe(description);

const flowChange = z.strictObject({
  id: z.string().optional().describe('a name for the inflow (tributary, inlet), for messages'),
  station: number.describe('where the discharge joins (it applies downstream of this station)'),
  addedDischarge: perFlow('discharge added there (negative: withdrawn): one number, or {"flow id": number, ...}', 'any'),
});

const lateral = z.strictObject({
  id: z.string().optional().describe('a name for the stretch, for messages'),
  from: number.describe('station where the lateral inflow begins'),
  to: number.describe('station where it ends (within the same prismatic reach)'),
  inflowPerLength: perFlow('discharge entering per unit length of channel: one number, or {"flow id": number, ...}', 'positive'),
});

const structureCommon = {
  id: id.describe('a name for the structure, unique in the model'),
  station: number.describe('station along the channel (inside it; a free overfall may sit at the downstream end)'),
  description: z.string().optional().describe('free text for the report'),
  bedDrop: nonNegative.optional().describe('the bed just downstream lies this much lower (default 0; a culvert: barrel length × slope)'),
};

const structure = z
  .discriminatedUnion('type', [
    z.strictObject({
      type: z.literal('sharp-crested-weir'),
      ...structureCommon,
      crestElevation: number.describe('crest elevation'),
      crestLength: positive.describe('crest length across the flow'),
      approachWidth: positive.optional().describe('approach channel width B (default the crest length: full width)'),
      coefficientMethod: z.enum(['kindsvater-carter', 'rehbock']).optional().describe('coefficient equation (default kindsvater-carter)'),
    }),
    z.strictObject({
      type: z.literal('v-notch-weir'),
      ...structureCommon,
      vertexElevation: number.describe('elevation of the lowest point of the notch'),
      notchAngle: positive.describe('notch angle in degrees (25–100 with the built-in coefficients)'),
      coefficient: positive.optional().describe('effective coefficient Ce (default from the angle)'),
      headCorrection: nonNegative.optional().describe('head correction kh, a length (default from the angle)'),
    }),
    z.strictObject({
      type: z.literal('broad-crested-weir'),
      ...structureCommon,
      crestElevation: number.describe('crest elevation'),
      crestWidth: positive.describe('crest width across the flow'),
      coefficient: positive.optional().describe('ratio of actual to ideal discharge (default 0.85)'),
    }),
    z.strictObject({
      type: z.literal('road-overflow'),
      ...structureCommon,
      crestElevation: number.describe('low point of the road crest'),
      overtoppedLength: positive.describe('length of roadway overtopped, across the flow'),
      roadWidth: positive.optional().describe('road crest width in the direction of flow'),
      coefficient: positive.optional().describe('Cr in Q = Cr·L·H^1.5, length^½/s (default the paved-road value)'),
    }),
    z.strictObject({
      type: z.literal('sluice-gate'),
      ...structureCommon,
      opening: positive.describe('gate opening above the floor'),
      width: positive.optional().describe('gate width (default the bottom width of a rectangular channel there)'),
      contractionCoefficient: positive.optional().describe('contraction coefficient Cc (default 0.61)'),
    }),
    z.strictObject({
      type: z.literal('culvert'),
      ...structureCommon,
      barrel: z
        .discriminatedUnion('shape', [
          z.strictObject({ shape: z.literal('circular'), diameter: positive.describe('inside diameter') }),
          z.strictObject({ shape: z.literal('box'), span: positive.describe('inside width'), rise: positive.describe('inside height') }),
        ])
        .describe('the barrel: circular (diameter) or box (span, rise)'),
      length: positive.describe('barrel length'),
      slope: number.describe('barrel slope as a fraction, falling downstream'),
      n: positive.describe("Manning's n of the barrel"),
      inlet: z
        .enum([
          'concrete-pipe-square-edge-headwall',
          'concrete-pipe-groove-end-headwall',
          'concrete-pipe-groove-end-projecting',
          'corrugated-pipe-projecting',
          'corrugated-pipe-mitered',
          'box-wingwalls-30-75',
          'box-wingwalls-90-15',
        ])
        .describe('entrance type (inlet-control coefficients, default entrance loss)'),
      entranceLoss: nonNegative.optional().describe('entrance loss coefficient ke (default from the entrance type)'),
      barrels: positive.optional().describe('identical barrels side by side (default 1)'),
    }),
    z.strictObject({ type: z.literal('free-overfall'), ...structureCommon }),
    z.strictObject({
      type: z.literal('spillway'),
      ...structureCommon,
      crestElevation: number.describe('crest elevation'),
      crestLength: positive.describe('crest length'),
      coefficient: positive.optional().describe('C in Q = C·L·He^1.5, length^½/s (default the curve against crest height over head)'),
      apronLength: positive.optional().describe('apron length below the toe, for the jump check'),
      apronWidth: positive.optional().describe('apron width (default the crest length)'),
      chuteLoss: nonNegative.optional().describe('chute loss, times the toe velocity head (default 0)'),
    }),
  ])
  .describe('a structure along the channel: weir, gate, culvert, drop or spillway');

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
      .strictObject({ upstream: upstreamBoundary.optional(), downstream: downstreamBoundary.optional() })
      .default({ ...modelDefaults.boundaries })
      .describe(
        'controls at the two ends; one the flow regime does not need is ignored with a note; a missing one is assumed (normal depth, or critical depth at a free overfall or pool entrance) with a note',
      ),
    method,
    freeboard: freeboardSchema.optional(),
    frictionAveraging,
    outputSpacing: positive.optional().describe('output spacing along the channel (default at most 1/100 of its length)'),
    description: z.string().optional().describe('free text: what the model is (say here when a scenario or its data are invented)'),
    structures: z.array(structure).optional().describe('weirs, gates, culverts, drops and spillways along the channel'),
    flowChanges: z.array(flowChange).optional().describe('discharges joining (tributaries, inlets) or leaving the channel at stations'),
    lateralInflow: z.array(lateral).optional().describe('lateral inflow along stretches (side-channel spillway, gutter, collector channel)'),
    sectionChartsAt: z
      .array(number)
      .min(1)
      .optional()
      .describe('stations where the report (gvf run --out) draws a cross-section chart, besides every structure; each must lie on the channel; --sections replaces this list'),
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
