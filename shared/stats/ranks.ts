/**
 * Mid-ranks (average ranks for ties), 1-based, and the tie groups' sizes.
 * Values are compared exactly: callers round to the reported precision first (precision.ts).
 */
export interface Ranking {
  ranks: Float64Array;
  tieSizes: number[];
}

export function midRanks(values: ArrayLike<number>): Ranking {
  const n = values.length;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a] - values[b]);
  const ranks = new Float64Array(n);
  const tieSizes: number[] = [];
  for (let start = 0; start < n; ) {
    let end = start + 1;
    while (end < n && values[order[end]] === values[order[start]]) end++;
    const rank = (start + 1 + end) / 2;
    for (let k = start; k < end; k++) ranks[order[k]] = rank;
    if (end - start > 1) tieSizes.push(end - start);
    start = end;
  }
  return { ranks, tieSizes };
}
