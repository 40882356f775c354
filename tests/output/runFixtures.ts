/**
 * INVENTED runs for the report-assembly tests: a steep rectangular chute onto a mild lined channel with a
 * jump on the chute (the invented demo channel of samples/demo-channel.json, kept here so the tests do not
 * change when the sample does). Computed by gvf's own engine; nothing here is a real place.
 */
import { parseModelText } from '../../src/input/model/parse.js';
import { type ModelRun, runModel } from '../../src/run.js';

export function chuteModelText(overrides: Record<string, unknown> = {}): string {
  return JSON.stringify({
    title: 'Invented chute onto a mild channel',
    units: 'SI',
    sections: {
      chute: { shape: 'rectangular', bottomWidth: 3, n: 0.014 },
      channel: { shape: 'rectangular', bottomWidth: 3, n: 0.016 },
    },
    reaches: [
      { id: 'chute', section: 'chute', length: 80, slope: 0.025 },
      { id: 'channel', section: 'channel', length: 320, slope: 0.0008 },
    ],
    downstreamBedElevation: 100,
    flows: [
      { id: '2-year', discharge: 6 },
      { id: '25-year', discharge: 11 },
    ],
    boundaries: { upstream: { type: 'critical' }, downstream: { type: 'normal' } },
    outputSpacing: 10,
    ...overrides,
  });
}

export function chuteRun(overrides: Record<string, unknown> = {}): ModelRun {
  return runModel(parseModelText(chuteModelText(overrides), 'invented.json'));
}

/** The run with an invented culvert result added at station 400 (as the structures layer reports one). */
export function chuteRunWithStructure(): ModelRun {
  const run = chuteRun();
  for (const flow of run.result.flows) {
    flow.structures = [{ id: 'C<1>', type: 'culvert', station: 400, values: { headwaterStage: 102.1, controllingCase: 'inlet' }, notes: ['invented result'] }];
  }
  return run;
}
