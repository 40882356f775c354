/**
 * readCrossSections: survey points of many sections in one file (invented data). Roughness zones follow the
 * divided-channel idea of Chow 1959 (Open-Channel Hydraulics, §6-4): n is constant within a zone and
 * changes at points across the section; the reader only locates those changes.
 * A cross-section needs three points to enclose an area (two points bound no area: geometry).
 */
import { describe, expect, it } from 'vitest';
import { readCrossSections } from '../../../src/input/csv/crossSections.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';

function problemsOf(text: string, options = {}): string[] {
  try {
    readCrossSections(text, 'xs.csv', SI, options);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

// Invented survey: a compound section with floodplains and a trapezoidal one.
const survey = [
  'section,offset_m,elevation_m,n',
  'XS-1,0,12.0,0.06',
  'XS-1,10,10.5,',
  'XS-1,12,9.0,0.03',
  'XS-1,18,9.0,',
  'XS-1,20,10.5,0.06',
  'XS-1,30,12.0,',
  'XS-2,0,11,0.035',
  'XS-2,3,9,',
  'XS-2,5,9,',
  'XS-2,8,11,',
].join('\r\n');

describe('readCrossSections', () => {
  it('readCrossSections(text) groups points by section, in file order, with roughness zones where n changes', () => {
    const sections = readCrossSections(survey, 'xs.csv', SI);
    expect([...sections.keys()]).toEqual(['XS-1', 'XS-2']);
    expect(sections.get('XS-1')).toEqual({
      points: [[0, 12], [10, 10.5], [12, 9], [18, 9], [20, 10.5], [30, 12]],
      roughness: [[0, 0.06], [12, 0.03], [20, 0.06]],
      line: 2,
    });
    expect(sections.get('XS-2')).toEqual({ points: [[0, 11], [3, 9], [5, 9], [8, 11]], roughness: [[0, 0.035]], line: 8 });
  });

  it('readCrossSections(text) leaves roughness out when the file has no n (n comes from the model)', () => {
    const sections = readCrossSections('xs,station (ft),elev (ft)\nA,0,5\nA,2,1\nA,4,5\n', 'xs.csv', US);
    expect(sections.get('A')).toEqual({ points: [[0, 5], [2, 1], [4, 5]], line: 2 });
  });

  it('readCrossSections(text) accepts a vertical wall (equal offsets) and drops a zone of no width', () => {
    const sections = readCrossSections('xs,x,z,n\nW,0,5,0.015\nW,0,1,0.02\nW,4,1,\nW,4,5,0.03\n', 'xs.csv', SI);
    // n changes at the foot of the left wall (same offset as the zone start), and on the last point (no width).
    expect(sections.get('W')).toEqual({ points: [[0, 5], [0, 1], [4, 1], [4, 5]], roughness: [[0, 0.02]], line: 2 });
  });

  it('readCrossSections(text) refuses a section with fewer than three points, at its id cell', () => {
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,2,1\nB,0,5\nB,1,1\nB,2,5\n')).toEqual([
      'xs.csv:2:1: cross-section "A" has 2 points; a cross-section needs at least three',
    ]);
  });

  it('readCrossSections(text) refuses offsets that go backwards, naming the offset cell and the line before', () => {
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,3,1\nA,2,1\nA,6,5\n')).toEqual([
      'xs.csv:4:2: cross-section "A": offset 2 goes backwards from 3 (line 3); list the points across the section with offsets rising (equal offsets make a vertical wall)',
    ]);
  });

  it('readCrossSections(text) refuses a repeated point (a loop of zero length)', () => {
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,2,1\nA,2,1\nA,4,5\n')).toEqual([
      'xs.csv:4:2: cross-section "A": the point (2, 1) repeats the one at line 3; remove one',
    ]);
  });

  it('readCrossSections(text) refuses a wall that goes down and back up at one offset (the outline crosses itself)', () => {
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,2,5\nA,2,1\nA,2,3\nA,4,5\n')).toEqual([
      'xs.csv:5:2: cross-section "A": at offset 2 the vertical wall goes down and back up, so the section crosses itself; a wall at one offset runs in one direction only',
    ]);
  });

  it('readCrossSections(text) refuses a section with no width', () => {
    expect(problemsOf('section,offset,elevation\nA,1,5\nA,1,3\nA,1,1\n')).toEqual([
      'xs.csv:2:1: cross-section "A" has no width: every point is at offset 1',
    ]);
  });

  it("readCrossSections(text) refuses a section whose rows are split by another section's", () => {
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,1,1\nB,0,5\nB,1,1\nB,2,5\nA,2,5\n')).toEqual([
      'xs.csv:7:1: cross-section "A" continues here after rows of other sections (it starts at line 2); keep each section\'s rows together',
    ]);
  });

  it('readCrossSections(text) refuses n missing at the first point, and a missing n when n is required', () => {
    expect(problemsOf('section,offset,elevation,n\nA,0,5,\nA,1,1,0.03\nA,2,5,\n')).toEqual([
      'xs.csv:2:4: cross-section "A": n is given further across but not at the first point; give n at the first point and wherever it changes',
    ]);
    expect(problemsOf('section,offset,elevation,n\nA,0,5,0.03\nA,1,1,\nA,2,5,\nB,0,5,\nB,1,1,\nB,2,5,\n', { requireN: true })).toEqual([
      'xs.csv:5:4: cross-section "B" has no Manning\'s n: give n at its first point (and wherever it changes)',
    ]);
    expect(problemsOf('section,offset,elevation\nA,0,5\nA,1,1\nA,2,5\n', { requireN: true })).toEqual([
      'xs.csv:1: Manning\'s n is required here but the file has no n column; add one (e.g. "n")',
    ]);
  });

  it('readCrossSections(text) names non-numbers and out-of-range n at file:line:column', () => {
    expect(problemsOf('section,offset,elevation,n\nA,0,5,0.03\nA,one,1,\nA,2,5,0.5\n')).toEqual([
      'xs.csv:3:2: offset: expected a number, got "one"',
      "xs.csv:4:4: Manning's n 0.5 is outside the accepted range 0.005–0.2 (pass --force to accept an unusual value)",
    ]);
  });

  it('readCrossSections(units) refuses a unit that contradicts the model', () => {
    expect(problemsOf('section,offset (ft),elevation (m)\nA,0,5\nA,1,1\nA,2,5\n')[0]).toBe(
      'xs.csv:1:2: column "offset (ft)" is in ft, but the model\'s units are SI (m): convert the column to m or change the model\'s "units"',
    );
  });

  it('readCrossSections(text) refuses a header-only file', () => {
    expect(problemsOf('section,offset,elevation\n')).toEqual([
      'xs.csv:1: no cross-section points: the file has a header row (line 1) but no data rows',
    ]);
  });
});
