/**
 * createProgress(stream): a bar on a terminal only, never on a pipe or file (common practice for command-line
 * tools: control characters belong on terminals). The clock is the test's own.
 */
import { describe, expect, it } from 'vitest';
import { createProgress, progressDelay, progressLine } from '../../src/cli/progress.js';

function recorder(isTTY: boolean | undefined, columns = 80) {
  const writes: string[] = [];
  return { stream: { isTTY, columns, write: (t: string) => writes.push(t) }, writes };
}

describe('createProgress(stream)', () => {
  it('createProgress(stream) writes nothing when the stream is not a terminal', () => {
    for (const tty of [false, undefined]) {
      const { stream, writes } = recorder(tty);
      let t = 0;
      const p = createProgress(stream, { now: () => (t += 1000) });
      for (let i = 1; i <= 50; i++) p.update(i, 50, `flow ${i}`);
      p.finish();
      expect(writes).toEqual([]);
    }
  });

  it('createProgress(stream) on a terminal redraws one line with a carriage return and wipes it when done', () => {
    const { stream, writes } = recorder(true);
    let t = 0;
    const p = createProgress(stream, { now: () => (t += 1000) });
    p.update(1, 4, 'flow a');
    p.update(4, 4, 'flow d');
    p.finish();
    expect(writes).toHaveLength(3);
    expect(writes[0]).toMatch(/^\rgvf █{6}░{18} 1\/4 flow a$/);
    expect(writes[1]).toMatch(/^\rgvf █{24} 4\/4 flow d$/);
    expect(writes[2]).toMatch(/^\r +\r$/);
    expect(writes.join('')).not.toContain('\n');
  });

  it('createProgress(stream) shows nothing for a run that ends within the delay', () => {
    const { stream, writes } = recorder(true);
    let t = 0;
    const p = createProgress(stream, { now: () => t });
    t = progressDelay - 1;
    p.update(3, 3, 'done');
    p.finish();
    expect(writes).toEqual([]);
  });

  it('progressLine(done, total, label, columns) fits a narrow terminal and clamps its counts', () => {
    expect([...progressLine(7, 5, 'a very long label that would wrap on a narrow terminal', 50)].length).toBeLessThanOrEqual(49);
    expect(progressLine(7, 5, '', 80)).toContain('5/5');
    expect(progressLine(-1, 0, '', 80)).toContain('0/1');
  });
});
