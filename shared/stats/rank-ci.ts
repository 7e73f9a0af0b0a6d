import { binomialCdf, binomialLogPmf } from './binomial';

/**
 * Nonparametric CI of a percentile by binomial ranks (distribution-free; W. R. Thompson (1936), Ann. Math.
 * Statist. 7, 122–128; the method of CLSI EP28-A3c practice). Equal-tailed, with α = (1 − level)/2 and
 * B ~ Binomial(n, p): the lower rank is the largest r with P(B ≤ r − 1) ≤ α and the upper rank the
 * smallest s with P(B ≥ s) ≤ α; the CI is [x(r), x(s)], coverage at least level. At n = 120, level 0.90:
 * ranks 1–7 for the 2.5th percentile and 114–120 for the 97.5th. Null when no such rank exists in 1..n
 * (n < 119 for the 2.5th and 97.5th percentiles at 90%, since 0.975^n must be at most 0.05).
 */
export interface RankInterval {
  lowerRank: number;
  upperRank: number;
  coverage: number;
}

export function binomialRankCi(n: number, p: number, level = 0.9): RankInterval | null {
  if (!(p > 0 && p < 1)) throw new RangeError('binomialRankCi requires 0 < p < 1');
  const alpha = (1 - level) / 2;
  let lowerRank = 0;
  let below = 0; // P(B <= r - 1), accumulated term by term
  for (let r = 1; r <= n; r++) {
    below += Math.exp(binomialLogPmf(r - 1, n, p));
    if (below > alpha) break;
    lowerRank = r;
  }
  let upperRank = 0;
  let above = 0; // P(B >= s)
  for (let s = n; s >= 1; s--) {
    above += Math.exp(binomialLogPmf(s, n, p));
    if (above > alpha) break;
    upperRank = s;
  }
  if (lowerRank === 0 || upperRank === 0 || lowerRank >= upperRank) return null;
  const coverage = binomialCdf(upperRank - 1, n, p) - binomialCdf(lowerRank - 1, n, p);
  return { lowerRank, upperRank, coverage };
}
