/** writeOutputs(dir, files): staged writes, renamed into place only when every file is written (common practice: write-then-rename, POSIX rename(2) replaces atomically). */
import { mkdtemp, readdir, readFile, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core/errors.js';
import { writeOutputs } from '../../src/output/files.js';

const fresh = () => mkdtemp(join(tmpdir(), 'gvf-out-'));

describe('writeOutputs(dir, files)', () => {
  it('writeOutputs(dir, files) writes text and bytes, into sub-folders too, and leaves no temporary file', async () => {
    const dir = join(await fresh(), 'run');
    const paths = await writeOutputs(dir, [
      { name: 'report.html', content: '<p>one</p>' },
      { name: 'charts/profile.png', content: new Uint8Array([1, 2, 3]) },
    ]);
    expect(paths).toEqual([join(dir, 'report.html'), join(dir, 'charts', 'profile.png')]);
    expect(await readFile(join(dir, 'report.html'), 'utf8')).toBe('<p>one</p>');
    expect([...(await readFile(join(dir, 'charts', 'profile.png')))]).toEqual([1, 2, 3]);
    expect((await readdir(dir)).sort()).toEqual(['charts', 'report.html']);
  });

  it('writeOutputs(dir, files) overwrites the previous run cleanly', async () => {
    const dir = await fresh();
    await writeOutputs(dir, [{ name: 'result.json', content: '{"a":1}' }]);
    await writeOutputs(dir, [{ name: 'result.json', content: '{"a":2}' }]);
    expect(await readFile(join(dir, 'result.json'), 'utf8')).toBe('{"a":2}');
    expect(await readdir(dir)).toEqual(['result.json']);
  });

  it('writeOutputs(dir, files) that fails part-way leaves the previous files as they were and cleans up', async () => {
    const dir = await fresh();
    await writeOutputs(dir, [{ name: 'report.html', content: 'old report' }, { name: 'stations.csv', content: 'old csv' }]);
    // a plain file where a folder is needed makes the third file impossible to write
    await writeFile(join(dir, 'charts'), 'in the way');
    await expect(
      writeOutputs(dir, [
        { name: 'report.html', content: 'new report' },
        { name: 'stations.csv', content: 'new csv' },
        { name: 'charts/profile.svg', content: '<svg/>' },
      ]),
    ).rejects.toThrow();
    expect(await readFile(join(dir, 'report.html'), 'utf8')).toBe('old report');
    expect(await readFile(join(dir, 'stations.csv'), 'utf8')).toBe('old csv');
    expect((await readdir(dir)).sort()).toEqual(['charts', 'report.html', 'stations.csv']);
  });

  it('writeOutputs(dir, files) refuses names that leave the folder, repeat, or are empty, naming the file', async () => {
    const dir = await fresh();
    await mkdir(join(dir, 'keep'));
    for (const name of ['../escape.txt', '/etc/x', 'a/../../b', '', '.gvf-tmp-x']) {
      const err = await writeOutputs(dir, [{ name, content: 'x' }]).catch((e: unknown) => e);
      expect(err, name).toBeInstanceOf(InputError);
      expect((err as InputError).problems[0]!.where).toBe('files[0].name');
    }
    const dup = await writeOutputs(dir, [{ name: 'a.txt', content: '1' }, { name: './a.txt', content: '2' }]).catch((e: unknown) => e);
    expect((dup as InputError).problems[0]!.message).toMatch(/same name/);
    expect(await readdir(dir)).toEqual(['keep']);
  });
});
