import type { SlopeTable } from './slope-table';
import type { SlopeOrder } from './slope-selection';
import { medianInPlace } from './select';

/**
 * Passing–Bablok slope and intercept of a resample given as counts over the rows, read off the slope table
 * sorted once for the data (no slope is recomputed or re-sorted per resample). In the resample, the pair of
 * rows (i, j) occurs c_i·c_j times with slope S_ij; copies of one row form identical points and are left
 * out, as are pairs left out in the table. So N* = Σ c_i c_j over table pairs, K* the same sum over slopes
 * below −1, and the median rule of passing-bablok.ts is applied at weighted ranks. O(N) per resample from
 * the table; given a SlopeOrder (slope-selection.ts) the same ranks are selected in O(n log n).
 * Returns NaN when the resample has no finite median slope (for instance all its rows share one x).
 */
export function weightedPassingBablok(
  table: SlopeTable | SlopeOrder, x: ArrayLike<number>, y: ArrayLike<number>, counts: Int32Array, scratch: Float64Array,
): { slope: number; intercept: number } {
  if ('weigh' in table) {
    if (!table.table) return selectedPassingBablok(table, x, y, counts, scratch);
    table = table.table;
  }
  const { slopes, first, second, leftOut } = table;
  const n = x.length;
  let size = 0;
  let sumSquares = 0;
  for (let i = 0; i < n; i++) { size += counts[i]; sumSquares += counts[i] * counts[i]; }
  let total = (size * size - sumSquares) / 2;
  for (let k = 0; k < leftOut.length; k += 2) total -= counts[leftOut[k]] * counts[leftOut[k + 1]];
  let below = 0;
  for (let k = 0; k < table.belowMinusOne; k++) below += counts[first[k]] * counts[second[k]];
  if (total === 0) return { slope: NaN, intercept: NaN };
  const rank = total % 2 === 1 ? (total + 1) / 2 + below : total / 2 + below;
  let seen = 0;
  let k = 0;
  for (; k < slopes.length; k++) {
    seen += counts[first[k]] * counts[second[k]];
    if (seen >= rank) break;
  }
  let slope = slopes[k];
  if (total % 2 === 0 && seen === rank) {
    let next = k + 1;
    while (next < slopes.length && counts[first[next]] * counts[second[next]] === 0) next++;
    slope = next < slopes.length ? (slope + slopes[next]) / 2 : NaN;
  }
  return withIntercept(slope, x, y, counts, scratch);
}

/**
 * The same rule on selected ranks: rank r as above and, for N* even, the slope at r + 1 (the next slope of
 * the weighted order: the same pair when its weight reaches past r, where the table takes the slope itself;
 * the mean of two equal doubles is the same double, except −0 and +0, whose mean is +0).
 */
function selectedPassingBablok(
  order: SlopeOrder, x: ArrayLike<number>, y: ArrayLike<number>, counts: Int32Array, scratch: Float64Array,
): { slope: number; intercept: number } {
  const { total, below } = order.weigh(counts);
  if (total === 0) return { slope: NaN, intercept: NaN };
  const rank = total % 2 === 1 ? (total + 1) / 2 + below : total / 2 + below;
  let slope = order.at(rank);
  if (total % 2 === 0) {
    const next = order.at(rank + 1);
    slope = Object.is(next, slope) ? slope : (slope + next) / 2; // −0 and +0 are two pairs: their mean is +0
  }
  return withIntercept(slope, x, y, counts, scratch);
}

function withIntercept(
  slope: number, x: ArrayLike<number>, y: ArrayLike<number>, counts: Int32Array, scratch: Float64Array,
): { slope: number; intercept: number } {
  if (!Number.isFinite(slope)) return { slope: NaN, intercept: NaN };
  let w = 0;
  for (let i = 0; i < x.length; i++) for (let c = counts[i]; c > 0; c--) scratch[w++] = y[i] - slope * x[i];
  return { slope, intercept: medianInPlace(scratch, w) };
}
