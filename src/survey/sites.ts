/**
 * Survey rows → the engine's nodes, each with what the results need to point back to the files.
 *
 * Decisions (README "Surveyed reaches"):
 * - The section at a station is the cross-section of that id in the cross-section file, else the model section
 *   of that name (a template placed at the station's bed). An id defined in both is a problem.
 * - Bed elevation: the stations file's bed elevation is the datum of the profile (water surface = bed + depth,
 *   depth measured from the section's lowest point). A surveyed cross-section carries its own elevations, so its
 *   lowest point must agree with the stated bed within `bedMismatchTolerance`; otherwise the stations file's bed
 *   cell is a problem. Model sections are shapes without elevations and are placed at the stated bed.
 * - Manning's n on a station row overrides the section's roughness over the whole section (zones included);
 *   otherwise the cross-section's n (by zone) or the model section's roughness applies.
 * - A roughness multiplier (calibration, sensitivity: input/model/roughness.ts) scales that roughness in the
 *   spec, before the section is built, so every zone of every surveyed section carries it, and so does every
 *   section interpolated from them (interpolate.ts blends the built sections, roughness included).
 * - Banks: the station row's left and right bank elevations; where a surveyed cross-section has none, the
 *   elevations of its end points (the surveyed ground at the section's edges).
 * - Reach length: the row's flow-path length to the next station downstream, else the station difference.
 * - Loss coefficients: the row's, else the survey's, else 0.1 (contraction) and 0.3 (expansion) (common practice).
 */
import { InputError, type Problem } from '../core/errors.js';
import type { Units } from '../core/units.js';
import { createSection } from '../geometry/index.js';
import { type HydraulicSection, hydraulicSection } from '../hydraulics/hydraulicSection.js';
import type { CrossSectionRows, StationRow } from '../input/csv/index.js';
import { formatPath } from '../input/model/issues.js';
import { scaleManning, scaledRoughnessSpec } from '../input/model/roughness.js';
import { resolveRoughness } from '../input/model/rules.js';
import { type SurveySpec, surveyDefaults } from '../input/model/survey.js';
import type { SectionSpec } from '../input/model/types.js';
import type { SurveyNode } from '../profile/types.js';
import { hydraulicSectionOf } from '../assembleSection.js';
import type { SurveyFiles } from './files.js';
import { bedMismatchTolerance } from './tolerances.js';

/** One node with where it came from. */
export interface SurveySite {
  /** the engine's node (station in the engine's stationing) */
  readonly node: SurveyNode;
  /** the station as the user numbers it */
  readonly userStation: number;
  /** `stations.csv:12`: the row of the station (absent on interpolated sites) */
  readonly row?: string;
  /** the section's id or name */
  readonly sectionId: string;
  /** `sections.csv:40` (the section's first row) or `sections.ditch` (a model section) */
  readonly sectionWhere: string;
  readonly leftBank?: number;
  readonly rightBank?: number;
}

const at = (file: string, line: number, column?: number) => (column === undefined ? `${file}:${line}` : `${file}:${line}:${column}`);

/**
 * The sites of one surveyed reach, upstream first. `engineStart` is the engine station of its upstream end;
 * `modelSections` are the model's section specs and `built` their hydraulic sections; `multiplier` scales the
 * roughness of every section of the reach (1: the survey's and the model's own).
 */
