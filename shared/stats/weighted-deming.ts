import { demingFromSums, type LineFit } from './deming';
import { pairSums } from './pair-sums';

/**
 * Weighted Deming regression for errors with constant CV (K. Linnet (1990), "Estimation of the linear
 * relationship between the measurements of two methods with proportional errors", Stat. Med. 9, 1463–1473;
 * the iteration below is our statement of it). With λ = σ²(x error)/σ²(y error) as in deming.ts:
 *   1. weights w_i = 1 / ((x_i + y_i)/2)²;
 *   2. fit the Deming line with weighted sums (deming.ts);
 *   3. estimate each specimen's true values on the line, X̂_i = (x_i + λb(y_i − a))/(1 + λb²),
 *      Ŷ_i = a + bX̂_i (the minimiser of (x_i − X)²/λ + (y_i − a − bX)²), and set w_i = 1/((X̂_i + Ŷ_i)/2)²;
 *   4. repeat 2–3 until the slope changes by less than 1e-12 relatively (at most 50 rounds).
 * The row multiplicities (bootstrap counts) multiply the weights. Needs positive values (weights 1/c²).
 * Returns NaN when a concentration is not positive or the fit is undefined.
 */
export function weightedDeming(
  x: ArrayLike<number>, y: ArrayLike<number>, lambda = 1, multiplicity: ArrayLike<number> | null = null,
  weights: Float64Array = new Float64Array(x.length),
): LineFit & { iterations: number } {
  const n = x.length;
  for (let i = 0; i < n; i++) {
    const c = (x[i] + y[i]) / 2;
    if (!(c > 0)) return { slope: NaN, intercept: NaN, iterations: 0 };
    weights[i] = (multiplicity ? multiplicity[i] : 1) / (c * c);
  }
  let fit = demingFromSums(pairSums(x, y, weights), lambda);
  for (let round = 1; round <= 50; round++) {
    if (!Number.isFinite(fit.slope)) return { ...fit, iterations: round };
    const { slope: b, intercept: a } = fit;
    for (let i = 0; i < n; i++) {
      const trueX = (x[i] + lambda * b * (y[i] - a)) / (1 + lambda * b * b);
      const c = (trueX + a + b * trueX) / 2;
      if (!(c > 0)) return { slope: NaN, intercept: NaN, iterations: round };
      weights[i] = (multiplicity ? multiplicity[i] : 1) / (c * c);
    }
    const next = demingFromSums(pairSums(x, y, weights), lambda);
    const converged = Math.abs(next.slope - b) <= 1e-12 * Math.abs(b);
    fit = next;
    if (converged) return { ...fit, iterations: round };
  }
  return { ...fit, iterations: 50 };
}
