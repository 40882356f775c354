/**
 * writeRunOutputs(dir, run): every output file written, PNGs of the stated size, re-runs overwrite cleanly
 * (stale charts of an earlier run removed, nothing else touched), a failed run leaves the previous files
 * byte for byte, and the same run gives the same bytes. PNG sizes are read as the PNG specification lays
 * the header out (W3C PNG 2nd ed. 2003 / ISO/IEC 15948: IHDR width and height, big-endian, at bytes 16 and 20).
 */
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sensitivityAnalysis } from '../../src/analysis/sensitivity.js';
import { parseModelText } from '../../src/input/model/parse.js';
import { type RenderedChart, renderChart } from '../../src/output/render.js';
import { manifestName, resultJson, runFiles, writeRunOutputs } from '../../src/output/runFiles.js';
import { size } from '../../src/output/charts/style.js';
import { filesIn, pngSize, scratchFolder } from '../helpers/outputFolder.js';
import { chuteModelText, chuteRun } from './runFixtures.js';

const scratch = () => scratchFolder('gvf-out-');

describe('writeRunOutputs(dir, run)', () => {
  const run = chuteRun();

  it('writeRunOutputs(dir, run) writes the report, result.json, stations.csv and each chart as .vl.json, .svg and .png', async () => {
    const dir = scratch();
    const written = await writeRunOutputs(dir, run);
    const files = filesIn(dir);
    const charts = written.charts;
    expect(charts).toContain('profile');
    const expected = ['report.html', 'result.json', 'stations.csv', manifestName, ...charts.flatMap((c) => ['vl.json', 'svg', 'png'].map((x) => `charts/${c}.${x}`))];
    expect([...files.keys()].sort()).toEqual(expected.sort());
    for (const [name, bytes] of files) expect(bytes.length, name).toBeGreaterThan(0);
    // the profile PNG: the chart size of the style module at its PNG scale
    expect(pngSize(files.get('charts/profile.png')!)).toEqual({ width: size.profile.width * size.pngScale, height: size.profile.height * size.pngScale });
    for (const c of charts) {
      const svg = files.get(`charts/${c}.svg`)!.toString('utf8');
      const m = /^<svg[^>]*\swidth="([\d.]+)"[^>]*\sheight="([\d.]+)"/.exec(svg)!;
      expect(pngSize(files.get(`charts/${c}.png`)!), c).toEqual({ width: Math.round(Number(m[1]) * size.pngScale), height: Math.round(Number(m[2]) * size.pngScale) });
      // the saved spec is the one drawn, so a user can restyle it
      expect(JSON.parse(files.get(`charts/${c}.vl.json`)!.toString('utf8')).$schema).toContain('vega-lite');
    }
    expect(files.get('result.json')!.toString('utf8')).toBe(resultJson(run));
    const html = files.get('report.html')!.toString('utf8');
    expect((html.match(/<figure class="chart"/g) ?? []).length).toBe(charts.length);
    expect(html).toContain('gvf 0.1.0');
    expect(written.report).toBe(join(dir, 'report.html'));
  });

  it('writeRunOutputs(dir, run) overwrites cleanly: stale charts of an earlier run go, other files in the folder stay', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run, { sections: [120] });
    expect(existsSync(join(dir, 'charts', 'section-at-120.svg'))).toBe(true);
    writeFileSync(join(dir, 'my-notes.txt'), 'mine');
    writeFileSync(join(dir, 'charts', 'my-sketch.svg'), '<svg/>');
    const second = await writeRunOutputs(dir, run);
    for (const x of ['vl.json', 'svg', 'png']) expect(existsSync(join(dir, 'charts', `section-at-120.${x}`))).toBe(false);
    expect(second.removed.map((p) => p.slice(dir.length + 1)).sort()).toEqual(['charts/section-at-120.png', 'charts/section-at-120.svg', 'charts/section-at-120.vl.json']);
    expect(readFileSync(join(dir, 'my-notes.txt'), 'utf8')).toBe('mine');
    expect(readFileSync(join(dir, 'charts', 'my-sketch.svg'), 'utf8')).toBe('<svg/>');
    expect(readdirSync(dir).some((n) => n.startsWith('.gvf-tmp-'))).toBe(false);
  });

  it('writeRunOutputs(dir, run) clears temporary files an interrupted run left behind', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run);
    writeFileSync(join(dir, '.gvf-tmp-999-dead-0'), 'half');
    writeFileSync(join(dir, 'charts', '.gvf-tmp-999-dead-3'), 'half');
    await writeRunOutputs(dir, run);
    expect(readdirSync(dir).filter((n) => n.startsWith('.gvf-tmp-'))).toEqual([]);
    expect(readdirSync(join(dir, 'charts')).filter((n) => n.startsWith('.gvf-tmp-'))).toEqual([]);
  });

  it('writeRunOutputs(dir, run) that fails while drawing a chart leaves the previous files byte for byte', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run);
    const before = filesIn(dir);
    const other = chuteRun({ flows: [{ id: 'other', discharge: 9 }] });
    let calls = 0;
    const failing = async (spec: Parameters<typeof renderChart>[0]) => {
      if (++calls === 3) throw new Error('simulated render failure');
      return renderChart(spec);
    };
    await expect(writeRunOutputs(dir, other, { render: failing })).rejects.toThrow('simulated render failure');
    expect(calls).toBe(3);
    const after = filesIn(dir);
    expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
  });

  it('runFiles(run) gives the same bytes for the same input: result.json, stations.csv, the report and every chart', async () => {
    const a = await runFiles(chuteRun());
    const b = await runFiles(chuteRun());
    expect(a.files.map((f) => f.name)).toEqual(b.files.map((f) => f.name));
    a.files.forEach((f, i) => expect(Buffer.from(f.content).equals(Buffer.from(b.files[i]!.content)), f.name).toBe(true));
    const csv = a.files.find((f) => f.name === 'stations.csv')!.content as string;
    const json = a.files.find((f) => f.name === 'result.json')!.content as string;
    // no clock in the outputs: nothing that looks like a date or time of day
    for (const text of [csv, json, a.files.find((f) => f.name === 'report.html')!.content as string]) expect(text).not.toMatch(/\b20\d\d-\d\d-\d\d|\d\d:\d\d:\d\d/);
  });

  it('runFiles(run) reports progress once per chart and once for the report', async () => {
    const seen: string[] = [];
    const out = await runFiles(run, { onProgress: (done, total, label) => seen.push(`${done}/${total} ${label}`) });
    expect(seen).toHaveLength(out.charts.length + 1);
    expect(seen[seen.length - 1]).toBe(`${out.charts.length + 1}/${out.charts.length + 1} report`);
  });
});

