import { allowableBiasAt, verdict } from './decision-levels';
import { jsonClean } from './json-clean';
import { histogram } from './histogram';

describe('decision-level verdicts', () => {
  it('uses the greater of the absolute and percent limits', () => {
    expect(allowableBiasAt(100, 3, 5)).toBe(5);
    expect(allowableBiasAt(10, 3, 5)).toBe(3);
    expect(allowableBiasAt(10, null, null)).toBeNull();
  });
  it('is within, inconclusive or exceeds by where the CI lies', () => {
    expect(verdict([-1, 1], 2)).toBe('within');
    expect(verdict([1, 3], 2)).toBe('inconclusive');
    expect(verdict([2.5, 3], 2)).toBe('exceeds');
    expect(verdict([-3, -2.5], 2)).toBe('exceeds');
    expect(verdict(null, 2)).toBeNull();
  });
  it('counts a CI ending on the limit as within, and one starting on it as inconclusive, not exceeds', () => {
    expect(verdict([-2, 2], 2)).toBe('within');
    expect(verdict([0.5, 2], 2)).toBe('within');
    expect(verdict([2, 3], 2)).toBe('inconclusive');
    expect(verdict([-3, -2], 2)).toBe('inconclusive');
    expect(verdict([2.000001, 3], 2)).toBe('exceeds');
    expect(verdict([-3, 3], 2)).toBe('inconclusive'); // wider than the band on both sides
    expect(verdict([-1, 1], null)).toBeNull();
  });
  it('takes the percent of a negative level by its size, and the absolute limit alone when no percent is given', () => {
    expect(allowableBiasAt(-50, null, 10)).toBe(5);
    expect(allowableBiasAt(50, 2, null)).toBe(2);
  });
});

describe('result helpers', () => {
  it('turn NaN into null and typed arrays into arrays', () => {
    expect(jsonClean({ a: NaN, b: Float64Array.from([1, 2]), c: [Infinity] })).toEqual({ a: null, b: [1, 2], c: [null] });
  });
  it('bin every value once', () => {
    const h = histogram(Float64Array.from([0, 1, 2, 3, 4, 5]), 5);
    expect(h.bins.reduce((s, b) => s + b.count, 0)).toBe(6);
    expect(h.bins[4].count).toBe(2);
  });
});
