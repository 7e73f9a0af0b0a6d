import { median, quantileSorted, rankInRange } from './quantile';

describe('quantileSorted (Hyndman & Fan definition 6)', () => {
  const sorted = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  it('interpolates at rank p(n + 1)', () => {
    expect(quantileSorted(sorted, 0.5)).toBe(5);
    expect(quantileSorted(sorted, 0.25)).toBe(2.5);
    expect(quantileSorted(sorted, 0.95)).toBe(9);
  });
  it('says when the rank leaves 1..n', () => {
    expect(rankInRange(120, 0.025)).toBe(true);
    expect(rankInRange(30, 0.025)).toBe(false);
  });
  it('refuses an empty sample or p outside [0, 1]', () => {
    expect(() => quantileSorted(new Float64Array(0), 0.5)).toThrow(RangeError);
    expect(() => quantileSorted(sorted, 1.5)).toThrow(RangeError);
  });
  it('leaves its input unchanged', () => {
    const v = [3, 1, 2];
    expect(median(v)).toBe(2);
    expect(v).toEqual([3, 1, 2]);
  });
});
