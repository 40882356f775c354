/**
 * Assembly: validated input specs → the objects the engine computes with.
 *
 *   SectionSpec ──geometrySpecOf──▶ geometry spec ──createSection──▶ Section ──hydraulicSection──▶ HydraulicSection
 *   Model ──assembleSections──▶ named HydraulicSections ──assembleProfileInputs──▶ one ProfileInput per flow
 *
 * One section's assembly (geometrySpecOf, hydraulicSectionOf) is in assembleSection.ts.
 * This sits above the profile engine (the input layer may not import geometry, hydraulics or profile), so
 * the model reader stays plain data and the engine stays free of file formats. Problems the geometry finds
 * come back with the user's place prefixed: `sections.lined.bottomWidth` or `--bottom-width`.
 */
import { InputError, type Problem } from './core/errors.js';
import { unitsOf } from './core/units.js';
import type { HydraulicSection } from './hydraulics/hydraulicSection.js';
import type { Model } from './input/model/types.js';
import { hydraulicSectionOf } from './assembleSection.js';
import { isSurveyReach } from './input/model/survey.js';
import { formatPath } from './input/model/issues.js';
import { scaledRoughnessSpec } from './input/model/roughness.js';
import type { ProfileInput, ReachInput } from './profile/types.js';
import { assembleExtras, structuredFlowInput } from './assembleStructures.js';
import type { StructuredFlowInput } from './structures/controls/flow.js';

export { geometrySpecOf, hydraulicSectionOf } from './assembleSection.js';

/** Every named section of a model, built; all geometry problems are reported together. */
export function assembleSections(model: Model): Map<string, HydraulicSection> {
  const units = unitsOf(model.units);
  const built = new Map<string, HydraulicSection>();
  const problems: Problem[] = [];
  for (const [name, spec] of Object.entries(model.sections)) {
    const base = formatPath(['sections', name]);
    try {
      built.set(name, hydraulicSectionOf(spec, units, (key) => `${base}.${key}`));
    } catch (error) {
      if (error instanceof InputError) problems.push(...error.problems);
      else throw error;
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  return built;
}

export interface AssembleOptions {
  /** overrides the model's method */
  readonly method?: ProfileInput['method'];
  /** overrides the model's output spacing */
  readonly outputSpacing?: number;
  /** the engine's form of each surveyed reach, by reach index (src/survey: loadChannelSurvey) */
  readonly surveyReaches?: ReadonlyMap<number, ReachInput>;
  /** the model file, for data files named in it (a rating curve's CSV) */
  readonly modelFile?: string;
  /** read data files outside the model's folder (--allow-outside) */
  readonly allowOutside?: boolean;
  /**
   * Each reach's roughness multiplier (calibration, sensitivity; 1 when absent). A prismatic reach's section is
   * built again from its spec with the roughness scaled (one per section and multiplier); surveyed reaches come
   * scaled already (loadChannelSurvey takes the same option).
   */
  readonly roughnessMultiplier?: (reachId: string) => number;
}

/** One engine input per flow of the model (with its structures, special ends and flow changes: assembleStructures.ts). */
export function assembleProfileInputs(
  model: Model,
  sections: ReadonlyMap<string, HydraulicSection>,
  options: AssembleOptions = {},
): StructuredFlowInput[] {
  const units = unitsOf(model.units);
  const scaled = new Map<string, HydraulicSection>();
  const sectionFor = (name: string, m: number): HydraulicSection | undefined => {
    const spec = model.sections[name];
    if (m === 1 || spec === undefined) return sections.get(name);
    const key = `${name}\u0000${m}`;
    let hs = scaled.get(key);
    if (hs === undefined) {
      const base = formatPath(['sections', name]);
      scaled.set(key, (hs = hydraulicSectionOf(scaledRoughnessSpec(spec, m), units, (k) => `${base}.${k}`)));
    }
    return hs;
  };
  const reaches: ReachInput[] = model.reaches.map((reach, i) => {
    if (isSurveyReach(reach)) {
      const surveyed = options.surveyReaches?.get(i);
      if (surveyed === undefined) throw new InputError({ where: `reaches[${i}].survey`, message: 'the survey of this reach was not read (the run needs the model file)' });
      return surveyed;
    }
    const section = sectionFor(reach.section, options.roughnessMultiplier?.(reach.id) ?? 1);
    if (section === undefined) {
      throw new InputError({ where: `reaches[${i}].section`, message: `no section named ${JSON.stringify(reach.section)}`, value: reach.section });
    }
    return { kind: 'prismatic', id: reach.id, section, length: reach.length, slope: reach.slope };
  });
  const outputSpacing = options.outputSpacing ?? model.outputSpacing;
  const extras = assembleExtras(model, reaches, units, options);
  return model.flows.map((flow) => structuredFlowInput(model, flow, {
    units,
    reaches,
    discharge: flow.discharge ?? 1,
    flowId: flow.id,
    // the ends as the engine takes them (a rating curve and a reservoir are set by structuredFlowInput)
    boundaries: {},
    method: options.method ?? model.method,
    frictionAveraging: model.frictionAveraging,
    ...(outputSpacing === undefined ? {} : { outputSpacing }),
    downstreamBedElevation: model.downstreamBedElevation,
  }, extras));
}