export function surveySites(
  files: SurveyFiles,
  spec: SurveySpec,
  units: Units,
  modelSections: Readonly<Record<string, SectionSpec>>,
  built: ReadonlyMap<string, HydraulicSection>,
  engineStart: number,
  multiplier = 1,
): SurveySite[] {
  const problems: Problem[] = [];
  const file = files.stationsFile;
  const csFile = files.crossSectionsFile ?? '';
  const cache = new Map<string, HydraulicSection>();
  const tolerance = bedMismatchTolerance[units.system];
  for (const id of files.crossSections.keys()) {
    if (modelSections[id] !== undefined) {
      const cs = files.crossSections.get(id)!;
      problems.push({
        where: at(csFile, cs.line),
        message: `cross-section id ${JSON.stringify(id)} is also the name of a model section (sections.${id}); rename one so each station's section is clear`,
        value: id,
      });
    }
  }

  const sectionFor = (row: StationRow): { hs: HydraulicSection; where: string; points?: CrossSectionRows } | undefined => {
    const key = `${row.section}\u0000${row.n ?? ''}`;
    const cs = files.crossSections.get(row.section);
    const nWhere = at(file, row.line, files.columnOf.n);
    if (cs !== undefined) {
      const where = at(csFile, cs.line);
      const roughness = row.n ?? cs.roughness;
      if (roughness === undefined) {
        problems.push({
          where: nWhere,
          message: `no Manning's n for cross-section ${JSON.stringify(row.section)} (${where}): give n in the cross-section file (at its first point and where it changes) or in this row's n column`,
        });
        return undefined;
      }
      let hs = cache.get(key);
      if (hs === undefined) {
        try {
          const scaled = multiplier === 1 ? roughness : scaleManning(roughness, multiplier);
          hs = hydraulicSection(createSection({ shape: 'points', points: cs.points, roughness: scaled }), 'manning', units);
        } catch (error) {
          if (!(error instanceof InputError)) throw error;
          problems.push(...error.problems.map((p) => ({ ...p, where: where, message: `cross-section ${JSON.stringify(row.section)}: ${p.message}` })));
          return undefined;
        }
        cache.set(key, hs);
      }
      return { hs, where, points: cs };
    }
    const model = modelSections[row.section];
    const base = built.get(row.section);
    const where = formatPath(['sections', row.section]);
    if (model === undefined || base === undefined) return undefined; // reported by the stations reader, or by the section itself
    if (row.n === undefined && multiplier === 1) return { hs: base, where };
    const resolved = resolveRoughness(model);
    if (row.n !== undefined && resolved?.friction !== 'manning') {
      problems.push({
        where: nWhere,
        message: `section ${JSON.stringify(row.section)} uses the ${resolved?.friction ?? 'unknown'} friction law, so a Manning's n here cannot override its roughness; leave the n cell empty`,
        value: row.n,
      });
      return undefined;
    }
    let hs = cache.get(key);
    if (hs === undefined) {
      const withN = row.n === undefined ? model : ({ ...model, n: row.n } as SectionSpec);
      hs = hydraulicSectionOf(scaledRoughnessSpec(withN, multiplier), units, (k) => `${where}.${k}`);
      cache.set(key, hs);
    }
    return { hs, where };
  };

  const rows = files.stations;
  const first = rows[0]!;
  const sites: SurveySite[] = [];
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i]!;
    const found = sectionFor(row);
    if (row.reachLength !== undefined && row.reachLength <= 0 && i < rows.length - 1) {
      problems.push({
        where: at(file, row.line, files.columnOf.reachLength),
        message: `reach length ${row.reachLength} must be more than zero (the flow-path length to the next station downstream)`,
        value: row.reachLength,
      });
    }
    if (found === undefined) continue;
    let leftBank = row.leftBank;
    let rightBank = row.rightBank;
    if (found.points !== undefined) {
      const pts = found.points.points;
      let lowest = Infinity;
      for (const [, z] of pts) lowest = Math.min(lowest, z);
      if (Math.abs(row.bedElevation - lowest) > tolerance) {
        problems.push({
          where: at(file, row.line, files.columnOf.bedElevation),
          message:
            `bed elevation ${row.bedElevation} differs from the lowest point ${lowest} of cross-section ${JSON.stringify(row.section)} (${found.where}) ` +
            `by ${round(Math.abs(row.bedElevation - lowest))}, more than ${tolerance} ${units.length}: give the section's lowest point as the bed, or correct the survey`,
          value: row.bedElevation,
        });
        continue;
      }
      leftBank ??= pts[0]![1];
      rightBank ??= pts[pts.length - 1]![1];
    }
    const node: SurveyNode = {
      station: engineStart + Math.abs(row.station - first.station),
      bedElevation: row.bedElevation,
      section: found.hs,
      contraction: row.contraction ?? spec.contraction ?? surveyDefaults.contraction,
      expansion: row.expansion ?? spec.expansion ?? surveyDefaults.expansion,
      ...(row.reachLength !== undefined && i < rows.length - 1 ? { reachLength: row.reachLength } : {}),
    };
    sites.push({
      node,
      userStation: row.station,
      row: at(file, row.line),
      sectionId: row.section,
      sectionWhere: found.where,
      ...(leftBank === undefined ? {} : { leftBank }),
      ...(rightBank === undefined ? {} : { rightBank }),
    });
  }
  if (problems.length > 0) throw new InputError(sortByPlace(problems));
  return sites;
}

function round(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

/** Problems by file, then line and column (the order a user works down a file). */
function sortByPlace(problems: Problem[]): Problem[] {
  const key = (w: string) => {
    const m = /^(.*?):(\d+)(?::(\d+))?$/.exec(w);
    return m ? { file: m[1]!, line: Number(m[2]), column: Number(m[3] ?? 0) } : { file: w, line: 0, column: 0 };
  };
  return problems
    .map((p, i) => ({ p, i, k: key(p.where) }))
    .sort((a, b) => (a.k.file < b.k.file ? -1 : a.k.file > b.k.file ? 1 : a.k.line - b.k.line || a.k.column - b.k.column || a.i - b.i))
    .map((e) => e.p);
}