/**
 * The record DIR/.gvf-outputs and the clean-up of an earlier run's files. Charts are drawn by a stand-in renderer
 * here (what is checked is which files are written and removed, not how they look), so only the run is computed.
 * The sensitivity run varies Manning's n of the invented chute by ±20 % (src/analysis/sensitivity.ts).
 */
describe('writeRunOutputs(dir, run) and the record of what it wrote', () => {
  const run = chuteRun();
  const { sensitivity } = sensitivityAnalysis(parseModelText(chuteModelText(), 'invented.json'), [{ parameter: 'n', percent: 20 }], { base: run });
  const render = async (spec: Parameters<typeof renderChart>[0]): Promise<RenderedChart> => ({
    spec,
    vega: {},
    svg: '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>',
    png: new Uint8Array([1, 2, 3]),
    width: 10,
    height: 10,
    pngWidth: 20,
    pngHeight: 20,
    warnings: [],
  });
  const sensitivityFiles = ['sensitivity.csv', 'charts/sensitivity-profile.vl.json', 'charts/sensitivity-profile.svg', 'charts/sensitivity-profile.png'];
  const record = (dir: string) => readFileSync(join(dir, manifestName), 'utf8').split('\n').filter((l) => l !== '');

  it('writeRunOutputs(dir, run, {sensitivity}) writes sensitivity.csv and the band chart and records every file it wrote', async () => {
    const dir = scratch();
    const written = await writeRunOutputs(dir, run, { sensitivity, render });
    const files = [...filesIn(dir).keys()].filter((n) => n !== manifestName).sort();
    for (const name of sensitivityFiles) expect(files, name).toContain(name);
    // the record lists exactly the files on disk, each once
    expect([...record(dir)].sort()).toEqual(files);
    expect(written.written.map((p) => p.slice(dir.length + 1)).sort()).toEqual(files);
    // the band chart is a file beside the report, not one of its figures
    expect(written.charts).not.toContain('sensitivity-profile');
    expect(readFileSync(join(dir, 'sensitivity.csv'), 'utf8').split('\n')[0]).toBe(
      'flow,station_m,bed_elevation_m,base_wsel_m,lowest_wsel_m,highest_wsel_m,range_m,lowest_case,highest_case',
    );
  });

  it('writeRunOutputs(dir, run) after a run with {sensitivity} removes the sensitivity files and keeps a user\'s own files', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run, { sensitivity, render });
    // files of the user's own, some with names like gvf's
    writeFileSync(join(dir, 'my-notes.txt'), 'mine');
    writeFileSync(join(dir, 'sensitivity-by-hand.csv'), 'mine');
    writeFileSync(join(dir, 'charts', 'sensitivity-sketch.svg'), '<svg/>');
    const second = await writeRunOutputs(dir, run, { render });
    for (const name of sensitivityFiles) expect(existsSync(join(dir, name)), name).toBe(false);
    expect(second.removed.map((p) => p.slice(dir.length + 1)).sort()).toEqual([...sensitivityFiles].sort());
    expect(record(dir).filter((n) => n.includes('sensitivity'))).toEqual([]);
    expect([...record(dir)].sort()).toEqual([...filesIn(dir).keys()].filter((n) => n !== manifestName && !n.includes('sensitivity-') && n !== 'my-notes.txt').sort());
    expect(readFileSync(join(dir, 'my-notes.txt'), 'utf8')).toBe('mine');
    expect(readFileSync(join(dir, 'sensitivity-by-hand.csv'), 'utf8')).toBe('mine');
    expect(readFileSync(join(dir, 'charts', 'sensitivity-sketch.svg'), 'utf8')).toBe('<svg/>');
    // the report no longer mentions a sensitivity run, and no file of one is left beside it
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).not.toContain('id="sensitivity"');
  });

  it('writeRunOutputs(dir, run) that fails after a run with {sensitivity} leaves every file of that run byte for byte', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run, { sensitivity, render });
    const before = filesIn(dir);
    let calls = 0;
    const failing = async (spec: Parameters<typeof renderChart>[0]) => {
      if (++calls === 2) throw new Error('simulated render failure');
      return render(spec);
    };
    await expect(writeRunOutputs(dir, run, { render: failing })).rejects.toThrow('simulated render failure');
    const after = filesIn(dir);
    expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
    for (const [name, bytes] of before) expect(after.get(name)!.equals(bytes), name).toBe(true);
    for (const name of sensitivityFiles) expect(after.has(name), name).toBe(true);
  });

  it('writeRunOutputs(dir, run) removes only names of the kinds gvf writes, from a record edited by hand', async () => {
    const parent = scratch();
    const dir = join(parent, 'out');
    await writeRunOutputs(dir, run, { render });
    writeFileSync(join(parent, 'outside.txt'), 'mine');
    writeFileSync(join(dir, 'my-notes.txt'), 'mine');
    writeFileSync(join(dir, 'charts', '.hidden.svg'), 'mine');
    writeFileSync(join(dir, 'data.csv'), 'mine');
    writeFileSync(join(dir, 'sensitivity.csv'), 'an earlier file gvf wrote');
    const hand = ['../outside.txt', 'my-notes.txt', 'charts/.hidden.svg', 'charts/../data.csv', '/etc/hostname', './sensitivity.csv', 'sensitivity.csv'];
    writeFileSync(join(dir, manifestName), `${readFileSync(join(dir, manifestName), 'utf8')}${hand.join('\n')}\n`);
    const second = await writeRunOutputs(dir, run, { render });
    expect(second.removed).toEqual([join(dir, 'sensitivity.csv')]);
    for (const [name, where] of [['outside.txt', parent], ['my-notes.txt', dir], ['.hidden.svg', join(dir, 'charts')], ['data.csv', dir]] as const) {
      expect(readFileSync(join(where, name), 'utf8'), name).toBe('mine');
    }
    expect(record(dir).some((n) => hand.includes(n))).toBe(false);
  });

  it('writeRunOutputs(dir, run) leaves alone a recorded name that has become a folder, and stops recording it', async () => {
    const dir = scratch();
    await writeRunOutputs(dir, run, { sensitivity, render });
    rmSync(join(dir, 'sensitivity.csv'));
    mkdirSync(join(dir, 'sensitivity.csv'));
    writeFileSync(join(dir, 'sensitivity.csv', 'mine.txt'), 'mine');
    const second = await writeRunOutputs(dir, run, { render });
    expect(readFileSync(join(dir, 'sensitivity.csv', 'mine.txt'), 'utf8')).toBe('mine');
    expect(second.removed.map((p) => p.slice(dir.length + 1)).sort()).toEqual(sensitivityFiles.slice(1).sort());
    expect(second.notes).toEqual([]);
    expect(record(dir)).not.toContain('sensitivity.csv');
  });
});
