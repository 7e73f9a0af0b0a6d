import { reportedDecimals } from './precision';
import { Xor128 } from './rng';
import { asIntegers, slopeTable, type SlopeTable } from './slope-table';

/**
 * Order statistics of the Passing–Bablok pairwise slopes without listing them: the same slopes, with the
 * same conventions, as slope-table.ts (rows in order of x then y; S_ij = (y_j − y_i)/(x_j − x_i) from the
 * exact integers of the reported precision where they exist, else from the doubles; equal x and different
 * y give +∞; identical points and slopes of exactly −1 are left out), for the rows as given or weighted by
 * bootstrap counts (the pair of rows i, j counts c_i·c_j times; copies of one row are identical points).
 *
 * Counting. For a threshold t = p/q (q > 0) and two points with x_i < x_j, S_ij < t exactly when
 * u_j < u_i with u = q·y − p·x; pairs with equal x never count (u grows with y). So the number of slopes
 * below t is the number of inversions of u in the x-then-y order: merge sort, or a Fenwick tree over a
 * fixed order, O(n log n), weighted by c_i·c_j for a resample. In the order of u at t_lo, the inversions of
 * u at t_hi are the pairs between the two thresholds: insertion sort lists them in O(n + m) for m pairs.
 * Selection (after the randomised slope selection of Matoušek (1991), "Randomized optimal algorithm for
 * slope selection", Inform. Process. Lett. 39, 183–187, and Dillencourt, Mount & Netanyahu (1992),
 * "A randomized algorithm for slope selection", Int. J. Comput. Geom. Appl. 2, 1–27): a fixed sample of
 * pairs (drawn once from a generator seeded by the data's size, not the bootstrap stream) gives
 * thresholds; counts at two of them bracket the wanted rank, and the slopes inside a narrow bracket are
 * listed, computed with the table's own formula, and the rank is read off them. A linear prediction of
 * the counts (predicted) places the bracket, so one count and one listing usually do, for every resample.
 * A count tells exactly where a threshold stands: the sample and the prediction only decide how fast the
 * bracket closes, never the answer.
 *
 * Why the numbers are the table's, bit for bit:
 * - 'integer' mode (values exact integers k = v·10^D of the reported decimals, and |q·y|, |p·x| below
 *   2^52 after centring, checked once): u is exact, the slope of a pair is fl(Δy/Δx) of exact integer
 *   differences, and rounding is monotone, so the r-th slope in the exact order, rounded, is the r-th of the
 *   table's sorted doubles. A slope rounds to −1 only when it is −1 (|Δx| < 2^53), so K is exact too.
 * - 'general' mode (values without an exact decimal integer, or integers whose products would pass 2^52):
 *   the table's slope fl(fl(Δy)/fl(Δx)) is within 3.01·2^-53 of the exact slope g but not monotone in it.
 *   The slopes below a double T are counted as the exact pairs with g below T(1 − 2^-49) (merge sort with
 *   an exact comparison: doubles, then exact expansions where the doubles cannot decide) plus the pairs of
 *   the thin band up to T(1 + 2^-49), each computed with the table's formula. Pairs the table leaves out
 *   as −1 (fl(Δy) = −fl(Δx)) lie within 2.01·2^-53 of −1, inside the band kept around −1. Exact while the
 *   values are 0 or between 2^-200 and 2^200 in magnitude (no underflow or overflow in the products).
 * - Slopes equal as doubles are told apart only by −0 and +0 (y values of −0): signedZero gives the one
 *   the table's order (row pairs i < j) puts at the rank.
 * - 'table' mode: the sorted table itself, for few rows (fast enough) and for data outside the ranges above.
 * Cost: O(n log n) per count, one to a few counts per rank; memory O(n) (a sample of 8 pairs per point,
 * 32 counts and orders per point for the prediction) plus the listed bracket (about n log n pairs).
 * Preparing the 'integer' prediction walks the pairs within ±4 bootstrap SDs of the median once (about
 * 3·n^1.5 steps). Many exactly equal real slopes in 'general' data (for instance y = 2x in doubles) fill
 * the band and the work grows towards n² (still exact).
 */
export type SlopeMode = 'table' | 'integer' | 'general';

export interface SlopeOrder {
  readonly mode: SlopeMode;
  /** The sorted table itself, in 'table' mode. */
  readonly table?: SlopeTable;
  /** Takes row weights (bootstrap counts; null: each row once); returns N (valid slopes) and K (below −1). */
  weigh(counts: Int32Array | null): { total: number; below: number };
  /** The valid slope at a 1-based rank of the weighted slopes in ascending order (+∞ last); NaN outside 1..N. */
  at(rank: number): number;
}

export interface SlopeOrderOptions {
  /** Forces a mode (tests); 'integer' falls back to 'general' where the products are too large. */
  mode?: SlopeMode;
  /** Threshold sample size (tests use small ones to exercise the bracketing). */
  poolSize?: number;
  /** Largest weighted number of slopes listed at once. */
  budget?: number;
}

/** Up to this many rows the sorted table is as fast as selection. */
const TABLE_UP_TO = 60;

export function slopeOrder(x: ArrayLike<number>, y: ArrayLike<number>, options: SlopeOrderOptions = {}): SlopeOrder {
  const n = x.length;
  const mode = options.mode ?? (n <= TABLE_UP_TO ? 'table' : undefined);
  if (mode === 'table' || n < 2 || y.length !== n) return new TableOrder(slopeTable(x, y));
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) return new TableOrder(slopeTable(x, y));
  const decimals = Math.max(reportedDecimals(x), reportedDecimals(y));
  const kx = asIntegers(x, decimals);
  const ky = kx && asIntegers(y, decimals);
  if (kx && ky) return new SelectedOrder(kx, ky, mode !== 'general' && integerKeysFit(kx, ky), options);
  if (inGeneralRange(x) && inGeneralRange(y)) return new SelectedOrder(Float64Array.from(x), Float64Array.from(y), false, options);
  return new TableOrder(slopeTable(x, y));
}

/** The sorted table read at weighted ranks (today's walk, O(n²)). */
class TableOrder implements SlopeOrder {
  readonly mode = 'table';
  private counts: Int32Array | null = null;
  private total = 0;

  constructor(readonly table: SlopeTable) {}

  weigh(counts: Int32Array | null): { total: number; below: number } {
    const { slopes, first, second, leftOut, belowMinusOne } = this.table;
    this.counts = counts;
    if (!counts) {
      this.total = slopes.length;
      return { total: this.total, below: belowMinusOne };
    }
    let size = 0;
    let sumSquares = 0;
    for (let i = 0; i < counts.length; i++) { size += counts[i]; sumSquares += counts[i] * counts[i]; }
    let total = (size * size - sumSquares) / 2;
    for (let k = 0; k < leftOut.length; k += 2) total -= counts[leftOut[k]] * counts[leftOut[k + 1]];
    let below = 0;
    for (let k = 0; k < belowMinusOne; k++) below += counts[first[k]] * counts[second[k]];
    this.total = total;
    return { total, below };
  }

  at(rank: number): number {
    if (!Number.isInteger(rank) || rank < 1 || rank > this.total) return NaN;
    const { slopes, first, second } = this.table;
    const counts = this.counts;
    if (!counts) return slopes[rank - 1];
    let seen = 0;
    for (let k = 0; k < slopes.length; k++) {
      seen += counts[first[k]] * counts[second[k]];
      if (seen >= rank) return slopes[k];
    }
    return NaN;
  }
}

/** Centred products |q·y|, |p·x| stay below 2^51 for every threshold p/q made of two points. */
function integerKeysFit(kx: Float64Array, ky: Float64Array): boolean {
  const [, spanX, halfX] = centre(kx);
  const [, spanY, halfY] = centre(ky);
  return spanX * halfY <= 2 ** 51 && spanY * halfX <= 2 ** 51;
}

/** The integer middle of the range, the range, and the largest distance from the middle. */
function centre(values: Float64Array): [number, number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) { lo = Math.min(lo, values[i]); hi = Math.max(hi, values[i]); }
  const mid = Math.round((lo + hi) / 2);
  return [mid, hi - lo, Math.max(hi - mid, mid - lo)];
}

