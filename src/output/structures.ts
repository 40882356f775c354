/**
 * The text summary of a flow's structure results: one line per structure with its controlling case and
 * headwater, the figures an engineer checks first, the notes, and the caution each result carries.
 */
import { unitsOf, type UnitSystem } from '../core/units.js';
import type { FlowResult, StructureResult } from '../results/types.js';

/** The values shown first, when a structure has them (the rest are in the JSON result). */
const headline: ReadonlyArray<[string, string, 'length' | 'discharge' | 'velocity' | '']> = [
  ['condition', 'condition', ''],
  ['controlling', 'controlling', ''],
  ['headwaterStage', 'headwater stage', 'length'],
  ['headwaterDepth', 'headwater depth', 'length'],
  ['inletControlHeadwater', 'inlet-control headwater', 'length'],
  ['outletControlHeadwater', 'outlet-control headwater', 'length'],
  ['outletDepth', 'outlet depth', 'length'],
  ['outletVelocity', 'outlet velocity', 'velocity'],
  ['headOverCrest', 'head over crest', 'length'],
  ['submergenceRatio', 'submergence H2/H1', ''],
  ['venaContractaDepth', 'vena contracta depth', 'length'],
  ['toeDepth', 'toe depth', 'length'],
  ['toeFroude', 'toe Froude', ''],
  ['sequentDepth', 'sequent depth', 'length'],
  ['tailwaterMinusSequent', 'tailwater − sequent', 'length'],
  ['brinkDepth', 'brink depth', 'length'],
  ['jumpToeDistanceBelowStructure', 'jump toe below structure', 'length'],
  ['jumpStaysOnApron', 'jump stays on apron', ''],
];

function format(value: number | string | boolean | null, unit: string): string {
  if (value === null) return '—';
  if (typeof value === 'number') return `${Number(value.toPrecision(5))}${unit ? ` ${unit}` : ''}`;
  return String(value);
}

/** Lines summarising each structure of a flow (empty when there is none). */
export function structureLines(flow: FlowResult, system: UnitSystem): string[] {
  const results: StructureResult[] = flow.structures ?? [];
  if (results.length === 0) return [];
  const u = unitsOf(system);
  const unitOf = { length: u.length, discharge: u.discharge, velocity: u.velocity, '': '' } as const;
  const lines: string[] = ['', 'structures:'];
  for (const r of results) {
    const figures = headline
      .filter(([key]) => key in r.values && r.values[key] !== null)
      .map(([key, words, unit]) => `${words} ${format(r.values[key]!, unitOf[unit])}`);
    lines.push(`  ${r.id} (${r.type}) at station ${format(r.station, '')}: ${figures.join(', ')}`);
    if (typeof r.values['method'] === 'string') lines.push(`    method: ${r.values['method']}`);
    if (r.barrelProfile && r.barrelProfile.length > 0) {
      const pts = [...r.barrelProfile].sort((a, b) => a.distanceFromOutlet - b.distanceFromOutlet);
      const inlet = pts[pts.length - 1]!;
      lines.push(`    barrel profile: ${pts.length} points, depth ${format(pts[0]!.depth, u.length)} at the outlet to ${format(inlet.depth, u.length)} at the inlet`);
    }
    const notes = r.notes.slice(0, -1);
    for (const n of notes) lines.push(`    note: ${n}`);
    const caution = r.notes[r.notes.length - 1];
    if (caution !== undefined) lines.push(`    caution: ${caution}`);
  }
  return lines;
}
