import { describe, expect, it } from 'vitest';
import { structureCaution, structureCautions } from '../../src/structures/cautions.js';

describe('cautions', () => {
  it('structureCaution says screening aid, licensed engineer, local codes and agency criteria', () => {
    // the required content of the caution
    expect(structureCaution).toMatch(/screening aid/i);
    expect(structureCaution).toMatch(/licensed engineer/);
    expect(structureCaution).toMatch(/local codes and agency criteria/);
    expect(structureCautions()).toEqual([structureCaution]);
  });
});
