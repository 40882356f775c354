/** reportError(error, streams): the exit code and the words a user sees for each kind of error. */
import { afterEach, describe, expect, it } from 'vitest';
import { HydraulicError, InputError, NumericalError } from '../../src/core/errors.js';
import { ModelFileError } from '../../src/input/model/validate.js';
import { reportError, toJson } from '../../src/cli/print.js';

function capture() {
  const err: string[] = [];
  return { streams: { out: () => undefined, err: (t: string) => void err.push(t) }, err };
}

afterEach(() => {
  delete process.env.GVF_DEBUG;
});

describe('reportError(error, streams)', () => {
  it('reportError(InputError) lists every problem and returns 2', () => {
    const { streams, err } = capture();
    const code = reportError(new InputError([{ where: '--n', message: 'too rough' }, { where: '--slope', message: 'missing' }]), streams);
    expect(code).toBe(2);
    expect(err).toEqual(['gvf: bad input (2 problems):\n  --n: too rough\n  --slope: missing']);
  });

  it('reportError(ModelFileError) names the file', () => {
    const { streams, err } = capture();
    expect(reportError(new ModelFileError('m.json', [{ where: 'units', message: 'missing' }]), streams)).toBe(2);
    expect(err).toEqual(['gvf: m.json is not a valid model (1 problem):\n  units: missing']);
  });

  it('reportError(HydraulicError) returns 2 and NumericalError or anything else 1, in one line, stack only with GVF_DEBUG=1', () => {
    const a = capture();
    expect(reportError(new HydraulicError('depth above the crown'), a.streams)).toBe(2);
    expect(a.err).toEqual(['gvf: cannot be computed: depth above the crown']);
    const b = capture();
    expect(reportError(new NumericalError('no bracket\nbetween 0 and 1'), b.streams)).toBe(1);
    expect(b.err).toEqual(['gvf: the computation failed: no bracket; between 0 and 1']);
    const c = capture();
    expect(reportError(new TypeError('x is undefined'), c.streams)).toBe(1);
    expect(c.err).toEqual(['gvf: unexpected error: x is undefined (set GVF_DEBUG=1 for details)']);
    process.env.GVF_DEBUG = '1';
    const d = capture();
    reportError(new TypeError('x is undefined'), d.streams);
    expect(d.err[1]).toMatch(/^TypeError: x is undefined\n\s+at /);
  });

  it('toJson(value) writes non-finite numbers as null', () => {
    expect(toJson({ a: Number.NaN, b: Infinity, c: 1 })).toBe('{\n  "a": null,\n  "b": null,\n  "c": 1\n}');
  });
});
