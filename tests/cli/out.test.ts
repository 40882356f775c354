/**
 * `gvf run MODEL --out DIR`, run as a user runs it (the built CLI in a child process, stderr a pipe):
 * every file written and non-empty, PNGs of the stated size, the same bytes on a second run, result.json the
 * `--json` structure, user text escaped in the report, no progress bar when stderr is not a terminal (and one
 * when it is), bad input refused with exit code 2 leaving the output folder as it was, and a later run into the
 * same folder removing what an earlier one wrote and it does not (the sensitivity files) but nothing else, even when
 * the earlier or the later run is killed part-way (./fixtures/killAt.mjs).
 * The models are invented scenarios (tests/output/runFixtures.ts).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { filesIn, pngSize, scratchFolder } from '../helpers/outputFolder.js';
import { chuteModelText } from '../output/runFixtures.js';
import { ensureBuilt, gvf, mainJs, root } from './built.js';

beforeAll(() => ensureBuilt(), 300_000);

const scratch = () => scratchFolder('gvf-cli-out-');
function model(dir: string, overrides: Record<string, unknown> = {}): string {
  const path = join(dir, 'model.json');
  writeFileSync(path, chuteModelText(overrides));
  return path;
}

describe('gvf run MODEL --out DIR', () => {
  it('gvf run --out writes report.html, result.json, stations.csv and every chart, says where, and prints nothing on a piped stderr', () => {
    const work = scratch();
    const out = join(work, 'out');
    const run = gvf(['run', model(work), '--out', out, '--sections', '120']);
    expect(run.code).toBe(0);
    expect(run.stderr).toBe(''); // no progress bar: stderr is a pipe here
    expect(run.stdout).toContain(`report written to ${join(out, 'report.html')}`);
    const written = filesIn(out);
    for (const name of ['report.html', 'result.json', 'stations.csv', 'charts/profile.svg', 'charts/profile.png', 'charts/profile.vl.json', 'charts/section-at-120.png', 'charts/rating.png']) {
      expect(written.has(name), name).toBe(true);
      expect(written.get(name)!.length, name).toBeGreaterThan(100);
    }
    // 900 × 480 CSS px at 2 PNG pixels per CSS pixel (the style module's sizes)
    expect(pngSize(written.get('charts/profile.png')!)).toEqual({ width: 1800, height: 960 });
    expect(pngSize(written.get('charts/section-at-120.png')!)).toEqual({ width: 1280, height: 760 });
    // result.json is exactly what --json prints
    const json = gvf(['run', model(work), '--json']);
    expect(written.get('result.json')!.toString('utf8')).toBe(json.stdout);
    expect(written.get('stations.csv')!.toString('utf8').split('\n')[0]).toMatch(/^flow,discharge_m3_s,station_m,/);
  });

  it('gvf run --out twice gives byte-identical result.json, stations.csv and charts', () => {
    const work = scratch();
    const a = join(work, 'a');
    const b = join(work, 'b');
    expect(gvf(['run', model(work), '--out', a]).code).toBe(0);
    expect(gvf(['run', model(work), '--out', b]).code).toBe(0);
    const fa = filesIn(a);
    const fb = filesIn(b);
    expect([...fa.keys()].sort()).toEqual([...fb.keys()].sort());
    for (const [name, bytes] of fa) {
      // the report names the model file given, which is the same path here, so it too is identical
      expect(bytes.equals(fb.get(name)!), name).toBe(true);
    }
  });

  it('gvf run --out escapes user text: a model title with markup shows as text in report.html and the charts', () => {
    const work = scratch();
    const out = join(work, 'out');
    const title = 'Invented <script>window.x=1</script> & <b>bold</b> "channel"';
    expect(gvf(['run', model(work, { title, flows: [{ id: '<i>q</i>', discharge: 8 }] }), '--out', out]).code).toBe(0);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).not.toContain('<script>');
    expect(html).not.toContain('<b>bold</b>');
    expect(html).not.toContain('<i>q</i>');
    expect(html).toContain('Invented &lt;script&gt;window.x=1&lt;/script&gt; &amp; &lt;b&gt;bold&lt;/b&gt;');
    const svg = readFileSync(join(out, 'charts', 'profile.svg'), 'utf8');
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&lt;script&gt;');
  });

  it('gvf run --out on bad input exits 2 and leaves the output folder as it was', () => {
    const work = scratch();
    const out = join(work, 'out');
    expect(gvf(['run', model(work), '--out', out]).code).toBe(0);
    const before = filesIn(out);
    const bad = join(work, 'bad.json');
    writeFileSync(bad, chuteModelText({ reaches: [{ id: 'x', section: 'chute', length: -5, slope: 0.01 }] }));
    const cases = [
      ['run', bad, '--out', out],
      ['run', model(work), '--out', out, '--sections', '120,abc'],
      ['run', model(work), '--out', out, '--sections', '9999'],
      ['run', model(work), '--out', out, '--energy-at', '100', '--energy-flow', 'nope'],
    ];
    for (const args of cases) {
      const r = gvf(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    }
    expect(gvf(cases[2]!).stderr).toContain('--sections: station 9999 is outside the channel');
    const after = filesIn(out);
    expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it('gvf run --sections without --out says it needs --out', () => {
    const work = scratch();
    const r = gvf(['run', model(work), '--sections', '120']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--sections: draws a chart of the report: use it with --out DIR');
  });

  it('gvf run --out into a new folder that cannot be made exits with an error and writes nothing', () => {
    const work = scratch();
    writeFileSync(join(work, 'file'), 'x');
    const r = gvf(['run', model(work), '--out', join(work, 'file', 'out')]);
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/^gvf: /);
    expect(readFileSync(join(work, 'file'), 'utf8')).toBe('x');
  });

  it.skipIf(!existsSync('/usr/bin/script'))('gvf run --out on a terminal (a pseudo-terminal from script(1)) shows a progress bar on stderr and wipes it', () => {
    const work = scratch();
    mkdirSync(join(work, 'out'));
    const command = `${JSON.stringify(process.execPath)} ${JSON.stringify(mainJs)} run ${JSON.stringify(model(work))} --out ${JSON.stringify(join(work, 'out'))} >/dev/null`;
    const r = spawnSync('/usr/bin/script', ['-qec', command, '/dev/null'], { cwd: root, encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/\rgvf [█░]+ \d+\/\d+ /);
    expect(r.stdout).toMatch(/\r +\r/);
  });

  const sensitivityFiles = ['sensitivity.csv', 'charts/sensitivity-profile.vl.json', 'charts/sensitivity-profile.svg', 'charts/sensitivity-profile.png'];
  const record = (dir: string) => readFileSync(join(dir, '.gvf-outputs'), 'utf8').split('\n').filter((l) => l !== '');
  const outputs = (dir: string) => new Map([...filesIn(dir)].filter(([name]) => !/(^|\/)\.gvf-tmp-/.test(name)));
  const killAt = (at: string) => ({ NODE_OPTIONS: `--import=${join(root, 'tests', 'cli', 'fixtures', 'killAt.mjs')}`, GVF_KILL_AT: at });

  it('gvf run --out after a run with --sensitivity removes sensitivity.csv and charts/sensitivity-profile.*, and keeps a user\'s own files', () => {
    const work = scratch();
    const out = join(work, 'out');
    const first = gvf(['run', model(work), '--out', out, '--sensitivity', 'n=±20%']);
    expect(first.code, first.stderr).toBe(0);
    expect(first.stdout).toContain(`sensitivity.csv and charts/sensitivity-profile (.vl.json, .svg, .png) written to ${out}`);
    for (const name of sensitivityFiles) expect(record(out), name).toContain(name);
    writeFileSync(join(out, 'my-notes.txt'), 'mine');
    writeFileSync(join(out, 'charts', 'my-sketch.svg'), '<svg/>');
    const second = gvf(['run', model(work), '--out', out]);
    expect(second.code, second.stderr).toBe(0);
    for (const name of sensitivityFiles) expect(existsSync(join(out, name)), name).toBe(false);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).not.toContain('id="sensitivity"');
    expect(readFileSync(join(out, 'my-notes.txt'), 'utf8')).toBe('mine');
    expect(readFileSync(join(out, 'charts', 'my-sketch.svg'), 'utf8')).toBe('<svg/>');
    // every file gvf left in the folder is recorded, and nothing else is
    expect([...record(out)].sort()).toEqual([...filesIn(out).keys()].filter((n) => !['.gvf-outputs', 'my-notes.txt', 'charts/my-sketch.svg'].includes(n)).sort());
  });

  it('gvf run --out killed while writing its files leaves the earlier run\'s files as they were, and the next run finishes the clean-up', () => {
    const work = scratch();
    const out = join(work, 'out');
    expect(gvf(['run', model(work), '--out', out, '--sensitivity', 'n=±20%']).code).toBe(0);
    const before = filesIn(out);
    // the third staged file: result.json and stations.csv are written under temporary names, nothing renamed yet
    const killed = spawnSync(process.execPath, [mainJs, 'run', model(work), '--out', out], { cwd: root, encoding: 'utf8', env: { ...process.env, GVF_DEBUG: '', ...killAt('open:3') } });
    expect(killed.signal).toBe('SIGKILL');
    expect([...filesIn(out).keys()].some((n) => n.includes('.gvf-tmp-'))).toBe(true);
    const after = outputs(out);
    expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
    const next = gvf(['run', model(work), '--out', out]);
    expect(next.code, next.stderr).toBe(0);
    expect([...filesIn(out).keys()].filter((n) => n.includes('.gvf-tmp-'))).toEqual([]);
    for (const name of sensitivityFiles) expect(existsSync(join(out, name)), name).toBe(false);
  });

  it('gvf run --out killed after renaming its files but before removing the earlier ones leaves those recorded, and the next run removes them', () => {
    const work = scratch();
    const out = join(work, 'out');
    expect(gvf(['run', model(work), '--out', out, '--sensitivity', 'n=±20%']).code).toBe(0);
    // lstat is called first when an earlier output is about to be removed
    const killed = gvf(['run', model(work), '--out', out], killAt('lstat:1'));
    expect(killed.code).toBe(null);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).not.toContain('id="sensitivity"');
    for (const name of sensitivityFiles) {
      expect(existsSync(join(out, name)), name).toBe(true);
      expect(record(out), name).toContain(name);
    }
    const next = gvf(['run', model(work), '--out', out]);
    expect(next.code, next.stderr).toBe(0);
    for (const name of sensitivityFiles) expect(existsSync(join(out, name)), name).toBe(false);
    expect(record(out).filter((n) => n.includes('sensitivity'))).toEqual([]);
    expect(readdirSync(out).filter((n) => n.startsWith('.gvf-tmp-'))).toEqual([]);
  });
});
