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
    const clean = [9.6, 9.8, 9.9, 10, 10, 10.1, 10.2, 10.4, 9.7, 10.3];
    expect(biweightLocation([...clean, 40])).toBeCloseTo(10, 0);
    expect(biweightScale(clean, biweightLocation(clean))).toBeGreaterThan(0.15);
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
