import { signTest } from './sign-test';
import { exactSignedRankP, wilcoxonSignedRank } from './wilcoxon';

describe('sign test and Wilcoxon signed-rank', () => {
  it('drop zero differences in both', () => {
    const d = [0, 0, 1.2, -0.4, 2.2, 0.7, 1.5];
    expect(signTest(d)).toMatchObject({ positive: 4, negative: 1, zeros: 2 });
    expect(wilcoxonSignedRank(d).n).toBe(5);
  });
  it('gives the exact sign-test p-value 2·P(B ≤ 1) for 1 of 6', () => {
    expect(signTest([1, 2, 3, 4, 5, -1]).pValue).toBeCloseTo((2 * 7) / 64, 12);
  });
  it('gives the exact signed-rank p-value: all positive of n = 5 is 2/32', () => {
    expect(exactSignedRankP(15, 5)).toBeCloseTo(2 / 32, 15);
    expect(wilcoxonSignedRank([1, 2, 3, 4, 5]).pValue).toBeCloseTo(2 / 32, 15);
  });
  it('uses the normal approximation when |d| are tied', () => {
    expect(wilcoxonSignedRank([1, 1, 2, -2, 3, 4, 5, 6]).method).toBe('normal');
  });
  it('has null p-values when every difference is zero', () => {
    expect(signTest([0, 0]).pValue).toBeNull();
    expect(wilcoxonSignedRank([0, 0]).pValue).toBeNull();
  });
});
