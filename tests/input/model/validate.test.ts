/**
 * validateModel(json, file): every message pinned with its path, the value found and what is accepted.
 * The wording is the contract with users (a changed message is reviewed here), after zod's issue format.
 * The model below is the core example of the profile-engine issue (an invented swale).
 */
import { describe, expect, it } from 'vitest';
import { InputError, type Problem } from '../../../src/core/errors.js';
import { ModelFileError, validateModel } from '../../../src/input/model/validate.js';

const example = () => ({
  title: 'Orchard Lane swale',
  units: 'SI',
  sections: { lined: { shape: 'trapezoidal', bottomWidth: 1.2, sideSlope: 2, n: 0.018 } },
  reaches: [
    { id: 'upper', section: 'lined', length: 90, slope: 0.015 },
    { id: 'lower', section: 'lined', length: 400, slope: 0.001 },
  ],
  downstreamBedElevation: 48.0,
  flows: [
    { id: '10-year', discharge: 3.1 },
    { id: '100-year', discharge: 5.4 },
  ],
  boundaries: { upstream: { type: 'critical' }, downstream: { type: 'stage', elevation: 49.3 } },
  method: 'standard-step',
});

/** The problems of an invalid model (fails the test when the model is accepted). */
function problemsOf(json: unknown, options = {}): Problem[] {
  try {
    validateModel(json, 'model.json', options);
  } catch (error) {
    expect(error).toBeInstanceOf(ModelFileError);
    expect(error).toBeInstanceOf(InputError);
    expect((error as ModelFileError).file).toBe('model.json');
    return [...(error as InputError).problems];
  }
  throw new Error('the model was accepted');
}

const lines = (json: unknown, options = {}) => problemsOf(json, options).map((p) => `${p.where}: ${p.message}`);

function edit(change: (m: ReturnType<typeof example>) => void): unknown {
  const m = example();
  change(m);
  return m;
}

