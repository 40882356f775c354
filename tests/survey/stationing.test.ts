/** The user's stationing against the engine's: an affine map, and station numbers in messages rewritten with it. */
import { describe, expect, it } from 'vitest';
import { mapStationText, toEngineStation, toUserStation } from '../../src/survey/stationing.js';

const upstream = { direction: 'increasing-upstream', anchorUser: 400, anchorEngine: 0 } as const;

describe('stationing', () => {
  it('toUserStation and toEngineStation invert each other (stations increasing upstream from 400 at the top)', () => {
    expect(toUserStation(upstream, 0)).toBe(400);
    expect(toUserStation(upstream, 150)).toBe(250);
    expect(toEngineStation(upstream, 250)).toBe(150);
    expect(toUserStation({ direction: 'increasing-downstream', anchorUser: 1000, anchorEngine: 100 }, 150)).toBe(1050);
  });

  it('mapStationText rewrites "station x" and "stations a to b" / "a and b", and nothing else', () => {
    expect(mapStationText(upstream, 'runs into critical depth at station 59.5 (depth 0.61)')).toBe('runs into critical depth at station 340.5 (depth 0.61)');
    expect(mapStationText(upstream, "part of reach 'r' (stations 0 to 80): a control")).toBe("part of reach 'r' (stations 400 to 320): a control");
    expect(mapStationText(upstream, 'Between stations 10 and 20 of reach')).toBe('Between stations 390 and 380 of reach');
  });
});
