import { describe, expect, it } from 'vitest';
import { SI, US } from '../../../src/core/units.js';
import { barrel, barrelConveyance, barrelCriticalDepth, barrelCriticalHead, barrelNormalDepth } from '../../../src/structures/culvert/barrel.js';
import { assertInDelta, assertRelative } from '../../helpers/assert.js';

/** Segment by central angle θ (Chow 1959 Table 2-1): A = D²(θ − sin θ)/8, T = D·sin(θ/2). Independent of the code. */
function segmentAtAngle(d: number, theta: number) {
  return { depth: (d / 2) * (1 - Math.cos(theta / 2)), area: (d * d * (theta - Math.sin(theta))) / 8, top: d * Math.sin(theta / 2) };
}

describe('culvert barrel', () => {
  it('barrelCriticalDepth(box) is (q²/g)^(1/3)', () => {
    // exact for a rectangle (Chow 1959 §3-2)
    const b = barrel({ shape: 'box', span: 2, rise: 1.5 });
    assertRelative(barrelCriticalDepth(b, 3, SI), Math.cbrt(1.5 ** 2 / SI.g), 1e-14, 'dc');
    assertRelative(barrelCriticalHead(b, 0.5), 0.75, 1e-14, 'Hc = 1.5·dc');
  });

  it('barrelCriticalDepth(circular) meets the Froude condition Q²T = gA³ of the segment', () => {
    // pick θ, build the segment from the angle formulas, take Q that makes it critical, and recover the depth
    const d = 1.2;
    const s = segmentAtAngle(d, 2.4);
    const q = Math.sqrt((SI.g * s.area ** 3) / s.top);
    assertRelative(barrelCriticalDepth(barrel({ shape: 'circular', diameter: d }), q, SI), s.depth, 1e-9, 'dc');
  });

  it('barrelNormalDepth(circular) at half the full-flow discharge is half the diameter', () => {
    // part-full circle, constant n: Q/Qfull = 0.5 at y/D = 0.5 (computed from the segment geometry)
    const b = barrel({ shape: 'circular', diameter: 1.5 });
    const qFull = barrelConveyance(b, 1.5, 0.013, SI) * Math.sqrt(0.01);
    assertRelative(barrelNormalDepth(b, 0.5 * qFull, 0.01, 0.013, SI) ?? NaN, 0.75, 1e-8, 'yn');
  });

  it('barrelNormalDepth(circular) at full-flow discharge is the lower root y/D = 0.8196', () => {
    // Q equals Qfull again at y/D = 0.8196 (computed from the segment geometry, ASCE MOP 37 chart)
    const b = barrel({ shape: 'circular', diameter: 1 });
    const qFull = barrelConveyance(b, 1, 0.013, US) * Math.sqrt(0.004);
    assertInDelta(barrelNormalDepth(b, qFull, 0.004, 0.013, US) ?? NaN, 0.8196, 1e-4, 'yn/D');
  });

  it('barrelNormalDepth(circular) is null above the part-full maximum 1.0757·Qfull and on a flat barrel', () => {
    // Qmax/Qfull = 1.0757 at y/D = 0.9382 (computed from the segment geometry)
    const b = barrel({ shape: 'circular', diameter: 1 });
    const qFull = barrelConveyance(b, 1, 0.013, SI) * Math.sqrt(0.004);
    expect(barrelNormalDepth(b, 1.07 * qFull, 0.004, 0.013, SI)).not.toBeNull();
    expect(barrelNormalDepth(b, 1.08 * qFull, 0.004, 0.013, SI)).toBeNull();
    expect(barrelNormalDepth(b, 0.5 * qFull, 0, 0.013, SI)).toBeNull();
  });
});
