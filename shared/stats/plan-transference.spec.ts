import { optionOf } from './option-of.testing';
import { allowedOutside, planTransference, TRANSFERENCE_OUTSIDE, type TransferencePlanOptions } from './plan-transference';

/** P(B ≤ k), B ~ Binomial(n, p), from the pmf by the recurrence pmf(j + 1) = pmf(j)·(n − j)/(j + 1)·p/(1 − p). */
function cdf(k: number, n: number, p: number): number {
  let pmf = (1 - p) ** n;
  let sum = pmf;
  for (let j = 0; j < k; j++) {
    pmf *= ((n - j) / (j + 1)) * (p / (1 - p));
    sum += pmf;
  }
  return sum;
}


describe('planTransference', () => {
  it('defaults to 20 individuals, at most 2 outside, a retest of 20 and the standard fractions', () => {
    const r = planTransference();
    expect([r.n, r.maxOutside, r.retest]).toEqual([20, 2, 20]);
    expect(r.rows.map((row) => row.trueOutside)).toEqual([...TRANSFERENCE_OUTSIDE]);
  });

  it('allows 10% of n, rounded down (exactly at whole tenths)', () => {
    expect([10, 19, 20, 25, 30, 40, 70, 120].map(allowedOutside)).toEqual([1, 1, 2, 2, 3, 4, 7, 12]);
    expect(planTransference({ n: 40 }).maxOutside).toBe(4);
    expect(planTransference({ n: 40 }).retest).toBe(40);
  });

  it('accepts a tenth outside 67.7% of the time at first and 89.6% with the retest (n = 20, k = 2)', () => {
    const row = planTransference({ outside: [0.1] }).rows[0];
    expect(row.acceptFirst).toBeCloseTo(0.6769, 4);
    expect(row.acceptWithRetest).toBeCloseTo(0.8956, 4);
  });

  it('judges the retest on its own: F + (1 − F)·F_retest, with the retest of its own size', () => {
    const r = planTransference({ n: 30, maxOutside: 3, retest: 50, outside: [0.05, 0.1, 0.2] });
    r.rows.forEach((row) => {
      const first = cdf(3, 30, row.trueOutside);
      expect(row.acceptFirst).toBeCloseTo(first, 11);
      expect(row.acceptWithRetest).toBeCloseTo(first + (1 - first) * cdf(3, 50, row.trueOutside), 11);
    });
  });

  it('accepts less often as more fall outside, and the retest always adds', () => {
    const rows = planTransference().rows;
    rows.forEach((row, i) => {
      expect(row.acceptWithRetest).toBeGreaterThan(row.acceptFirst);
      if (i > 0) expect(row.acceptFirst).toBeLessThan(rows[i - 1].acceptFirst);
    });
  });

  it('is certain at the ends: nobody outside is always accepted, everybody outside never (k < n)', () => {
    const [none, all] = planTransference({ outside: [0, 1] }).rows;
    expect([none.acceptFirst, none.acceptWithRetest]).toEqual([1, 1]);
    expect([all.acceptFirst, all.acceptWithRetest]).toEqual([0, 0]);
  });

  it.each<[string, string, TransferencePlanOptions]>([
    ['maxOutside above the retest', 'maxOutside', { n: 20, maxOutside: 5, retest: 4 }],
    ['maxOutside above n', 'maxOutside', { n: 20, maxOutside: 21 }],
    ['maxOutside negative', 'maxOutside', { maxOutside: -1 }],
    ['n 0', 'n', { n: 0 }],
    ['n not whole', 'n', { n: 20.5 }],
    ['retest 0', 'retest', { retest: 0 }],
    ['a fraction above 1', 'outside', { outside: [0.1, 1.5] }],
    ['no fractions', 'outside', { outside: [] }],
  ])('%s: names %s', (_what, option, options) => {
    expect(optionOf(() => planTransference(options))).toBe(option);
  });
});
