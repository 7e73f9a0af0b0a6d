import { nounFor, plural } from './plural';

describe('plural', () => {
  it('writes one of a thing in the singular and every other count in the plural', () => {
    expect(plural(1, 'row')).toBe('1 row');
    expect(plural(3, 'row')).toBe('3 rows');
    expect(plural(0, 'outlier')).toBe('0 outliers');
  });

  it('takes an irregular plural and groups the digits of large counts', () => {
    expect(plural(1, 'study', 'studies')).toBe('1 study');
    expect(plural(2, 'study', 'studies')).toBe('2 studies');
    expect(plural(1200, 'value')).toBe('1,200 values');
  });

  it('gives the noun alone for a count written elsewhere', () => {
    expect(nounFor(1, 'pair')).toBe('pair');
    expect(nounFor(40, 'pair')).toBe('pairs');
    expect(nounFor(2, 'criterion change', 'criterion changes')).toBe('criterion changes');
  });
});
