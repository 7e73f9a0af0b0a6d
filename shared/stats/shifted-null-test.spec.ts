import { medianFromCounts } from './counts-stats';
import { meanFromCounts } from './difference-bias';
import { streamFor } from './rng';
import { shiftedNullTest } from './shifted-null-test';

const data = Float64Array.from([-0.4, 0.1, 0.2, 0.3, 0.3, 0.5, 0.6, 0.8, 1.1, 1.4, 2.0]);
const run = (reader = medianFromCounts, nullValue = 0, seed = 's') =>
  shiftedNullTest(data, reader, nullValue, { resamples: 2000, stream: streamFor(seed, 'test') });

describe('shiftedNullTest', () => {
  it('is bit-identical for the same seed and differs for another seed', () => {
    expect(run()).toEqual(run());
    expect(run(medianFromCounts, 0, 'other').upperCount).not.toBe(run().upperCount);
  });

  it('reports tails with the (count + 1)/(B + 1) correction and their sum once corrected', () => {
    const t = run(meanFromCounts, 0.4);
    expect(t.upperTail).toBeCloseTo((t.upperCount + 1) / 2001, 15);
    expect(t.lowerTail).toBeCloseTo((t.lowerCount + 1) / 2001, 15);
    expect(t.pValue).toBeCloseTo((t.upperCount + t.lowerCount + 1) / 2001, 15);
  });

  it('puts exactly the tail counts into the bins marked as tails', () => {
    const t = run(medianFromCounts, 0.2);
    const sum = (tail: string) => t.nullDistribution.bins.filter((b) => b.tail === tail).reduce((s, b) => s + b.count, 0);
    expect(sum('upper')).toBe(t.upperCount);
    expect(sum('lower')).toBe(t.lowerCount);
    expect(t.nullDistribution.bins.reduce((s, b) => s + b.count, 0)).toBe(2000);
  });

  it('gives a small p-value for data far from the null and p = 1 at the observed value', () => {
    expect(run(medianFromCounts, -2).pValue).toBeLessThan(0.001);
    expect(run(medianFromCounts, 0.5).pValue).toBe(1);
  });

  it('refuses a statistic that shifting cannot bring to the null', () => {
    const spread = (s: Float64Array, c: Int32Array, n: number) => meanFromCounts(s.map((v) => v * v), c, n);
    expect(() => shiftedNullTest(data, spread, 0, { resamples: 1000, stream: streamFor('s', 'x') })).toThrow(RangeError);
  });
});
