/**
 * Header matching: names and unit suffixes. The unit symbols are those of the two consistent unit systems
 * (SI: m, m³/s; US customary: ft, ft³/s), so a header's unit either agrees with the model or is an error.
 * The alias lists are gvf's own; these tests pin the matching rules, not a foreign file format.
 */
import { describe, expect, it } from 'vitest';
import { matchColumns, splitHeader, stationColumns, ratingCurveColumns, crossSectionColumns } from '../../../src/input/csv/columns.js';
import { parseCsvTable } from '../../../src/input/csv/table.js';
import { ProblemList } from '../../../src/input/csv/problems.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US, type Units } from '../../../src/core/units.js';

function match(header: string, units: Units = SI, specs: Parameters<typeof matchColumns>[1] = stationColumns) {
  const problems = new ProblemList();
  const columns = matchColumns(parseCsvTable(`${header}\n`, 'h.csv'), specs, units, problems);
  let messages: string[] = [];
  try {
    problems.throwIfAny('h.csv');
  } catch (error) {
    messages = (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  const found = Object.fromEntries(Object.entries(columns).map(([k, v]) => [k, v?.index]));
  return { found, messages };
}

describe('matchColumns', () => {
  it('matchColumns(header) ignores case, spaces, hyphens, underscores and apostrophes', () => {
    const { found, messages } = match("STATION, Bed-Elevation ,section_id,Manning's n,left bank,Right_Bank,flow length,CC,Ce");
    expect(messages).toEqual([]);
    expect(found).toEqual({
      station: 0, bedElevation: 1, section: 2, n: 3, leftBank: 4, rightBank: 5, reachLength: 6, contraction: 7, expansion: 8,
    });
  });

  it('matchColumns(header) takes the alternative names: chainage, invert, xs', () => {
    expect(match('chainage,invert_elevation,xs').found).toEqual({ station: 0, bedElevation: 1, section: 2 });
  });

  it('matchColumns(header) allows unit suffixes that agree with the model: bed_elev_m, Station (ft), bed elevation [m]', () => {
    expect(match('Station (m),bed_elev_m,section').messages).toEqual([]);
    expect(match('Station (ft),bed elevation [ft],section,Manning n (s/ft^(1/3))', US).messages).toEqual([]);
    expect(match('station {metres},bed elevation [m],section,n [-]').messages).toEqual([]);
  });

  it('matchColumns(header) refuses a unit that contradicts the model, at the header cell', () => {
    const { messages } = match('station,bed_elev_ft,section');
    expect(messages).toMatchInlineSnapshot(`
      [
        "h.csv:1:2: column "bed_elev_ft" is in ft, but the model's units are SI (m): convert the column to m or change the model's "units"",
      ]
    `);
    expect(match('Station (m),bed,section', US).messages[0]).toContain('h.csv:1:1: column "Station (m)" is in m');
  });

  it('matchColumns(header) refuses a length unit of another size (km) and an unknown unit', () => {
    expect(match('station (km),bed,section').messages[0]).toContain('h.csv:1:1: column "station (km)" is in km');
    expect(match('station,bed [furlongs],section').messages).toEqual([
      'h.csv:1:2: column "bed [furlongs]": unit "furlongs" is not recognised; write m or leave the unit out',
    ]);
  });

  it('matchColumns(header) refuses a length unit on a coefficient and percent on a loss coefficient', () => {
    expect(match('station,bed,section,cc (m)').messages[0]).toContain('h.csv:1:4: column "cc (m)" takes no unit');
    expect(match('station,bed,section,expansion (%)').messages[0]).toContain('h.csv:1:4: column "expansion (%)" is marked as percent');
  });

  it('matchColumns(header) checks discharge units: m3/s and cms for SI, cfs for US', () => {
    expect(match('stage_m,Q (m3/s)', SI, ratingCurveColumns).messages).toEqual([]);
    expect(match('stage,discharge cms', SI, ratingCurveColumns).messages).toEqual([]);
    expect(match('stage (ft),flow (cfs)', US, ratingCurveColumns).messages).toEqual([]);
    expect(match('stage,Q (cfs)', SI, ratingCurveColumns).messages[0]).toContain('h.csv:1:2: column "Q (cfs)" is in ft³/s');
  });

  it('matchColumns(header) names every missing required column and lists the columns found', () => {
    expect(match('chainage,notes').messages).toEqual([
      'h.csv:1:1: missing required columns "bed elevation", "section"; columns found: "chainage", "notes"',
    ]);
  });

  it('matchColumns(header) refuses two columns for one quantity (bed and invert)', () => {
    expect(match('station,bed,invert,section').messages).toEqual([
      'h.csv:1:3: column "invert" is a second bed elevation column (the first is column 2); keep one',
    ]);
  });

  it('matchColumns(header) reads "station" as the offset in a cross-section file', () => {
    expect(match('xs,station,elevation', SI, crossSectionColumns).found).toEqual({ section: 0, offset: 1, elevation: 2 });
  });

  it('matchColumns(header) ignores columns it does not know (notes, comments)', () => {
    expect(match('notes,station,bed,section,surveyor').found).toEqual({ station: 1, bedElevation: 2, section: 3 });
  });
});

describe('splitHeader', () => {
  it('splitHeader(text) takes a unit only as a bracket or a known unit word at the end', () => {
    expect(splitHeader('bed_elev_m')).toContainEqual({ name: 'bedelev', unit: 'm', bare: true });
    expect(splitHeader('Station (ft)')[0]).toEqual({ name: 'station', unit: 'ft', bare: false });
    expect(splitHeader('section_id').some((o) => o.unit !== undefined)).toBe(false);
  });
});
