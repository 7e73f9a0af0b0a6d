import { pairSums, type PairSums } from './pair-sums';

/**
 * Deming regression in closed form (W. E. Deming (1943), Statistical Adjustment of Data; formula as in
 * C. Cornbleet and N. Gochman (1979), Clin. Chem. 25(3), 432–438, and K. Linnet (1998), Clin. Chem. 44(5),
 * 1024–1031). Convention used throughout Parallax: λ = σ²(x error) / σ²(y error), the comparative method's
 * error variance over the candidate's (λ = 1: equal errors, orthogonal regression). With centred sums
 * Sxx, Syy, Sxy:
 *   b = [λ·Syy − Sxx + sqrt((λ·Syy − Sxx)² + 4λ·Sxy²)] / (2λ·Sxy),  a = ȳ − b·x̄.
 * (With δ = 1/λ = σ²y/σ²x this is the usual [Syy − δSxx + sqrt((Syy − δSxx)² + 4δSxy²)]/(2Sxy).)
 * Returns NaN slope when Sxy = 0 (no linear relation to estimate); callers report that as not estimable.
 */
export interface LineFit {
  slope: number;
  intercept: number;
}

export function demingFromSums(s: PairSums, lambda: number): LineFit {
  if (!(lambda > 0)) throw new RangeError('deming requires an error-variance ratio λ > 0');
  if (s.sxy === 0 || s.sxx === 0) return { slope: NaN, intercept: NaN };
  const u = lambda * s.syy - s.sxx;
  const slope = (u + Math.sqrt(u * u + 4 * lambda * s.sxy * s.sxy)) / (2 * lambda * s.sxy);
  return { slope, intercept: s.meanY - slope * s.meanX };
}

export function deming(x: ArrayLike<number>, y: ArrayLike<number>, lambda = 1, weights: ArrayLike<number> | null = null): LineFit {
  return demingFromSums(pairSums(x, y, weights), lambda);
}

/** Ordinary least squares of y on x (for reference), with Pearson's r. */
export function olsFromSums(s: PairSums): LineFit & { r: number } {
  if (s.sxx === 0) return { slope: NaN, intercept: NaN, r: NaN };
  const slope = s.sxy / s.sxx;
  const r = s.syy === 0 ? NaN : s.sxy / Math.sqrt(s.sxx * s.syy);
  return { slope, intercept: s.meanY - slope * s.meanX, r };
}

export function ols(x: ArrayLike<number>, y: ArrayLike<number>, weights: ArrayLike<number> | null = null): LineFit & { r: number } {
  return olsFromSums(pairSums(x, y, weights));
}
