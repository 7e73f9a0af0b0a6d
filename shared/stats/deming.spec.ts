import { deming, ols } from './deming';
import { weightedDeming } from './weighted-deming';
import { pairSums } from './pair-sums';
import { demingFromSums } from './deming';

const x = [10, 20, 30, 40, 50, 60, 70, 80];
const y = [11.5, 20.4, 32.1, 41.0, 52.6, 61.2, 73.9, 81.8];

describe('deming', () => {
  it('recovers an exact line for any λ', () => {
    for (const lambda of [0.25, 1, 4]) {
      const fit = deming(x, x.map((v) => 2 + 1.1 * v), lambda);
      expect(fit.slope).toBeCloseTo(1.1, 12);
      expect(fit.intercept).toBeCloseTo(2, 10);
    }
  });

  it('tends to least squares of y on x as x becomes error-free (λ → 0)', () => {
    expect(deming(x, y, 1e-9).slope).toBeCloseTo(ols(x, y).slope, 6);
  });

  it('tends to the inverse regression of x on y as y becomes error-free (λ → ∞)', () => {
    const inverse = ols(y, x);
    expect(deming(x, y, 1e9).slope).toBeCloseTo(1 / inverse.slope, 6);
  });

  it('is not estimable without spread in x', () => {
    expect(Number.isNaN(deming([5, 5, 5], [1, 2, 3]).slope)).toBe(true);
  });
});

describe('weightedDeming', () => {
  it('recovers an exact proportional line', () => {
    const fit = weightedDeming(x, x.map((v) => 1.05 * v));
    expect(fit.slope).toBeCloseTo(1.05, 10);
    expect(fit.intercept).toBeCloseTo(0, 8);
  });

  it('converges to a fixed point: the Deming line of its own final weights', () => {
    const weights = new Float64Array(x.length);
    const fit = weightedDeming(x, y, 1.5, null, weights);
    const again = demingFromSums(pairSums(x, y, weights), 1.5);
    expect(again.slope).toBeCloseTo(fit.slope, 9);
    expect(fit.iterations).toBeLessThan(50);
  });

  it('refuses non-positive concentrations (NaN)', () => {
    expect(Number.isNaN(weightedDeming([-1, 2, 3], [-1, 2, 3]).slope)).toBe(true);
  });
});
