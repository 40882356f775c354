/**
 * The shared frame of every weir: a free-flow law Q(h) for the crest, inverted for the head at a discharge,
 * Villemonte's submergence correction when the tailwater stands above the crest, and the conversion between
 * water surface and energy grade in the approach section. Each weir module supplies only its law.
 */
import type { Units } from '../../core/units.js';
import { approachEnergy, approachStage } from '../approach.js';
import { structureCaution } from '../cautions.js';
import type { ApproachArea, HandValues, StructureKind, StructureOutcome } from '../types.js';
import { submergedHead } from './submergence.js';

export interface WeirLaw {
  readonly kind: StructureKind;
  readonly method: string;
  /** free discharge at head h above the crest */
  discharge(head: number): number;
  /** the exponent of head in the free-flow law (Villemonte's n) */
  readonly headExponent: number;
  /** what the head of the law measures above the crest */
  readonly headIs: 'water-surface' | 'energy';
  /** the hand-check values of the law at head h */
  values(head: number): HandValues;
  readonly notes: readonly string[];
  /** a length typical of the weir (crest length, notch head range) */
  readonly scale: number;
}

export interface WeirSite {
  readonly crestElevation: number;
  /** approach flow area against stage; without it the approach velocity head is neglected */
  readonly approachArea?: ApproachArea;
}

/** Headwater of a weir for a discharge and (optionally) the tailwater stage below it. */
export function weirControl(
  law: WeirLaw,
  site: WeirSite,
  discharge: number,
  tailwaterStage: number | null,
  units: Units,
): StructureOutcome {
  const crest = site.crestElevation;
  const tailwaterHead = tailwaterStage === null ? 0 : tailwaterStage - crest;
  const notes = [...law.notes];
  const floorQ = law.discharge(0);
  let solution;
  if (discharge <= floorQ) {
    solution = { head: 0, freeHead: 0, submergenceRatio: 0, factor: 1 };
    if (discharge > 0) notes.push(`the discharge is below the smallest the law rates (${floorQ} at zero head); head set to zero`);
  } else {
    solution = submergedHead((h) => law.discharge(h), law.headExponent, discharge, tailwaterHead, law.scale);
  }
  const submerged = solution.submergenceRatio > 0;
  if (submerged) {
    notes.push('submerged: Villemonte (1947) correction Q/Q1 = (1 − (H2/H1)^n)^0.385 applied');
    if (law.headIs === 'energy') notes.push('the downstream head H2 is compared with the upstream energy head H1 (an approximation)');
  }
  let headwaterStage: number;
  let headwaterEnergy: number;
  if (law.headIs === 'water-surface') {
    headwaterStage = crest + solution.head;
    headwaterEnergy = approachEnergy(headwaterStage, discharge, site.approachArea, units);
  } else {
    headwaterEnergy = crest + solution.head;
    headwaterStage = approachStage(headwaterEnergy, crest, discharge, site.approachArea, units);
  }
  if (!site.approachArea) notes.push('no approach section given: approach velocity head neglected (water surface = energy grade)');
  return {
    kind: law.kind,
    method: law.method,
    units: units.system,
    discharge,
    condition: submerged ? 'submerged' : 'free',
    headwaterStage,
    headwaterEnergy,
    tailwaterStage,
    downstreamSupercriticalDepth: null,
    values: {
      ...law.values(solution.head),
      headOverCrest: solution.head,
      freeFlowHead: solution.freeHead,
      tailwaterHeadOverCrest: tailwaterStage === null ? null : tailwaterHead,
      submergenceRatio: solution.submergenceRatio,
      submergenceFactor: solution.factor,
    },
    notes,
    caution: structureCaution,
  };
}
