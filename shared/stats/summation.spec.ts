import { mean, neumaierSum, sampleVariance } from './summation';
import { decimalMoments } from './decimal-moments';

describe('sums and moments', () => {
  it('keeps small terms beside large ones (compensated sum)', () => {
    expect(neumaierSum([1e16, 1, -1e16])).toBe(1);
  });
  it('computes the variance of decimal data exactly at its reported precision', () => {
    expect(sampleVariance([10000000.1, 10000000.2, 10000000.3])).toBe(0.01);
    expect(mean([0.1, 0.2, 0.3])).toBe(0.2);
  });
  it('falls back to binary arithmetic for values with many decimals', () => {
    expect(decimalMoments([Math.PI, Math.E])).toBeNull();
    expect(sampleVariance([Math.PI, Math.E])).toBeCloseTo((Math.PI - Math.E) ** 2 / 2, 14);
  });
});
