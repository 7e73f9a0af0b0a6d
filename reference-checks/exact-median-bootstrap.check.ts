import { medianFromCounts } from '@shared/stats/counts-stats';
import { streamFor } from '@shared/stats/rng';
import { shiftedNullTest } from '@shared/stats/shifted-null-test';
import { fixture } from './support';

// Source: J. S. Maritz and R. G. Jarrett (1978), "A note on estimating the variance of the sample median",
// JASA 73(361), 194–196 (from memory): for odd n = 2m − 1 the bootstrap median is x(k) with
// P(median* ≤ x(k)) = P(Binomial(n, k/n) ≥ m). The exact CDF for an invented sample of n = 21 was evaluated
// with scipy.stats.binom (make-fixtures/make_scipy_fixtures.py). Check: the Monte Carlo tail counts of the
// shifted-null test agree with the exact tails within 4 Monte Carlo standard errors, sqrt(p(1 − p)/B).
const { sorted, cdfAtOrder } = fixture('scipy.json').exactMedian;
const B = 40_000;

function exactTail(sortedValues: number[], cdf: number[], cutoff: number, upper: boolean): number {
  let p = 0;
  sortedValues.forEach((v, k) => {
    const mass = cdf[k] - (k > 0 ? cdf[k - 1] : 0);
    if (upper ? v >= cutoff - 1e-9 : v <= cutoff + 1e-9) p += mass;
  });
  return p;
}

describe('shifted-null median test against the exact bootstrap distribution (Maritz & Jarrett 1978)', () => {
  const data = Float64Array.from(sorted);
  const observed = data[(data.length - 1) / 2];
  it.each([0.15, 0.3, 0.6])('null = median − %s: both tails within 4 Monte Carlo SE of the exact ones', (offset) => {
    const nullValue = observed - offset;
    const test = shiftedNullTest(data, medianFromCounts, nullValue, { resamples: B, stream: streamFor('maritz-jarrett', String(offset)) });
    // t* = median*(x) − observed + null, so the tails are those of median*(x) at observed ± offset
    const upper = exactTail(sorted, cdfAtOrder, observed + offset, true);
    const lower = exactTail(sorted, cdfAtOrder, observed - offset, false);
    for (const [count, p] of [[test.upperCount, upper], [test.lowerCount, lower]]) {
      const se = Math.sqrt((p * (1 - p)) / B);
      expect(Math.abs(count / B - p)).toBeLessThanOrEqual(4 * se + 1 / B);
    }
    expect(upper + lower).toBeGreaterThan(0.01);
  });
});
