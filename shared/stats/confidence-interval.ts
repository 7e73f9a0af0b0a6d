import { jStat } from 'jstat';

/**
 * Bootstrap confidence intervals from the replicates, computed as R's boot package does
 * (A. C. Davison and D. V. Hinkley (1997), Bootstrap Methods and their Application, Cambridge, §5.3;
 * boot's norm.inter, perc.ci and bca.ci):
 * - quantile of B replicates at level α: the order statistic at rank (B + 1)α, interpolated on the
 *   normal-quantile scale between ranks k and k + 1 (norm.inter); ranks outside 1..B use the extremes;
 * - percentile interval: [q((1 − level)/2), q((1 + level)/2)];
 * - BCa (B. Efron (1987), JASA 82(397), 171–185): bias correction z0 = Φ⁻¹(#{t* < t} / B), counting the
 *   replicates strictly below the estimate, as boot does; acceleration from the jackknife,
 *   a = Σ L³ / (6 (Σ L²)^1.5) with L_i = θ̄(·) − θ(−i); limits q(Φ(z0 + (z0 + z_α)/(1 − a(z0 + z_α)))).
 */
export type Interval = [number, number];

function qnorm(p: number): number {
  return jStat.normal.inv(p, 0, 1);
}

function pnorm(z: number): number {
  return jStat.normal.cdf(z, 0, 1);
}

/** boot's norm.inter for one α on ascending replicates. */
export function bootQuantileSorted(sorted: Float64Array, alpha: number): number {
  const B = sorted.length;
  const rank = (B + 1) * alpha;
  const k = Math.trunc(rank);
  if (k <= 0) return sorted[0];
  if (k >= B) return sorted[B - 1];
  if (k === rank) return sorted[k - 1];
  const z = qnorm(alpha);
  const zk = qnorm(k / (B + 1));
  const zk1 = qnorm((k + 1) / (B + 1));
  return sorted[k - 1] + ((z - zk) / (zk1 - zk)) * (sorted[k] - sorted[k - 1]);
}

/** @param sorted ascending replicates */
export function percentileInterval(sorted: Float64Array, level: number): Interval {
  return [bootQuantileSorted(sorted, (1 - level) / 2), bootQuantileSorted(sorted, (1 + level) / 2)];
}

/** Jackknife acceleration; 0 when every leave-one-out value is the same (no skewness to correct). */
export function jackknifeAcceleration(jackknife: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < jackknife.length; i++) m += jackknife[i];
  m /= jackknife.length;
  let s2 = 0;
  let s3 = 0;
  for (let i = 0; i < jackknife.length; i++) {
    const L = m - jackknife[i];
    s2 += L * L;
    s3 += L * L * L;
  }
  return s2 === 0 ? 0 : s3 / (6 * Math.pow(s2, 1.5));
}

/**
 * @param sorted ascending replicates; @param estimate the statistic of the data;
 * @param jackknife the leave-one-out values. Returns null when z0 is infinite (every replicate on one
 * side of the estimate), where boot stops with an error.
 */
export function bcaInterval(
  sorted: Float64Array, estimate: number, jackknife: ArrayLike<number>, level: number,
): Interval | null {
  const B = sorted.length;
  let below = 0;
  while (below < B && sorted[below] < estimate) below++;
  if (below === 0 || below === B) return null;
  const z0 = qnorm(below / B);
  const a = jackknifeAcceleration(jackknife);
  const limit = (alpha: number): number => {
    const z = z0 + qnorm(alpha);
    return bootQuantileSorted(sorted, pnorm(z0 + z / (1 - a * z)));
  };
  return [limit((1 - level) / 2), limit((1 + level) / 2)];
}
