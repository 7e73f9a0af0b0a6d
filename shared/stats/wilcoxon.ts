import { jStat } from 'jstat';
import { midRanks } from './ranks';

/**
 * Wilcoxon signed-rank test of the differences against 0 (F. Wilcoxon (1945), Biometrics Bull. 1, 80–83).
 * Zero differences are dropped (Wilcoxon's convention); |d| ranked with mid-ranks; V = sum of the ranks of
 * the positive differences, with m the number of non-zero differences.
 * - exact when m < 50 and no |d| are tied: the null distribution of V counted by dynamic programming
 *   over the ranks 1..m; p = min(1, 2 · min(P(V ≤ v), P(V ≥ v)));
 * - otherwise the normal approximation with tie correction and continuity correction:
 *   z = (V − m(m + 1)/4 − ½·sign) / sqrt(m(m + 1)(2m + 1)/24 − Σ(t³ − t)/48).
 * This is the rule of R's wilcox.test (exact below 50 without ties, correct = TRUE) applied after the
 * zeros are dropped. p is null when fewer than one non-zero difference remains.
 */
export interface WilcoxonTest {
  statistic: number | null;
  n: number;
  method: 'exact' | 'normal' | null;
  pValue: number | null;
}

export function wilcoxonSignedRank(differences: ArrayLike<number>): WilcoxonTest {
  const nonZero = Array.from(differences).filter((d) => d !== 0);
  const m = nonZero.length;
  if (m === 0) return { statistic: null, n: 0, method: null, pValue: null };
  const { ranks, tieSizes } = midRanks(nonZero.map(Math.abs));
  let v = 0;
  for (let i = 0; i < m; i++) if (nonZero[i] > 0) v += ranks[i];
  if (m < 50 && tieSizes.length === 0) return { statistic: v, n: m, method: 'exact', pValue: exactSignedRankP(v, m) };
  const centre = (m * (m + 1)) / 4;
  const tieTerm = tieSizes.reduce((s, t) => s + t ** 3 - t, 0) / 48;
  const sigma = Math.sqrt((m * (m + 1) * (2 * m + 1)) / 24 - tieTerm);
  if (sigma === 0) return { statistic: v, n: m, method: 'normal', pValue: 1 };
  const z = (v - centre - 0.5 * Math.sign(v - centre)) / sigma;
  return { statistic: v, n: m, method: 'normal', pValue: Math.min(1, jStat.erfc(Math.abs(z) / Math.SQRT2)) };
}

/** Two-sided exact p-value of V = v for m untied non-zero differences. */
export function exactSignedRankP(v: number, m: number): number {
  const max = (m * (m + 1)) / 2;
  const ways = new Float64Array(max + 1);
  ways[0] = 1;
  for (let rank = 1; rank <= m; rank++) {
    for (let s = max; s >= rank; s--) ways[s] += ways[s - rank];
  }
  const total = Math.pow(2, m);
  let below = 0;
  let above = 0;
  for (let s = 0; s <= max; s++) {
    if (s <= v) below += ways[s];
    if (s >= v) above += ways[s];
  }
  return Math.min(1, (2 * Math.min(below, above)) / total);
}
