import { PERCENTILE_CHOICES, percentileWords, samePercentiles } from './percentile-choices';

describe('percentile choices', () => {
  it('offers the default two-sided interval first and a one-sided 99th percentile', () => {
    expect(PERCENTILE_CHOICES[0].value).toEqual([2.5, 97.5]);
    expect(PERCENTILE_CHOICES.some((c) => samePercentiles(c.value, [99]))).toBe(true);
  });

  it('compares percentile lists by value', () => {
    expect(samePercentiles([2.5, 97.5], [2.5, 97.5])).toBe(true);
    expect(samePercentiles([2.5, 97.5], [97.5])).toBe(false);
    expect(samePercentiles(null, [99])).toBe(false);
  });

  it('names a one-sided limit as upper above 50 and lower below', () => {
    expect(percentileWords([2.5, 97.5])).toBe('2.5th–97.5th percentiles');
    expect(percentileWords([99])).toBe('99th percentile (one-sided upper limit)');
    expect(percentileWords([2.5])).toBe('2.5th percentile (one-sided lower limit)');
  });
});
