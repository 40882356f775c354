import { describe, expect, it } from 'vitest';
import { HydraulicError } from '../../src/core/errors.js';
import { SI } from '../../src/core/units.js';
import { approachEnergy, approachStage } from '../../src/structures/approach.js';
import { assertInDelta } from '../helpers/assert.js';

describe('approach section', () => {
  const area = (stage: number) => 5 * (stage - 10); // rectangle 5 m wide, bed at 10
  it('approachStage() is the subcritical root of E = z + Q²/(2gA²)', () => {
    // energy equation (definition) and the subcritical branch above critical depth
    const s = approachStage(12, 11, 8, area, SI);
    assertInDelta(approachEnergy(s, 8, area, SI), 12, 1e-9, 'E');
    const yc = Math.cbrt((8 / 5) ** 2 / SI.g);
    expect(s - 10).toBeGreaterThan(yc);
  });

  it('approachStage() without a section is the energy grade itself', () => {
    expect(approachStage(12, 11, 8, undefined, SI)).toBe(12);
  });

  it('approachStage() refuses an energy grade too low to carry the flow subcritically above the crest', () => {
    expect(() => approachStage(10.5, 10.4, 40, area, SI)).toThrow(HydraulicError);
  });
});
