/**
 * A compound section read from a survey (main channel and floodplains with different n): conveyance by the
 * subsection method — the area divided by vertical lines at the changes of n, the lines carrying no wetted
 * perimeter, K = Σ (1/nᵢ)·Aᵢ·Rᵢ^(2/3) — and the energy coefficient α = Σ(Kᵢ³/Aᵢ²) / (K³/A²), as Chow 1959
 * §6-4 (compound sections) and §2-7 (α from subsection conveyances) give them (published formulas; section
 * numbers from memory). The hand calculation below follows those formulas step by step for an invented section.
 *
 * Then a gradual expansion and contraction: the eddy loss is C·|Δ(αV²/2g)|, with the contraction coefficient
 * where the velocity head rises downstream and the expansion coefficient where it falls (common practice for
 * gradual transitions, 0.1 and 0.3), and the energy equation balances at every step to the solver tolerance.
 */
import { describe, expect, it } from 'vitest';
import { SI } from '../../src/core/units.js';
import { conveyanceAndAlpha } from '../../src/hydraulics/hydraulicSection.js';
import { normalDepth } from '../../src/hydraulics/normalDepth.js';
import { readModelFile } from '../../src/input/model/parse.js';
import { pointState } from '../../src/profile/energy.js';
import type { SurveyedReachInput } from '../../src/profile/types.js';
import { runModel } from '../../src/run.js';
import { assertInDelta, assertRelative } from '../helpers/assert.js';
import { modelFolder } from './folder.js';

// main channel 10 m wide at the top and 2 m deep, banks nearly vertical (0.01 m across), n 0.030, between
// floodplains 20 m wide (n 0.050) with walls at their outer edges. (The banks lean a little so that no vertical
// wall stands exactly on a change of n: which side such a wall belongs to is the geometry's convention.)
const compound = [
  'section,offset,elevation,n',
  'C,-25,4,0.05',
  'C,-25,2,',
  'C,-5,2,0.03',
  'C,-4.99,0,',
  'C,4.99,0,',
  'C,5,2,0.05',
  'C,25,2,',
  'C,25,4,',
].join('\n');

const upper = compound
  .split('\n')
  .slice(1)
  .map((row) => {
    const [, x, z, n] = row.split(',');
    return `U,${x},${Number(z) + 0.2},${n}`;
  })
  .join('\n');

function compoundRun(discharge: number) {
  const folder = modelFolder(
    {
      units: 'SI',
      sections: {},
      reaches: [{ id: 'r', survey: { stations: 'st.csv', crossSections: 'xs.csv', stationing: 'increasing-downstream' } }],
      flows: [{ id: 'q', discharge }],
      boundaries: { downstream: { type: 'normal' } },
    },
    // the same section surveyed twice, 0.2 m apart in elevation
    { 'st.csv': 'station,bed,section\n0,0.2,U\n200,0,C\n', 'xs.csv': `${compound}\n${upper}` },
  );
  return runModel(readModelFile(folder.model), { modelFile: folder.model, interpolate: false });
}

describe('a compound surveyed section', () => {
  it('normalDepth and α of a main channel with floodplains equal the subsection hand calculation (Chow 1959 §6-4)', () => {
    const S = 0.001;
    const y = 3; // 1 m over the floodplains
    // hand calculation, subsection by subsection
    const bank = Math.hypot(0.01, 2);
    const Am = ((9.98 + 10) / 2) * 2 + 10 * (y - 2); // main channel: the trapezoid below floodplain level and the strip above
    const Pm = 9.98 + 2 * bank; // bed and the two banks up to floodplain level; the dividing lines above carry none
    const Af = 20 * (y - 2); // each floodplain: 20 m²
    const Pf = 20 + (y - 2); // floodplain bed and its outer wall
    const Km = (1 / 0.03) * Am * (Am / Pm) ** (2 / 3);
    const Kf = (1 / 0.05) * Af * (Af / Pf) ** (2 / 3);
    const K = Km + 2 * Kf;
    const A = Am + 2 * Af;
    const alpha = (Km ** 3 / Am ** 2 + (2 * Kf ** 3) / Af ** 2) / (K ** 3 / A ** 2);
    const Q = K * Math.sqrt(S);

    const run = compoundRun(Q);
    const hs = (run.stages.inputs[0]!.reaches[0] as SurveyedReachInput).nodes[0]!.section;
    const computed = conveyanceAndAlpha(hs, y, Q);
    assertRelative(computed.conveyance, K, 1e-12, 'conveyance');
    assertRelative(computed.alpha, alpha, 1e-12, 'α');
    expect(alpha).toBeGreaterThan(1.2); // the slow floodplains make α well above 1 (here about 1.5)
    assertInDelta(normalDepth(hs, Q, S)!, y, 1e-9, 'normal depth');
    // the surveyed reach falls 0.2 m in 200 m (S = 0.001): the downstream normal-depth control gives the same depth
    assertInDelta(run.result.flows[0]!.stations.at(-1)!.depth, y, 1e-6, 'normal depth at the downstream control');
  });
});

