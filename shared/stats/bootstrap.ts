import { medianFromCounts, positionOfRank } from './counts-stats';
import type { Xor128 } from './rng';

/** Limits on the number of resamples (the contract: default 10,000, allowed 1,000 to 200,000). */
export const DEFAULT_RESAMPLES = 10_000;
export const DEFAULT_REGRESSION_RESAMPLES = 2_000;
export const MIN_RESAMPLES = 1_000;
export const MAX_RESAMPLES = 200_000;

export type ProgressFn = (fraction: number) => void;

export interface ResampleSettings {
  resamples: number;
  stream: Xor128;
  onProgress?: ProgressFn;
}

/**
 * The nonparametric bootstrap loop (Efron (1979), Ann. Statist. 7(1), 1–26): for b = 0..B−1, one resample
 * of size n drawn with replacement, as counts over positions 0..n−1 of the array being resampled
 * (the sorted values for one-sample statistics, the rows in input order for pairs). Draw order: resample b
 * takes draws b·n .. b·n + n − 1 of the stream (rng.ts). One counts buffer is reused: memory does not grow
 * with B; the visitor stores whatever replicate it needs (one number per resample).
 */
export function forEachResample(
  n: number, settings: ResampleSettings, visit: (counts: Int32Array, b: number) => void,
): void {
  const counts = new Int32Array(n);
  const { resamples, stream, onProgress } = settings;
  const step = Math.max(1, Math.floor(resamples / 50));
  for (let b = 0; b < resamples; b++) {
    stream.fillCounts(counts, n);
    visit(counts, b);
    if (onProgress && (b + 1) % step === 0) onProgress((b + 1) / resamples);
  }
  onProgress?.(1);
}

/**
 * The median of every resample, as forEachResample with medianFromCounts gives it (the same draws, the same
 * values in the same order) but in one loop with no call through a visitor per resample, for the median CI
 * (differenceBias; `npm run bench`'s median-ci). For even n the draws are tallied by halves while they are
 * counted (Xor128.fillCountsUpperHalf), which gives counts[0] + … + counts[n/2 − 1], so the two middle order
 * statistics are found by walking from the middle (positionOfRank: about √n/2 steps) rather than from an end
 * (n/2 steps); for odd n no position boundary falls at u = 1/2 and medianFromCounts reads each resample.
 * `visit`, when given, is called after each median with the same counts (the caller's other statistics of the
 * same resamples). Replicates are written into `replicates` (length >= B). Memory: one Int32Array of n.
 */
export function medianReplicates(
  sorted: Float64Array, settings: ResampleSettings, replicates = new Float64Array(settings.resamples),
  visit?: (counts: Int32Array, b: number) => void,
): Float64Array {
  const n = sorted.length;
  if (n < 1) throw new RangeError('medianReplicates requires at least 1 value');
  const counts = new Int32Array(n);
  const { resamples, stream, onProgress } = settings;
  const step = Math.max(1, Math.floor(resamples / 50));
  const half = n >> 1;
  const even = n % 2 === 0;
  for (let b = 0; b < resamples; b++) {
    if (even) {
      const below = n - stream.fillCountsUpperHalf(counts, n);
      const lower = positionOfRank(counts, half, below, half);
      const upper = positionOfRank(counts, half, below, half + 1);
      replicates[b] = lower === upper ? sorted[lower] : (sorted[lower] + sorted[upper]) / 2;
    } else {
      stream.fillCounts(counts, n);
      replicates[b] = medianFromCounts(sorted, counts, n);
    }
    if (visit) visit(counts, b);
    if (onProgress && (b + 1) % step === 0) onProgress((b + 1) / resamples);
  }
  onProgress?.(1);
  return replicates;
}

/**
 * Resampling for any statistic of a sample: each resample is written in draw order into one reused
 * buffer (sample[j] = data[floor(u·n)]) and handed to the statistic. Slower than the counts path
 * but general; the statistic must not keep the buffer.
 */
export function bootstrapStatistic(
  data: ArrayLike<number>, statistic: (sample: Float64Array) => number, settings: ResampleSettings,
): Float64Array {
  const n = data.length;
  const sample = new Float64Array(n);
  const replicates = new Float64Array(settings.resamples);
  const step = Math.max(1, Math.floor(settings.resamples / 50));
  for (let b = 0; b < settings.resamples; b++) {
    for (let j = 0; j < n; j++) sample[j] = data[settings.stream.nextIndex(n)];
    replicates[b] = statistic(sample);
    if (settings.onProgress && (b + 1) % step === 0) settings.onProgress((b + 1) / settings.resamples);
  }
  return replicates;
}

/** Maps a part of the work onto [from, to] of the caller's progress scale. */
export function progressSpan(onProgress: ProgressFn | undefined, from: number, to: number): ProgressFn | undefined {
  return onProgress && ((fraction) => onProgress(from + (to - from) * fraction));
}

/** Bootstrap standard error: the SD (divisor B − 1) of the replicates. */
export function bootstrapSe(replicates: Float64Array): number {
  let sum = 0;
  for (let b = 0; b < replicates.length; b++) sum += replicates[b];
  const m = sum / replicates.length;
  let ss = 0;
  for (let b = 0; b < replicates.length; b++) ss += (replicates[b] - m) ** 2;
  return Math.sqrt(ss / (replicates.length - 1));
}
