import { binomialCdf } from './binomial';

/**
 * Exact sign test of the median difference against 0 (W. J. Dixon and A. M. Mood (1946), JASA 41,
 * 557–566): zero differences are dropped; with m non-zero differences of which k are positive,
 * p = min(1, 2 · P(B ≤ min(k, m − k))), B ~ Binomial(m, 1/2), the two-sided exact p-value that R's
 * binom.test and scipy's binomtest give for p = 1/2. p is null when no difference is non-zero.
 * Differences should already be rounded to the inputs' precision (differences.ts), so zeros are exact.
 */
export interface SignTest {
  positive: number;
  negative: number;
  zeros: number;
  pValue: number | null;
}

export function signTest(differences: ArrayLike<number>): SignTest {
  let positive = 0;
  let negative = 0;
  for (let i = 0; i < differences.length; i++) {
    if (differences[i] > 0) positive++;
    else if (differences[i] < 0) negative++;
  }
  const m = positive + negative;
  const zeros = differences.length - m;
  const pValue = m === 0 ? null : Math.min(1, 2 * binomialCdf(Math.min(positive, negative), m, 0.5));
  return { positive, negative, zeros, pValue };
}
