import { binomialCdf } from './binomial';
import { integerOption, numberListOption, OptionError } from './options';

/**
 * How often the transference rule accepts a stated reference interval, as a function of the true fraction of the
 * local population outside it (the binomial distribution; CLSI EP28-A3c practice for the rule, from memory:
 * accept when at most k of n fall outside, k = 10% of n; when more fall outside, test n more and accept when
 * at most k of those fall outside).
 *   acceptFirst      = P(X ≤ k),                     X ~ Binomial(n, p)
 *   acceptWithRetest = P(X ≤ k) + P(X > k)·P(X' ≤ k), X' ~ Binomial(retest, p), the retest judged on its own
 * With n = 20, k = 2 and p = 10%: 67.7% and 89.6%; the rule is weak against a population shifted so that a
 * tenth falls outside (reference-checks/plan.check.ts checks these against scipy.stats.binom).
 */
export interface TransferencePlanOptions {
  n?: number;
  maxOutside?: number;
  /** Individuals tested at the retest (default n). */
  retest?: number;
  /** The true fractions outside (0 to 1). */
  outside?: number[];
}

export interface TransferencePlanRow { trueOutside: number; acceptFirst: number; acceptWithRetest: number }

export interface TransferencePlanResult {
  kind: 'plan-transference';
  n: number;
  maxOutside: number;
  retest: number;
  rows: TransferencePlanRow[];
}

export const TRANSFERENCE_OUTSIDE = [0.025, 0.05, 0.075, 0.1, 0.125, 0.15, 0.2, 0.25] as const;

/** The largest number outside the rule allows: 10% of n (2 of 20). */
export const allowedOutside = (n: number): number => Math.floor(0.1 * n + 1e-9);

/** @throws OptionError naming the first bad option */
export function planTransference(o: TransferencePlanOptions = {}): TransferencePlanResult {
  const n = integerOption('n', o.n, 20, 1, 10_000);
  const maxOutside = integerOption('maxOutside', o.maxOutside, allowedOutside(n), 0, n);
  const retest = integerOption('retest', o.retest, n, 1, 10_000);
  if (maxOutside > retest) throw new OptionError('maxOutside', `must be at most the retest's size (${retest})`);
  const outside = numberListOption('outside', o.outside ?? [...TRANSFERENCE_OUTSIDE], (v) => v >= 0 && v <= 1, 'a fraction from 0 to 1');
  if (outside.length === 0) throw new OptionError('outside', 'must list at least one fraction');
  return {
    kind: 'plan-transference', n, maxOutside, retest,
    rows: outside.map((p) => {
      const first = binomialCdf(maxOutside, n, p);
      return { trueOutside: p, acceptFirst: first, acceptWithRetest: first + (1 - first) * binomialCdf(maxOutside, retest, p) };
    }),
  };
}