describe('a gradual expansion and contraction in a survey', () => {
  // an invented transition: a 4 m trapezoidal bed widening to 8 m over 60 m, then narrowing back over 60 m
  const width = (x: number) => (x <= 40 ? 4 : x <= 100 ? 4 + (4 * (x - 40)) / 60 : x <= 160 ? 8 - (4 * (x - 100)) / 60 : 4);
  const stationsAt = Array.from({ length: 21 }, (_, i) => i * 10);
  const xsRows = ['section,offset,elevation,n'];
  const stRows = ['station,bed,section'];
  for (const x of stationsAt) {
    const b = width(x);
    const bed = 20 + 0.0008 * (200 - x);
    const id = `T${x}`;
    xsRows.push(`${id},0,${bed + 3},0.025`, `${id},${4.5},${bed}`, `${id},${4.5 + b},${bed}`, `${id},${9 + b},${bed + 3}`);
    stRows.push(`${x},${bed},${id}`);
  }
  const folder = modelFolder(
    {
      units: 'SI',
      sections: {},
      reaches: [{ id: 't', survey: { stations: 'st.csv', crossSections: 'xs.csv', stationing: 'increasing-downstream' } }],
      flows: [{ id: 'q', discharge: 10 }],
      boundaries: { downstream: { type: 'depth', depth: 1.4 } },
    },
    { 'st.csv': stRows.join('\n'), 'xs.csv': xsRows.join('\n') },
  );

  it('computeChannelFlow: eddy losses follow C·|Δ(αV²/2g)| and every step balances the energy equation to the solver tolerance', () => {
    const run = runModel(readModelFile(folder.model), { modelFile: folder.model });
    const flow = run.result.flows[0]!;
    const nodes = (run.stages.inputs[0]!.reaches[0] as SurveyedReachInput).nodes;
    expect(flow.warnings).toEqual([]);
    expect(flow.stations).toHaveLength(nodes.length);
    let expansions = 0;
    let contractions = 0;
    for (let i = 0; i + 1 < nodes.length; i++) {
      const a = nodes[i]!;
      const b = nodes[i + 1]!;
      const up = pointState(a.section, flow.stations[i]!.depth, 10);
      const down = pointState(b.section, flow.stations[i + 1]!.depth, 10);
      const L = b.station - a.station;
      // average conveyance, the default friction-slope mean (Chow 1959 §10-3)
      const hf = (10 / ((up.conveyance + down.conveyance) / 2)) ** 2 * L;
      const dh = down.velocityHead - up.velocityHead;
      const he = dh > 0 ? 0.1 * dh : 0.3 * -dh;
      if (dh > 0) contractions++;
      else expansions++;
      const residual = a.bedElevation + up.energy - (b.bedElevation + down.energy) - hf - he;
      // Brent's depth tolerance is 1e-5 of the 1 mm goal; the energy residual follows it (dE/dy is of order 1)
      expect(Math.abs(residual), `step ${i} (stations ${a.station}–${b.station})`).toBeLessThan(1e-7);
    }
    // the widening slows the flow (expansion losses) and the narrowing speeds it up (contraction losses)
    expect(expansions).toBeGreaterThan(3);
    expect(contractions).toBeGreaterThan(3);
    // the stations file gave no coefficients: the usual 0.1 and 0.3 were used
    expect(nodes[0]!.contraction).toBe(0.1);
    expect(nodes[0]!.expansion).toBe(0.3);
  });
});