describe('validateModel(json, file)', () => {
  it('validateModel(example) accepts the core example and fills in the defaults', () => {
    const model = validateModel(example(), 'model.json');
    expect(model.reaches.map((r) => r.id)).toEqual(['upper', 'lower']);
    expect(model.frictionAveraging).toBe('conveyance');
    const bare = example() as Record<string, unknown>;
    delete bare.boundaries;
    delete bare.method;
    delete bare.downstreamBedElevation;
    const filled = validateModel(bare, 'model.json');
    expect(filled.boundaries).toEqual({});
    expect(filled.method).toBe('standard-step');
    expect(filled.downstreamBedElevation).toBe(0);
  });

  it('validateModel(json) names the path, the value and the expectation of a wrong type', () => {
    const problems = problemsOf(edit((m) => ((m.reaches[1] as Record<string, unknown>).slope = '0.01%')));
    expect(problems).toEqual([{ where: 'reaches[1].slope', message: 'expected a number, got "0.01%"', value: '0.01%' }]);
  });

  it('validateModel(json) keeps the offending value with each problem', () => {
    const json = edit((m) => {
      (m.reaches[0] as Record<string, unknown>).lenght = 90;
      m.reaches[1]!.section = 'lind';
      m.flows[0]!.discharge = -3.1;
    });
    // in the order the places appear in the file
    expect(problemsOf(json).map((p) => [p.where, p.value])).toEqual([
      ['reaches[0].lenght', 90],
      ['reaches[1].section', 'lind'],
      ['flows[0].discharge', -3.1],
    ]);
  });

  it('validateModel(json) reports a reach naming a section that does not exist, with a suggestion', () => {
    expect(lines(edit((m) => (m.reaches[0]!.section = 'lind')))).toEqual([
      'reaches[0].section: no section named "lind" (did you mean "lined"?); the sections defined are "lined"',
    ]);
  });

  it('validateModel(json) reports every unknown key with the keys allowed there', () => {
    const json = edit((m) => {
      (m as Record<string, unknown>).colour = 'blue';
      (m.reaches[0] as Record<string, unknown>).lenght = 90;
      (m.boundaries.downstream as Record<string, unknown>).depth = 1;
    });
    expect(lines(json)).toEqual([
      'reaches[0].lenght: unknown key (did you mean "length"?); the keys allowed here are id, section, length, slope, bankHeight',
      'boundaries.downstream.depth: unknown key; the keys allowed here are type, elevation',
      'colour: unknown key; the keys allowed here are $schema, title, units, sections, reaches, downstreamBedElevation, flows, boundaries, method, freeboard, frictionAveraging, outputSpacing, description, structures, flowChanges, lateralInflow, sectionChartsAt',
    ]);
  });

  it('validateModel(json) names the accepted values of an enumeration and a tag', () => {
    const json = edit((m) => {
      m.units = 'si';
      (m.sections.lined as Record<string, unknown>).shape = 'trapezoid';
      (m.boundaries.upstream as Record<string, unknown>).type = 'brink';
      m.method = 'euler';
    });
    expect(lines(json)).toEqual([
      'units: expected one of "SI", "US", got "si" (did you mean "SI"?)',
      'sections.lined.shape: expected one of "rectangular", "trapezoidal", "triangular", "circular", "points", got "trapezoid" (did you mean "trapezoidal"?)',
      'boundaries.upstream.type: expected one of "depth", "stage", "normal", "critical", "reservoir", got "brink"',
      'method: expected one of "standard-step", "direct-step", "ode", got "euler"',
    ]);
  });

  it('validateModel(json) reports missing keys as missing, saying what belongs there', () => {
    const json = edit((m) => {
      delete (m as Record<string, unknown>).units;
      delete (m.flows[0] as Record<string, unknown>).discharge;
    });
    expect(lines(json)).toEqual(['units: missing: expected one of "SI", "US"', 'flows[0].discharge: missing: expected the discharge Q (a number greater than 0); only a reservoir upstream boundary lets gvf find it']);
  });

  it('validateModel(json) refuses zero and negative discharges and lengths, and empty lists', () => {
    const json = edit((m) => {
      m.flows[0]!.discharge = 0;
      m.flows[1]!.discharge = -5.4;
      m.reaches[0]!.length = -90;
    });
    expect(lines(json)).toEqual([
      'reaches[0].length: expected a number greater than 0, got -90',
      'flows[0].discharge: expected a number greater than 0, got 0',
      'flows[1].discharge: expected a number greater than 0, got -5.4',
    ]);
    expect(lines(edit((m) => (m.reaches = [])))).toEqual(['reaches: expected at least 1 entry, got 0']);
    expect(lines(edit((m) => (m.sections = {} as typeof m.sections)))).toEqual([
      'sections: expected at least 1 section, got 0',
      'reaches[0].section: no section named "lined"; the model defines no sections',
      'reaches[1].section: no section named "lined"; the model defines no sections',
    ]);
  });

  it('validateModel(json) refuses a discharge, bottom width or diameter no real channel has, at its path with the range', () => {
    // limits.ts: gvf's own plausibility bounds (common practice), not physics; the values at the limits are accepted
    const json = edit((m) => {
      m.flows[0]!.discharge = 1e-12;
      m.sections.lined.bottomWidth = 1e-9;
    });
    expect(lines(json)).toEqual([
      'sections.lined.bottomWidth: expected 0 (a triangle) or a bottom width of at least 0.001 (0.001 m is a millimetre; a narrower channel is a capillary, where none of the friction laws apply), got 1e-9',
      'flows[0].discharge: expected a discharge from 0.000001 to 10000000 (0.000001 m³/s is a millilitre a second; less is a trickle held by surface tension, not open-channel flow), got 1e-12',
    ]);
    const pipe = edit((m) => ((m.sections as Record<string, unknown>).lined = { shape: 'circular', diameter: 5000, n: 0.013 }));
    expect(lines(pipe)).toEqual([
      'sections.lined.diameter: expected a diameter from 0.001 to 1000 (a narrower conduit is a capillary; the largest tunnels are some 20 m across), got 5000',
    ]);
    const atLimits = edit((m) => {
      m.flows[0]!.discharge = 1e-6;
      m.sections.lined.bottomWidth = 0.001;
    });
    expect(validateModel(atLimits, 'model.json').flows[0]!.discharge).toBe(1e-6);
  });

  it("validateModel(json) keeps Manning's n within 0.005–0.2 unless forced", () => {
    const json = edit((m) => (m.sections.lined.n = 0.5));
    expect(lines(json)).toEqual([
      "sections.lined.n: Manning's n must lie between 0.005 and 0.2, got 0.5; run with --force if the value is intended",
    ]);
    expect(validateModel(json, 'model.json', { force: true }).sections.lined).toMatchObject({ n: 0.5 });
    expect(lines(edit((m) => (m.sections.lined.n = 0.004)))[0]).toContain('got 0.004');
  });

  it('validateModel(json) wants exactly one roughness, matching the friction law', () => {
    const none = edit((m) => delete (m.sections.lined as Record<string, unknown>).n);
    expect(lines(none)).toEqual([
      "sections.lined.n: a roughness is required: give n, chezy or ks (Manning's n, Chézy C, or sand roughness ks)",
    ]);
    const two = edit((m) => ((m.sections.lined as Record<string, unknown>).chezy = 50));
    expect(lines(two)).toEqual(['sections.lined.chezy: give one roughness, not n and chezy']);
    const mismatch = edit((m) => ((m.sections.lined as Record<string, unknown>).friction = 'chezy'));
    expect(lines(mismatch)).toEqual(['sections.lined.friction: the friction law "chezy" takes its roughness from chezy, but n was given']);
  });

  it('validateModel(json) checks irregular sections: pairs, order, roughness tables', () => {
    const points = (section: Record<string, unknown>) =>
      edit((m) => ((m.sections as Record<string, unknown>).lined = { shape: 'points', ...section }));
    const good = { points: [[0, 2], [1, 0], [3, 0], [4, 2]], n: [[0, 0.035], [1, 0.015], [3, 0.035]] };
    expect(validateModel(points(good), 'model.json').sections.lined).toMatchObject(good);
    expect(lines(points({ ...good, points: [[0, 2], [1, 0, 5], [4, 2]] }))).toEqual([
      'sections.lined.points[1]: expected a pair [station, elevation] of numbers, got [1,0,5]',
    ]);
    expect(lines(points({ ...good, points: [[0, 2], [2, 0], [1, 0], [4, 2]] }))).toEqual([
      'sections.lined.points[2][0]: stations across the section must not decrease: 1 follows 2',
    ]);
    expect(lines(points({ ...good, points: [[0, 2], [4, 2]] }))).toEqual([
      'sections.lined.points: an irregular section needs at least 3 points [station, elevation], got 2',
    ]);
    expect(lines(points({ ...good, points: [[0, 0], [1, 1], [4, 2]] }))).toEqual([
      'sections.lined.points: the section holds no water: both end points must lie above its lowest point',
    ]);
    expect(lines(points({ ...good, n: [[0, 0.035], [3, 0.015], [1, 0.035]] }))).toEqual([
      'sections.lined.n[2][0]: roughness stations must increase across the section: 1 follows 3',
    ]);
    expect(lines(points({ ...good, n: [[0, 0.035], [1, 'smooth']] }))).toEqual(['sections.lined.n[1][1]: expected a number, got "smooth"']);
    expect(lines(points({ ...good, n: 'rough' }))).toEqual([
      'sections.lined.n: expected one positive number or a list of [fromStation, value] pairs, got "rough"',
    ]);
    expect(lines(points({ ...good, n: [[0, 0.035], [1, 0.9]] }))).toEqual([
      "sections.lined.n[1][1]: Manning's n must lie between 0.005 and 0.2, got 0.9; run with --force if the value is intended",
    ]);
  });

  it('validateModel(json) reports duplicated reach and flow ids', () => {
    const json = edit((m) => {
      m.reaches[1]!.id = 'upper';
      m.flows[1]!.id = '10-year';
    });
    expect(lines(json)).toEqual([
      'reaches[1].id: the reach id "upper" is used twice (first at index 0); ids must be unique',
      'flows[1].id: the flow id "10-year" is used twice (first at index 0); ids must be unique',
    ]);
  });

  it('validateModel(json) takes a slope as a fraction and refuses one of magnitude 1 or more', () => {
    expect(lines(edit((m) => (m.reaches[0]!.slope = 1.5)))).toEqual([
      'reaches[0].slope: expected a bed slope as a fraction with magnitude below 1 (0.001 means 0.1 %), got 1.5',
    ]);
    // zero (horizontal) and negative (adverse) slopes are valid channels
    expect(() => validateModel(edit((m) => (m.reaches[1]!.slope = -0.002)), 'model.json')).not.toThrow();
  });

  it('validateModel(json) refuses a stage at or below the bed and a depth above a conduit crown', () => {
    // bed at the downstream end is 48.0; upstream it is 48.0 + 0.001·400 + 0.015·90 = 49.75
    expect(lines(edit((m) => (m.boundaries.downstream = { type: 'stage', elevation: 47.9 })))).toEqual([
      'boundaries.downstream.elevation: the stage 47.9 lies at or below the downstream bed elevation 48; a stage is a water-surface elevation',
    ]);
    expect(lines(edit((m) => ((m.boundaries as Record<string, unknown>).upstream = { type: 'stage', elevation: 49.7 })))).toEqual([
      'boundaries.upstream.elevation: the stage 49.7 lies at or below the upstream bed elevation 49.75; a stage is a water-surface elevation',
    ]);
    const pipe = edit((m) => {
      (m.sections as Record<string, unknown>).lined = { shape: 'circular', diameter: 0.9, n: 0.013 };
      (m.boundaries as Record<string, unknown>).downstream = { type: 'depth', depth: 1.2 };
    });
    expect(lines(pipe)).toEqual([
      "boundaries.downstream.depth: the depth 1.2 m lies above the conduit's crown at 0.9 m; a closed conduit holds at most its diameter",
    ]);
  });

  it('validateModel(json) reports problems of the schema and of the rules together', () => {
    const json = edit((m) => {
      m.flows[0]!.discharge = -1;
      m.reaches[1]!.section = 'nowhere';
    });
    expect(lines(json)).toEqual([
      'reaches[1].section: no section named "nowhere"; the sections defined are "lined"',
      'flows[0].discharge: expected a number greater than 0, got -1',
    ]);
  });

  it('validateModel(json) refuses anything but an object at the top, naming the file', () => {
    expect(lines([example()])).toEqual([
      'model.json: expected a JSON object holding the model (see schema/gvf-model.schema.json), got a list of 1',
    ]);
    expect(lines(null)[0]).toBe('model.json: expected a JSON object holding the model (see schema/gvf-model.schema.json), got null');
  });

  it('validateModel(json) quotes section names that are not identifiers in paths', () => {
    const json = edit((m) => {
      (m.sections as Record<string, unknown>)['main channel'] = { shape: 'rectangular', bottomWidth: 0, n: 0.03 };
    });
    expect(lines(json)).toEqual(['sections["main channel"].bottomWidth: expected a number greater than 0, got 0']);
  });
});

