import { medianReplicates, type ProgressFn, progressSpan } from './bootstrap';
import { bcaFallbackWarning, summariseReplicates, type BootstrapEstimate, type IntervalMethod } from './bootstrap-estimate';
import { medianFromCounts, momentsFromCounts } from './counts-stats';
import { histogram, type Histogram } from './histogram';
import { jackknifeMoments, jackknifeQuantileSorted } from './jackknife';
import { mean, sampleSd } from './summation';
import { medianSorted, sortedCopy } from './quantile';
import { streamFor } from './rng';
import { shiftedNullTest, testRefusal, type ShiftedNullTest } from './shifted-null-test';

/**
 * Bias and agreement from the paired differences d (differences.ts):
 * - mean and median bias, each with a bootstrap CI and the shifted-null bootstrap p-value against 0
 *   (shifted-null-test.ts; the median is the headline because clinical differences have outliers);
 * - SD of the differences and the limits of agreement mean ± k·SD (J. M. Bland and D. G. Altman (1986),
 *   Lancet 327(8476), 307–310; k = 1.96 by default, the paper used 2), each with a bootstrap CI.
 * All of mean, median, SD and both limits are read from the same resamples (stream 'differences'),
 * drawn as counts over the sorted differences; the two tests use the streams 'null-median', 'null-mean'.
 */
export interface DifferenceBias {
  mean: BootstrapEstimate & { pValue: number | null };
  median: BootstrapEstimate & { pValue: number | null };
  sd: BootstrapEstimate;
  lower: BootstrapEstimate;
  upper: BootstrapEstimate;
  /** Null when the test is refused (testRefusal in shifted-null-test.ts; the reason is in warnings). */
  medianTest: ShiftedNullTest | null;
  meanTest: ShiftedNullTest | null;
  distributions: { median: Histogram; mean: Histogram };
  warnings: string[];
}

export interface DifferenceBiasSettings {
  resamples: number;
  seed: string;
  level: number;
  interval: IntervalMethod;
  loaMultiplier: number;
  onProgress?: ProgressFn;
}

export function differenceBias(differences: Float64Array, s: DifferenceBiasSettings): DifferenceBias {
  const sorted = sortedCopy(differences);
  const n = sorted.length;
  if (n < 3) throw new RangeError('differenceBias requires at least 3 differences');
  const B = s.resamples;
  const k = s.loaMultiplier;
  const reps = { mean: new Float64Array(B), median: new Float64Array(B), sd: new Float64Array(B), lower: new Float64Array(B), upper: new Float64Array(B) };
  const moments = new Float64Array(2);
  const centre = sorted[n >> 1];
  medianReplicates(sorted, { resamples: B, stream: streamFor(s.seed, 'differences'), onProgress: progressSpan(s.onProgress, 0, 0.5) }, reps.median, (counts, b) => {
    momentsFromCounts(sorted, counts, n, centre, moments);
    reps.mean[b] = moments[0];
    reps.sd[b] = moments[1];
    reps.lower[b] = moments[0] - k * moments[1];
    reps.upper[b] = moments[0] + k * moments[1];
  });
  const m = mean(sorted);
  const sd = sampleSd(sorted);
  const bca = s.interval === 'bca';
  const jm = bca ? jackknifeMoments(sorted) : null;
  const combine = (sign: number): Float64Array | undefined => jm ? jm.mean.map((v, i) => v + sign * k * jm.sd[i]) : undefined;
  const summarise = (r: Float64Array, estimate: number, jack?: ArrayLike<number>): BootstrapEstimate =>
    summariseReplicates(r, estimate, s.level, s.interval, jack);
  const distributions = { median: histogram(reps.median), mean: histogram(reps.mean) };
  const warnings: string[] = [];
  const refusal = testRefusal(sorted, 'differences');
  if (refusal) warnings.push(refusal);
  const medianTest = refusal ? null : shiftedNullTest(sorted, medianFromCounts, 0, { resamples: B, stream: streamFor(s.seed, 'null-median'), onProgress: progressSpan(s.onProgress, 0.5, 0.75) });
  const meanTest = refusal ? null : shiftedNullTest(sorted, meanFromCounts, 0, { resamples: B, stream: streamFor(s.seed, 'null-mean'), onProgress: progressSpan(s.onProgress, 0.75, 1) });
  const estimates = {
    median: summarise(reps.median, medianSorted(sorted), bca ? jackknifeQuantileSorted(sorted, 0.5) : undefined),
    mean: summarise(reps.mean, m, jm?.mean),
    sd: summarise(reps.sd, sd, jm?.sd),
    lower: summarise(reps.lower, m - k * sd, combine(-1)),
    upper: summarise(reps.upper, m + k * sd, combine(1)),
  };
  const names = { median: 'the median bias', mean: 'the mean bias', sd: 'the SD of the differences', lower: 'the lower limit of agreement', upper: 'the upper limit of agreement' };
  const fallback = bcaFallbackWarning((Object.keys(estimates) as (keyof typeof estimates)[]).filter((key) => estimates[key].bcaFailed).map((key) => names[key]));
  if (fallback) warnings.push(fallback);
  return {
    median: { ...estimates.median, pValue: medianTest?.pValue ?? null },
    mean: { ...estimates.mean, pValue: meanTest?.pValue ?? null },
    sd: estimates.sd,
    lower: estimates.lower,
    upper: estimates.upper,
    medianTest, meanTest, distributions, warnings,
  };
}

/** The mean of a resample given as counts (a counts reader for shiftedNullTest). */
export function meanFromCounts(sorted: Float64Array, counts: Int32Array, n: number): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += counts[i] * sorted[i];
  return sum / n;
}