function inGeneralRange(values: ArrayLike<number>): boolean {
  for (let i = 0; i < values.length; i++) {
    const v = Math.abs(values[i]);
    if (v !== 0 && !(v >= 2 ** -200 && v <= 2 ** 200)) return false;
  }
  return true;
}

const CHUNK = 4096;
/** Thresholds of the prediction grid. */
const GRID = 32;
const RUN = 16;
const SINK_INTEGER = 0;
const SINK_COUNT = 1;
const SINK_COLLECT = 2;
const SINK_EXCLUDED = 3;
const SINK_PAIRS = 4;
/** Pairs below −1 (or left out as −1) kept as a list for resamples up to this many per point (else counted). */
const KEEP_PAIRS = 64;
/** Slopes left out as −1 in 'general' mode lie strictly inside (J_LOW, J_HIGH). */
const J_LOW = -1 - 2 ** -49;
const J_HIGH = -1 + 2 ** -49;

class SelectedOrder implements SlopeOrder {
  readonly mode: SlopeMode;
  private readonly integer: boolean;
  private readonly rows: number;
  private readonly points: number;
  /** Distinct points in x-then-y order (centred integers in 'integer' mode). */
  private readonly pa: Float64Array;
  private readonly pb: Float64Array;
  private readonly rowPoint: Int32Array;
  private readonly mult: Float64Array;
  /** Runs of equal x (vertical pairs) and, in 'integer' mode, groups of equal x + y (slope −1). */
  private readonly run: Int32Array;
  private readonly group: Int32Array;
  private readonly groupWeight: Float64Array;
  private readonly budgetOption: number | undefined;

  // Current weights and what they give.
  private readonly weight: Float64Array;
  private readonly seq: Int32Array;
  private seqLength = 0;
  private total = 0;
  private finite = 0;
  private minusOne = 0;
  private budget = 0;
  private fresh = true;

  // Merge buffers.
  private k1: Float64Array;
  private k2: Float64Array;
  private e1: Float64Array;
  private e2: Float64Array;
  private w1: Float64Array;
  private w2: Float64Array;
  private i1: Int32Array;
  private i2: Int32Array;
  private rawLt = 0;
  private rawLe = 0;
  private readonly sigma: Int32Array;
  private overflow = false;
  /** Threshold of the keys in 'general' mode (±∞ allowed). */
  private threshold = 0;

  // Pairs found by a sort ('general' mode), handed on in chunks.
  private readonly chunkP = new Int32Array(CHUNK);
  private readonly chunkQ = new Int32Array(CHUNK);
  private chunkLength = 0;
  private sink = SINK_INTEGER;
  private sinkLow = 0;
  private sinkHigh = 0;
  private sinkLt = 0;
  private sinkLe = 0;
  private sinkCap = Infinity;
  private pairs: number[] = [];

  // Listed slopes between two thresholds, with weights, for ranks above entryLow up to entryHigh.
  private values: Float64Array;
  private valueWeights: Float64Array;
  private entries = 0;
  private entryLow = 0;
  private entryHigh = -1;
  /** The last value picked from the list: listed weight below it and up to and with it (−1: none). */
  private pickedValue = NaN;
  private pickedLow = 0;
  private pickedUpTo = -1;

  // Thresholds: the distinct slopes of the sampled pairs, ascending.
  private poolSize = 0;
  private poolValue = new Float64Array(0);
  private poolDy = new Float64Array(0);
  private poolDx = new Float64Array(0);
  /** Sample weight below, and up to and with, each threshold. */
  private sampleBelow = new Float64Array(0);
  private sampleUpTo = new Float64Array(0);
  private sampleTotal = 0;

  // Thresholds counted for the current weights.
  private countedK: number[] = [];
  private countedLt: number[] = [];
  private countedLe: number[] = [];

  // What the whole data gave: K and the pairs left out as −1 ('general' mode), as counts and as lists.
  private mainBelow = 0;
  private mainExcluded = 0;
  private belowPairs: Int32Array | null = null;
  private excludedPairs: Int32Array | null = null;
  private lastLt = 0;
  private lastLe = 0;
  /** Where some y is −0: the rows by (y, x, index), and the coordinates the table takes differences of. */
  private zeroRows: Int32Array | null = null;
  private zeroA: Float64Array | null = null;
  private zeroB: Float64Array | null = null;
  private counts: Int32Array | null = null;
  /** Thresholds around the data's median slope with each point's count of pairs below them. */
  private gridK = new Int32Array(0);
  private gridTally = new Float64Array(0);
  private gridMain = new Float64Array(0);
  /** 'integer' mode: the points in order of u at each grid threshold (equal keys in x-then-y order). */
  private gridOrder = new Int32Array(0);
  private readonly tree: Float64Array;

  constructor(a: Float64Array, b: Float64Array, integer: boolean, options: SlopeOrderOptions) {
    this.integer = integer;
    this.mode = integer ? 'integer' : 'general';
    if (Array.prototype.some.call(b, (v: number) => Object.is(v, -0))) {
      // Slopes of 0 then have signs (−0 − 0 = −0): kept for signedZero.
      const rows = new Int32Array(a.length);
      for (let r = 0; r < rows.length; r++) rows[r] = r;
      sortIndices(rows, a, null);
      sortIndices(rows, b, null);
      this.zeroRows = rows;
      this.zeroA = Float64Array.from(a);
      this.zeroB = Float64Array.from(b);
    }
    this.budgetOption = options.budget;
    const n = a.length;
    this.rows = n;
    const order = new Int32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    sortIndices(order, a, b);
    const pa = new Float64Array(n);
    const pb = new Float64Array(n);
    const mult = new Float64Array(n);
    this.rowPoint = new Int32Array(n);
    let points = 0;
    for (let t = 0; t < n; t++) {
      const r = order[t];
      if (points === 0 || a[r] !== pa[points - 1] || b[r] !== pb[points - 1]) {
        pa[points] = a[r];
        pb[points] = b[r];
        points++;
      }
      this.rowPoint[r] = points - 1;
      mult[points - 1]++;
    }
    this.points = points;
    this.pa = pa.slice(0, points);
    this.pb = pb.slice(0, points);
    this.mult = mult.slice(0, points);
    if (integer) {
      // Exact: integers below 2^52 minus an integer between them.
      const [ma] = centre(this.pa);
      const [mb] = centre(this.pb);
      for (let p = 0; p < points; p++) { this.pa[p] -= ma; this.pb[p] -= mb; }
    }
    this.run = new Int32Array(points);
    let runs = 0;
    for (let p = 0; p < points; p++) this.run[p] = p > 0 && this.pa[p] === this.pa[p - 1] ? runs - 1 : runs++;
    this.group = new Int32Array(points);
    let groups = 0;
    if (integer) {
      const bySum = new Int32Array(points);
      const sum = new Float64Array(points);
      for (let p = 0; p < points; p++) { bySum[p] = p; sum[p] = this.pa[p] + this.pb[p]; }
      sortIndices(bySum, sum, null);
      for (let t = 0; t < points; t++) this.group[bySum[t]] = t > 0 && sum[bySum[t]] === sum[bySum[t - 1]] ? groups - 1 : groups++;
    }
    this.groupWeight = new Float64Array(groups);
    this.weight = new Float64Array(points);
    this.seq = new Int32Array(points);
    this.k1 = new Float64Array(points);
    this.k2 = new Float64Array(points);
    this.e1 = new Float64Array(points);
    this.e2 = new Float64Array(points);
    this.w1 = new Float64Array(points);
    this.w2 = new Float64Array(points);
    this.i1 = new Int32Array(points);
    this.i2 = new Int32Array(points);
    this.sigma = new Int32Array(points);
    this.tree = new Float64Array(points + 1);
    this.values = new Float64Array(1024);
    this.valueWeights = new Float64Array(1024);
    this.buildPool(options.poolSize ?? Math.min(1 << 20, Math.max(256, 8 * points)));
    const main = this.weigh(null);
    this.mainBelow = main.below;
    this.mainExcluded = this.minusOne;
    // A resample's pairs are the data's pairs: keep the few below −1 and left out as −1 as lists.
    if (main.below > 0 && main.below <= KEEP_PAIRS * points) {
      this.startSink(SINK_PAIRS, -Infinity, -1);
      if (integer) this.listInteger(-1, 0, -1, 1);
      else this.band(-Infinity, above(-1));
      this.belowPairs = Int32Array.from(this.pairs);
    }
    if (!integer && this.mainExcluded > 0 && this.mainExcluded <= KEEP_PAIRS * points) {
      this.startSink(SINK_EXCLUDED, 0, 0);
      this.band(J_LOW, J_HIGH);
      this.excludedPairs = Int32Array.from(this.pairs);
    }
    if (this.poolSize > 4 * GRID) this.buildGrid(n, main.below);
  }

