import { analyzeInterval } from './analyze-interval';
import { verifyInterval } from './verify-interval';
import { Xor128 } from './rng';

function values(n: number, centre: number, seed: string): number[] {
  const s = new Xor128(seed);
  return Array.from({ length: n }, () => Math.round((centre + (s.nextUniform() + s.nextUniform() + s.nextUniform() - 1.5)) * 100) / 100);
}

describe('analyzeInterval', () => {
  it('estimates nonparametric limits with bootstrap and binomial-rank CIs', () => {
    const result = analyzeInterval(values(150, 5, 'a').map((value) => ({ value })), { resamples: 1000 });
    expect(result.lower!.ranks).toMatchObject({ lowerRank: 1 });
    expect(result.lower!.ci![0]).toBeLessThanOrEqual(result.lower!.estimate!);
    expect(result.upper!.estimate!).toBeGreaterThan(result.lower!.estimate!);
  });

  it('gives a one-sided upper limit for a single percentile and leaves lower null', () => {
    const result = analyzeInterval(values(200, 5, 'b').map((value) => ({ value })), { resamples: 1000, percentiles: [99] });
    expect(result.lower).toBeNull();
    expect(result.upper!.percentile).toBe(99);
  });

  it('recommends partitioning two shifted subgroups and gives their limits', () => {
    const rows = [...values(130, 4, 'f').map((value) => ({ value, sex: 'F' })), ...values(130, 5, 'm').map((value) => ({ value, sex: 'M' }))];
    const result = analyzeInterval(rows, { resamples: 1000, partitionFields: ['sex'] });
    expect(result.partition).toMatchObject({ field: 'sex', recommended: true });
    expect(result.partition!.intervals!.map((i) => i.group)).toEqual(['F', 'M']);
  });

  it('warns below 120 values and supports the robust and parametric methods', () => {
    const rows = values(60, 5, 'c').map((value) => ({ value }));
    expect(analyzeInterval(rows, { resamples: 1000 }).warnings.join(' ')).toMatch(/at least 120/);
    const robust = analyzeInterval(rows, { resamples: 1000, method: 'robust' });
    const parametric = analyzeInterval(rows, { resamples: 1000, method: 'parametric' });
    expect(robust.lower!.estimate!).toBeCloseTo(parametric.lower!.estimate!, 0);
    expect(parametric.boxCoxLambda).not.toBeNull();
  });

  it('flags a gross outlier by Dixon and Tukey rules without removing it', () => {
    const rows = [...values(40, 5, 'd'), 25].map((value) => ({ value }));
    const result = analyzeInterval(rows, { resamples: 1000 });
    expect(result.outliers).toEqual([41]);
    expect(result.n).toBe(41);
  });
});

describe('verifyInterval', () => {
  it('accepts 2 of 20 outside and rejects 3, with the advice to test 20 more', () => {
    const inside = Array(18).fill(5);
    expect(verifyInterval([...inside, 1, 9], { lower: 2, upper: 8 })).toMatchObject({ n: 20, outside: 2, accepted: true });
    const failed = verifyInterval([...inside.slice(1), 1, 9, 9], { lower: 2, upper: 8 });
    expect(failed.accepted).toBe(false);
    expect(failed.advice).toMatch(/20 more/);
  });

  it('shows the rule passes about 68% of the time when 10% truly fall outside (n = 20)', () => {
    expect(verifyInterval(Array(20).fill(5), { lower: 2, upper: 8 }).passRiskAt10Percent).toBeCloseTo(0.6769, 4);
  });
});
