import { COMPARISON_LAYOUT, GridRow, blankRow } from '../specimen-layout';
import { repeatMarks, rowList } from './repeat-marks';

const rows = (...specs: (string | [string, 'excluded'])[]): GridRow[] =>
  specs.map((s) => ({ ...blankRow(COMPARISON_LAYOUT), label: Array.isArray(s) ? s[0] : s, excluded: Array.isArray(s) }));

describe('repeatMarks', () => {
  it('marks every included row whose trimmed label another included row carries, regardless of case', () => {
    const marks = repeatMarks(rows('VH-001', 'VH-002', ' vh-001 ', 'VH-003', 'VH-002', 'VH-002'));
    expect([...marks.entries()]).toEqual([
      [0, 'Label repeated on rows 1 and 3'],
      [2, 'Label repeated on rows 1 and 3'],
      [1, 'Label repeated on rows 2, 5 and 6'],
      [4, 'Label repeated on rows 2, 5 and 6'],
      [5, 'Label repeated on rows 2, 5 and 6'],
    ]);
  });

  it('does not count excluded rows or empty labels', () => {
    expect(repeatMarks(rows('A', ['A', 'excluded'], '', '  ', 'B')).size).toBe(0);
    expect([...repeatMarks(rows('A', ['A', 'excluded'], 'a')).keys()]).toEqual([0, 2]);
  });
});

describe('rowList', () => {
  it('names rows as the grid numbers them', () => {
    expect(rowList([2])).toBe('row 3');
    expect(rowList([2, 16])).toBe('rows 3 and 17');
    expect(rowList([0, 4, 9])).toBe('rows 1, 5 and 10');
  });
});
