import { reportedDecimals } from './precision';

/**
 * The pairwise slopes of Passing–Bablok regression, sorted once, each with the two rows it joins.
 * For rows i < j with x_i ≤ x_j (rows taken in order of x, then y): S_ij = (y_j − y_i)/(x_j − x_i);
 * a pair with equal x and different y has slope +∞; identical points (0/0) and slopes of exactly −1 are
 * left out (Passing & Bablok 1983). K = the number of slopes below −1.
 * Ties and −1 are judged at the reported precision (precision.ts), as the engine judges every tie: with
 * D the decimals the values carry, the values become integers k = x·10^D and each slope is the quotient
 * of two exact integers, so slopes equal in decimal (0.3/0.1 and 0.6/0.2) are equal doubles and a slope is
 * −1 exactly when Δy = −Δx. Where the integers would pass 2^52 the values carry about as many digits as a
 * double holds, and their binary differences are the reported precision.
 * O(n²) time and memory: used for few rows and beyond slope-selection.ts's ranges, and as its reference.
 */
export interface SlopeTable {
  slopes: Float64Array;
  first: Int32Array;
  second: Int32Array;
  /** Pairs left out (identical points or slope −1), as row pairs, for weighted counts. */
  leftOut: Int32Array;
  belowMinusOne: number;
}

export function slopeTable(x: ArrayLike<number>, y: ArrayLike<number>): SlopeTable {
  const n = x.length;
  const total = (n * (n - 1)) / 2;
  const raw = new Float64Array(total);
  const a = new Int32Array(total);
  const b = new Int32Array(total);
  const leftOut: number[] = [];
  const decimals = Math.max(reportedDecimals(x), reportedDecimals(y));
  const kx = asIntegers(x, decimals);
  const ky = kx && asIntegers(y, decimals);
  const exact = kx !== null && ky !== null;
  let count = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const [lo, hi] = x[i] < x[j] || (x[i] === x[j] && y[i] <= y[j]) ? [i, j] : [j, i];
      const dx = exact ? kx[hi] - kx[lo] : x[hi] - x[lo];
      const dy = exact ? ky[hi] - ky[lo] : y[hi] - y[lo];
      const slope = dx === 0 ? (dy === 0 ? NaN : Infinity) : dy / dx;
      if (Number.isNaN(slope) || (dx !== 0 && dy === -dx)) {
        leftOut.push(i, j);
        continue;
      }
      raw[count] = slope;
      a[count] = i;
      b[count] = j;
      count++;
    }
  }
  const order = new Uint32Array(count);
  for (let k = 0; k < count; k++) order[k] = k;
  order.sort((p, q) => raw[p] - raw[q] || p - q);
  const slopes = new Float64Array(count);
  const first = new Int32Array(count);
  const second = new Int32Array(count);
  let belowMinusOne = 0;
  for (let k = 0; k < count; k++) {
    slopes[k] = raw[order[k]];
    first[k] = a[order[k]];
    second[k] = b[order[k]];
    if (slopes[k] < -1) belowMinusOne++;
  }
  return { slopes, first, second, leftOut: Int32Array.from(leftOut), belowMinusOne };
}

/** The values as integers of their last reported decimal, or null where that is not exact below 2^52. */
export function asIntegers(values: ArrayLike<number>, decimals: number): Float64Array | null {
  if (decimals > 22) return null;
  const scale = 10 ** decimals;
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const scaled = values[i] * scale;
    const k = Math.round(scaled);
    if (!(Math.abs(k) < 2 ** 52) || Math.abs(scaled - k) > 1e-6) return null;
    out[i] = k;
  }
  return out;
}
