/**
 * The CSV part of the bad-input corpus: each malformed file in corpus/ (invented data) must be refused with
 * an InputError whose first problem names the expected file:line[:column] and says what to do.
 * Files are read as UTF-8 bytes from disk, so byte-order marks, CRLF and UTF-16 reach the readers as a user's would.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { readStations } from '../../../src/input/csv/stations.js';
import { readCrossSections } from '../../../src/input/csv/crossSections.js';
import { readRatingCurve } from '../../../src/input/csv/ratingCurve.js';
import { InputError } from '../../../src/core/errors.js';
import { unitsOf } from '../../../src/core/units.js';

interface Case {
  file: string;
  reader: 'stations' | 'crossSections' | 'ratingCurve';
  where: string;
  contains: string;
  units?: 'SI' | 'US';
  sections?: string[];
}

const folder = path.join(path.dirname(fileURLToPath(import.meta.url)), 'corpus');
const { cases } = JSON.parse(readFileSync(path.join(folder, 'expected.json'), 'utf8')) as { cases: Case[] };

function read(c: Case): unknown {
  const text = readFileSync(path.join(folder, c.file), 'utf8');
  const units = unitsOf(c.units ?? 'SI');
  switch (c.reader) {
    case 'stations':
      return readStations(text, c.file, units, { direction: 'downstream', ...(c.sections && { sections: c.sections }) });
    case 'crossSections':
      return readCrossSections(text, c.file, units);
    case 'ratingCurve':
      return readRatingCurve(text, c.file, units);
  }
}

describe('CSV bad-input corpus', () => {
  it('the corpus holds at least 40 malformed CSV files', () => {
    expect(cases.length).toBeGreaterThanOrEqual(40);
  });

  it.each(cases)('$reader($file) is refused at $where', (c) => {
    let error: unknown;
    try {
      read(c);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(InputError);
    const first = (error as InputError).problems[0];
    expect(first?.where).toBe(c.where);
    expect(first?.message).toContain(c.contains);
    // No NaN or undefined of our own making (the user's quoted text may say NaN), no stack frames.
    const ours = (error as InputError).message.replace(/"[^"]*"/g, '""');
    expect(ours).not.toMatch(/\bNaN\b|undefined|\bat .*\.ts:/);
  });
});
