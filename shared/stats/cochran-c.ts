import { jStat } from 'jstat';

/**
 * Cochran's C test for the largest of k variances, each from n results: C = s²_max / Σ s²_i, significant when
 * C exceeds C_crit = 1 / (1 + (k − 1)/F(1 − α/k; n − 1, (n − 1)(k − 1))).
 * Sources: W. G. Cochran (1941), Ann. Eugenics 11, 47–52 (the test); the critical value from the F quantile is the
 * usual Bonferroni-type form, quoted with ISO 5725-2:1994 §7.3.3, where the test screens laboratories' replicate
 * scatter at α = 0.01 ("outlier") and 0.05 ("straggler") (from memory); checked against the standard's printed
 * table in cochran-c.spec.ts.
 * With unequal group sizes the smallest n is used (the test then errs towards flagging less; stated in the findings).
 * Returns null with fewer than 3 groups of 2 or more results, or when every variance is 0.
 */
export function cochranC(variances: number[], n: number, alpha: number): { c: number; critical: number; index: number; significant: boolean } | null {
  const k = variances.length;
  if (k < 3 || n < 2) return null;
  let sum = 0;
  let index = 0;
  for (let i = 0; i < k; i++) {
    sum += variances[i];
    if (variances[i] > variances[index]) index = i;
  }
  if (!(sum > 0)) return null;
  const c = variances[index] / sum;
  const f = jStat.centralF.inv(1 - alpha / k, n - 1, (n - 1) * (k - 1));
  const critical = 1 / (1 + (k - 1) / f);
  return { c, critical, index, significant: c > critical };
}
