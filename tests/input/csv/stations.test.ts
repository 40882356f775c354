/**
 * readStations: surveyed station tables (invented data). The checks are the rules the issue sets for a
 * survey table; the numeric limits are gvf's: Manning's n 0.005–0.2 without --force (common practice: lined
 * channels to dense floodplain vegetation) and loss coefficients 0–1 (a coefficient times a change in velocity
 * head cannot lose more than that change: common practice).
 */
import { describe, expect, it } from 'vitest';
import { readStations, type StationOptions } from '../../../src/input/csv/stations.js';
import { problemCap } from '../../../src/input/csv/problems.js';
import { InputError } from '../../../src/core/errors.js';
import { SI, US } from '../../../src/core/units.js';

const down: StationOptions = { direction: 'downstream' };

function problemsOf(text: string, options: StationOptions = down, units = SI): string[] {
  try {
    readStations(text, 'stations.csv', units, options);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems.map((p) => `${p.where}: ${p.message}`);
  }
  throw new Error('expected an InputError, nothing was thrown');
}

// Invented survey: four stations of a made-up drainage channel.
const survey = [
  'station_m,bed_elev_m,section,n,left_bank,right_bank,reach_length,contraction,expansion',
  '0,52.40,upper,0.030,54.1,54.0,101,0.1,0.3',
  '100,52.25,upper,0.032,53.9,53.95,99.5,,',
  '200,52.05,"pool, lower",,53.7,53.6,,0.2,0.4',
  '300,51.90,outlet,0.035,,,,,',
].join('\n');

