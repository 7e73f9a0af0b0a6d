import { forEachResample, medianReplicates } from './bootstrap';
import { medianFromCounts, momentsFromCounts, orderStatisticFromCounts, positionOfRank, quantileFromCounts } from './counts-stats';
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

/** Sorted data with ties and uneven gaps, so that a wrong position or a wrong mean of two shows in the value. */
function tiedData(n: number): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => Math.round(Math.sqrt(i * 7 + 3) * 10) / 10 + (i % 4 === 0 ? 0.05 : 0)).sort();
}

describe('the counts loops of the median CI', () => {
  it.each([1, 2, 3, 4, 5, 7, 9, 25, 64])('fillCounts and fillCountsUpperHalf make the draws of nextIndex (n = %i)', (n) => {
    const a = new Xor128('fill-spec');
    const b = new Xor128('fill-spec');
    const c = new Xor128('fill-spec');
    const counts = new Int32Array(n);
    const halves = new Int32Array(n);
    for (let rep = 0; rep < 20; rep++) {
      a.fillCounts(counts, n);
      const upper = b.fillCountsUpperHalf(halves, n);
      const expected = new Int32Array(n);
      let expectedUpper = 0;
      for (let k = 0; k < n; k++) {
        const u = c.nextUniform();
        expected[Math.floor(u * n)]++;
        if (u >= 0.5) expectedUpper++;
      }
      expect(Array.from(counts)).toEqual(Array.from(expected));
      expect(Array.from(halves)).toEqual(Array.from(expected));
      expect(upper).toBe(expectedUpper);
    }
    const next = c.nextInt32();
    expect(a.nextInt32()).toBe(next);
    expect(b.nextInt32()).toBe(next);
  });

  it('positionOfRank gives the position a walk from the low end gives, from any split', () => {
    const stream = new Xor128('position-spec');
    for (const n of [1, 2, 3, 6, 11]) {
      const counts = new Int32Array(n);
      for (let rep = 0; rep < 30; rep++) {
        stream.fillCounts(counts, n);
        for (let rank = 1; rank <= n; rank++) {
          let seen = 0;
          let expected = 0;
          while ((seen += counts[expected]) < rank) expected++;
          let below = 0;
          for (let split = 0; split <= n; split++) {
            expect(positionOfRank(counts, split, below, rank)).toBe(expected);
            below += counts[split] ?? 0;
          }
        }
      }
    }
  });

  it.each([1, 2, 3, 4, 5, 6, 7, 8, 40, 41, 500, 501])(
    'medianReplicates gives the replicates of forEachResample with medianFromCounts and of sorting each resample (n = %i)', (n) => {
      const sorted = tiedData(n);
      const B = n >= 500 ? 200 : 1000;
      const viaLoop = medianReplicates(sorted, { resamples: B, stream: new Xor128(`median-spec-${n}`) });
      const viaVisitor = new Float64Array(B);
      forEachResample(n, { resamples: B, stream: new Xor128(`median-spec-${n}`) }, (counts, b) => (viaVisitor[b] = medianFromCounts(sorted, counts, n)));
      const bySorting = new Float64Array(B);
      const stream = new Xor128(`median-spec-${n}`);
      const resample = new Float64Array(n);
      for (let b = 0; b < B; b++) {
        for (let j = 0; j < n; j++) resample[j] = sorted[stream.nextIndex(n)];
        bySorting[b] = medianSorted(resample.sort());
      }
      expect(Array.from(viaLoop)).toEqual(Array.from(viaVisitor));
      expect(Array.from(viaLoop)).toEqual(Array.from(bySorting));
      if (n > 2) expect(new Set(viaLoop).size).toBeGreaterThan(2);
    });

  it('medianReplicates shows each resample to the visitor, reports progress as forEachResample and leaves the stream where it does', () => {
    for (const n of [40, 41]) {
      const sorted = tiedData(n);
      const seen = (loop: 'median' | 'each'): { sums: number[]; progress: number[]; next: number } => {
        const stream = new Xor128('visit-spec');
        const sums: number[] = [];
        const progress: number[] = [];
        const settings = { resamples: 1000, stream, onProgress: (f: number) => progress.push(f) };
        const visit = (counts: Int32Array): void => { sums.push(counts.reduce((acc, c, k) => acc + c * (k + 1), 0)); };
        if (loop === 'median') medianReplicates(sorted, settings, new Float64Array(1000), visit);
        else forEachResample(n, settings, visit);
        return { sums, progress, next: stream.nextInt32() };
      };
      const mine = seen('median');
      expect(mine.sums).toHaveLength(1000);
      expect(mine).toEqual(seen('each'));
    }
  });

  it('medianReplicates refuses an empty sample', () => {
    expect(() => medianReplicates(new Float64Array(0), { resamples: 10, stream: new Xor128('x') })).toThrow(RangeError);
  });
});
