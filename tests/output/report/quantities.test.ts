/** labelOf(key), unitOf(key, units): report words and units for named quantities (our own naming rules). */
import { describe, expect, it } from 'vitest';
import { labelOf, unitOf } from '../../../src/output/report/quantities.js';

describe('labelOf(key), unitOf(key, units)', () => {
  it('labelOf(key) turns camelCase into words and keeps short symbols', () => {
    expect(labelOf('headwaterStage')).toBe('Headwater stage');
    expect(labelOf('downstreamBedElevation')).toBe('Downstream bed elevation');
    expect(labelOf('K')).toBe('K');
    expect(labelOf('Ks')).toBe('Ks');
    expect(labelOf('n')).toBe("Manning's n");
  });

  it('unitOf(key, units) gives lengths, discharges and velocities their units and ratios none', () => {
    expect(unitOf('headwaterStage', 'SI')).toBe('m');
    expect(unitOf('barrelCriticalDepth', 'US')).toBe('ft');
    expect(unitOf('outletVelocity', 'SI')).toBe('m/s');
    expect(unitOf('discharge', 'US')).toBe('ft³/s');
    expect(unitOf('dischargePerBarrel', 'SI')).toBe('m³/s');
    expect(unitOf('dischargeIntensity', 'SI')).toBeUndefined();
    expect(unitOf('headwaterToRise', 'SI')).toBeUndefined();
    expect(unitOf('criticalHeadOverRise', 'SI')).toBeUndefined();
    expect(unitOf('entranceLossCoefficient', 'SI')).toBeUndefined();
    expect(unitOf('fullFlowHeadLoss', 'SI')).toBe('m');
    expect(unitOf('barrels', 'SI')).toBeUndefined();
  });
});