  /**
   * GRID thresholds spanning ±4 bootstrap SDs of the median's rank (about sqrt(n(n − 1)(2n + 5)/18)
   * slopes) around the data's median slope, each with every point's weighted count of pairs below it.
   */
  private buildGrid(n: number, below: number): void {
    const density = this.sampleTotal / this.finite;
    const middle = (this.total / 2 + below) * density;
    const span = 4 * Math.sqrt((n * (n - 1) * (2 * n + 5)) / 18) * density + 2;
    const ks: number[] = [];
    for (let g = 0; g < GRID; g++) {
      const k = this.firstFrom(middle - span + (2 * span * g) / (GRID - 1), -1, this.poolSize);
      if (k >= 0 && (ks.length === 0 || k > ks[ks.length - 1])) ks.push(k);
    }
    this.gridK = Int32Array.from(ks);
    const size = this.points;
    this.gridTally = new Float64Array(ks.length * size);
    this.gridOrder = new Int32Array(ks.length * size);
    this.gridMain = new Float64Array(ks.length);
    if (ks.length === 0) return;
    if (!this.integer) {
      // Real slopes below each threshold, by exact merge sort (the prediction needs no more).
      for (let g = 0; g < ks.length; g++) {
        const tally = this.gridTally.subarray(g * size, (g + 1) * size);
        for (let t = 0; t < size; t++) { this.i1[t] = t; this.w1[t] = this.mult[t]; tally[t] = 0; }
        this.setKeys(this.poolValue[ks[g]], size);
        this.gridMain[g] = this.mergeSort(size, tally);
      }
      return;
    }
    const [p0, q0] = [this.poolDy[ks[0]], this.poolDx[ks[0]]];
    this.gridMain[0] = this.tallyInteger(p0, q0, this.gridTally.subarray(0, size), this.gridOrder.subarray(0, size));
    const { pa, pb, mult } = this;
    const keys = this.k1;
    for (let g = 1; g < ks.length; g++) {
      // From the previous threshold by insertion: each shift is a pair between the two thresholds.
      const tally = this.gridTally.subarray(g * size, (g + 1) * size);
      const order = this.gridOrder.subarray(g * size, (g + 1) * size);
      tally.set(this.gridTally.subarray((g - 1) * size, g * size));
      order.set(this.gridOrder.subarray((g - 1) * size, g * size));
      const p = this.poolDy[ks[g]];
      const q = this.poolDx[ks[g]];
      for (let t = 0; t < size; t++) keys[t] = q * pb[order[t]] - p * pa[order[t]];
      let count = this.gridMain[g - 1];
      for (let j = 1; j < size; j++) {
        const v = keys[j];
        if (keys[j - 1] <= v) continue;
        const iv = order[j];
        let i = j - 1;
        let greater = 0;
        while (i >= 0 && keys[i] > v) {
          const x = order[i];
          greater += mult[x];
          tally[x] += mult[iv];
          keys[i + 1] = keys[i];
          order[i + 1] = x;
          i--;
        }
        keys[i + 1] = v;
        order[i + 1] = iv;
        tally[iv] += greater;
        count += mult[iv] * greater;
      }
      this.gridMain[g] = count;
    }
  }

  /**
   * The slope at a rank whose value is zero, with the sign the table gives it. The table orders equal
   * slopes by row pair (i, j), i < j, and a pair of equal y gives −0 when its higher-x row holds −0 and the
   * other +0. So: the rank within the zero slopes (after the count below 0), then the pair at that weighted
   * position in row-pair order (pairs of equal y and different x), then its Δy.
   */
  private signedZero(rank: number): number {
    const rows = this.zeroRows!;
    const a = this.zeroA!;
    const b = this.zeroB!;
    const n = rows.length;
    const c = (r: number): number => (this.counts ? this.counts[r] : 1);
    if (this.integer) {
      this.countInteger(0, 1);
      this.lastLt = this.rawLt - this.minusOne;
    } else this.countGeneral(0);
    let target = rank - this.lastLt;
    // Per row, the weight of later rows (higher index) of equal y and different x; rows is in y, x order.
    const partners = new Float64Array(n);
    const runOf = new Int32Array(n);
    for (let start = 0, run = 0; start < n; run++) {
      let end = start + 1;
      while (end < n && b[rows[end]] === b[rows[start]]) end++;
      const members = Array.from(rows.subarray(start, end)).sort((p, q) => q - p);
      const sameX = new Map<number, number>();
      let later = 0;
      for (const r of members) {
        runOf[r] = run;
        partners[r] = later - (sameX.get(a[r]) ?? 0);
        later += c(r);
        sameX.set(a[r], (sameX.get(a[r]) ?? 0) + c(r));
      }
      start = end;
    }
    for (let i = 0; i < n; i++) {
      const weight = c(i) * partners[i];
      if (target > weight) { target -= weight; continue; }
      for (let j = i + 1; j < n; j++) {
        if (runOf[j] !== runOf[i] || a[j] === a[i]) continue;
        target -= c(i) * c(j);
        if (target <= 0) return a[i] < a[j] ? b[j] - b[i] : b[i] - b[j];
      }
    }
    throw new Error('Passing–Bablok slope selection: zero slope not found');
  }

  /** The linear prediction of the current weights' count of valid slopes below grid threshold g. */
  private predict(g: number): number {
    const { seq, weight, points } = this;
    const tally = this.gridTally;
    const base = g * points;
    let sum = 0;
    for (let t = 0; t < this.seqLength; t++) {
      const id = seq[t];
      sum += weight[id] * tally[base + id];
    }
    return sum - this.gridMain[g] - (this.poolValue[this.gridK[g]] > -1 ? this.minusOne : 0);
  }

