import { describe, expect, it } from 'vitest';
import { froudeNumber } from '../../src/hydraulics/froude.js';
import { assertRelative } from '../helpers/assert.js';
import { pipe, rect, SI, trap } from './sections.js';

describe('froudeNumber', () => {
  it('froudeNumber(rectangular) is V/√(gy)', () => {
    // definition (Chow 1959, ch. 1 and 3); exact
    const b = 2, y = 0.5, q = 3;
    assertRelative(froudeNumber(rect(b), y, q), q / (b * y) / Math.sqrt(SI.g * y), 1e-14, 'F');
  });

  it('froudeNumber(trapezoidal) with α is V/√(gD/α), D = A/T', () => {
    const b = 3, z = 2, y = 1.1, q = 9, alpha = 1.2;
    const a = (b + z * y) * y;
    const t = b + 2 * z * y;
    assertRelative(froudeNumber(trap(b, z, 0.02, SI, alpha), y, q), q / a / Math.sqrt((SI.g * a) / t / alpha), 1e-14, 'F');
  });

  it('froudeNumber(circular) is 0 at the crown (T = 0: no free surface)', () => {
    expect(froudeNumber(pipe(1), 1, 0.5)).toBe(0);
  });
});
