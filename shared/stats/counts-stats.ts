/**
 * Statistics of a bootstrap resample held as counts over the sorted data: counts[k] copies of sorted[k].
 * Order statistics are read off the running count (from the low end for low ranks, from the high end
 * for high ranks), so no resample is ever sorted or selected. The quantile is Hyndman & Fan definition 6
 * (rank p(n + 1), as in quantile.ts) and gives the same value as quantileSorted on the expanded resample.
 */

/** The value at 1-based rank r of the resample (1 <= r <= total of counts). */
export function orderStatisticFromCounts(sorted: Float64Array, counts: Int32Array, n: number, rank: number): number {
  if (rank <= n / 2) {
    let seen = 0;
    for (let k = 0; k < n; k++) {
      seen += counts[k];
      if (seen >= rank) return sorted[k];
    }
    return sorted[n - 1];
  }
  let fromTop = n - rank + 1;
  for (let k = n - 1; k >= 0; k--) {
    fromTop -= counts[k];
    if (fromTop <= 0) return sorted[k];
  }
  return sorted[0];
}

/** Definition-6 quantile of a resample of size n given as counts. */
export function quantileFromCounts(sorted: Float64Array, counts: Int32Array, n: number, p: number): number {
  const rank = p * (n + 1);
  if (rank <= 1) return orderStatisticFromCounts(sorted, counts, n, 1);
  if (rank >= n) return orderStatisticFromCounts(sorted, counts, n, n);
  const lowerRank = Math.floor(rank);
  const fraction = rank - lowerRank;
  const below = orderStatisticFromCounts(sorted, counts, n, lowerRank);
  if (fraction === 0) return below;
  return below + fraction * (orderStatisticFromCounts(sorted, counts, n, lowerRank + 1) - below);
}

/**
 * The 0-based position of the value at 1-based rank `rank` (1 <= rank <= total of counts), walking from
 * position `split` when below = counts[0] + … + counts[split − 1] is known (0 <= split <= n): down when the
 * rank lies below split, up otherwise. The same position as a walk from the low end, in as many steps as the
 * rank's position is away from split.
 */
export function positionOfRank(counts: Int32Array, split: number, below: number, rank: number): number {
  let k = split;
  let seen = below;
  if (seen >= rank) {
    do {
      k--;
      seen -= counts[k];
    } while (seen >= rank);
    return k;
  }
  while ((seen += counts[k]) < rank) k++;
  return k;
}

export function medianFromCounts(sorted: Float64Array, counts: Int32Array, n: number): number {
  const half = n >> 1;
  if (n % 2 === 1) return orderStatisticFromCounts(sorted, counts, n, half + 1);
  let seen = 0;
  for (let k = 0; k < n; k++) {
    seen += counts[k];
    if (seen >= half) {
      const lower = sorted[k];
      if (seen > half) return lower;
      let next = k + 1;
      while (counts[next] === 0) next++;
      return (lower + sorted[next]) / 2;
    }
  }
  return sorted[n - 1];
}

/** Mean and SD (n − 1) of the resample; values are centred on `centre` first to keep the rounding small. */
export function momentsFromCounts(
  sorted: Float64Array, counts: Int32Array, n: number, centre: number, out: Float64Array,
): void {
  let sum = 0;
  let sumSquares = 0;
  for (let k = 0; k < n; k++) {
    const c = counts[k];
    if (c === 0) continue;
    const v = sorted[k] - centre;
    sum += c * v;
    sumSquares += c * v * v;
  }
  const meanShift = sum / n;
  out[0] = centre + meanShift;
  out[1] = n > 1 ? Math.sqrt(Math.max(0, (sumSquares - sum * meanShift) / (n - 1))) : NaN;
}
