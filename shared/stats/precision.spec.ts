import { decimalsOf, reportedDecimals, roundTo } from './precision';
import { pairedDifferences } from './differences';

describe('precision', () => {
  it('reads the decimals a value was reported with', () => {
    expect(decimalsOf(5.2)).toBe(1);
    expect(decimalsOf(120)).toBe(0);
    expect(decimalsOf(0.00125)).toBe(5);
    expect(decimalsOf(1e-7)).toBe(7);
    expect(reportedDecimals([1, 2.25, 3.5])).toBe(2);
  });

  it('rounds half away from zero without binary drift', () => {
    expect(roundTo(5.2 - 4.9, 1)).toBe(0.3);
    expect(roundTo(-0.125, 2)).toBe(-0.13);
    expect(roundTo(0.1 + 0.2, 1)).toBe(0.3);
  });
});

describe('pairedDifferences', () => {
  it('makes 5.2 − 4.9 and 0.3 the same difference', () => {
    const { differences } = pairedDifferences([4.9, 1.0], [5.2, 1.3], 'absolute');
    expect(differences[0]).toBe(differences[1]);
  });

  it('computes percent of the pair mean and percent of x', () => {
    expect(pairedDifferences([100], [110], 'percent-mean').differences[0]).toBeCloseTo((100 * 10) / 105, 10);
    expect(pairedDifferences([100], [110], 'percent-x').differences[0]).toBeCloseTo(10, 10);
  });

  it('refuses a percent difference on a zero base, naming the pair', () => {
    expect(() => pairedDifferences([1, 0], [2, 1], 'percent-x')).toThrow(/pair 2/);
  });
});
