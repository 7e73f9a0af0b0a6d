import { jStat } from 'jstat';

/**
 * Binomial probabilities summed term by term from the log-pmf (ln C(n,k) + k ln p + (n − k) ln(1 − p),
 * with jStat.gammaln), so that small tail probabilities keep their relative accuracy.
 * (jStat.binomial.cdf rounds to 1e-10, too coarse for exact sign-test p-values.)
 */
export function binomialLogPmf(k: number, n: number, p: number): number {
  if (k < 0 || k > n) return -Infinity;
  if (p === 0) return k === 0 ? 0 : -Infinity;
  if (p === 1) return k === n ? 0 : -Infinity;
  return jStat.gammaln(n + 1) - jStat.gammaln(k + 1) - jStat.gammaln(n - k + 1) + k * Math.log(p) + (n - k) * Math.log1p(-p);
}

/** P(B ≤ k), B ~ Binomial(n, p). */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n) return 1;
  let sum = 0;
  for (let j = 0; j <= k; j++) sum += Math.exp(binomialLogPmf(j, n, p));
  return Math.min(1, sum);
}

/** P(B ≥ k), B ~ Binomial(n, p). */
export function binomialSf(k: number, n: number, p: number): number {
  if (k <= 0) return 1;
  if (k > n) return 0;
  let sum = 0;
  for (let j = n; j >= k; j--) sum += Math.exp(binomialLogPmf(j, n, p));
  return Math.min(1, sum);
}
