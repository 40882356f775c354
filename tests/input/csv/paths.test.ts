/**
 * resolveModelPath: files named in a model are read from the model's folder tree only, unless the user
 * allows otherwise. Symbolic links are resolved (POSIX realpath) before the check. Uses a temporary folder.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { readModelFile, resolveModelPath } from '../../../src/input/csv/paths.js';
import { InputError } from '../../../src/core/errors.js';

let root: string;
let model: string;
let outside: string;

beforeAll(() => {
  root = realpathSync(mkdtempSync(path.join(tmpdir(), 'gvf-paths-')));
  mkdirSync(path.join(root, 'job', 'survey'), { recursive: true });
  model = path.join(root, 'job', 'model.json');
  writeFileSync(model, '{}');
  writeFileSync(path.join(root, 'job', 'survey', 'stations.csv'), 'station,bed,section\n');
  outside = path.join(root, 'secret.csv');
  writeFileSync(outside, 'not for the model\n');
  symlinkSync(outside, path.join(root, 'job', 'survey', 'link.csv'));
});

afterAll(() => rmSync(root, { recursive: true, force: true }));

function problemOf(call: () => unknown): { where: string; message: string } {
  try {
    call();
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    const p = (error as InputError).problems[0];
    return { where: p?.where ?? '', message: p?.message ?? '' };
  }
  throw new Error('expected an InputError, nothing was thrown');
}

describe('resolveModelPath', () => {
  it('resolveModelPath(model, relative) resolves against the model file\'s folder', () => {
    expect(resolveModelPath(model, 'survey/stations.csv', false, 'survey.stations')).toBe(path.join(root, 'job', 'survey', 'stations.csv'));
    expect(resolveModelPath(model, './survey/../survey/stations.csv', false, 'x')).toBe(path.join(root, 'job', 'survey', 'stations.csv'));
  });

  it('resolveModelPath(model, "../x") refuses a path outside the folder tree, naming the key and --allow-outside', () => {
    const p = problemOf(() => resolveModelPath(model, '../secret.csv', false, 'survey.stations'));
    expect(p.where).toBe('survey.stations');
    expect(p.message).toContain(`"../secret.csv" resolves to ${outside}, outside the model's folder ${path.join(root, 'job')}`);
    expect(p.message).toContain('--allow-outside');
  });

  it('resolveModelPath(model, absolute) refuses an absolute path outside the folder tree', () => {
    const p = problemOf(() => resolveModelPath(model, outside, false, 'boundaries.downstream.file'));
    expect(p.where).toBe('boundaries.downstream.file');
    expect(p.message).toContain(`resolves to ${outside}, outside`);
  });

  it('resolveModelPath(model, link) refuses a symbolic link inside the folder that points outside it', () => {
    const p = problemOf(() => resolveModelPath(model, 'survey/link.csv', false, 'survey.crossSections'));
    expect(p.message).toContain(`"survey/link.csv" resolves to ${outside}, outside`);
  });

  it('resolveModelPath(allowOutside) reads outside paths and links when allowed', () => {
    expect(resolveModelPath(model, '../secret.csv', true, 'k')).toBe(outside);
    expect(resolveModelPath(model, 'survey/link.csv', true, 'k')).toBe(outside);
    expect(readModelFile(model, outside, true, 'k').text).toBe('not for the model\n');
  });

  it('resolveModelPath(model, missing) names the resolved path of a missing file', () => {
    const p = problemOf(() => resolveModelPath(model, 'survey/nothere.csv', false, 'survey.stations'));
    expect(p).toEqual({
      where: 'survey.stations',
      message: `file not found: ${path.join(root, 'job', 'survey', 'nothere.csv')} ("survey/nothere.csv", relative to the model file's folder)`,
    });
  });

  it('resolveModelPath(model, outside-missing) refuses before looking, so it tells nothing about outside files', () => {
    expect(problemOf(() => resolveModelPath(model, '../nothere.csv', false, 'k')).message).toContain('outside the model\'s folder');
  });

  it('resolveModelPath(model, folder or empty) refuses a folder and an empty path', () => {
    expect(problemOf(() => resolveModelPath(model, 'survey', false, 'k')).message).toContain('which is not a file');
    expect(problemOf(() => resolveModelPath(model, ' ', false, 'k')).message).toBe(
      'expected a file path relative to the model file, got an empty string',
    );
  });
});