  /**
   * A rank placed by prediction. A resample's count below a threshold is, to first order in the weights,
   * Σ_P w_P·L_P − (the data's count), L_P the point's count of pairs below it (off by about 0.6·√N; exact
   * for the whole data); interpolated between grid thresholds this places the rank within a narrow window.
   * One exact count at the window's lower threshold, then the slopes up to its upper one are listed (the
   * listing also counts them). Returns null where a guess misses (select goes on from the counts made).
   */
  private predicted(rank: number): number | null {
    const gridK = this.gridK;
    let lo = 0;
    let hi = gridK.length - 1;
    let previous = this.predict(lo);
    let predicted = this.predict(hi);
    if (previous >= rank || predicted < rank) return null;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      const p = this.predict(mid);
      if (p >= rank) { hi = mid; predicted = p; } else { lo = mid; previous = p; }
    }
    if (predicted <= previous) return null;
    const g = hi;
    const s0 = this.sampleBelow[gridK[g - 1]];
    const s1 = this.sampleBelow[gridK[g]];
    const target = s0 + ((rank - previous) / (predicted - previous)) * (s1 - s0);
    const perRank = (s1 - s0) / (predicted - previous);
    // The whole data's counts at the grid are exact; a resample's are off by about 0.6·√N.
    const error = this.counts === null ? 0 : 0.6 * Math.sqrt(this.total) * perRank;
    const spread = 2 * (error + Math.sqrt((s1 - s0) / 4) + 1);
    const kA = this.lastBelow(target - spread, -1, this.poolSize);
    if (kA < 0) return null;
    this.countAt(kA);
    const lt = this.lastLt;
    const le = this.lastLe;
    if (lt < rank && rank <= le) return this.poolValue[kA];
    if (lt >= rank || le - lt > this.budget) return null;
    // The rank is now known to lie (rank − le) slopes above kA: only the sample's own scatter is left.
    const ahead = (rank - le) * perRank;
    const kB = this.firstFrom(this.sampleUpTo[kA] + ahead + 2.5 * (Math.sqrt(ahead) + 0.05 * ahead) + 2, kA, this.poolSize);
    if (kB < 0) return null;
    this.entries = 0;
    this.pickedUpTo = -1;
    let start: number;
    if (this.integer) {
      // Pairs from threshold kA (sigma is in its order) up to below kB: ranks lt + 1 .. lt + listed.
      start = lt;
      this.startSink(SINK_INTEGER, 0, 0);
      this.pairsInteger(this.poolDy[kB], this.poolDx[kB], 4 * this.budget);
    } else {
      // Slopes strictly between the doubles of kA and kB: ranks le + 1 .. le + listed.
      start = le;
      const [tA, tB] = [this.poolValue[kA], this.poolValue[kB]];
      this.startSink(SINK_COLLECT, tA, tB, 4 * this.budget);
      this.band(below(nextUp(tA)), above(tB));
    }
    if (this.overflow || rank > start + this.sinkLt) return null;
    this.entryLow = start;
    this.entryHigh = start + this.sinkLt;
    return this.pick(rank - start);
  }

  weigh(counts: Int32Array | null): { total: number; below: number } {
    const { weight: w, seq, run, rowPoint } = this;
    this.counts = counts;
    if (counts) {
      w.fill(0);
      for (let r = 0; r < this.rows; r++) w[rowPoint[r]] += counts[r];
    } else w.set(this.mult);
    this.fresh = counts !== null;
    let m = 0;
    let sum = 0;
    let squares = 0;
    // Equal x forms runs in point order: pairs within a run are vertical.
    let vertical = 0;
    let runSum = 0;
    for (let p = 0; p < this.points; p++) {
      if (p > 0 && run[p] !== run[p - 1]) { vertical += runSum * runSum; runSum = 0; }
      const v = w[p];
      if (v === 0) continue;
      seq[m++] = p;
      sum += v;
      squares += v * v;
      runSum += v;
    }
    vertical = (vertical + runSum * runSum - squares) / 2;
    this.seqLength = m;
    this.countedK.length = 0;
    this.countedLt.length = 0;
    this.countedLe.length = 0;
    this.entryHigh = -1;
    this.pickedUpTo = -1;
    this.budget = this.budgetOption ?? Math.max(512, Math.ceil(m * Math.log2(m + 1)));
    let minusOne = 0;
    if (this.integer) {
      const groups = this.groupWeight;
      groups.fill(0);
      for (let t = 0; t < m; t++) groups[this.group[seq[t]]] += w[seq[t]];
      for (let g = 0; g < groups.length; g++) minusOne += groups[g] * groups[g];
      minusOne = (minusOne - squares) / 2;
    } else if (this.excludedPairs) minusOne = pairWeight(this.excludedPairs, w);
    else if (!counts || this.mainExcluded > 0) {
      this.startSink(SINK_EXCLUDED, 0, 0);
      this.band(J_LOW, J_HIGH);
      minusOne = this.sinkLt;
    }
    this.minusOne = minusOne;
    this.total = (sum * sum - squares) / 2 - minusOne;
    this.finite = this.total - vertical;
    let below = 0;
    if (this.belowPairs) below = pairWeight(this.belowPairs, w);
    else if (!counts || this.mainBelow > 0) {
      if (this.integer) {
        this.countInteger(-1, 1);
        below = this.rawLt;
      } else {
        this.countGeneral(-1);
        below = this.lastLt;
      }
    }
    return { total: this.total, below };
  }

  at(rank: number): number {
    if (!Number.isInteger(rank) || rank < 1 || rank > this.total) return NaN;
    if (rank > this.finite) return Infinity;
    const value = this.select(rank);
    return value === 0 && this.zeroRows ? this.signedZero(rank) : value;
  }

  private select(rank: number): number {
    if (rank > this.entryLow && rank <= this.entryHigh) return this.pick(rank - this.entryLow);
    let lowK = -1;
    let lowLe = 0;
    let highK = this.poolSize;
    let highLt = this.finite;
    for (let c = 0; c < this.countedK.length; c++) {
      const k = this.countedK[c];
      const lt = this.countedLt[c];
      const le = this.countedLe[c];
      if (lt < rank && rank <= le) return this.poolValue[k];
      if (le < rank) {
        if (k > lowK) { lowK = k; lowLe = le; }
      } else if (k < highK) { highK = k; highLt = lt; }
    }
    let fresh = this.fresh && lowK < 0 && highK >= this.poolSize;
    this.fresh = false;
    if (this.gridK.length > 1 && (fresh || this.counts === null)) {
      const counted = this.countedK.length;
      const value = this.predicted(rank);
      if (value !== null) return value;
      for (let c = counted; c < this.countedK.length; c++) {
        const k = this.countedK[c];
        if (this.countedLe[c] < rank) {
          if (k > lowK) { lowK = k; lowLe = this.countedLe[c]; }
        } else if (k < highK) { highK = k; highLt = this.countedLt[c]; }
        fresh = false;
      }
    }
    const density = this.sampleTotal / this.finite;
    for (let round = 0; ; round++) {
      if (highLt - lowLe <= this.budget || highK - lowK <= 1) return this.list(lowK, highK, lowLe, highLt, rank);
      // Where the rank should fall among the sampled thresholds (sample units), and how far off that may be.
      const sLow = lowK < 0 ? 0 : this.sampleUpTo[lowK];
      const sHigh = highK >= this.poolSize ? this.sampleTotal : this.sampleBelow[highK];
      let target: number;
      let spread: number;
      if (lowK >= 0 && highK < this.poolSize) {
        const f = (rank - lowLe - 0.5) / (highLt - lowLe);
        target = sLow + f * (sHigh - sLow);
        spread = 2.5 * Math.sqrt((sHigh - sLow) * f * (1 - f)) + 1;
      } else if (lowK >= 0 || highK < this.poolSize) {
        target = lowK >= 0 ? sLow + (rank - lowLe - 0.5) * density : sHigh - (highLt - rank + 0.5) * density;
        const distance = Math.abs(target - (lowK >= 0 ? sLow : sHigh));
        spread = 2.5 * (Math.sqrt(distance) + 0.02 * distance) + 1;
      } else {
        target = (rank - 0.5) * density;
        const f = Math.min(1, Math.max(0, target / this.sampleTotal));
        spread = 2.5 * Math.sqrt(this.sampleTotal * f * (1 - f)) + 1;
      }
      let kA: number;
      let kB = -1;
      if (round >= 6) kA = (lowK + highK) >> 1; // guesses that keep missing: halve the bracket instead
      else if (fresh && round === 0) {
        // A resample: one count near the guess first; it tells how far the resample's rank has moved.
        kA = this.firstFrom(target, lowK, highK);
        if (kA < 0) kA = this.lastBelow(target, lowK, highK);
      } else {
        kA = this.lastBelow(target - spread, lowK, highK);
        kB = this.firstFrom(target + spread, lowK, highK);
        if (kA === kB) kB = -1;
        if (kA < 0) { kA = kB; kB = -1; }
        if (kA < 0) kA = Math.max(this.lastBelow(target, lowK, highK), this.firstFrom(target, lowK, highK));
      }
      for (let c = 0; c < 2; c++) {
        const k = c === 0 ? kA : kB;
        if (!(k > lowK && k < highK)) continue;
        this.countAt(k);
        const lt = this.lastLt;
        const le = this.lastLe;
        if (lt < rank && rank <= le) return this.poolValue[k];
        if (le < rank) { lowK = k; lowLe = le; } else { highK = k; highLt = lt; }
      }
    }
  }

  /** The largest threshold index in (low, high) whose sample position is at most s, or −1. */
  private lastBelow(s: number, low: number, high: number): number {
    let lo = low + 1;
    let hi = high - 1;
    if (lo > hi || this.sampleBelow[lo] > s) return -1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.sampleBelow[mid] <= s) lo = mid; else hi = mid - 1;
    }
    return lo;
  }

  /** The smallest threshold index in (low, high) whose sample position is at least s, or −1. */
  private firstFrom(s: number, low: number, high: number): number {
    let lo = low + 1;
    let hi = high - 1;
    if (lo > hi || this.sampleBelow[hi] < s) return -1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.sampleBelow[mid] >= s) hi = mid; else lo = mid + 1;
    }
    return lo;
  }

  /** Valid weighted slopes below and up to threshold k (lastLt, lastLe), remembered for the current weights. */
  private countAt(k: number): void {
    if (this.integer) {
      const p = this.poolDy[k];
      const q = this.poolDx[k];
      const grid = this.gridK;
      if (grid.length > 0 && k >= grid[0] && k <= grid[grid.length - 1]) {
        let g = grid.length - 1;
        while (grid[g] > k) g--;
        this.countFromGrid(g, k);
      } else this.countInteger(p, q);
      this.lastLt = this.rawLt - (p > -q ? this.minusOne : 0);
      this.lastLe = this.rawLe - (p >= -q ? this.minusOne : 0);
    } else this.countGeneral(this.poolValue[k]);
    this.countedK.push(k);
    this.countedLt.push(this.lastLt);
    this.countedLe.push(this.lastLe);
  }

  /** Lists the slopes strictly between thresholds low and high (−1 and poolSize: none) and picks a rank. */
  private list(low: number, high: number, lowLe: number, highLt: number, rank: number): number {
    this.entries = 0;
    this.pickedUpTo = -1;
    if (this.integer) {
      this.startSink(SINK_INTEGER, 0, 0);
      this.listInteger(
        low < 0 ? -1 : this.poolDy[low], low < 0 ? 0 : this.poolDx[low],
        high >= this.poolSize ? 1 : this.poolDy[high], high >= this.poolSize ? 0 : this.poolDx[high],
      );
    } else {
      const tLow = low < 0 ? -Infinity : this.poolValue[low];
      const tHigh = high >= this.poolSize ? Infinity : this.poolValue[high];
      this.startSink(SINK_COLLECT, tLow, tHigh);
      this.band(tLow === -Infinity ? -Infinity : below(nextUp(tLow)), tHigh === Infinity ? Infinity : above(tHigh));
    }
    let weight = 0;
    for (let e = 0; e < this.entries; e++) weight += this.valueWeights[e];
    if (weight !== highLt - lowLe) throw new Error('Passing–Bablok slope selection: listed slopes do not match their count');
    this.entryLow = lowLe;
    this.entryHigh = highLt;
    return this.pick(rank - lowLe);
  }

  /**
   * Weighted quickselect: the value at weighted rank target (1-based) of the listed slopes. The ranks of
   * that value are remembered, so the next rank (the median's partner) is that value again or, past it,
   * the least listed value above it (one pass).
   */
  private pick(target: number): number {
    const v = this.values;
    const w = this.valueWeights;
    if (this.pickedUpTo >= 0) {
      if (target > this.pickedLow && target <= this.pickedUpTo) return this.pickedValue;
      if (target === this.pickedUpTo + 1) {
        let least = Infinity;
        let weight = 0;
        for (let i = 0; i < this.entries; i++) {
          const x = v[i];
          if (x <= this.pickedValue || x > least) continue;
          if (x < least) { least = x; weight = 0; }
          weight += w[i];
        }
        return this.remember(least, this.pickedUpTo, this.pickedUpTo + weight);
      }
    }
    let offset = 0; // listed weight left of lo (all below the values from lo on)
    let lo = 0;
    let hi = this.entries;
    for (;;) {
      if (hi - lo <= 24) {
        for (let i = lo + 1; i < hi; i++) {
          const x = v[i];
          const y = w[i];
          let j = i - 1;
          while (j >= lo && v[j] > x) { v[j + 1] = v[j]; w[j + 1] = w[j]; j--; }
          v[j + 1] = x;
          w[j + 1] = y;
        }
        let seen = offset;
        for (let i = lo; i < hi; i++) {
          const low = seen;
          seen += w[i];
          if (seen >= target) {
            let first = low;
            for (let e = i - 1; e >= lo && v[e] === v[i]; e--) first -= w[e];
            for (let e = i + 1; e < hi && v[e] === v[i]; e++) seen += w[e];
            return this.remember(v[i], first, seen);
          }
        }
        throw new Error('Passing–Bablok slope selection: rank beyond the listed slopes');
      }
      const a = v[lo];
      const b = v[(lo + hi) >> 1];
      const c = v[hi - 1];
      const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
      let lt = lo;
      let i = lo;
      let gt = hi - 1;
      let less = 0;
      let equal = 0;
      while (i <= gt) {
        const x = v[i];
        if (x < pivot) {
          const y = w[i];
          v[i] = v[lt]; w[i] = w[lt]; v[lt] = x; w[lt] = y;
          less += y;
          lt++;
          i++;
        } else if (x > pivot) {
          const y = w[i];
          v[i] = v[gt]; w[i] = w[gt]; v[gt] = x; w[gt] = y;
          gt--;
        } else {
          equal += w[i];
          i++;
        }
      }
      if (target <= offset + less) hi = lt;
      else if (target <= offset + less + equal) return this.remember(pivot, offset + less, offset + less + equal);
      else { offset += less + equal; lo = gt + 1; }
    }
  }

  private remember(value: number, low: number, upTo: number): number {
    this.pickedValue = value;
    this.pickedLow = low;
    this.pickedUpTo = upTo;
    return value;
  }

  private addEntry(value: number, weight: number): void {
    if (this.entries === this.values.length) this.grow();
    this.values[this.entries] = value;
    this.valueWeights[this.entries++] = weight;
  }

  private grow(): void {
    const v = new Float64Array(2 * this.values.length);
    const w = new Float64Array(2 * this.values.length);
    v.set(this.values);
    w.set(this.valueWeights);
    this.values = v;
    this.valueWeights = w;
  }

  // ---- 'integer' mode: keys u = q·y − p·x, exact doubles ----

  /**
   * Weighted inversions of u = q·y − p·x over the present points (rawLt: slopes < p/q; rawLe: slopes ≤ p/q).
   * The points leave sorted by u in sigma (stable: equal keys in x-then-y order; from the reversed order
   * when reversed, equal keys then last point first, and the counts are not used).
   */
  private countInteger(p: number, q: number, reversed = false): void {
    const m = this.seqLength;
    const { seq, pa, pb, weight } = this;
    let ka = this.k1;
    let kb = this.k2;
    let wa = this.w1;
    let wb = this.w2;
    let ia = this.i1;
    let ib = this.i2;
    for (let t = 0; t < m; t++) {
      const id = seq[reversed ? m - 1 - t : t];
      ka[t] = q * pb[id] - p * pa[id];
      wa[t] = weight[id];
      ia[t] = id;
    }
    let lt = 0;
    let le = 0;
    // Runs of RUN sorted by insertion (each shift past a greater key is an inversion), then merged.
    for (let lo = 0; lo < m; lo += RUN) {
      const hi = Math.min(lo + RUN, m);
      for (let j = lo + 1; j < hi; j++) {
        const v = ka[j];
        const wv = wa[j];
        const iv = ia[j];
        let i = j - 1;
        let greater = 0;
        while (i >= lo && ka[i] > v) { greater += wa[i]; ka[i + 1] = ka[i]; wa[i + 1] = wa[i]; ia[i + 1] = ia[i]; i--; }
        let notLess = greater;
        for (let e = i; e >= lo && ka[e] === v; e--) notLess += wa[e];
        ka[i + 1] = v;
        wa[i + 1] = wv;
        ia[i + 1] = iv;
        lt += wv * greater;
        le += wv * notLess;
      }
    }
    for (let width = RUN; width < m; width *= 2) {
      for (let lo = 0; lo < m; lo += 2 * width) {
        const mid = Math.min(lo + width, m);
        const hi = Math.min(lo + 2 * width, m);
        let rest = 0;
        for (let t = lo; t < mid; t++) rest += wa[t];
        let rest2 = rest;
        let i = lo;
        let i2 = lo;
        let j = mid;
        let k = lo;
        while (j < hi) {
          const v = ka[j];
          while (i < mid && ka[i] <= v) { kb[k] = ka[i]; wb[k] = wa[i]; ib[k] = ia[i]; rest -= wa[i]; i++; k++; }
          while (i2 < i && ka[i2] < v) { rest2 -= wa[i2]; i2++; }
          const wj = wa[j];
          lt += wj * rest;
          le += wj * rest2;
          kb[k] = v;
          wb[k] = wj;
          ib[k] = ia[j];
          j++;
          k++;
        }
        for (; i < mid; i++, k++) { kb[k] = ka[i]; wb[k] = wa[i]; ib[k] = ia[i]; }
      }
      const tk = ka; ka = kb; kb = tk;
      const tw = wa; wa = wb; wb = tw;
      const ti = ia; ia = ib; ib = ti;
    }
    this.sigma.set(ia.subarray(0, m));
    this.rawLt = lt;
    this.rawLe = le;
  }

  /**
   * Every pair that is an inversion of u_high = qH·y − pH·x in the order sigma (earlier point, later point):
   * with sigma sorted by u_low, the pairs whose slope is from p_low/q_low up to below pH/qH (qH = 0: +∞).
   * Insertion sort, each shift one such pair: O(m + pairs). Their slopes (the table's formula, −1 left out)
   * are listed with weights, or with SINK_PAIRS the pairs kept. Stops once more than cap (weighted) is listed.
   */
  private pairsInteger(pH: number, qH: number, cap = Infinity): void {
    const m = this.seqLength;
    const { pa, pb, sigma, weight } = this;
    const ka = this.k1;
    const keep = this.sink === SINK_PAIRS;
    for (let t = 0; t < m; t++) {
      const id = sigma[t];
      ka[t] = qH * pb[id] - pH * pa[id];
    }
    this.overflow = false;
    let listed = 0;
    let values = this.values;
    let weights = this.valueWeights;
    let entries = this.entries;
    for (let j = 1; j < m; j++) {
      const v = ka[j];
      if (ka[j - 1] <= v) continue;
      const q = sigma[j];
      const wq = weight[q];
      const xq = pa[q];
      const yq = pb[q];
      let i = j - 1;
      while (i >= 0 && ka[i] > v) {
        const p = sigma[i];
        const dx = xq - pa[p];
        const dy = yq - pb[p];
        if (dy !== -dx) {
          if (keep) this.pairs.push(p, q);
          else {
            if (entries === values.length) {
              this.entries = entries;
              this.grow();
              values = this.values;
              weights = this.valueWeights;
            }
            const w = weight[p] * wq;
            values[entries] = dy / dx;
            weights[entries++] = w;
            listed += w;
          }
        }
        ka[i + 1] = ka[i];
        sigma[i + 1] = p;
        i--;
      }
      ka[i + 1] = v;
      sigma[i + 1] = q;
      if (listed > cap) { this.overflow = true; break; }
    }
    this.entries = entries;
    this.sinkLt = listed;
  }

  /** Lists (with weights) the slopes strictly between pL/qL and pH/qH (qL = 0: from −∞; qH = 0: to +∞). */
  private listInteger(pL: number, qL: number, pH: number, qH: number): void {
    // Order of u_low, ties last point first: pairs at the lower threshold then count as below it.
    if (qL === 0) this.sigma.set(this.seq.subarray(0, this.seqLength));
    else this.countInteger(pL, qL, true);
    this.pairsInteger(pH, qH);
  }

  /**
   * Per point (tally), the weighted number of its pairs with slope below p/q in the whole data, and the
   * points in order of u (order); returns the weighted number of such pairs. For the linear prediction
   * of a resample's counts, Σ_P w_P·L_P − that number, and for countFromGrid.
   */
  private tallyInteger(p: number, q: number, tally: Float64Array, order: Int32Array): number {
    const m = this.points;
    const { pa, pb, mult } = this;
    let ka = this.k1, kb = this.k2, wa = this.w1, wb = this.w2, ia = this.i1, ib = this.i2;
    for (let t = 0; t < m; t++) { ka[t] = q * pb[t] - p * pa[t]; wa[t] = mult[t]; ia[t] = t; tally[t] = 0; }
    let count = 0;
    for (let width = 1; width < m; width *= 2) {
      for (let lo = 0; lo < m; lo += 2 * width) {
        const mid = Math.min(lo + width, m);
        const hi = Math.min(lo + 2 * width, m);
        let rest = 0;
        for (let t = lo; t < mid; t++) rest += wa[t];
        let taken = 0;
        let i = lo;
        let j = mid;
        let k = lo;
        while (i < mid || j < hi) {
          if (j >= hi || (i < mid && ka[i] <= ka[j])) {
            tally[ia[i]] += taken;
            rest -= wa[i];
            kb[k] = ka[i]; wb[k] = wa[i]; ib[k] = ia[i];
            i++;
          } else {
            tally[ia[j]] += rest;
            count += wa[j] * rest;
            taken += wa[j];
            kb[k] = ka[j]; wb[k] = wa[j]; ib[k] = ia[j];
            j++;
          }
          k++;
        }
      }
      const tk = ka; ka = kb; kb = tk;
      const tw = wa; wa = wb; wb = tw;
      const ti = ia; ia = ib; ib = ti;
    }
    order.set(ia.subarray(0, m));
    return count;
  }

  /**
   * rawLt and rawLe at pool threshold k from grid threshold g below it: the count at g by a Fenwick tree
   * (Fenwick (1994), "A new data structure for cumulative frequency tables", Softw. Pract. Exp. 24, 327–336) over
   * the fixed order of g (no sort), then that order insertion-sorted by the keys of k, each shift one pair
   * from g up to below k. Leaves sigma in the order of k (equal keys in x-then-y order).
   */
  private countFromGrid(g: number, k: number): void {
    const { points, weight, sigma, pa, pb, tree } = this;
    const order = this.gridOrder;
    const base = g * points;
    tree.fill(0);
    let m = 0;
    let lt = 0;
    let seen = 0;
    for (let t = 0; t < points; t++) {
      const id = order[base + t];
      const w = weight[id];
      if (w === 0) continue;
      let upTo = 0;
      for (let i = id + 1; i > 0; i -= i & -i) upTo += tree[i];
      lt += w * (seen - upTo);
      for (let i = id + 1; i <= points; i += i & -i) tree[i] += w;
      seen += w;
      sigma[m++] = id;
    }
    const p = this.poolDy[k];
    const q = this.poolDx[k];
    const ka = this.k1;
    for (let t = 0; t < m; t++) ka[t] = q * pb[sigma[t]] - p * pa[sigma[t]];
    for (let j = 1; j < m; j++) {
      const v = ka[j];
      if (ka[j - 1] <= v) continue;
      const iv = sigma[j];
      let i = j - 1;
      let greater = 0;
      while (i >= 0 && ka[i] > v) {
        greater += weight[sigma[i]];
        ka[i + 1] = ka[i];
        sigma[i + 1] = sigma[i];
        i--;
      }
      ka[i + 1] = v;
      sigma[i + 1] = iv;
      lt += weight[iv] * greater;
    }
    // Pairs with slope exactly p/q: within runs of equal keys (no two points of a run share x).
    let le = lt;
    for (let t = 0; t < m;) {
      let e = t + 1;
      if (e < m && ka[e] === ka[t]) {
        let sum = 0;
        let squares = 0;
        for (e = t; e < m && ka[e] === ka[t]; e++) { const w = weight[sigma[e]]; sum += w; squares += w * w; }
        le += (sum * sum - squares) / 2;
      }
      t = e;
    }
    this.rawLt = lt;
    this.rawLe = le;
  }

  // ---- 'general' mode: keys w = y − T·x for a double T, compared exactly ----

  /** Valid weighted slopes below T and up to T (lastLt, lastLe; the table's doubles): exact count plus the band. */
  private countGeneral(t: number): void {
    const next = nextUp(t);
    let low = below(t);
    let high = above(next);
    if (low <= J_HIGH && high > J_LOW) {
      low = Math.min(low, J_LOW);
      high = Math.max(high, J_HIGH);
    }
    this.startSink(SINK_COUNT, t, next);
    const under = this.band(low, high) - (low > J_HIGH ? this.minusOne : 0);
    this.lastLt = under + this.sinkLt;
    this.lastLe = under + this.sinkLe;
  }

  /**
   * Exact weighted count of pairs with real slope g < low (merge sort of the points by y − low·x), then
   * every pair with low ≤ g < high handed to the sink (inversions of y − high·x in that order).
   */
  private band(low: number, high: number): number {
    const m = this.seqLength;
    const { seq, weight } = this;
    let under = 0;
    for (let t = 0; t < m; t++) {
      this.i1[t] = seq[t];
      this.w1[t] = weight[seq[t]];
    }
    if (low !== -Infinity) {
      this.setKeys(low, m);
      under = this.mergeSort(m);
    }
    this.setKeys(high, m);
    this.insertPairs(m);
    return under;
  }

  /**
   * Insertion sort of i1 by k1 (exact comparison), handing every shift, an inversion (earlier point, later
   * point), to the sink: O(m + inversions), the inversions being the pairs of the band.
   */
  private insertPairs(m: number): void {
    const { k1: keys, e1: errors, i1: ids, chunkP, chunkQ } = this;
    for (let j = 1; j < m; j++) {
      const v = keys[j];
      const e = errors[j];
      const q = ids[j];
      let i = j - 1;
      for (; i >= 0; i--) {
        const d = keys[i] - v;
        const tol = errors[i] + e;
        if (d < -tol || (d <= tol && this.compareExact(ids[i], q) <= 0)) break;
        chunkP[this.chunkLength] = ids[i];
        chunkQ[this.chunkLength] = q;
        if (++this.chunkLength === CHUNK) this.flush();
        keys[i + 1] = keys[i];
        errors[i + 1] = errors[i];
        ids[i + 1] = ids[i];
      }
      keys[i + 1] = v;
      errors[i + 1] = e;
      ids[i + 1] = q;
    }
    this.flush();
  }

  /** Keys y − T·x (T = ±∞: ∓x) of the points in i1, with a bound on their rounding error. */
  private setKeys(t: number, m: number): void {
    this.threshold = t;
    const { pa, pb, i1, k1, e1 } = this;
    if (t === Infinity || t === -Infinity) {
      const sign = t === Infinity ? -1 : 1;
      for (let s = 0; s < m; s++) { k1[s] = sign * pa[i1[s]]; e1[s] = 0; }
      return;
    }
    for (let s = 0; s < m; s++) {
      const id = i1[s];
      const product = t * pa[id];
      k1[s] = pb[id] - product;
      e1[s] = (Math.abs(pb[id]) + 2 * Math.abs(product)) * 2 ** -50;
    }
  }

  /** Sign of key(P) − key(Q) at the current threshold, exact. */
  private compareExact(p: number, q: number): number {
    const t = this.threshold;
    const { pa, pb } = this;
    if (t === Infinity) return Math.sign(pa[q] - pa[p]);
    if (t === -Infinity) return Math.sign(pa[p] - pa[q]);
    return keyOrder(pb[p], pb[q], pa[p], pa[q], t);
  }


  /**
   * Stable merge sort of i1 by k1 (w1, e1 alongside; exact comparison where the doubles cannot decide);
   * returns the weighted strict inversions, the pairs with real slope below the threshold of the keys.
   */
  private mergeSort(m: number, tally: Float64Array | null = null): number {
    let ka = this.k1, kb = this.k2, ia = this.i1, ib = this.i2, wa = this.w1, wb = this.w2, ea = this.e1, eb = this.e2;
    let count = 0;
    // Runs of RUN by insertion (each shift past a greater key an inversion), then merged.
    for (let lo = 0; lo < m; lo += RUN) {
      const hi = Math.min(lo + RUN, m);
      for (let j = lo + 1; j < hi; j++) {
        const v = ka[j];
        const e = ea[j];
        const id = ia[j];
        const w = wa[j];
        let i = j - 1;
        let greater = 0;
        for (; i >= lo; i--) {
          const d = ka[i] - v;
          const tol = ea[i] + e;
          if (d < -tol || (d <= tol && this.compareExact(ia[i], id) <= 0)) break;
          greater += wa[i];
          if (tally) tally[ia[i]] += w;
          ka[i + 1] = ka[i]; ea[i + 1] = ea[i]; ia[i + 1] = ia[i]; wa[i + 1] = wa[i];
        }
        ka[i + 1] = v; ea[i + 1] = e; ia[i + 1] = id; wa[i + 1] = w;
        count += w * greater;
        if (tally) tally[id] += greater;
      }
    }
    for (let width = RUN; width < m; width *= 2) {
      for (let lo = 0; lo < m; lo += 2 * width) {
        const mid = Math.min(lo + width, m);
        const hi = Math.min(lo + 2 * width, m);
        let rest = 0;
        for (let t = lo; t < mid; t++) rest += wa[t];
        let taken = 0;
        let i = lo;
        let j = mid;
        let k = lo;
        while (i < mid && j < hi) {
          const d = ka[i] - ka[j];
          const tol = ea[i] + ea[j];
          const leftFirst = d < -tol || (d <= tol && this.compareExact(ia[i], ia[j]) <= 0);
          const s = leftFirst ? i++ : j++;
          if (leftFirst) {
            rest -= wa[s];
            if (tally) tally[ia[s]] += taken;
          } else {
            count += wa[s] * rest;
            if (tally) { tally[ia[s]] += rest; taken += wa[s]; }
          }
          kb[k] = ka[s]; ib[k] = ia[s]; wb[k] = wa[s]; eb[k] = ea[s];
          k++;
        }
        if (tally) for (let t = i; t < mid; t++) tally[ia[t]] += taken;
        for (; i < mid; i++, k++) { kb[k] = ka[i]; ib[k] = ia[i]; wb[k] = wa[i]; eb[k] = ea[i]; }
        for (; j < hi; j++, k++) { kb[k] = ka[j]; ib[k] = ia[j]; wb[k] = wa[j]; eb[k] = ea[j]; }
      }
      const tk = ka; ka = kb; kb = tk;
      const ti = ia; ia = ib; ib = ti;
      const tw = wa; wa = wb; wb = tw;
      const te = ea; ea = eb; eb = te;
    }
    this.k1 = ka; this.k2 = kb; this.i1 = ia; this.i2 = ib; this.w1 = wa; this.w2 = wb; this.e1 = ea; this.e2 = eb;
    return count;
  }

  private startSink(kind: number, low: number, high: number, cap = Infinity): void {
    this.sink = kind;
    this.sinkLow = low;
    this.sinkHigh = high;
    this.sinkCap = cap;
    this.overflow = false;
    this.sinkLt = 0;
    this.sinkLe = 0;
    this.chunkLength = 0;
    this.pairs = [];
  }

  /** Pairs (P lower in x-then-y order, Q higher): their slopes by the table's formula, as the sink wants. */
  private flush(): void {
    const { pa, pb, weight, chunkP, chunkQ } = this;
    const count = this.chunkLength;
    this.chunkLength = 0;
    const low = this.sinkLow;
    const high = this.sinkHigh;
    for (let c = 0; c < count; c++) {
      const p = chunkP[c];
      const q = chunkQ[c];
      const dx = pa[q] - pa[p];
      const dy = pb[q] - pb[p];
      const w = weight[p] * weight[q];
      if (dy === -dx) {
        if (this.sink === SINK_EXCLUDED) { this.sinkLt += w; this.pairs.push(p, q); }
        continue;
      }
      const slope = dy / dx;
      if (this.sink === SINK_PAIRS) { if (slope < high) this.pairs.push(p, q); }
      else if (this.sink === SINK_COUNT) {
        if (slope < low) this.sinkLt += w;
        if (slope < high) this.sinkLe += w;
      } else if (this.sink === SINK_COLLECT && slope > low && slope < high) {
        // Past the cap the listing is abandoned (overflow), not kept.
        this.sinkLt += w;
        if (this.sinkLt > this.sinkCap) this.overflow = true;
        if (!this.overflow) this.addEntry(slope, w);
      }
    }
  }

  // ---- thresholds ----

  /**
   * A sample of the valid finite slopes (all of them for few points), sorted; slopes equal as doubles are
   * merged into one threshold (any one of their exact fractions: counts at it are exact all the same).
   */
  private buildPool(size: number): void {
    const { pa, pb, mult, points, rows, rowPoint } = this;
    const all = (points * (points - 1)) / 2 <= 2 * size;
    const capacity = all ? (points * (points - 1)) / 2 : size;
    const dy = new Float64Array(capacity);
    const dx = new Float64Array(capacity);
    const weights = new Float64Array(capacity);
    let count = 0;
    const add = (p: number, q: number, w: number): void => {
      const y = pb[q] - pb[p];
      const x = pa[q] - pa[p];
      if (x === 0 || y === -x) return; // equal x, or left out as −1
      dy[count] = y;
      dx[count] = x;
      weights[count++] = w;
    };
    if (all) {
      for (let p = 0; p < points; p++) for (let q = p + 1; q < points; q++) add(p, q, mult[p] * mult[q]);
    } else {
      const stream = new Xor128(`passing-bablok thresholds ${rows} ${points}`);
      for (let attempt = 0; attempt < 20 * size && count < size; attempt++) {
        const p = rowPoint[stream.nextIndex(rows)];
        const q = rowPoint[stream.nextIndex(rows)];
        if (p !== q) add(Math.min(p, q), Math.max(p, q), 1);
      }
    }
    const value = new Float64Array(count);
    const order = new Int32Array(count);
    for (let s = 0; s < count; s++) { value[s] = dy[s] / dx[s]; order[s] = s; }
    sortIndices(order, value, null);
    let unique = 0;
    for (let r = 0; r < count; r++) if (r === 0 || value[order[r]] !== value[order[r - 1]]) unique++;
    this.poolSize = unique;
    this.poolValue = new Float64Array(unique);
    this.poolDy = new Float64Array(unique);
    this.poolDx = new Float64Array(unique);
    this.sampleBelow = new Float64Array(unique);
    this.sampleUpTo = new Float64Array(unique);
    let k = -1;
    let seen = 0;
    for (let r = 0; r < count; r++) {
      const s = order[r];
      if (r === 0 || value[s] !== value[order[r - 1]]) {
        k++;
        this.poolValue[k] = value[s];
        this.poolDy[k] = dy[s];
        this.poolDx[k] = dx[s];
        this.sampleBelow[k] = seen;
      }
      seen += weights[s];
      this.sampleUpTo[k] = seen;
    }
    this.sampleTotal = seen;
  }
}

