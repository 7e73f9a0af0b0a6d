import { jStat } from 'jstat';
import type { Interval } from './confidence-interval';
import { median } from './quantile';
import { slopeOrder, type SlopeOrder } from './slope-selection';

/**
 * Passing–Bablok regression (H. Passing and W. Bablok (1983), "A new biometrical procedure for testing the
 * equality of measurements from two different analytical methods", J. Clin. Chem. Clin. Biochem. 21,
 * 709–720). With the N valid pairwise slopes in ascending order (slope-table.ts; S(k) 1-based, read by
 * selection without listing them, slope-selection.ts) and K of them below −1:
 *   slope b = S((N + 1)/2 + K) for N odd, ½[S(N/2 + K) + S(N/2 + 1 + K)] for N even;
 *   CI: C = z(1 − α/2) · sqrt(n(n − 1)(2n + 5)/18), M1 = round((N − C)/2), M2 = N − M1 + 1,
 *       [S(M1 + K), S(M2 + K)];
 *   intercept a = median(y − b·x), CI [median(y − b_upper·x), median(y − b_lower·x)].
 * A CI whose ranks fall outside 1..N is null (too few pairs). Without negative slopes (K = 0) this is the
 * Theil–Sen estimator with Sen's (1968) interval (checked against scipy's theilslopes).
 */
export interface PassingBablok {
  slope: number;
  slopeCi: Interval | null;
  intercept: number;
  interceptCi: Interval | null;
  slopeCount: number;
  belowMinusOne: number;
}

export function passingBablok(x: ArrayLike<number>, y: ArrayLike<number>, level = 0.95, slopes?: SlopeOrder): PassingBablok {
  const n = x.length;
  if (n < 2 || y.length !== n) throw new RangeError('passingBablok requires at least two pairs of equal length');
  const order = slopes ?? slopeOrder(x, y);
  const { total: N, below: K } = order.weigh(null);
  if (N === 0) throw new RangeError('passingBablok requires at least one defined pairwise slope');
  const S = (rank: number): number => order.at(rank);
  const slope = N % 2 === 1 ? S((N + 1) / 2 + K) : (S(N / 2 + K) + S(N / 2 + 1 + K)) / 2;
  if (!Number.isFinite(slope)) throw new RangeError('passingBablok requires spread in x (the median slope is infinite)');
  const C = jStat.normal.inv((1 + level) / 2, 0, 1) * Math.sqrt((n * (n - 1) * (2 * n + 5)) / 18);
  const M1 = Math.round((N - C) / 2);
  const M2 = N - M1 + 1;
  const inRange = M1 + K >= 1 && M2 + K <= N && M1 <= M2;
  const slopeCi: Interval | null = inRange ? [S(M1 + K), S(M2 + K)] : null;
  const intercept = interceptFor(x, y, slope);
  const interceptCi: Interval | null =
    slopeCi && Number.isFinite(slopeCi[0]) && Number.isFinite(slopeCi[1])
      ? [interceptFor(x, y, slopeCi[1]), interceptFor(x, y, slopeCi[0])]
      : null;
  return { slope, slopeCi, intercept, interceptCi, slopeCount: N, belowMinusOne: K };
}

function interceptFor(x: ArrayLike<number>, y: ArrayLike<number>, slope: number): number {
  const residual = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) residual[i] = y[i] - slope * x[i];
  return median(residual);
}
