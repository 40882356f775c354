/**
 * The user's stationing and the engine's. The engine measures stations from the upstream end, increasing
 * downstream; a survey may number its stations either way. One affine map joins them for the whole channel:
 *
 *   user = anchorUser + sign · (engine − anchorEngine),   sign = +1 increasing downstream, −1 increasing upstream,
 *
 * anchored at the upstream station of the first surveyed reach. With stations increasing downstream and the
 * survey as the first reach the map is the identity (the engine keeps the survey's own numbers). Every station
 * in a result (stations, reaches, profile stretches, jumps, controls, stops, structures) is mapped back, and so
 * are the station numbers written in warnings and notes.
 */
import type { SurveyStationing } from '../input/model/survey.js';
import type { FlowResult } from '../results/types.js';

export interface StationMap {
  readonly direction: SurveyStationing;
  readonly anchorUser: number;
  readonly anchorEngine: number;
}

/** The identity: stations increase downstream and the engine's numbers are the user's. */
export const identityStations: StationMap = { direction: 'increasing-downstream', anchorUser: 0, anchorEngine: 0 };

const signOf = (map: StationMap): 1 | -1 => (map.direction === 'increasing-downstream' ? 1 : -1);

export function isIdentity(map: StationMap): boolean {
  return map.direction === 'increasing-downstream' && map.anchorUser === map.anchorEngine;
}

export function toUserStation(map: StationMap, engine: number): number {
  if (isIdentity(map)) return engine;
  return map.anchorUser + signOf(map) * (engine - map.anchorEngine);
}

export function toEngineStation(map: StationMap, user: number): number {
  if (isIdentity(map)) return user;
  return map.anchorEngine + signOf(map) * (user - map.anchorUser);
}

/** How the result's stations read, for the result and the report. */
export function stationingNote(map: StationMap): string {
  return map.direction === 'increasing-downstream'
    ? 'Stations are the survey\'s own numbers, increasing downstream.'
    : 'Stations are the survey\'s own numbers, increasing upstream (the upstream end has the largest number); the table runs upstream to downstream.';
}

const number = String.raw`-?\d+(?:\.\d+)?(?:e[-+]?\d+)?`;
const stationText = new RegExp(String.raw`\b(stations?) (${number})((?:,? (?:to|and) ))?(${number})?`, 'g');

function show(value: number): string {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Number.isInteger(rounded) ? String(rounded) : String(Number(rounded.toPrecision(8)));
}

/** Station numbers written in a message ("at station 120", "stations 40 to 80") in the user's numbers. */
export function mapStationText(map: StationMap, text: string): string {
  if (isIdentity(map)) return text;
  return text.replace(stationText, (_all, word: string, a: string, joint: string | undefined, b: string | undefined) => {
    const first = show(toUserStation(map, Number(a)));
    if (joint === undefined || b === undefined) return `${word} ${first}`;
    return `${word} ${first}${joint}${show(toUserStation(map, Number(b)))}`;
  });
}

/** A flow's result with every station in the user's numbers (the input is not changed). */
export function mapFlowStations(map: StationMap, flow: FlowResult): FlowResult {
  if (isIdentity(map)) return flow;
  const at = (x: number) => toUserStation(map, x);
  const text = (t: string) => mapStationText(map, t);
  const out: FlowResult = {
    ...flow,
    stations: flow.stations.map((s) => ({ ...s, station: at(s.station) })),
    reaches: flow.reaches.map((r) => ({
      ...r,
      from: at(r.from),
      to: at(r.to),
      profiles: r.profiles.map((p) => ({ ...p, from: at(p.from), to: at(p.to) })),
      ...(r.parts ? { parts: r.parts.map((p) => ({ ...p, from: at(p.from), to: at(p.to) })) } : {}),
    })),
    jumps: flow.jumps.map((j) => ({ ...j, station: at(j.station) })),
    warnings: flow.warnings.map(text),
  };
  if (flow.notes) out.notes = flow.notes.map(text);
  if (flow.controls) out.controls = flow.controls.map((c) => ({ ...c, station: at(c.station), reason: text(c.reason) }));
  if (flow.stops) out.stops = flow.stops.map((s) => ({ ...s, station: at(s.station), message: text(s.message) }));
  if (flow.structures) out.structures = flow.structures.map((s) => ({ ...s, station: at(s.station), notes: s.notes.map(text) }));
  if (flow.freeboard) out.freeboard = flow.freeboard.map((r) => ({ ...r, station: at(r.station) }));
  return out;
}
