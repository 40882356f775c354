/**
 * Freeboard: the height from the water surface up to each bank (or lining) top, against the freeboard the
 * model requires, fixed + fraction × αV²/2g (a fixed height alone, or one that grows with the velocity head,
 * as drainage criteria commonly state it; common practice). One row per station that has a bank elevation.
 */
import type { FreeboardRow, StationResult } from './types.js';

export interface FreeboardRequirement {
  readonly fixed: number;
  readonly velocityHeadFraction: number;
}

/** The freeboard rows of a flow's stations (those with at least one bank), in station-table order. */
export function freeboardRows(stations: readonly StationResult[], requirement?: FreeboardRequirement): FreeboardRow[] {
  const rows: FreeboardRow[] = [];
  for (const s of stations) {
    if (s.leftBank === undefined && s.rightBank === undefined) continue;
    const velocityHead = Math.max(0, s.energyElevation - s.wsel);
    const required = requirement === undefined ? 0 : requirement.fixed + requirement.velocityHeadFraction * velocityHead;
    const banks = [s.leftBank, s.rightBank].filter((b): b is number => b !== undefined);
    const lowest = Math.min(...banks);
    const freeboards = banks.map((b) => b - s.wsel);
    rows.push({
      station: s.station,
      wsel: s.wsel,
      energyElevation: s.energyElevation,
      ...(s.leftBank === undefined ? {} : { leftBank: s.leftBank, freeboardLeft: s.leftBank - s.wsel }),
      ...(s.rightBank === undefined ? {} : { rightBank: s.rightBank, freeboardRight: s.rightBank - s.wsel }),
      required,
      pass: freeboards.every((f) => f >= required),
      overtopped: s.wsel > lowest,
      energyOvertopped: s.energyElevation > lowest,
      velocityHead,
    });
  }
  return rows;
}

/** Station numbers for a message: all of them up to `limit`, then how many more. */
function list(stations: readonly number[], limit = 8): string {
  const unique = [...new Set(stations)];
  const shown = unique.slice(0, limit).map((x) => String(Math.round(x * 1000) / 1000));
  return unique.length > limit ? `${shown.join(', ')} and ${unique.length - limit} more` : shown.join(', ');
}

/** Warnings for the stations where the water surface or the energy grade line overtops, or freeboard falls short. */
export function freeboardWarnings(rows: readonly FreeboardRow[], unit: string, requirement?: FreeboardRequirement): string[] {
  const out: string[] = [];
  const over = rows.filter((r) => r.overtopped).map((r) => r.station);
  const energy = rows.filter((r) => !r.overtopped && r.energyOvertopped).map((r) => r.station);
  const short = rows.filter((r) => !r.pass && !r.overtopped).map((r) => r.station);
  if (over.length > 0) {
    out.push(`The water surface overtops a bank (or lining) top at ${over.length === 1 ? 'station' : 'stations'} ${list(over)}: water leaves the channel there, which a one-dimensional profile does not follow.`);
  }
  if (energy.length > 0) out.push(`The energy grade line lies above a bank top at ${energy.length === 1 ? 'station' : 'stations'} ${list(energy)}.`);
  if (requirement !== undefined && short.length > 0) {
    const rule = requirement.velocityHeadFraction > 0 ? `${requirement.fixed} ${unit} + ${requirement.velocityHeadFraction} × velocity head` : `${requirement.fixed} ${unit}`;
    out.push(`Freeboard is less than the required ${rule} at ${short.length === 1 ? 'station' : 'stations'} ${list(short)}.`);
  }
  return out;
}
