import { forEachResample, type ProgressFn, progressSpan } from './bootstrap';
import { summariseReplicates, type BootstrapEstimate, type IntervalMethod } from './bootstrap-estimate';
import { medianFromCounts, momentsFromCounts } from './counts-stats';
import { histogram, type Histogram } from './histogram';
import { jackknifeMoments, jackknifeQuantileSorted } from './jackknife';
import { mean, sampleSd } from './summation';
import { medianSorted, sortedCopy } from './quantile';
import { streamFor } from './rng';
import { shiftedNullTest, type ShiftedNullTest } from './shifted-null-test';

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
  mean: BootstrapEstimate & { pValue: number };
  median: BootstrapEstimate & { pValue: number };
  sd: BootstrapEstimate;
  lower: BootstrapEstimate;
  upper: BootstrapEstimate;
  medianTest: ShiftedNullTest;
  meanTest: ShiftedNullTest;
  distributions: { median: Histogram; mean: Histogram };
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
  forEachResample(n, { resamples: B, stream: streamFor(s.seed, 'differences'), onProgress: progressSpan(s.onProgress, 0, 0.5) }, (counts, b) => {
    reps.median[b] = medianFromCounts(sorted, counts, n);
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
  const medianTest = shiftedNullTest(sorted, medianFromCounts, 0, { resamples: B, stream: streamFor(s.seed, 'null-median'), onProgress: progressSpan(s.onProgress, 0.5, 0.75) });
  const meanTest = shiftedNullTest(sorted, meanFromCounts, 0, { resamples: B, stream: streamFor(s.seed, 'null-mean'), onProgress: progressSpan(s.onProgress, 0.75, 1) });
  return {
    median: { ...summarise(reps.median, medianSorted(sorted), bca ? jackknifeQuantileSorted(sorted, 0.5) : undefined), pValue: medianTest.pValue },
    mean: { ...summarise(reps.mean, m, jm?.mean), pValue: meanTest.pValue },
    sd: summarise(reps.sd, sd, jm?.sd),
    lower: summarise(reps.lower, m - k * sd, combine(-1)),
    upper: summarise(reps.upper, m + k * sd, combine(1)),
    medianTest, meanTest, distributions,
  };
}

/** The mean of a resample given as counts (a counts reader for shiftedNullTest). */
export function meanFromCounts(sorted: Float64Array, counts: Int32Array, n: number): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += counts[i] * sorted[i];
  return sum / n;
}
