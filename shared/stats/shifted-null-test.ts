import { forEachResample, type ResampleSettings } from './bootstrap';
import type { HistogramBin } from './histogram';
import { decimalPlace, roundTo } from './precision';

/**
 * Bootstrap test of a location statistic against a null value by shifting to the null
 * (P. Hall and S. R. Wilson (1991), "Two guidelines for bootstrap hypothesis testing", Biometrics 47,
 * 757–762): shift the data by (null − t) so the statistic of the shifted data equals the null, resample
 * the shifted data B times, and count
 *   upper = #{t* ≥ null + |t − null|},  lower = #{t* ≤ null − |t − null|}.
 * Reported: upperTail = (upper + 1)/(B + 1), lowerTail = (lower + 1)/(B + 1) and the two-sided
 * pValue = min(1, (upper + lower + 1)/(B + 1)), i.e. (1 + #{|t* − null| ≥ |t − null|})/(B + 1):
 * the tail counts are summed and the +1 correction applied once (so pValue ≤ upperTail + lowerTail).
 * Ties are judged on the data's resolution, not its magnitude, so the test is translation invariant:
 * the data are taken relative to their smallest value and rounded to their finest decimal place
 * (precision.ts), which gives the same doubles wherever the data lie on the number line; the null
 * replicate is t*(v) − t(v) + null, and a replicate counts as reaching a cutoff when it is within
 * eps = max(h/(4n), 1e-12·range) of it, h = 10^−(finest decimal place). Means and medians of n values
 * on a lattice of step h lie on a lattice of step h/n or h/2, so h/(4n) is less than half their spacing and
 * more than the floating-point noise of the subtraction; 1e-12·range covers data with no decimal lattice.
 *
 * Refusal (testRefusal): with fewer than MIN_TEST_VALUES values, or all values equal, the bootstrap null
 * distribution cannot reach the tail that a p-value below 5% needs, and the test would report
 * 1/(B + 1), an artefact of B. MIN_TEST_VALUES = 6 is the smallest n at which the median of a resample
 * can equal the most extreme value with probability below 2.5% (P(Binomial(n, 1/n) ≥ ⌊n/2⌋ + 1):
 * 5.8% at n = 5, 0.87% at n = 6; checked in shifted-null-test.spec.ts), so that a two-sided 5% test
 * is possible with atoms of the resampling distribution rather than beyond it.
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
  const reference = sorted[0];
  const place = Math.min(100, finestPlace(sorted));
  const relative = sorted.map((v) => roundTo(v - reference, place));
  const range = relative[n - 1] - relative[0];
  const eps = Math.max(10 ** -place / (4 * n), 1e-12 * range);
  const centre = statistic(relative, ones, n);
  const shift = 3.5 * range + 1;
  if (Math.abs(statistic(relative.map((v) => v + shift), ones, n) - (centre + shift)) > eps + 1e-12 * shift) {
    throw new RangeError('shiftedNullTest requires a shift-equivariant statistic');
  }
  const distance = Math.abs(observed - nullValue);
  const upperCutoff = nullValue + distance;
  const lowerCutoff = nullValue - distance;
  const relativeDistance = Math.abs(centre - (nullValue - reference));
  const replicates = new Float64Array(settings.resamples);
  let upper = 0;
  let lower = 0;
  forEachResample(n, settings, (counts, b) => {
    const moved = statistic(relative, counts, n) - centre;
    replicates[b] = nullValue + moved;
    if (moved >= relativeDistance - eps) upper++;
    if (moved <= -relativeDistance + eps) lower++;
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

/** The fewest values for a shifted-null p-value (see above). */
export const MIN_TEST_VALUES = 6;

/** Why no p-value can be given for these sorted values, in words; null when the test applies. */
export function testRefusal(sorted: ArrayLike<number>, what = 'values'): string | null {
  const n = sorted.length;
  if (n < MIN_TEST_VALUES) {
    return `No p-value: the shifted-null bootstrap test needs at least ${MIN_TEST_VALUES} ${what} (have ${n}); with fewer, resampling cannot reach a 5% tail and the p-value would only reflect the number of resamples.`;
  }
  if (sorted[0] === sorted[n - 1]) {
    return `No p-value: all ${n} ${what} are equal, so every resample gives the same value and the shifted-null bootstrap test has nothing to resample.`;
  }
  return null;
}

/** The finest decimal place among the values (0 when all are 0). */
function finestPlace(values: ArrayLike<number>): number {
  let place = -Infinity;
  for (let i = 0; i < values.length; i++) place = Math.max(place, decimalPlace(values[i]));
  return Number.isFinite(place) ? place : 0;
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
