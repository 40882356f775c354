/**
 * Roughness multipliers: a section whose roughness is the model's times m, and an engine input whose reaches
 * carry such sections. m > 1 always means a rougher channel: Manning's n and the sand roughness ks are
 * multiplied by m, Chézy's C (a smoothness) is divided by it. With Manning's equation (Manning 1891) the
 * conveyance is then exactly K/m; with Chézy too; with Darcy–Weisbach the friction factor follows Colebrook–White.
 *
 * The wrapper is a new Section object, so the depth tables the solvers keep per section are built for it
 * and never mixed with those of the unscaled section.
 */
import type { Section, SubsectionElements } from '../geometry/section.js';
import type { HydraulicSection } from '../hydraulics/hydraulicSection.js';
import { InputError } from '../core/errors.js';
import { isSurveyReach } from '../input/model/survey.js';
import type { Model } from '../input/model/types.js';
import type { ProfileInput, ReachInput } from '../profile/types.js';
import * as say from './messages.js';

type SubsectionsInto = (depth: number, out: Float64Array) => number;

/** The roughness value a subsection gets for multiplier m under the section's friction law. */
function scaleRoughness(value: number, law: HydraulicSection['law'], m: number): number {
  return law === 'chezy' ? value / m : value * m;
}

/** `hs` with every roughness subsection's value scaled by multiplier m (m = 1 returns `hs` itself). */
export function scaledSection(hs: HydraulicSection, m: number): HydraulicSection {
  if (m === 1) return hs;
  if (!(Number.isFinite(m) && m > 0)) throw new RangeError(`a roughness multiplier must be a number greater than 0, got ${m}`);
  const inner = hs.section;
  const law = hs.law;
  const scaled: Section = {
    shape: inner.shape,
    closed: inner.closed,
    maxDepth: inner.maxDepth,
    lengthScale: inner.lengthScale,
    compound: inner.compound,
    elements: (depth) => inner.elements(depth),
    subsections: (depth): SubsectionElements[] =>
      inner.subsections(depth).map((s) => ({ ...s, roughness: scaleRoughness(s.roughness, law, m) })),
    describe: () => inner.describe(),
  };
  // the allocation-free form, when the section has one: the same subsections, roughness scaled in place
  const into = (inner as { subsectionsInto?: SubsectionsInto }).subsectionsInto;
  const limit = (inner as { subsectionLimit?: number }).subsectionLimit;
  if (into !== undefined && limit !== undefined) {
    Object.assign(scaled, {
      subsectionLimit: limit,
      subsectionsInto: (depth: number, out: Float64Array): number => {
        const count = into.call(inner, depth, out);
        for (let i = 0; i < count; i++) out[4 * i + 3] = scaleRoughness(out[4 * i + 3]!, law, m);
        return count;
      },
    });
  }
  return { ...hs, section: scaled };
}

/**
 * The engine input with each reach's roughness scaled by `multiplierOf(reach id)`. Sections shared by reaches
 * with the same multiplier stay shared (one wrapper per section and multiplier), so the solvers' tables are
 * built once per run.
 */
export function withRoughnessMultipliers(input: ProfileInput, multiplierOf: (reachId: string) => number): ProfileInput {
  const wrappers = new Map<HydraulicSection, Map<number, HydraulicSection>>();
  const wrap = (hs: HydraulicSection, m: number): HydraulicSection => {
    if (m === 1) return hs;
    let byM = wrappers.get(hs);
    if (byM === undefined) wrappers.set(hs, (byM = new Map()));
    let w = byM.get(m);
    if (w === undefined) byM.set(m, (w = scaledSection(hs, m)));
    return w;
  };
  const reaches = input.reaches.map((reach): ReachInput => {
    const m = multiplierOf(reach.id);
    if (m === 1) return reach;
    if (reach.kind === 'surveyed') return { ...reach, nodes: reach.nodes.map((node) => ({ ...node, section: wrap(node.section, m) })) };
    return { ...reach, section: wrap(reach.section, m) };
  });
  return { ...input, reaches };
}

/**
 * Roughness multipliers reach prismatic reaches only: a surveyed reach's sections are rebuilt from its survey
 * files (and blended between surveyed ones) after the engine input is made, so a multiplier on the input
 * would be silently lost there. Refused, naming the reach, rather than giving a result that ignores it.
 */
export function refuseSurveyedRoughness(model: Model, what: string): void {
  const i = model.reaches.findIndex((r) => isSurveyReach(r));
  if (i >= 0) throw new InputError({ where: `reaches[${i}].survey`, message: say.surveyedRoughness(what, model.reaches[i]!.id) });
}
