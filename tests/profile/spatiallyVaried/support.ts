/**
 * Test-only sections and closed forms shared by the spatially varied flow tests.
 * `wideChannel` is a rectangle whose sides carry no friction (P = b): exactly the "wide channel" of
 * Bresse's solution (R = y), so closed forms hold without a width correction.
 */
import type { Section } from '../../../src/geometry/section.js';

export function wideChannel(width: number, roughness: number): Section {
  const elements = (y: number) => ({ area: width * y, wettedPerimeter: width, topWidth: width, firstMoment: (width * y * y) / 2 });
  return {
    shape: 'rectangular',
    closed: false,
    maxDepth: Infinity,
    lengthScale: width,
    compound: false,
    elements,
    subsections: (y: number) => {
      const e = elements(y);
      return [{ area: e.area, wettedPerimeter: e.wettedPerimeter, topWidth: e.topWidth, roughness }];
    },
    describe: () => ({ shape: 'wide test channel', width, roughness }),
  };
}

/**
 * Bresse (1860) for a wide rectangular channel with Chézy friction (Chow 1959 ch. 10; form from memory,
 * checked here by differentiation: dφ/du = 1/(1 − u³)):
 * x = (yn/S0)·{u − [1 − (yc/yn)³]·φ(u)} + const, u = y/yn.
 */
export function bresseDistance(y: number, yn: number, yc: number, slope: number): number {
  const u = y / yn;
  const phi = Math.log((u * u + u + 1) / ((u - 1) * (u - 1))) / 6 - Math.atan(Math.sqrt(3) / (2 * u + 1)) / Math.sqrt(3);
  return (yn / slope) * (u - (1 - (yc / yn) ** 3) * phi);
}

/** Composite Simpson's rule over equally spaced samples (an odd count). */
export function simpson(values: readonly number[], h: number): number {
  if (values.length % 2 === 0) throw new Error('simpson needs an odd number of samples');
  let sum = values[0]! + values[values.length - 1]!;
  for (let i = 1; i < values.length - 1; i++) sum += (i % 2 === 1 ? 4 : 2) * values[i]!;
  return (sum * h) / 3;
}
