import { jStat } from 'jstat';
import { midRanks } from './ranks';
import { pairSums } from './pair-sums';

/** Pearson's product-moment correlation r (null without spread in x or y). */
export function pearson(x: ArrayLike<number>, y: ArrayLike<number>): number | null {
  const s = pairSums(x, y, null);
  return s.sxx === 0 || s.syy === 0 ? null : s.sxy / Math.sqrt(s.sxx * s.syy);
}

/**
 * Spearman's rank correlation (Pearson's r of the mid-ranks; C. Spearman (1904), Am. J. Psychol. 15, 72–101)
 * with the two-sided p-value of t = r·sqrt((n − 2)/(1 − r²)) on n − 2 degrees of freedom (the usual
 * large-sample approximation). Null when n < 4 or either variable has no spread.
 */
export function spearman(x: ArrayLike<number>, y: ArrayLike<number>): { rho: number; pValue: number } | null {
  const n = x.length;
  if (n < 4) return null;
  const rho = pearson(midRanks(x).ranks, midRanks(y).ranks);
  if (rho === null) return null;
  if (Math.abs(rho) >= 1) return { rho, pValue: 0 };
  const t = rho * Math.sqrt((n - 2) / (1 - rho * rho));
  return { rho, pValue: 2 * (1 - jStat.studentt.cdf(Math.abs(t), n - 2)) };
}