/** Stable merge sort of indices by key a, then key b (where given). */
function sortIndices(index: Int32Array, a: ArrayLike<number>, b: ArrayLike<number> | null): void {
  const m = index.length;
  let from: Int32Array = index;
  let to: Int32Array = new Int32Array(m);
  for (let width = 1; width < m; width *= 2) {
    for (let lo = 0; lo < m; lo += 2 * width) {
      const mid = Math.min(lo + width, m);
      const hi = Math.min(lo + 2 * width, m);
      let i = lo;
      let j = mid;
      let k = lo;
      while (i < mid && j < hi) {
        const x = from[i];
        const y = from[j];
        const leftFirst = a[x] < a[y] || (a[x] === a[y] && (b === null || b[x] <= b[y]));
        to[k++] = leftFirst ? from[i++] : from[j++];
      }
      while (i < mid) to[k++] = from[i++];
      while (j < hi) to[k++] = from[j++];
    }
    const t = from; from = to; to = t;
  }
  if (from !== index) index.set(from);
}

/** Σ w_P·w_Q over a list of point pairs. */
function pairWeight(pairs: Int32Array, w: Float64Array): number {
  let sum = 0;
  for (let k = 0; k < pairs.length; k += 2) sum += w[pairs[k]] * w[pairs[k + 1]];
  return sum;
}

