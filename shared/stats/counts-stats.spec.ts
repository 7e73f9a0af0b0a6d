import { medianFromCounts, momentsFromCounts, orderStatisticFromCounts, quantileFromCounts } from './counts-stats';
import { medianSorted, quantileSorted } from './quantile';
import { Xor128 } from './rng';
import { sampleSd } from './summation';

function expand(sorted: Float64Array, counts: Int32Array): Float64Array {
  const out: number[] = [];
  counts.forEach((c, k) => { for (let j = 0; j < c; j++) out.push(sorted[k]); });
  return Float64Array.from(out);
}

describe('statistics read off resample counts', () => {
  const stream = new Xor128('counts-spec');
  it.each([7, 8, 40, 41])('equal the same statistics of the expanded, sorted resample (n = %i)', (n) => {
    const sorted = Float64Array.from({ length: n }, (_, i) => i * 0.5 + (i % 3) * 0.1).sort();
    const counts = new Int32Array(n);
    for (let rep = 0; rep < 50; rep++) {
      stream.fillCounts(counts, n);
      const resample = expand(sorted, counts);
      expect(medianFromCounts(sorted, counts, n)).toBe(medianSorted(resample));
      for (const p of [0.025, 0.25, 0.9, 0.975]) expect(quantileFromCounts(sorted, counts, n, p)).toBe(quantileSorted(resample, p));
      expect(orderStatisticFromCounts(sorted, counts, n, n)).toBe(resample[n - 1]);
      const out = new Float64Array(2);
      momentsFromCounts(sorted, counts, n, sorted[0], out);
      expect(out[1]).toBeCloseTo(sampleSd(resample), 12);
    }
  });

  it('leave the sorted data and counts unchanged', () => {
    const sorted = Float64Array.from([1, 2, 3, 4, 5]);
    const counts = Int32Array.from([2, 0, 1, 0, 2]);
    medianFromCounts(sorted, counts, 5);
    expect(Array.from(sorted)).toEqual([1, 2, 3, 4, 5]);
    expect(Array.from(counts)).toEqual([2, 0, 1, 0, 2]);
  });
});
