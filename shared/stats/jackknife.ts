/**
 * Leave-one-out (jackknife) values, for BCa acceleration and jackknife standard errors
 * (B. Efron and R. J. Tibshirani (1993), An Introduction to the Bootstrap, ch. 11 and 14.3).
 * jackknifeSe = sqrt((n − 1)/n · Σ (θ(−i) − θ̄(·))²).
 */
import { jStat } from 'jstat';
import type { Interval } from './confidence-interval';

/** Definition-6 quantile of sorted without element `skip` (O(1)); see quantile.ts. */
export function quantileSortedSkipping(sorted: Float64Array, skip: number, p: number): number {
  const m = sorted.length - 1;
  const at = (rank: number): number => sorted[rank - 1 < skip ? rank - 1 : rank];
  const rank = p * (m + 1);
  if (rank <= 1) return at(1);
  if (rank >= m) return at(m);
  const lower = Math.floor(rank);
  const fraction = rank - lower;
  return fraction === 0 ? at(lower) : at(lower) + fraction * (at(lower + 1) - at(lower));
}

/** Jackknife of the definition-6 quantile (the median for p = 0.5) of sorted data, O(n). */
export function jackknifeQuantileSorted(sorted: Float64Array, p: number): Float64Array {
  const out = new Float64Array(sorted.length);
  for (let i = 0; i < sorted.length; i++) out[i] = quantileSortedSkipping(sorted, i, p);
  return out;
}

/** Jackknife of the mean and of the SD (n − 1), in closed form from the sums, O(n). */
export function jackknifeMoments(values: ArrayLike<number>): { mean: Float64Array; sd: Float64Array } {
  const n = values.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i];
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - m) ** 2;
  const mean = new Float64Array(n);
  const sd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const d = values[i] - m;
    mean[i] = m - d / (n - 1);
    sd[i] = Math.sqrt(Math.max(0, ss - (d * d * n) / (n - 1)) / (n - 2));
  }
  return { mean, sd };
}

/** Jackknife of any statistic of a sample (O(n²) work; one reused buffer). */
export function jackknifeStatistic(values: ArrayLike<number>, statistic: (sample: Float64Array) => number): Float64Array {
  const n = values.length;
  const buffer = new Float64Array(n - 1);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0, w = 0; j < n; j++) if (j !== i) buffer[w++] = values[j];
    out[i] = statistic(buffer);
  }
  return out;
}

export function jackknifeSe(jackknife: ArrayLike<number>): number {
  const n = jackknife.length;
  let m = 0;
  for (let i = 0; i < n; i++) m += jackknife[i];
  m /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (jackknife[i] - m) ** 2;
  return Math.sqrt(((n - 1) / n) * ss);
}

/** estimate ± t(n − 1) · jackknife SE (the jackknife interval used for Deming regression, Linnet 1990). */
export function jackknifeInterval(estimate: number, jackknife: ArrayLike<number>, level: number): Interval {
  const t = jStat.studentt.inv((1 + level) / 2, jackknife.length - 1);
  const half = t * jackknifeSe(jackknife);
  return [estimate - half, estimate + half];
}