/** A double below which every real slope gives a table slope below t (3.01·2^-53 relative, with room). */
function below(t: number): number {
  return t - Math.max(Math.abs(t) * 2 ** -49, 2 ** -460);
}

/** A double from which on every real slope gives a table slope of at least t. */
function above(t: number): number {
  return t + Math.max(Math.abs(t) * 2 ** -49, 2 ** -460);
}

const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);

/** The next double above t (t finite). */
export function nextUp(t: number): number {
  if (t === 0) return Number.MIN_VALUE;
  bits[0] = t;
  // Little-endian: words[0] low, words[1] high.
  if (t > 0) {
    if (words[0] === 0xffffffff) { words[0] = 0; words[1]++; } else words[0]++;
  } else if (words[0] === 0) { words[0] = 0xffffffff; words[1]--; } else words[0]--;
  return bits[0];
}

/**
 * Exact sign of (yp − t·xp) − (yq − t·xq) for doubles in the 'general' range (values 0 or 2^-200 to 2^200,
 * |t| 2^-460 to 2^460). The doubles decide when the difference exceeds 2^-50·(|Δy| + |t·Δx|) (the
 * rounding of Δy, t·Δx and their difference is below 3.1·2^-53 of that); otherwise exactSign does.
 */
export function keyOrder(yp: number, yq: number, xp: number, xq: number, t: number): number {
  const dy = yp - yq;
  const product = t * (xp - xq);
  const d = dy - product;
  const bound = (Math.abs(dy) + Math.abs(product)) * 2 ** -50;
  if (d > bound) return 1;
  if (d < -bound) return -1;
  return exactSign(yp, yq, xp, xq, t);
}

