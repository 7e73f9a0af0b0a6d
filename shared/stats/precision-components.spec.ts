import { oneWayAnova } from './one-way-anova';
import { coefficientOfVariation, precisionComponents, sdConfidenceInterval } from './precision-components';

describe('precision components', () => {
  it('gives s_r² = MS_W, s_b² = (MS_B − MS_W)/n0 and s_WL² = s_r² + s_b² in a balanced design', () => {
    const c = precisionComponents(oneWayAnova([[1, 2, 3], [4, 5, 6], [7, 8, 9]])); // MS_B 27, MS_W 1, n0 3
    expect(c.repeatability).toEqual({ variance: 1, sd: 1, df: 6 });
    expect(c.betweenDay.variance).toBeCloseTo(26 / 3, 14);
    expect(c.withinLab.variance).toBeCloseTo(29 / 3, 14);
    expect(c.betweenClipped).toBe(false);
    // Satterthwaite with a = 1/3, b = 2/3: (9 + 2/3)² / (9²/2 + (2/3)²/6)
    expect(c.withinLab.df).toBeCloseTo((29 / 3) ** 2 / (81 / 2 + 4 / 9 / 6), 12);
  });

  it('uses n0, not the mean group size, in an unbalanced design', () => {
    const c = precisionComponents(oneWayAnova([[1, 3], [4, 5, 6], [8]])); // MS_B 12.75, MS_W 4/3, n0 11/6
    expect(c.betweenDay.variance).toBeCloseTo((12.75 - 4 / 3) / (11 / 6), 12);
    expect(c.betweenDay.variance).not.toBeCloseTo((12.75 - 4 / 3) / 2, 3); // N/k = 2 would be wrong
    const a = 6 / 11;
    const b = 5 / 11;
    expect(c.withinLab.df).toBeCloseTo((a * 12.75 + b * 4 / 3) ** 2 / ((a * 12.75) ** 2 / 2 + (b * 4 / 3) ** 2 / 3), 12);
  });

  it('clips s_b² to 0 when MS_B ≤ MS_W, and then ν_WL = N − k', () => {
    const c = precisionComponents(oneWayAnova([[1, 3, 5], [2, 4, 6], [1.5, 3.5, 5.5]]));
    expect(c.betweenClipped).toBe(true);
    expect(c.betweenDay).toEqual({ variance: 0, sd: 0 });
    expect(c.withinLab.sd).toBe(c.repeatability.sd);
    expect(c.withinLab.df).toBe(6);
  });

  it('keeps ν_WL between min(k − 1, N − k) and N − 1', () => {
    for (const groups of [[[1, 2, 3], [4, 5, 6], [7, 8, 9]], [[1, 3], [4, 5, 6], [8]], [[10, 10.4, 10.1, 10.3], [10.2, 10.6, 10.5, 10.9], [9.9, 10.1, 10.0, 10.2]]]) {
      const a = oneWayAnova(groups);
      const df = precisionComponents(a).withinLab.df;
      expect(df).toBeGreaterThanOrEqual(Math.min(a.dfBetween, a.dfWithin) - 1e-12);
      expect(df).toBeLessThanOrEqual(a.n - 1 + 1e-12);
    }
  });

  it('gives the χ² CI of an SD around s, wider above than below, also for non-integer ν', () => {
    const ci = sdConfidenceInterval(2, 20, 0.05);
    // χ²(0.975; 20) = 34.1696, χ²(0.025; 20) = 9.59078 (scipy.stats.chi2.ppf)
    expect(ci.lower).toBeCloseTo(2 * Math.sqrt(20 / 34.16960690283833), 10);
    expect(ci.upper).toBeCloseTo(2 * Math.sqrt(20 / 9.590777392264867), 10);
    const odd = sdConfidenceInterval(1, 6.5228, 0.05);
    expect(odd.lower).toBeLessThan(1);
    expect(odd.upper).toBeGreaterThan(1);
    expect(sdConfidenceInterval(0, 4, 0.05)).toEqual({ lower: 0, upper: 0 });
    expect(() => sdConfidenceInterval(1, 0, 0.05)).toThrow(RangeError);
  });

  it('gives CV = 100·s/|x̄| and NaN at a zero mean', () => {
    expect(coefficientOfVariation(2, 50)).toBe(4);
    expect(coefficientOfVariation(2, -50)).toBe(4);
    expect(coefficientOfVariation(2, 0)).toBeNaN();
  });
});
