/**
 * Weighted first and second moments of pairs, the sufficient statistics of Deming and least-squares
 * regression. Weights are per row: bootstrap counts, 0/1 for the jackknife, or the weights of weighted
 * Deming. Centred sums are accumulated around a fixed centre first (two passes), which keeps them
 * accurate when the values are large relative to their spread.
 */
export interface PairSums {
  weight: number;
  meanX: number;
  meanY: number;
  sxx: number;
  syy: number;
  sxy: number;
}

export function pairSums(x: ArrayLike<number>, y: ArrayLike<number>, weights: ArrayLike<number> | null): PairSums {
  const n = x.length;
  let weight = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i] : 1;
    if (w === 0) continue;
    weight += w;
    sx += w * x[i];
    sy += w * y[i];
  }
  const meanX = sx / weight;
  const meanY = sy / weight;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i] : 1;
    if (w === 0) continue;
    const dx = x[i] - meanX;
    const dy = y[i] - meanY;
    sxx += w * dx * dx;
    syy += w * dy * dy;
    sxy += w * dx * dy;
  }
  return { weight, meanX, meanY, sxx, syy, sxy };
}