const expansion = new Float64Array(16);
const terms = new Float64Array(6);

/**
 * Exact sign of (yp − yq) − t·(xp − xq) for doubles in the 'general' range: the differences and products
 * split into error-free sums of doubles (Knuth's two-sum; Dekker (1971), "A floating-point technique for
 * extending the available precision", Numer. Math. 18, 224–242, two-product), added as a non-overlapping
 * expansion (Shewchuk (1997), "Adaptive precision floating-point arithmetic and fast robust geometric
 * predicates", Discrete Comput. Geom. 18, 305–363), whose largest part carries the sign.
 */
export function exactSign(yp: number, yq: number, xp: number, xq: number, t: number): number {
  let s = yp - yq;
  let v = yp - s;
  terms[0] = s;
  terms[1] = (yp - (s + v)) + (v - yq);
  s = xp - xq;
  v = xp - s;
  const dx = s;
  const ex = (xp - (s + v)) + (v - xq);
  twoProduct(t, dx, terms, 2);
  twoProduct(t, ex, terms, 4);
  terms[2] = -terms[2];
  terms[3] = -terms[3];
  terms[4] = -terms[4];
  terms[5] = -terms[5];
  let length = 0;
  for (let k = 0; k < 6; k++) {
    let q = terms[k];
    let kept = 0;
    for (let e = 0; e < length; e++) {
      const h = expansion[e];
      const sum = q + h;
      const bv = sum - q;
      const err = (q - (sum - bv)) + (h - bv);
      q = sum;
      if (err !== 0) expansion[kept++] = err;
    }
    if (q !== 0) expansion[kept++] = q;
    length = kept;
  }
  return length === 0 ? 0 : Math.sign(expansion[length - 1]);
}

const SPLITTER = 134217729; // 2^27 + 1

function twoProduct(a: number, b: number, out: Float64Array, at: number): void {
  const p = a * b;
  let c = SPLITTER * a;
  const aHigh = c - (c - a);
  const aLow = a - aHigh;
  c = SPLITTER * b;
  const bHigh = c - (c - b);
  const bLow = b - bHigh;
  out[at] = p;
  out[at + 1] = ((aHigh * bHigh - p) + aHigh * bLow + aLow * bHigh) + aLow * bLow;
}
