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
