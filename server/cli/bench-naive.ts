/**
 * Sort-per-resample versions of the benchmarked workloads, for `npm run bench` only: each draws the same
 * resamples from the same streams as the engine (Xor128.nextIndex, same seeds and parts) but materialises
 * every resample, sorts it and reads the statistic off the sorted copy. Two styles:
 * - 'plain': the straightforward JavaScript, a new array per resample sorted with (a, b) => a - b;
 * - 'typed': one reused Float64Array sorted with the native numeric typed-array sort (a strong baseline).
 */
export type SortStyle = 'plain' | 'typed';
let style: SortStyle = 'plain';
export function useStyle(s: SortStyle): void {
  style = s;
}
import { percentileInterval } from '@shared/stats/confidence-interval';
import { medianSorted, quantileSorted, sortedCopy } from '@shared/stats/quantile';
import { streamFor, type Xor128 } from '@shared/stats/rng';
import { slopeTable } from '@shared/stats/slope-table';
import { median } from '@shared/stats';

function eachSortedResample(data: Float64Array, B: number, stream: Xor128, visit: (sorted: Float64Array, b: number) => void): void {
  const n = data.length;
  const buffer = new Float64Array(n);
  for (let b = 0; b < B; b++) {
    if (style === 'typed') {
      for (let j = 0; j < n; j++) buffer[j] = data[stream.nextIndex(n)];
      visit(buffer.sort(), b);
    } else {
      const sample: number[] = new Array(n);
      for (let j = 0; j < n; j++) sample[j] = data[stream.nextIndex(n)];
      visit(sample.sort((p, q) => p - q) as unknown as Float64Array, b);
    }
  }
}

export function naiveMedianCi(values: Float64Array, B: number, seed: string): [number, number] {
  const reps = new Float64Array(B);
  eachSortedResample(sortedCopy(values), B, streamFor(seed, 'differences'), (s, b) => (reps[b] = medianSorted(s)));
  return percentileInterval(reps.sort(), 0.95);
}

export function naiveMedianTest(values: Float64Array, B: number, seed: string): number {
  const sorted = sortedCopy(values);
  const t = medianSorted(sorted);
  const shifted = sorted.map((v) => v - t);
  let extreme = 0;
  eachSortedResample(shifted, B, streamFor(seed, 'null-median'), (s) => { if (Math.abs(medianSorted(s)) >= Math.abs(t)) extreme++; });
  return (extreme + 1) / (B + 1);
}

export function naiveIntervalCi(values: Float64Array, B: number, seed: string): [number, number][] {
  const lower = new Float64Array(B);
  const upper = new Float64Array(B);
  eachSortedResample(sortedCopy(values), B, streamFor(seed, 'interval'), (s, b) => {
    lower[b] = quantileSorted(s, 0.025);
    upper[b] = quantileSorted(s, 0.975);
  });
  return [percentileInterval(lower.sort(), 0.9), percentileInterval(upper.sort(), 0.9)];
}

/** The one-sample parts of a comparison: median, mean, SD and limits from sorted resamples, and both tests. */
export function naiveDifferenceParts(d: Float64Array, B: number, seed: string): void {
  const reps = [0, 1, 2, 3, 4].map(() => new Float64Array(B));
  eachSortedResample(sortedCopy(d), B, streamFor(seed, 'differences'), (s, b) => {
    let sum = 0;
    let ss = 0;
    for (const v of s) sum += v;
    const m = sum / s.length;
    for (const v of s) ss += (v - m) ** 2;
    const sd = Math.sqrt(ss / (s.length - 1));
    reps[0][b] = medianSorted(s); reps[1][b] = m; reps[2][b] = sd; reps[3][b] = m - 1.96 * sd; reps[4][b] = m + 1.96 * sd;
  });
  for (const r of reps) percentileInterval(r.sort(), 0.95);
  naiveMedianTest(d, B, seed);
  const m = d.reduce((a, v) => a + v, 0) / d.length;
  eachSortedResample(sortedCopy(d).map((v) => v - m), B, streamFor(seed, 'null-mean'), () => undefined);
}

/** Passing–Bablok by recomputing and sorting the resample's pairwise slopes, for `resamples` resamples. */
export function naivePassingBablokBootstrap(x: Float64Array, y: Float64Array, resamples: number, seed: string): void {
  const n = x.length;
  const stream = streamFor(seed, 'regression');
  const rx = new Float64Array(n);
  const ry = new Float64Array(n);
  for (let b = 0; b < resamples; b++) {
    for (let j = 0; j < n; j++) { const k = stream.nextIndex(n); rx[j] = x[k]; ry[j] = y[k]; }
    const table = slopeTable(rx, ry);
    const N = table.slopes.length;
    const K = table.belowMinusOne;
    const slope = N % 2 ? table.slopes[(N + 1) / 2 + K - 1] : (table.slopes[N / 2 + K - 1] + table.slopes[N / 2 + K]) / 2;
    median(ry.map((v, i) => v - slope * rx[i]));
  }
}
