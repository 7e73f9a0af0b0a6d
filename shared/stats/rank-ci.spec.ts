import { binomialRankCi } from './rank-ci';
import { binomialCdf, binomialSf } from './binomial';

describe('binomialRankCi', () => {
  it('gives ranks 1–7 at n = 120 with coverage above 90%', () => {
    const ci = binomialRankCi(120, 0.025, 0.9)!;
    expect([ci.lowerRank, ci.upperRank]).toEqual([1, 7]);
    expect(ci.coverage).toBeGreaterThan(0.9);
  });
  it('has no 90% CI below n = 119 for the 2.5th percentile (0.975^n must be at most 0.05)', () => {
    expect(binomialRankCi(118, 0.025, 0.9)).toBeNull();
    expect(binomialRankCi(119, 0.025, 0.9)).not.toBeNull();
  });
  it('sums binomial tails consistently', () => {
    expect(binomialCdf(3, 10, 0.3) + binomialSf(4, 10, 0.3)).toBeCloseTo(1, 10);
  });
});
