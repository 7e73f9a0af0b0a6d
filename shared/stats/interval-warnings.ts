import type { ResolvedIntervalOptions } from './interval-options';
import type { LimitResult } from './reference-interval';

/**
 * Warnings for an established interval (CLSI EP28-A3c practice, as quoted by Ozarda et al., Clin Chem Lab
 * Med 2019;57:30): fewer than 120 values for the nonparametric method (suggest the robust method for 20 to
 * 119), and a limit whose CI is wider than 0.2 times the interval's width (the 0.2 ratio is from memory).
 */
export function intervalWarnings(n: number, o: ResolvedIntervalOptions, lower: LimitResult | null, upper: LimitResult | null): string[] {
  const out: string[] = [];
  if (o.method === 'nonparametric' && n < 120) {
    out.push(`Only ${n} ${n === 1 ? 'value' : 'values'}: the nonparametric method needs at least 120${n >= 20 ? '; consider the robust method for 20 to 119 values' : ''}.`);
  }
  if (o.method === 'robust' && n >= 120) out.push('With 120 or more values the nonparametric method is preferred to the robust method.');
  const width = lower?.estimate != null && upper?.estimate != null ? upper.estimate - lower.estimate : null;
  for (const limit of [lower, upper]) {
    const ci = limit?.ci;
    if (width !== null && width > 0 && ci && ci[1] - ci[0] > 0.2 * width) {
      out.push(`The ${o.level * 100}% CI of the ${limit!.percentile}th percentile is wider than 0.2 of the interval's width.`);
    }
  }
  return out;
}
