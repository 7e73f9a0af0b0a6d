import { forEachResample, type ResampleSettings } from './bootstrap';
import type { HistogramBin } from './histogram';

/**
 * Bootstrap test of a location statistic against a null value by shifting to the null
 * (P. Hall and S. R. Wilson (1991), "Two guidelines for bootstrap hypothesis testing", Biometrics 47,
 * 757–762): shift the data by (null − t) so the statistic of the shifted data equals the null, resample
 * the shifted data B times, and count
 *   upper = #{t* ≥ null + |t − null|},  lower = #{t* ≤ null − |t − null|}.
 * Reported: upperTail = (upper + 1)/(B + 1), lowerTail = (lower + 1)/(B + 1) and the two-sided
 * pValue = min(1, (upper + lower + 1)/(B + 1)), i.e. (1 + #{|t* − null| ≥ |t − null|})/(B + 1):
 * the tail counts are summed and the +1 correction applied once (so pValue ≤ upperTail + lowerTail).
 * A replicate within 1e-9 of the data's scale of a cutoff counts as reaching it, so that floating-point
 * noise from the shift does not move whole atoms of a discrete (median) distribution across a cutoff.
 */
export interface ShiftedNullTest {
  observed: number;
  nullValue: number;
  pValue: number;
  upperTail: number;
  lowerTail: number;
  upperCount: number;
  lowerCount: number;
  resamples: number;
  /** The shifted-null distribution as bins; tail bins lie wholly at or beyond a cutoff. */
  nullDistribution: { bins: (HistogramBin & { tail: 'lower' | 'upper' | null })[]; lowerCutoff: number; upperCutoff: number; observed: number };
}

/** A statistic read from a resample given as counts over the sorted (shifted) data. */
export type CountsStatistic = (sorted: Float64Array, counts: Int32Array, n: number) => number;

/**
 * @param sorted ascending data (not modified)
 * @param statistic the statistic as a counts reader; it must be shift-equivariant (mean, median, ...)
 * @throws RangeError if shifting does not bring the statistic to the null value
 */
export function shiftedNullTest(
  sorted: Float64Array, statistic: CountsStatistic, nullValue: number, settings: ResampleSettings,
): ShiftedNullTest {
  const n = sorted.length;
  const ones = new Int32Array(n).fill(1);
  const observed = statistic(sorted, ones, n);
  const shifted = sorted.map((v) => v + (nullValue - observed));
  const scale = Math.max(1, Math.abs(sorted[0]), Math.abs(sorted[n - 1]));
  const eps = 1e-9 * scale;
  if (Math.abs(statistic(shifted, ones, n) - nullValue) > eps) {
    throw new RangeError('shiftedNullTest requires a shift-equivariant statistic');
  }
  const distance = Math.abs(observed - nullValue);
  const upperCutoff = nullValue + distance;
  const lowerCutoff = nullValue - distance;
  const replicates = new Float64Array(settings.resamples);
  let upper = 0;
  let lower = 0;
  forEachResample(n, settings, (counts, b) => {
    const t = statistic(shifted, counts, n);
    replicates[b] = t;
    if (t >= upperCutoff - eps) upper++;
    if (t <= lowerCutoff + eps) lower++;
  });
  const B = settings.resamples;
  return {
    observed, nullValue, upperCount: upper, lowerCount: lower, resamples: B,
    upperTail: (upper + 1) / (B + 1),
    lowerTail: (lower + 1) / (B + 1),
    pValue: Math.min(1, (upper + lower + 1) / (B + 1)),
    nullDistribution: { ...tailBins(replicates, lowerCutoff, upperCutoff, eps), lowerCutoff, upperCutoff, observed },
  };
}

/**
 * Bins on a grid that has both cutoffs as edges, so every bin is wholly inside or wholly in a tail.
 * A value within eps of a cutoff goes to the tail bin beside it, as in the counts above.
 */
export function tailBins(
  values: Float64Array, lowerCutoff: number, upperCutoff: number, eps: number, target = 40,
): { bins: (HistogramBin & { tail: 'lower' | 'upper' | null })[] } {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) { if (v < min) min = v; if (v > max) max = v; }
  const gap = upperCutoff - lowerCutoff;
  const span = Math.max(max, upperCutoff) - Math.min(min, lowerCutoff);
  const inner = gap > 0 ? Math.max(1, Math.round((target * gap) / Math.max(span, gap))) : 0;
  const width = gap > 0 ? gap / inner : Math.max(span, eps) / target;
  const below = Math.max(1, Math.ceil((lowerCutoff - min) / width) || 1);
  const above = Math.max(1, Math.ceil((max - upperCutoff) / width) || 1);
  const edges: number[] = [];
  for (let k = below; k >= 1; k--) edges.push(lowerCutoff - k * width);
  for (let k = 0; k <= inner; k++) edges.push(k === inner ? upperCutoff : lowerCutoff + k * width);
  for (let k = 1; k <= above; k++) edges.push(upperCutoff + k * width);
  const counts = new Array<number>(edges.length - 1).fill(0);
  const lowerBins = below;
  const upperStart = below + inner;
  for (const v of values) counts[binOf(v, edges, lowerCutoff, upperCutoff, eps, lowerBins, upperStart)]++;
  const bins = counts.map((count, k) => ({
    from: edges[k], to: edges[k + 1], count,
    tail: k < lowerBins ? ('lower' as const) : k >= upperStart ? ('upper' as const) : null,
  }));
  return { bins };
}

function binOf(v: number, edges: number[], lc: number, uc: number, eps: number, lowerBins: number, upperStart: number): number {
  if (v <= lc + eps) {
    const k = Math.floor((v - edges[0]) / (edges[1] - edges[0]));
    return Math.min(lowerBins - 1, Math.max(0, k));
  }
  if (v >= uc - eps) {
    const k = upperStart + Math.floor((v - uc) / (edges[upperStart + 1] - edges[upperStart]));
    return Math.min(edges.length - 2, Math.max(upperStart, k));
  }
  const k = lowerBins + Math.floor((v - lc) / (edges[lowerBins + 1] - edges[lowerBins]));
  return Math.min(upperStart - 1, Math.max(lowerBins, k));
}
