/** Linear interpolation in a coefficient table (x ascending), clamped to its ends only by the caller's range check. */
export function interpolate(xs: readonly number[], ys: readonly number[], x: number): number {
  const n = xs.length;
  if (n === 0) return NaN;
  if (x <= xs[0]!) return ys[0]!;
  if (x >= xs[n - 1]!) return ys[n - 1]!;
  let i = 1;
  while (i < n - 1 && xs[i]! < x) i++;
  const x0 = xs[i - 1]!;
  const x1 = xs[i]!;
  const t = (x - x0) / (x1 - x0);
  return ys[i - 1]! + t * (ys[i]! - ys[i - 1]!);
}
