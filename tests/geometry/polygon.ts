/**
 * Independent geometry for the tests (not used by src/): the wetted polygons of a ground line cut by a level
 * water surface, their area by the shoelace formula, and areas and first moments by integrating the top
 * width numerically over the depth (Gauss–Legendre, 5 points, composite).
 */

export type Point = readonly [number, number];

/** Shoelace (Gauss's area formula): |Σ (xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ)| / 2 of a closed polygon. */
export function shoelaceArea(polygon: readonly Point[]): number {
  let twice = 0;
  for (let i = 0; i < polygon.length; i++) {
    const [x0, y0] = polygon[i]!;
    const [x1, y1] = polygon[(i + 1) % polygon.length]!;
    twice += x0 * y1 - x1 * y0;
  }
  return Math.abs(twice) / 2;
}

/**
 * The wet pockets of a ground line (left to right) under a level surface at elevation `level`: each pocket is a
 * closed polygon (ground below the surface, closed along the surface), with its wetted ground length.
 */
export function wetPockets(ground: readonly Point[], level: number): { polygon: Point[]; perimeter: number }[] {
  const pockets: { polygon: Point[]; perimeter: number }[] = [];
  let current: Point[] | null = null;
  let perimeter = 0;
  for (let i = 0; i + 1 < ground.length; i++) {
    const [x0, z0] = ground[i]!;
    const [x1, z1] = ground[i + 1]!;
    const wet0 = z0 < level;
    const wet1 = z1 < level;
    const cross = (): Point => [x0 + ((x1 - x0) * (level - z0)) / (z1 - z0), level];
    if (wet0 && wet1) {
      if (current === null) current = [[x0, z0]];
      current.push([x1, z1]);
      perimeter += Math.hypot(x1 - x0, z1 - z0);
    } else if (!wet0 && wet1) {
      const c = cross();
      current = [c, [x1, z1]];
      perimeter = Math.hypot(x1 - c[0], z1 - c[1]);
    } else if (wet0 && !wet1) {
      const c = cross();
      if (current === null) current = [[x0, z0]];
      current.push(c);
      perimeter += Math.hypot(c[0] - x0, c[1] - z0);
      pockets.push({ polygon: current, perimeter });
      current = null;
      perimeter = 0;
    }
  }
  // a line that ends under water (a piece clipped at a zone boundary): its wetted length counts; its polygon is
  // closed along the surface only when the line ends above the water
  if (current !== null) pockets.push({ polygon: current, perimeter });
  return pockets;
}

/** The top width at elevation η: the total length of the horizontal line at η that lies above the ground. */
export function widthAt(ground: readonly Point[], eta: number): number {
  let w = 0;
  for (let i = 0; i + 1 < ground.length; i++) {
    const [x0, z0] = ground[i]!;
    const [x1, z1] = ground[i + 1]!;
    if (x1 === x0) continue;
    const lo = Math.min(z0, z1);
    const hi = Math.max(z0, z1);
    if (eta <= lo) continue;
    if (eta >= hi) w += x1 - x0;
    else w += ((x1 - x0) * (eta - lo)) / (hi - lo);
  }
  return w;
}

const gaussNodes = [0, -0.5384693101056831, 0.5384693101056831, -0.906179845938664, 0.906179845938664];
const gaussWeights = [0.5688888888888889, 0.47862867049936647, 0.47862867049936647, 0.23692688505618908, 0.23692688505618908];

/** ∫ f over [a, b], composite 5-point Gauss–Legendre on `pieces` equal parts (exact for polynomials of degree ≤ 9 per part). */
export function integrate(f: (x: number) => number, a: number, b: number, pieces = 64): number {
  const h = (b - a) / pieces;
  let sum = 0;
  for (let k = 0; k < pieces; k++) {
    const mid = a + (k + 0.5) * h;
    for (let i = 0; i < gaussNodes.length; i++) sum += gaussWeights[i]! * f(mid + (gaussNodes[i]! * h) / 2);
  }
  return (sum * h) / 2;
}

/**
 * Area and first moment about the surface (at height y above the invert) by integrating the width w(η):
 * A = ∫₀ʸ w dη, A·ȳ = ∫₀ʸ w·(y − η) dη. `breaks` are heights where w has a kink (integrated piece by piece).
 */
export function integrateWidth(width: (eta: number) => number, y: number, breaks: readonly number[] = [], pieces = 64): { area: number; firstMoment: number } {
  const cuts = [0, ...breaks.filter((b) => b > 0 && b < y).sort((p, q) => p - q), y];
  let area = 0;
  let firstMoment = 0;
  for (let i = 0; i + 1 < cuts.length; i++) {
    area += integrate(width, cuts[i]!, cuts[i + 1]!, pieces);
    firstMoment += integrate((eta) => width(eta) * (y - eta), cuts[i]!, cuts[i + 1]!, pieces);
  }
  return { area, firstMoment };
}
