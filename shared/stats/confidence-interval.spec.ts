import { bcaInterval, bootQuantileSorted, jackknifeAcceleration, percentileInterval } from './confidence-interval';

describe('bootstrap interval arithmetic', () => {
  const reps = Float64Array.from({ length: 999 }, (_, i) => i + 1);
  it('takes the order statistic at rank (B + 1)α when it is whole', () => {
    expect(bootQuantileSorted(reps, 0.025)).toBeCloseTo(25, 10);
    const [lo, hi] = percentileInterval(reps, 0.95);
    expect(lo).toBeCloseTo(25, 10);
    expect(hi).toBeCloseTo(975, 10);
  });
  it('interpolates on the normal scale between ranks, and uses the extremes outside them', () => {
    const v = bootQuantileSorted(reps, 0.0255);
    expect(v).toBeGreaterThan(25);
    expect(v).toBeLessThan(26);
    expect(bootQuantileSorted(reps, 0.0001)).toBe(1);
  });
  it('reduces BCa to the percentile interval with no bias and no skew', () => {
    const even = Float64Array.from({ length: 1000 }, (_, i) => i + 1);
    const bca = bcaInterval(even, 500.5, [1, 1, 1], 0.95)!;
    const percentile = percentileInterval(even, 0.95);
    expect(bca[0]).toBeCloseTo(percentile[0], 12);
    expect(bca[1]).toBeCloseTo(percentile[1], 12);
  });
  it('counts replicates strictly below the estimate and gives null when none are', () => {
    expect(bcaInterval(reps, 1, [1, 2, 3], 0.95)).toBeNull();
  });
  it('has zero acceleration for symmetric jackknife values', () => {
    expect(jackknifeAcceleration([1, 2, 3, 4, 5])).toBe(0);
    expect(jackknifeAcceleration([1, 1, 1, 1, 10])).not.toBe(0);
  });
});
