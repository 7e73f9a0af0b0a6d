import { cochranC } from './cochran-c';

describe('cochranC', () => {
  // Critical values of Cochran's C as tabulated in ISO 5725-2:1994, Table 4 (p laboratories, n replicates; values
  // from memory, to 3 decimals): p = 5, n = 2: 0.928 (1%), 0.841 (5%); p = 7, n = 2: 0.838, 0.727;
  // p = 10, n = 2: 0.718, 0.602; p = 7, n = 3: 0.664, 0.561; p = 5, n = 4: 0.696, 0.598.
  it.each([
    [5, 2, 0.928, 0.841], [7, 2, 0.838, 0.727], [10, 2, 0.718, 0.602], [7, 3, 0.664, 0.561], [5, 4, 0.696, 0.598],
  ])('gives the tabulated critical values for %i groups of %i', (k, n, at1, at5) => {
    const variances = [1, ...Array(k - 1).fill(0.5)];
    // within 0.001: the table rounds to 3 decimals, and the F-quantile form is the usual close bound, not the exact distribution
    expect(Math.abs(cochranC(variances, n, 0.01)!.critical - at1)).toBeLessThan(0.001);
    expect(Math.abs(cochranC(variances, n, 0.05)!.critical - at5)).toBeLessThan(0.001);
  });

  it('takes the largest variance over the sum and says whether it exceeds the critical value', () => {
    const t = cochranC([0.01, 0.02, 0.5, 0.01, 0.02], 2, 0.01)!;
    expect(t.index).toBe(2);
    expect(t.c).toBeCloseTo(0.5 / 0.56, 12);
    expect(t.significant).toBe(false); // 0.893 < 0.928
    expect(cochranC([0.01, 0.01, 0.5, 0.005, 0.005], 2, 0.01)!.significant).toBe(true); // 0.943
  });

  it('has nothing to say with fewer than 3 groups, one result each, or no scatter at all', () => {
    expect(cochranC([1, 2], 2, 0.01)).toBeNull();
    expect(cochranC([1, 2, 3], 1, 0.01)).toBeNull();
    expect(cochranC([0, 0, 0], 2, 0.01)).toBeNull();
  });
});
