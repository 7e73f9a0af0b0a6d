import { jStat } from 'jstat';
import type { OneWayAnova } from './one-way-anova';
import type { VarianceComponents } from './precision-components';

export interface TruenessCheck {
  /** bias = x̄ − TV, and 100·bias/|TV| in % (same sign as the bias; NaN, shown as null, when TV = 0). */
  bias: number;
  biasPercent: number;
  /** Standard error of the grand mean and its Satterthwaite degrees of freedom. */
  se: number;
  seDf: number;
  /** Effective degrees of freedom of √(SE² + u²) (Welch–Satterthwaite, u taken as exactly known in its df). */
  df: number;
  /** t(1 − α/(2ℓ); df), the multiplier of √(SE² + u²). */
  multiplier: number;
  interval: { lower: number; upper: number };
  verdict: 'verified' | 'not-verified';
}

/**
 * Trueness against a material with an assigned value TV and standard uncertainty u (CLSI EP15-A3 practice as
 * the design notes state it, DOMAIN.md "Precision"; from memory):
 *   bias = x̄ − TV;  SE² = s_b²·Σn_i²/N² + s_r²/N, the variance of the grand mean x̄ = ΣΣx_ij/N under the
 *   one-way random model (Var x̄ = σ_b²·Σn_i²/N² + σ_r²/N);
 *   verification interval TV ± t(1 − α/(2ℓ); ν)·√(SE² + u²); 'verified' when x̄ lies in it (ends included).
 *
 * Which ν (our choice, documented here and in shared/stats/README.md):
 * 1. The SE's own degrees of freedom by Satterthwaite (1946): with s_b² = (MS_B − MS_W)/n0 and s_r² = MS_W,
 *    SE² = A·MS_B + B·MS_W with A = Σn_i²/(N²·n0) and B = 1/N − A (B ≤ 0, and B = 0 in a balanced design), so
 *    ν_SE = SE⁴ / ((A·MS_B)²/(k − 1) + (B·MS_W)²/(N − k)). In a balanced design SE² = MS_B/N and ν_SE = k − 1
 *    exactly: the grand mean's uncertainty rests on the k day means, so its df are those of the days, not
 *    ν_WL (which counts the replicates and would make the interval too narrow when days differ).
 *    When s_b² is clipped to 0, SE² = s_r²/N with ν_SE = N − k, as for s_WL.
 * 2. The combined √(SE² + u²) by Welch–Satterthwaite (JCGM 100:2008, GUM, G.4.1; from memory), the assigned
 *    value's u counted with infinite degrees of freedom (a certificate's uncertainty; common practice):
 *    ν = (SE² + u²)² / (SE⁴/ν_SE). With u = 0 this is ν_SE; a larger u moves t toward the normal quantile.
 *    When SE = 0 (all results equal) ν = ν_SE. Beyond 10^7 df the normal quantile is used (jStat's t
 *    quantile loses accuracy there; the two agree to 1e-6).
 * @throws RangeError for u < 0, a non-finite TV, α outside (0, 1) or ℓ < 1
 */
export function truenessCheck(
  anova: OneWayAnova, components: VarianceComponents,
  assigned: number, uncertainty: number, alpha: number, materials: number,
): TruenessCheck {
  if (!Number.isFinite(assigned) || !(uncertainty >= 0) || !(alpha > 0 && alpha < 1) || !(materials >= 1)) {
    throw new RangeError('truenessCheck requires a finite TV, u ≥ 0, 0 < α < 1 and ℓ ≥ 1');
  }
  const { n, groupSizes, n0, msBetween, msWithin, dfBetween, dfWithin, mean } = anova;
  let squares = 0;
  for (const s of groupSizes) squares += s * s;
  let variance: number;
  let seDf: number;
  if (components.betweenClipped) {
    variance = components.repeatability.variance / n;
    seDf = dfWithin;
  } else {
    variance = (components.betweenDay.variance * squares) / (n * n) + components.repeatability.variance / n;
    const a = squares / (n * n * n0);
    const b = 1 / n - a;
    seDf = variance ** 2 / ((a * msBetween) ** 2 / dfBetween + (b * msWithin) ** 2 / dfWithin);
  }
  const combined = variance + uncertainty * uncertainty;
  const df = variance > 0 ? combined ** 2 / (variance ** 2 / seDf) : seDf;
  const p = 1 - alpha / (2 * materials);
  const multiplier = df > 1e7 ? jStat.normal.inv(p, 0, 1) : jStat.studentt.inv(p, df);
  const half = multiplier * Math.sqrt(combined);
  const interval = { lower: assigned - half, upper: assigned + half };
  const bias = mean - assigned;
  return {
    bias,
    biasPercent: assigned === 0 ? NaN : (100 * bias) / Math.abs(assigned),
    se: Math.sqrt(variance),
    seDf,
    df,
    multiplier,
    interval,
    verdict: mean >= interval.lower && mean <= interval.upper ? 'verified' : 'not-verified',
  };
}
