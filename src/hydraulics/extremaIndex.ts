/**
 * Which samples of a curve v(y) = base(y) + q2·weight(y) are local extrema, for any q2, without scanning every sample.
 *
 * The scan's test between samples j and j+1 is whether the curve falls there: v[j+1] < v[j], i.e.
 *   q2·(weight[j] − weight[j+1]) > base[j+1] − base[j].
 * With base rising (depth for specific energy, Aȳ for specific force) that holds exactly when q2 exceeds the pair's
 * threshold t[j] = (base[j+1] − base[j]) / (weight[j] − weight[j+1]) (Infinity where the weight does not fall:
 * the curve rises there for every q2). For specific energy t[j] is the squared discharge at which the sampled
 * curve is flat between the two samples, the critical discharge² of that depth. A sample i is a minimum where
 * the curve falls on the pair below it and not on the pair above (q2 > t[i−1] and q2 ≤ t[i]), a maximum the other
 * way round: the extrema are where the sequence of thresholds crosses the level q2. Within a monotone run of
 * thresholds it crosses at most once, found by binary search, so a discharge costs one test per run plus a
 * binary search per extremum, where the scan costs one step per sample (400). The runs are found once per table.
 *
 * Where a weight is not finite (a dry sample) the index is not made and the caller scans.
 */

export interface ExtremaIndex {
  /** t[j] for each pair of consecutive samples (n − 1 values) */
  readonly thresholds: Float64Array;
  /** the first pair index of each monotone run of thresholds, then n − 2 (the last pair); runs share their end pairs */
  readonly runStarts: Int32Array;
  /** the thresholds at the run starts (t[runStarts[r]]), side by side so that testing the runs reads little memory */
  readonly runThresholds: Float64Array;
}

/** The index of the curve base + q2·weight over n samples; undefined where a weight is not finite or base does not rise. */
export function extremaIndex(base: ArrayLike<number>, weight: ArrayLike<number>): ExtremaIndex | undefined {
  const n = base.length;
  if (n < 3) return undefined;
  const thresholds = new Float64Array(n - 1);
  for (let j = 0; j < n - 1; j++) {
    const rise = base[j + 1]! - base[j]!;
    const fall = weight[j]! - weight[j + 1]!;
    if (!(rise > 0) || !Number.isFinite(fall)) return undefined;
    thresholds[j] = fall > 0 ? rise / fall : Infinity;
  }
  // monotone runs: a run ends where the thresholds turn (a strict rise after a strict fall, or the reverse)
  const starts: number[] = [0];
  let direction = 0;
  for (let j = 1; j < n - 1; j++) {
    const step = Math.sign(thresholds[j]! - thresholds[j - 1]!);
    if (Number.isNaN(step) || step === 0) continue; // equal (Infinity beside Infinity): part of either run
    if (direction !== 0 && step !== direction) starts.push(j - 1);
    direction = step;
  }
  starts.push(n - 2);
  const runStarts = Int32Array.from(starts);
  return { thresholds, runStarts, runThresholds: Float64Array.from(runStarts, (j) => thresholds[j]!) };
}

/**
 * Calls `visit(i, minimum)` for every sample i (1 … n − 2) that the scan would find an extremum of the curve at this
 * q2, ascending; returns whether the curve falls on the last pair (a minimum may lie above the samples).
 */
export function indexedExtrema(index: ExtremaIndex, q2: number, visit: (sample: number, minimum: boolean) => void): boolean {
  const t = index.thresholds;
  const starts = index.runStarts;
  const ends = index.runThresholds;
  let falls = q2 > ends[0]!;
  for (let r = 0; r + 1 < starts.length; r++) {
    const fallsAtEnd = q2 > ends[r + 1]!;
    if (falls === fallsAtEnd) continue; // no crossing in this run (it is monotone)
    const a = starts[r]!;
    const b = starts[r + 1]!;
    // the last pair j in [a, b) that has the first end's state; the crossing is between j and j + 1
    let lo = a;
    let hi = b - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (q2 > t[mid]! === falls) lo = mid;
      else hi = mid - 1;
    }
    // falling below sample lo + 1 and not above it: a minimum there; the other way round, a maximum
    visit(lo + 1, falls);
    falls = fallsAtEnd;
  }
  return falls;
}
