import { deleteRows, insertRow, moveRow, setCell } from './row-edits';
import { COMPARISON_LAYOUT, GridRow, blankRow } from './specimen-layout';

const labelled = (...labels: string[]): GridRow[] => labels.map((label) => ({ ...blankRow(COMPARISON_LAYOUT), label }));
const labels = (rows: GridRow[]): unknown[] => rows.map((r) => r['label']);

describe('row edits', () => {
  it('inserts a blank row at a position or at the end', () => {
    const rows = labelled('a', 'b');
    expect(labels(insertRow(rows, COMPARISON_LAYOUT, 1))).toEqual(['a', '', 'b']);
    expect(labels(insertRow(rows, COMPARISON_LAYOUT))).toEqual(['a', 'b', '']);
    expect(labels(insertRow(rows, COMPARISON_LAYOUT, 99))).toEqual(['a', 'b', '']);
  });

  it('deletes the selected rows only', () => {
    const rows = labelled('a', 'b', 'c');
    expect(labels(deleteRows(rows, new Set([rows[0].uid, rows[2].uid])))).toEqual(['b']);
  });

  it('moves a row up or down and leaves the ends alone', () => {
    const rows = labelled('a', 'b', 'c');
    expect(labels(moveRow(rows, rows[1].uid, -1))).toEqual(['b', 'a', 'c']);
    expect(labels(moveRow(rows, rows[1].uid, 1))).toEqual(['a', 'c', 'b']);
    expect(labels(moveRow(rows, rows[0].uid, -1))).toEqual(['a', 'b', 'c']);
    expect(labels(moveRow(rows, rows[2].uid, 1))).toEqual(['a', 'b', 'c']);
  });

  it('changes one cell in a new row object and leaves the others as they were', () => {
    const rows = labelled('a', 'b');
    const out = setCell(rows, rows[1].uid, 'candidate', '5.5');
    expect(out[1]).not.toBe(rows[1]);
    expect(out[1]['candidate']).toBe('5.5');
    expect(out[0]).toBe(rows[0]);
    expect(rows[1]['candidate']).toBe('');
  });
});
