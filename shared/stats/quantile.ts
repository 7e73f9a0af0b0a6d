/**
 * Sample quantile by linear interpolation between order statistics at the rank r = p(n + 1)
 * (Hyndman & Fan definition 6; the rank used for reference limits in CLSI EP28-A3c practice).
 * Source: R. J. Hyndman and Y. Fan (1996), "Sample quantiles in statistical packages",
 * The American Statistician 50(4), 361–365.
 * Ranks below 1 or above n are clamped to the extreme order statistic; rankInRange tells callers
 * (reference limits) when that happened, because such a limit is not estimable from the sample.
 * @param sorted ascending sample, at least one value; not modified
 * @throws RangeError if sorted is empty or p is outside [0, 1]
 */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new RangeError('quantileSorted requires at least one value');
  if (!(p >= 0 && p <= 1)) throw new RangeError('quantileSorted requires p in [0, 1]');
  const rank = p * (n + 1);
  if (rank <= 1) return sorted[0];
  if (rank >= n) return sorted[n - 1];
  const lowerRank = Math.floor(rank);
  const fraction = rank - lowerRank;
  const below = sorted[lowerRank - 1];
  return fraction === 0 ? below : below + fraction * (sorted[lowerRank] - below);
}

/** Whether the rank p(n + 1) lies within 1..n, so that quantileSorted interpolates rather than clamps. */
export function rankInRange(n: number, p: number): boolean {
  const rank = p * (n + 1);
  return rank >= 1 && rank <= n;
}

/** The median: the middle order statistic, or the mean of the two middle ones. */
export function medianSorted(sorted: ArrayLike<number>): number {
  const n = sorted.length;
  if (n === 0) throw new RangeError('medianSorted requires at least one value');
  const half = n >> 1;
  return n % 2 === 1 ? sorted[half] : (sorted[half - 1] + sorted[half]) / 2;
}

/** A sorted copy as a Float64Array (the input is left unchanged). */
export function sortedCopy(values: ArrayLike<number>): Float64Array {
  return Float64Array.from(values).sort();
}

export function median(values: ArrayLike<number>): number {
  return medianSorted(sortedCopy(values));
}
