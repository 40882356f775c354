/**
 * Flags → model pieces: each bad flag named, with the accepted range; the same rules and words as the
 * model file (messages.ts). Manning's n limits 0.005–0.2 as stated in the foundation issue.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors.js';
import { FlagReader, boundaryFromFlag, modelFromProfileFlags, sectionFromFlags, slopeAndDischarge } from '../../../src/input/model/flags.js';

function read(flags: Record<string, string | boolean>) {
  const reader = new FlagReader();
  const spec = sectionFromFlags(reader, flags);
  return { spec, problems: reader.problems.map((p) => `${p.where}: ${p.message}`) };
}

describe('sectionFromFlags(reader, flags)', () => {
  it('sectionFromFlags(trapezoidal) builds the same spec a model file holds', () => {
    expect(read({ shape: 'trapezoidal', bottomWidth: '3', sideSlope: '2', sideSlopeRight: '1.5', n: '0.015' })).toEqual({
      spec: { shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2, sideSlopeRight: 1.5, n: 0.015 },
      problems: [],
    });
    expect(read({ shape: 'circular', diameter: '0.9', ks: '0.0015', friction: 'darcy-weisbach' }).spec).toEqual({
      shape: 'circular',
      diameter: 0.9,
      ks: 0.0015,
      friction: 'darcy-weisbach',
    });
  });

  it('sectionFromFlags(flags) names each bad flag with what it accepts', () => {
    expect(read({ shape: 'trapezoidal', bottomWidth: '-3', sideSlope: '-1', n: '0.3' }).problems).toEqual([
      '--bottom-width: expected a number of at least 0, got -3',
      '--side-slope: expected a number of at least 0, got -1',
      "--n: Manning's n must lie between 0.005 and 0.2, got 0.3; pass --force if the value is intended",
    ]);
    expect(read({ shape: 'rectangular', bottomWidth: '3 m', n: '1/64' }).problems).toEqual([
      '--bottom-width: expected a number, got "3 m"',
      '--n: expected a number, got "1/64"',
    ]);
    expect(read({ shape: 'circular', n: '0.013' }).problems).toEqual(['--diameter: required: the conduit diameter, a number greater than 0']);
    expect(read({ shape: 'triangular', sideSlope: '2', bottomWidth: '1', n: '0.02' }).problems).toEqual([
      '--bottom-width: does not apply to a triangular section; a triangular section takes --side-slope, --side-slope-right',
    ]);
    expect(read({ shape: 'rectangular', bottomWidth: '2' }).problems).toEqual([
      "--n: a roughness is required: give --n, --chezy or --ks (Manning's n, Chézy C, or sand roughness ks)",
    ]);
    expect(read({ shape: 'rectangular', bottomWidth: '2', n: '0.015', alpha: '0.8' }).problems).toEqual([
      '--alpha: α must lie between 1 and 3 (it is 1 for uniform velocity), got 0.8',
    ]);
  });

  it('sectionFromFlags(flags) refuses widths and diameters no real channel has, stating the range (limits.ts)', () => {
    // the limits are gvf's own plausibility bounds (common practice: a millimetre slot is a capillary)
    const narrow = 'a bottom width of at least 0.001 (0.001 m is a millimetre; a narrower channel is a capillary, where none of the friction laws apply), got 1e-9';
    expect(read({ shape: 'rectangular', bottomWidth: '1e-9', n: '0.013' }).problems).toEqual([`--bottom-width: expected ${narrow}`]);
    expect(read({ shape: 'trapezoidal', bottomWidth: '1e-9', sideSlope: '2', n: '0.013' }).problems).toEqual([
      `--bottom-width: expected 0 (a triangle) or ${narrow}`,
    ]);
    const range = 'a diameter from 0.001 to 1000 (a narrower conduit is a capillary; the largest tunnels are some 20 m across)';
    expect(read({ shape: 'circular', diameter: '1e-9', n: '0.013' }).problems).toEqual([`--diameter: expected ${range}, got 1e-9`]);
    expect(read({ shape: 'circular', diameter: '5000', n: '0.013' }).problems).toEqual([`--diameter: expected ${range}, got 5000`]);
    // the ends of the ranges, and a trapezoid with no bottom (a triangle), are accepted
    expect(read({ shape: 'rectangular', bottomWidth: '0.001', n: '0.013' }).problems).toEqual([]);
    expect(read({ shape: 'trapezoidal', bottomWidth: '0', sideSlope: '2', n: '0.013' }).problems).toEqual([]);
    expect(read({ shape: 'circular', diameter: '1000', n: '0.013' }).problems).toEqual([]);
  });

  it('slopeAndDischarge(flags) refuses a discharge below 0.000001 (limits.ts smallestDischarge) and accepts it at the limit', () => {
    const readQ = (discharge: string) => {
      const reader = new FlagReader();
      const found = slopeAndDischarge(reader, { slope: '0.001', discharge });
      return { found, problems: reader.problems.map((p) => `${p.where}: ${p.message}`) };
    };
    expect(readQ('1e-12')).toEqual({
      found: { slope: 0.001, discharge: undefined },
      problems: [
        '--discharge: expected a discharge from 0.000001 to 10000000 (0.000001 m³/s is a millilitre a second; less is a trickle held by surface tension, not open-channel flow), got 1e-12',
      ],
    });
    expect(readQ('1e-6')).toEqual({ found: { slope: 0.001, discharge: 1e-6 }, problems: [] });
  });

  it('sectionFromFlags(flags) with --force accepts an unusual n', () => {
    expect(read({ shape: 'rectangular', bottomWidth: '2', n: '0.3', force: true }).problems).toEqual([]);
  });

  it('boundaryFromFlag(text) reads normal, critical or a depth', () => {
    const reader = new FlagReader();
    expect(boundaryFromFlag(reader, '--downstream', 'normal')).toEqual({ type: 'normal' });
    expect(boundaryFromFlag(reader, '--downstream', 'Critical')).toEqual({ type: 'critical' });
    expect(boundaryFromFlag(reader, '--downstream', '1.25')).toEqual({ type: 'depth', depth: 1.25 });
    expect(boundaryFromFlag(reader, '--upstream', '-1')).toBeUndefined();
    expect(reader.problems).toEqual([
      { where: '--upstream', message: 'expected "normal", "critical" or a depth greater than 0, got "-1"', value: '-1' },
    ]);
  });
});

describe('modelFromProfileFlags(flags)', () => {
  const flags = { shape: 'rectangular', bottomWidth: '4', n: '0.015', slope: '0.001', discharge: '6', length: '500' };

  it('modelFromProfileFlags(flags) makes a one-reach model, leaving an end without a flag to the engine', () => {
    const model = modelFromProfileFlags({ ...flags, downstream: '2.2', step: '10', units: 'US' });
    expect(model).toMatchObject({
      units: 'US',
      reaches: [{ id: 'reach', section: 'channel', length: 500, slope: 0.001 }],
      flows: [{ id: 'flow', discharge: 6 }],
      boundaries: { downstream: { type: 'depth', depth: 2.2 } },
      method: 'standard-step',
      outputSpacing: 10,
    });
  });

  it('modelFromProfileFlags(flags) throws one InputError naming every bad flag', () => {
    try {
      modelFromProfileFlags({ ...flags, discharge: '-6', length: '0', method: 'euler', units: 'metric' });
      throw new Error('accepted');
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).problems.map((p) => `${p.where}: ${p.message}`)).toEqual([
        '--units: expected one of "SI", "US", got "metric"',
        '--discharge: expected a number greater than 0, got -6',
        '--length: expected a number greater than 0, got 0',
        '--method: expected one of "standard-step", "direct-step", "ode", got "euler"',
      ]);
    }
  });
});
