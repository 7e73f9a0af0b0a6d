import { analyzeComparison, bootstrapCi, mean } from '@shared/stats';

// Source: B. Efron and R. J. Tibshirani (1993), An Introduction to the Bootstrap, Chapman & Hall, §6.2
// (from memory): the ideal (B → ∞) bootstrap standard error of the mean is sqrt(Σ(x − x̄)²)/n.
// Tolerance from the simulation size: the bootstrap SE from B resamples has relative standard error about
// 1/sqrt(2B) (the SD of an SD estimate, normal theory); we allow 4 of those.
const values = [4.1, 5.6, 3.9, 6.2, 5.0, 4.4, 7.3, 5.8, 4.9, 5.1, 6.6, 3.7, 5.5, 4.8, 6.0, 5.2, 4.6, 8.1, 5.3, 4.2];
const m = values.reduce((a, b) => a + b, 0) / values.length;
const ideal = Math.sqrt(values.reduce((s, v) => s + (v - m) ** 2, 0)) / values.length;

describe('bootstrap SE of the mean against its ideal value (Efron & Tibshirani 1993)', () => {
  it('the counts-based resampling of the comparison engine (B = 50,000)', () => {
    const B = 50_000;
    const result = analyzeComparison(values.map((y) => ({ x: 0, y })), { resamples: B, seed: 'ideal-se' });
    expect(Math.abs(result.bias.mean.se! / ideal - 1)).toBeLessThan(4 / Math.sqrt(2 * B));
  });

  it('the general statistic-function resampling (B = 50,000)', () => {
    const B = 50_000;
    const result = bootstrapCi(values, (s) => mean(s), { resamples: B, seed: 'ideal-se-2' });
    expect(Math.abs(result.se / ideal - 1)).toBeLessThan(4 / Math.sqrt(2 * B));
  });
});