describe('readStations', () => {
  it('readStations(text) reads every column with its line, leaving blank optional values out', () => {
    const rows = readStations(survey, 'stations.csv', SI, down);
    expect(rows).toHaveLength(4);
    expect(rows[0]).toEqual({
      station: 0, bedElevation: 52.4, section: 'upper', n: 0.03, leftBank: 54.1, rightBank: 54,
      reachLength: 101, contraction: 0.1, expansion: 0.3, line: 2,
    });
    expect(rows[2]).toEqual({ station: 200, bedElevation: 52.05, section: 'pool, lower', leftBank: 53.7, rightBank: 53.6, contraction: 0.2, expansion: 0.4, line: 4 });
    expect(rows[3]).toEqual({ station: 300, bedElevation: 51.9, section: 'outlet', n: 0.035, line: 5 });
  });

  it('readStations(direction) returns rows upstream first: stations rising downstream, file ascending', () => {
    const rows = readStations('station,bed,section\n0,10,a\n50,9.9,a\n100,9.8,a\n', 's.csv', SI, { direction: 'downstream' });
    expect(rows.map((r) => r.station)).toEqual([0, 50, 100]);
  });

  it('readStations(direction) returns rows upstream first: stations rising upstream, file ascending', () => {
    const rows = readStations('station,bed,section\n0,9.8,a\n50,9.9,a\n100,10,a\n', 's.csv', SI, { direction: 'upstream' });
    expect(rows.map((r) => r.station)).toEqual([100, 50, 0]);
    expect(rows.map((r) => r.line)).toEqual([4, 3, 2]);
  });

  it('readStations(direction) accepts a file sorted descending, in either direction', () => {
    const text = 'station,bed,section\n100,9.8,a\n50,9.9,a\n0,10,a\n';
    expect(readStations(text, 's.csv', SI, { direction: 'downstream' }).map((r) => r.station)).toEqual([0, 50, 100]);
    expect(readStations(text, 's.csv', SI, { direction: 'upstream' }).map((r) => r.station)).toEqual([100, 50, 0]);
  });

  it('readStations(text) names a missing column and the columns found', () => {
    expect(problemsOf('station,elevation,section\n0,1,a\n')).toEqual([
      'stations.csv:1:1: missing required column "bed elevation"; columns found: "station", "elevation", "section"',
    ]);
  });

  it('readStations(text) names file:line:column and the text of a non-number', () => {
    expect(problemsOf('station,bed,section\n0,10,a\n10,9.9.1,a\n20,9.8,a\n')).toEqual([
      'stations.csv:3:2: bed elevation: expected a number, got "9.9.1"',
    ]);
  });

  it('readStations(text) refuses NaN and Infinity spelled as strings', () => {
    expect(problemsOf('station,bed,section\n0,NaN,a\nInfinity,9.9,a\n20,9.8,a\n30,-inf,a\n')).toEqual([
      'stations.csv:2:2: bed elevation: "NaN" is not a finite number; give a number such as 12.5',
      'stations.csv:3:1: station: "Infinity" is not a finite number; give a number such as 12.5',
      'stations.csv:5:2: bed elevation: "-inf" is not a finite number; give a number such as 12.5',
    ]);
  });

  it('readStations(text) refuses hex, blank and huge numbers and hints at a quoted decimal comma', () => {
    expect(problemsOf('station,bed,section\n0x10,10,a\n10,,a\n20,1e400,a\n30,"9,8",a\n')).toEqual([
      'stations.csv:2:1: station: expected a number, got "0x10"',
      'stations.csv:3:2: missing bed elevation: this column needs a number in every row',
      'stations.csv:4:2: bed elevation: 1e400 is too large to be a real value (limit ±10000000); check the value and its units',
      'stations.csv:5:2: bed elevation: expected a number, got "9,8" (a decimal comma? write decimals with a point: 1.5)',
    ]);
  });

  it('readStations(text) names an unquoted decimal comma that makes a row too long', () => {
    expect(problemsOf('station,bed,section\n0,10,a\n10,9,8,a\n')).toContainEqual(
      'stations.csv:3:4: this row has 4 values but the header names 3 columns (a decimal comma? write decimals with a point, or quote text that contains commas)',
    );
  });

  it('readStations(text) refuses a duplicated station, naming both lines', () => {
    expect(problemsOf('station,bed,section\n0,10,a\n10,9.9,a\n10,9.8,b\n20,9.7,a\n')).toEqual([
      'stations.csv:4:1: station 10 appears twice (first at line 3); each station needs one row',
    ]);
  });

  it('readStations(text) refuses unsorted stations, naming the row that breaks the order', () => {
    expect(problemsOf('# invented\nstation,bed,section\n0,10,a\n20,9.9,a\n10,9.8,a\n30,9.7,a\n')).toEqual([
      'stations.csv:5:1: station 10 is out of order: the rows increase in station up to 20 (line 4); sort the rows by station, all rising or all falling',
    ]);
  });

  it('readStations(text) refuses a negative reach length and loss coefficients outside 0–1', () => {
    expect(problemsOf('station,bed,section,length,cc,ce\n0,10,a,-5,1.2,-0.1\n10,9,a,,,\n')).toEqual([
      'stations.csv:2:4: reach length -5 is negative; it must be zero or more',
      'stations.csv:2:5: contraction coefficient 1.2 is outside the accepted range 0–1',
      'stations.csv:2:6: expansion coefficient -0.1 is outside the accepted range 0–1',
    ]);
  });

  it('readStations(text) refuses n outside 0.005–0.2 unless forced', () => {
    const text = 'station,bed,section,n\n0,10,a,0.003\n10,9,a,0.25\n20,8,a,0.2\n';
    expect(problemsOf(text)).toEqual([
      "stations.csv:2:4: Manning's n 0.003 is outside the accepted range 0.005–0.2 (pass --force to accept an unusual value)",
      "stations.csv:3:4: Manning's n 0.25 is outside the accepted range 0.005–0.2 (pass --force to accept an unusual value)",
    ]);
    expect(readStations(text, 's.csv', SI, { direction: 'downstream', force: true }).map((r) => r.n)).toEqual([0.003, 0.25, 0.2]);
  });

  it('readStations(text) refuses a bank below the bed', () => {
    expect(problemsOf('station,bed,section,left top,right top\n0,10,a,9.5,11\n10,9,a,10,10\n')).toEqual([
      'stations.csv:2:4: left bank 9.5 is below the bed elevation 10; bank (top of bank or lining) elevations must be at or above the bed',
    ]);
  });

  it('readStations(sections) refuses a section id that is not defined, and a blank one', () => {
    expect(problemsOf('station,bed,section\n0,10,lined\n10,9,earth\n20,8,\n', { direction: 'downstream', sections: ['lined', 'XS-3'] })).toEqual([
      'stations.csv:3:3: section "earth" is not defined; defined sections: "lined", "XS-3"',
      'stations.csv:4:3: missing section: this column needs a name in every row',
    ]);
  });

  it('readStations(text) refuses a header-only file and a single station', () => {
    expect(problemsOf('station,bed,section\r\n')).toEqual([
      'stations.csv:1: no stations: the file has a header row (line 1) but no data rows',
    ]);
    expect(problemsOf('station,bed,section\n0,1,a\n')).toEqual([
      'stations.csv:1: a surveyed reach needs at least two stations; found 1',
    ]);
  });

  it('readStations(units) refuses a header unit that contradicts the model, at the header cell', () => {
    expect(problemsOf('station (ft),bed (ft),section\n0,10,a\n10,9,a\n')).toEqual([
      'stations.csv:1:1: column "station (ft)" is in ft, but the model\'s units are SI (m): convert the column to m or change the model\'s "units"',
      'stations.csv:1:2: column "bed (ft)" is in ft, but the model\'s units are SI (m): convert the column to m or change the model\'s "units"',
    ]);
    expect(readStations('station (ft),bed (ft),section\n0,10,a\n10,9,a\n', 's.csv', US, down)).toHaveLength(2);
  });

  it('readStations(text) reads a CRLF file with a byte-order mark and quoted commas, lines intact', () => {
    const text = '\uFEFFStation,Invert,XS\r\n0,10,"A, upper"\r\n\r\n10,oops,B\r\n';
    expect(problemsOf(text)).toEqual(['stations.csv:4:2: bed elevation: expected a number, got "oops"']);
  });

  it('readStations(text) lists at most problemCap problems, then how many more', () => {
    const rows = Array.from({ length: 70 }, (_, i) => `${i},x,a`).join('\n');
    const problems = problemsOf(`station,bed,section\n${rows}\n`);
    expect(problems).toHaveLength(problemCap + 1);
    expect(problems[0]).toBe('stations.csv:2:2: bed elevation: expected a number, got "x"');
    expect(problems[problemCap]).toBe('stations.csv: and 20 more problems not listed (fix the ones above first)');
  });
});
