import { bootstrapCi, bootstrapTest } from './one-sample';
import { median } from './quantile';

const values = [4.2, 5.1, 3.8, 6.0, 5.5, 4.9, 5.3, 4.4, 6.3, 5.0, 4.7];

describe('one-sample entry points', () => {
  it('tests the median against a null with reproducible tails', () => {
    const a = bootstrapTest(values, { null: 4, resamples: 2000, seed: 'q' });
    expect(a).toEqual(bootstrapTest(values, { null: 4, resamples: 2000, seed: 'q' }));
    expect(a.observed).toBe(5);
    expect(a.pValue).toBeLessThan(0.05);
  });
  it('makes a percentile or BCa CI of any statistic', () => {
    const iqr = (s: Float64Array) => { const t = Float64Array.from(s).sort(); return t[8] - t[2]; };
    for (const interval of ['percentile', 'bca'] as const) {
      const r = bootstrapCi(values, iqr, { resamples: 2000, interval });
      expect(r.ci![0]).toBeLessThanOrEqual(r.ci![1]);
    }
    expect(bootstrapCi(values, (s) => median(s), { resamples: 1000 }).estimate).toBe(5);
  });
});