describe('validateModel(json) sectionChartsAt', () => {
  // the example's channel: reaches of 90 m and 400 m, so stations run from 0 to 490 m (README: stations run
  // from the upstream end of the first reach)
  const withStations = (list: unknown) => edit((m) => Object.assign(m, { sectionChartsAt: list }));

  it('validateModel(json) accepts chart stations on the channel, both ends included', () => {
    expect(validateModel(withStations([0, 45, 90, 490]), 'model.json').sectionChartsAt).toEqual([0, 45, 90, 490]);
  });

  it('validateModel(json) refuses a chart station on no reach, naming the channel’s stations', () => {
    expect(lines(withStations([120, 495.5, -3]))).toEqual([
      'sectionChartsAt[1]: station 495.5 m lies on no reach: a cross-section chart is drawn on the channel, between stations 0 and 490 m',
      'sectionChartsAt[2]: station -3 m lies on no reach: a cross-section chart is drawn on the channel, between stations 0 and 490 m',
    ]);
  });

  it('validateModel(json) refuses a station listed twice, an empty list and a non-number', () => {
    expect(lines(withStations([120, 300, 120]))).toEqual(['sectionChartsAt[2]: station 120 is listed twice (first at index 0); list each station once']);
    expect(lines(withStations([]))).toEqual(['sectionChartsAt: expected at least 1 entry, got 0']);
    expect(lines(withStations([120, '300']))).toEqual(['sectionChartsAt[1]: expected a number, got "300"']);
  });

  it('validateModel(json) in US units names stations in feet', () => {
    const json = withStations([600]) as Record<string, unknown>;
    json.units = 'US';
    expect(lines(json)).toEqual([
      'sectionChartsAt[0]: station 600 ft lies on no reach: a cross-section chart is drawn on the channel, between stations 0 and 490 ft',
    ]);
  });
});
