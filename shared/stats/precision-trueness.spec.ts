import { oneWayAnova } from './one-way-anova';
import { precisionComponents } from './precision-components';
import { truenessCheck } from './precision-trueness';

// t quantiles from scipy.stats.t.ppf: t(0.975; 2) = 4.302652729749462, t(0.975; 16/4.5) = 2.918821890180115,
// t(0.9875; 6) = 2.9686866841534867. jStat's t quantile agrees to about 1e-8, hence 7 decimals below.
const check = (groups: number[][], assigned: number, u: number, materials = 1) => {
  const a = oneWayAnova(groups);
  return truenessCheck(a, precisionComponents(a), assigned, u, 0.05, materials);
};
const BALANCED = [[1, 2, 3], [4, 5, 6], [7, 8, 9]]; // mean 5, MS_B 27, MS_W 1, N 9, k 3

describe('trueness against an assigned value', () => {
  it('gives bias = x̄ − TV and in % of TV', () => {
    const t = check(BALANCED, 4, 0);
    expect(t.bias).toBe(1);
    expect(t.biasPercent).toBe(25);
    expect(check(BALANCED, -4, 0).biasPercent).toBe(225);
  });

  it('gives SE² = MS_B/N with k − 1 df in a balanced design, and the interval TV ± t(1 − α/2; 2)·SE', () => {
    const t = check(BALANCED, 0, 0);
    expect(t.se).toBeCloseTo(Math.sqrt(3), 14);
    expect(t.seDf).toBeCloseTo(2, 12);
    expect(t.df).toBeCloseTo(2, 12);
    expect(t.multiplier).toBeCloseTo(4.302652729749462, 7);
    expect(t.interval.upper).toBeCloseTo(4.302652729749462 * Math.sqrt(3), 6);
    expect(t.interval.lower).toBeCloseTo(-4.302652729749462 * Math.sqrt(3), 6);
  });

  it('verifies TV = −2.3 (x̄ = 5 inside, upper end 5.15), which ν_WL = 2.30 in place of k − 1 = 2 would not', () => {
    const t = check(BALANCED, -2.3, 0);
    expect(t.interval.upper).toBeGreaterThan(5);
    expect(t.verdict).toBe('verified');
    expect(check(BALANCED, -2.5, 0).verdict).toBe('not-verified'); // upper end 4.95
  });

  it('adds u in quadrature and counts it with infinite df (Welch–Satterthwaite)', () => {
    const t = check(BALANCED, 0, 1);
    expect(t.df).toBeCloseTo(16 / 4.5, 12); // (3 + 1)² / (3²/2)
    expect(t.multiplier).toBeCloseTo(2.918821890180115, 7);
    expect(t.interval.upper).toBeCloseTo(2.918821890180115 * 2, 6);
  });

  it('adjusts for ℓ materials: t(1 − α/(2ℓ))', () => {
    const t = check(BALANCED, 0, 0, 2);
    expect(t.multiplier).toBeGreaterThan(check(BALANCED, 0, 0, 1).multiplier);
  });

  it('gives SE² = s_b²·Σn_i²/N² + s_r²/N in an unbalanced design', () => {
    const t = check([[1, 3], [4, 5, 6], [8]], 4.5, 0); // s_b² = (12.75 − 4/3)/(11/6), s_r² = 4/3, Σn² = 14, N = 6
    const se2 = ((12.75 - 4 / 3) / (11 / 6)) * 14 / 36 + 4 / 3 / 6;
    expect(t.se).toBeCloseTo(Math.sqrt(se2), 13);
    const a = 14 / 36 / (11 / 6);
    const b = 1 / 6 - a;
    expect(t.seDf).toBeCloseTo(se2 ** 2 / ((a * 12.75) ** 2 / 2 + (b * 4 / 3) ** 2 / 3), 10);
    expect(t.verdict).toBe('verified');
  });

  it('uses s_r²/N with N − k df when s_b² is clipped to 0', () => {
    const t = check([[1, 3, 5], [2, 4, 6], [1.5, 3.5, 5.5]], 3.5, 0, 2); // MS_W 4, N 9, k 3
    expect(t.se).toBeCloseTo(Math.sqrt(4 / 9), 14);
    expect(t.seDf).toBe(6);
    expect(t.multiplier).toBeCloseTo(2.9686866841534867, 7);
  });

  it('refuses u < 0 and a non-finite TV', () => {
    const a = oneWayAnova(BALANCED);
    expect(() => truenessCheck(a, precisionComponents(a), 1, -1, 0.05, 1)).toThrow(RangeError);
    expect(() => truenessCheck(a, precisionComponents(a), NaN, 0, 0.05, 1)).toThrow(RangeError);
  });
});
