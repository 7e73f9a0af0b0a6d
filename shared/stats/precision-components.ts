import { jStat } from 'jstat';
import type { OneWayAnova } from './one-way-anova';

/** Repeatability, between-day and within-laboratory variance components of a one-way design by day. */
export interface VarianceComponents {
  repeatability: { variance: number; sd: number; df: number };
  betweenDay: { variance: number; sd: number };
  withinLab: { variance: number; sd: number; df: number };
  /** True when MS_B ≤ MS_W, so that s_b² was set to 0 (and s_WL = s_r with ν_WL = N − k). */
  betweenClipped: boolean;
}

/**
 * Precision components by the ANOVA (method-of-moments) estimators, CLSI EP15-A3 practice (from memory, as
 * the design notes state it, DOMAIN.md "Precision"):
 *   s_r² = MS_W (repeatability), ν_r = N − k;
 *   s_b² = max(0, (MS_B − MS_W)/n0) (between-day), n0 = (N − Σn_i²/N)/(k − 1) (one-way-anova.ts);
 *   s_WL² = s_r² + s_b² (within-laboratory).
 * ν_WL by Satterthwaite's approximation for the linear combination s_WL² = a·MS_B + b·MS_W with a = 1/n0,
 * b = 1 − 1/n0: ν_WL = (a·MS_B + b·MS_W)² / ((a·MS_B)²/(k − 1) + (b·MS_W)²/(N − k))
 * (F. E. Satterthwaite (1946), "An approximate distribution of estimates of variance components",
 * Biometrics Bulletin 2(6), 110–114). When s_b² is clipped to 0, s_WL = s_r and ν_WL = N − k.
 * ν_WL lies between min(k − 1, N − k) and N − 1 and is in general not an integer.
 */
export function precisionComponents(anova: OneWayAnova): VarianceComponents {
  const { msBetween, msWithin, n0, dfBetween, dfWithin } = anova;
  const repeatability = { variance: msWithin, sd: Math.sqrt(msWithin), df: dfWithin };
  const betweenClipped = !(msBetween > msWithin);
  if (betweenClipped) {
    return {
      repeatability,
      betweenDay: { variance: 0, sd: 0 },
      withinLab: { variance: msWithin, sd: Math.sqrt(msWithin), df: dfWithin },
      betweenClipped,
    };
  }
  const between = (msBetween - msWithin) / n0;
  const a = 1 / n0;
  const b = 1 - 1 / n0;
  const withinLab = msWithin + between;
  const df = (a * msBetween + b * msWithin) ** 2 / ((a * msBetween) ** 2 / dfBetween + (b * msWithin) ** 2 / dfWithin);
  return {
    repeatability,
    betweenDay: { variance: between, sd: Math.sqrt(between) },
    withinLab: { variance: withinLab, sd: Math.sqrt(withinLab), df },
    betweenClipped,
  };
}

/**
 * Two-sided (1 − α) confidence interval of a standard deviation s with ν degrees of freedom, from
 * ν·s²/σ² ~ χ²(ν): s·√(ν/χ²(1 − α/2; ν)) to s·√(ν/χ²(α/2; ν)). Non-integer ν (Satterthwaite) is used as it
 * is: the χ² quantile is jStat's inverse of the regularised incomplete gamma function, which takes any ν > 0
 * (checked against R's qchisq in reference-checks/precision-r.check.ts).
 * Source: the χ² interval for the SD of a normal sample (NIST/SEMATECH e-Handbook of Statistical Methods,
 * §1.3.5.8, "Chi-Square Test for the Standard Deviation"; from memory); CLSI EP15-A3 practice as stated in
 * DOMAIN.md (from memory).
 * @throws RangeError if s < 0, ν ≤ 0 or α is outside (0, 1)
 */
export function sdConfidenceInterval(sd: number, df: number, alpha: number): { lower: number; upper: number } {
  if (!(sd >= 0) || !(df > 0) || !(alpha > 0 && alpha < 1)) throw new RangeError('sdConfidenceInterval requires s ≥ 0, ν > 0 and 0 < α < 1');
  return {
    lower: sd * Math.sqrt(df / jStat.chisquare.inv(1 - alpha / 2, df)),
    upper: sd * Math.sqrt(df / jStat.chisquare.inv(alpha / 2, df)),
  };
}

/** Coefficient of variation in %: CV = 100·s/|x̄| (NaN when x̄ = 0, which JSON shows as null). */
export function coefficientOfVariation(sd: number, mean: number): number {
  return mean === 0 ? NaN : (100 * sd) / Math.abs(mean);
}
