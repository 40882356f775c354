/**
 * Bad survey input through runModel: every problem names the file, line and column (or the model's JSON path
 * of the file name), as issue 4 asks. The cases are the list plus the survey layer's own checks
 * (a stated bed that disagrees with its cross-section, water above a section's end points).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { InputError } from '../../src/core/errors.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { runModel } from '../../src/run.js';
import { modelFolder } from './folder.js';

const sections = [
  'section,offset,elevation,n',
  'A,0,12,0.04',
  'A,4,10,0.03',
  'A,8,10,0.04',
  'A,12,12,',
  'B,0,11.9,0.04',
  'B,4,9.9,0.03',
  'B,8,9.9,0.04',
  'B,12,11.9,',
].join('\n');
const stations = ['station,bed,section', '0,10,A', '100,9.9,B'].join('\n');

function model(extra: Record<string, unknown> = {}) {
  return {
    units: 'SI',
    sections: {},
    reaches: [{ id: 'r', survey: { stations: 'survey/stations.csv', crossSections: 'survey/sections.csv', stationing: 'increasing-downstream', ...extra } }],
    flows: [{ id: 'q', discharge: 3 }],
    boundaries: { downstream: { type: 'depth', depth: 1 } },
  };
}

/** The problems runModel reports for these files. */
function problems(files: { stations?: string; sections?: string }, extra: Record<string, unknown> = {}, options: { allowOutside?: boolean } = {}) {
  const folder = modelFolder(model(extra), { 'survey/stations.csv': files.stations ?? stations, 'survey/sections.csv': files.sections ?? sections });
  try {
    runModel(readModelFile(folder.model), { modelFile: folder.model, ...options });
  } catch (error) {
    if (error instanceof InputError) return { dir: folder.dir, list: error.problems };
    throw error;
  }
  throw new Error('expected an InputError');
}

const st = (dir: string) => join(dir, 'survey', 'stations.csv');
const xs = (dir: string) => join(dir, 'survey', 'sections.csv');

describe('runModel: bad survey files name file:line:column', () => {
  it('runModel: a missing column is placed at the header row (line 1, column 1)', () => {
    const { dir, list } = problems({ stations: 'station,section\n0,A\n100,B' });
    expect(list[0]!.where).toBe(`${st(dir)}:1:1`);
    expect(list[0]!.message).toContain('"bed elevation"');
  });

  it('runModel: a value that is not a number is placed at its cell', () => {
    const { dir, list } = problems({ stations: 'station,bed,section\n0,10,A\n100,9.9x,B' });
    expect(list[0]!.where).toBe(`${st(dir)}:3:2`);
    expect(list[0]!.message).toContain('expected a number');
  });

  it('runModel: a duplicated station is placed at the second one', () => {
    const { dir, list } = problems({ stations: 'station,bed,section\n0,10,A\n100,9.9,B\n100,9.9,B' });
    expect(list[0]!.where).toBe(`${st(dir)}:4:1`);
    expect(list[0]!.message).toContain('appears twice');
  });

  it('runModel: an unsorted station is placed where the order breaks', () => {
    const { dir, list } = problems({ stations: 'station,bed,section\n0,10,A\n100,9.9,B\n50,9.95,A' });
    expect(list[0]!.where).toBe(`${st(dir)}:4:1`);
    expect(list[0]!.message).toContain('out of order');
  });

  it('runModel: a section id defined nowhere is placed at its cell, with the ids that exist', () => {
    const { dir, list } = problems({ stations: 'station,bed,section\n0,10,A\n100,9.9,C' });
    expect(list[0]!.where).toBe(`${st(dir)}:3:3`);
    expect(list[0]!.message).toMatch(/section "C" is not defined; defined sections: "A", "B"/);
  });

  it('runModel: a cross-section with fewer than three points is placed at its first row', () => {
    const { dir, list } = problems({ sections: 'section,offset,elevation,n\nA,0,12,0.04\nA,4,10,\nB,0,11.9,0.04\nB,4,9.9,0.03\nB,8,9.9,0.04\nB,12,11.9,' });
    expect(list[0]!.where).toBe(`${xs(dir)}:2:1`);
    expect(list[0]!.message).toContain('needs at least three');
  });

  it('runModel: offsets that go backwards are placed at the offset cell', () => {
    const bad = sections.replace('A,8,10,0.04', 'A,3,10,0.04');
    const { dir, list } = problems({ sections: bad });
    expect(list[0]!.where).toBe(`${xs(dir)}:4:2`);
    expect(list[0]!.message).toContain('goes backwards');
  });

  it('runModel: a path outside the model folder is refused at its JSON path unless allowed', () => {
    const folder = modelFolder(
      { ...model(), reaches: [{ id: 'r', survey: { stations: '../elsewhere.csv', stationing: 'increasing-downstream' } }] },
      {},
    );
    let caught: unknown;
    try {
      runModel(readModelFile(folder.model), { modelFile: folder.model });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(InputError);
    const problem = (caught as InputError).problems[0]!;
    expect(problem.where).toBe('reaches[0].survey.stations');
    expect(problem.message).toContain('--allow-outside');
  });

  it('runModel: a stated bed far from the cross-section\'s lowest point is placed at the bed cell', () => {
    const { dir, list } = problems({ stations: 'station,bed,section\n0,10,A\n100,9.7,B' });
    expect(list[0]!.where).toBe(`${st(dir)}:3:2`);
    expect(list[0]!.message).toContain('differs from the lowest point 9.9 of cross-section "B"');
  });

  it('runModel: water above a surveyed section\'s end points names the station and the section\'s file:line', () => {
    // a tailwater 1.95 m deep in sections 2 m deep: the M1 curve rises above section A's end points upstream
    const folder = modelFolder(
      { ...model(), flows: [{ id: 'big', discharge: 3 }], boundaries: { downstream: { type: 'depth', depth: 1.98 } } },
      { 'survey/stations.csv': ['station,bed,section', '0,10.5,A2', '100,9.9,B'].join('\n'), 'survey/sections.csv': `${sections}\nA2,0,11.5,0.04\nA2,4,10.5,0.03\nA2,8,10.5,0.04\nA2,12,11.5,` },
    );
    let caught: unknown;
    try {
      runModel(readModelFile(folder.model), { modelFile: folder.model, interpolate: false });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(InputError);
    const problem = (caught as InputError).problems[0]!;
    expect(problem.where).toBe(`${xs(folder.dir)}:10`);
    expect(problem.message).toContain('cross-section "A2"');
    expect(problem.message).toContain(`station 0 (${st(folder.dir)}:2)`);
    expect(problem.message).toContain('extend the section');
  });
});
