import { oneWayAnova } from './one-way-anova';

/** Σ(x − x̄)² of doubles, exactly: each double is an integer multiple of 2^−shift; BigInt sums, one rounding. */
function exactBalancedSums(groups: number[][], shift = 80): { ssWithin: number; ssBetween: number } {
  const scale = 2 ** shift;
  const ints = groups.map((g) => g.map((v) => {
    const scaled = v * scale;
    if (!Number.isInteger(scaled)) throw new Error('shift too small');
    return BigInt(scaled);
  }));
  const n = BigInt(groups[0].length);
  const total = BigInt(groups.length) * n;
  const sums = ints.map((g) => g.reduce((a, b) => a + b, 0n));
  const grand = sums.reduce((a, b) => a + b, 0n);
  const within = ints.reduce((acc, g, i) => acc + n * g.reduce((a, b) => a + b * b, 0n) - sums[i] * sums[i], 0n); // · n
  const between = sums.reduce((acc, s) => acc + (total * s - n * grand) ** 2n, 0n); // · n·N²
  const unscale = (v: bigint, by: number) => Number(v) / by / scale / scale;
  return { ssWithin: unscale(within, Number(n)), ssBetween: unscale(between, Number(n) * Number(total) ** 2) };
}

describe('one-way ANOVA by group', () => {
  it('gives the worked values of a balanced 3 × 3 design', () => {
    const a = oneWayAnova([[1, 2, 3], [4, 5, 6], [7, 8, 9]]);
    expect(a).toMatchObject({ k: 3, n: 9, groupSizes: [3, 3, 3], groupMeans: [2, 5, 8], mean: 5, dfBetween: 2, dfWithin: 6, n0: 3, balanced: true });
    expect(a.ssBetween).toBe(54);
    expect(a.msBetween).toBe(27);
    expect(a.ssWithin).toBe(6);
    expect(a.msWithin).toBe(1);
    expect(a.f).toBe(27);
  });

  it('gives the worked values of an unbalanced design (2, 3 and 1 results), n0 = (N − Σn²/N)/(k − 1) = 11/6', () => {
    const a = oneWayAnova([[1, 3], [4, 5, 6], [8]]);
    expect(a.balanced).toBe(false);
    expect(a.n).toBe(6);
    expect(a.mean).toBe(4.5);
    expect(a.groupMeans).toEqual([2, 5, 8]);
    expect(a.ssBetween).toBeCloseTo(25.5, 13); // 2·2.5² + 3·0.5² + 1·3.5²
    expect(a.msBetween).toBeCloseTo(12.75, 13);
    expect(a.ssWithin).toBeCloseTo(4, 13); // (1 + 1) + (1 + 0 + 1) + 0
    expect(a.msWithin).toBeCloseTo(4 / 3, 14);
    expect(a.n0).toBeCloseTo(11 / 6, 14);
    expect(a.dfWithin).toBe(3);
  });

  it('weighs each result the same in the grand mean, not each group', () => {
    expect(oneWayAnova([[10], [20, 20, 20]]).mean).toBe(17.5);
  });

  it('keeps decimal data exact far from zero (values 10^9 + 0.x)', () => {
    const a = oneWayAnova([[1e9 + 0.1, 1e9 + 0.3], [1e9 + 0.5, 1e9 + 0.7]]);
    expect(a.msWithin).toBeCloseTo(0.02, 15);
    expect(a.msBetween).toBeCloseTo(0.16, 15);
    expect(a.mean).toBe(1e9 + 0.4);
  });

  it('keeps the binary path (values without short decimals) at full precision against exact rational sums', () => {
    const base = [[196.3052, 196.124, 196.189, 196.2569, 196.3403], [196.3042, 196.3825, 196.1669, 196.3257, 196.0422], [196.1303, 196.2005, 196.2889, 196.0343, 196.1811]];
    const groups = base.map((g) => g.map((v) => v / 3 + 1e4 / 7));
    const exact = exactBalancedSums(groups);
    const a = oneWayAnova(groups);
    expect(Math.abs(a.ssWithin - exact.ssWithin) / exact.ssWithin).toBeLessThan(1e-13);
    expect(Math.abs(a.ssBetween - exact.ssBetween) / exact.ssBetween).toBeLessThan(1e-13);
  });

  it('leaves its input unchanged', () => {
    const groups = [[3.1, 2.9, 3.0], [3.4, 3.3]];
    const copy = groups.map((g) => [...g]);
    oneWayAnova(groups);
    expect(groups).toEqual(copy);
  });

  it('refuses fewer than 2 groups, an empty group, no replicate and non-finite values', () => {
    expect(() => oneWayAnova([[1, 2, 3]])).toThrow('oneWayAnova requires at least 2 groups');
    expect(() => oneWayAnova([[1, 2], []])).toThrow('at least one value in every group');
    expect(() => oneWayAnova([[1], [2], [3]])).toThrow('N − k ≥ 1');
    expect(() => oneWayAnova([[1, NaN], [2, 3]])).toThrow('finite values');
  });
});
