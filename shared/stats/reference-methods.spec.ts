import { biweightLocation, biweightScale } from './biweight';
import { boxCox, boxCoxLambda, inverseBoxCox } from './box-cox';
import { dixonRange } from './dixon-range';
import { harrisBoyd } from './harris-boyd';
import { tukeyFences } from './tukey-fences';

describe('reference-interval building blocks', () => {
  it('Box–Cox inverts its transform, and finds λ ≈ 0 for log-symmetric data', () => {
    expect(inverseBoxCox(boxCox(3.7, 0.4), 0.4)).toBeCloseTo(3.7, 12);
    const logSymmetric = [-2, -1.5, -1, -0.5, 0, 0.5, 1, 1.5, 2].map(Math.exp);
    expect(Math.abs(boxCoxLambda(logSymmetric))).toBeLessThan(0.01);
  });
  it('biweight location ignores a gross outlier and scale is near the SD for clean data', () => {
    const clean = [9.6, 9.8, 9.9, 10, 10, 10.1, 10.2, 10.4, 9.7, 10.3]; // symmetric about 10; mean 10, SD √(0.6/9)
    // From the median 10 the MAD is 0.2, so 40 has u = 30/(3.7·0.2) > 1 and weight 0, and the weights of the rest are
    // symmetric about 10: 10 is the fixed point, where the mean with the outlier would be 12.7.
    expect(biweightLocation([...clean, 40])).toBeCloseTo(10, 10);
    expect(biweightLocation(clean)).toBeCloseTo(10, 10);
    // Expected value computed independently, in exact rational arithmetic (Python's fractions) from the midvariance
    // formula at T = 10, MAD 0.2, c = 9: S² = n·Σd²(1 − u²)⁴ / (Σ(1 − u²)(1 − 5u²))² = 47570806967/731109963000.
    const expected = Math.sqrt(47570806967 / 731109963000); // 0.255081468312680…
    const sd = Math.sqrt(0.6 / 9); // 0.258198889747161…
    expect(biweightScale(clean, 10)).toBeCloseTo(expected, 14);
    expect(biweightScale(clean, biweightLocation(clean))).toBeCloseTo(expected, 10);
    // Near the SD: within 2 % of it here (the ratio is 0.988); the biweight midvariance estimates σ for clean,
    // normal-like data (Mosteller & Tukey 1977, ch. 10; the tolerance is ours, for this sample).
    expect(Math.abs(biweightScale(clean, 10) / sd - 1)).toBeLessThan(0.02);
  });
  it('Tukey fences flag values beyond 1.5 IQR', () => {
    expect(tukeyFences([1, 2, 3, 4, 5, 6, 7, 8, 30]).indexes).toEqual([8]);
  });
  it('Dixon flags an extreme whose gap exceeds a third of the range, and the next one after it', () => {
    expect(dixonRange([1, 1.1, 1.2, 1.3, 1.4, 9])).toEqual([5]);
    expect(dixonRange([1, 1.2, 1.3, 1.5, 9, 9.1])).toEqual([]);
    expect(dixonRange([1, 1.1, 1.3, 1.5, 1.6])).toEqual([]);
    expect(dixonRange([1, 1.1, 1.2, 8, 9])).toEqual([]);
  });
  it('Harris & Boyd recommend partitioning on z > 3·sqrt(n̄/120) or SD ratio > 1.5', () => {
    const same = harrisBoyd({ group: 'a', n: 120, mean: 5, sd: 1 }, { group: 'b', n: 120, mean: 5.1, sd: 1 });
    expect(same).toMatchObject({ zCritical: 3, recommended: false });
    expect(harrisBoyd({ group: 'a', n: 120, mean: 5, sd: 1 }, { group: 'b', n: 120, mean: 5.5, sd: 1 }).recommended).toBe(true);
    expect(harrisBoyd({ group: 'a', n: 120, mean: 5, sd: 1 }, { group: 'b', n: 120, mean: 5, sd: 1.6 }).recommended).toBe(true);
  });
});
