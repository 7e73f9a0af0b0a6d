import { EMPTY_HISTORY, deleteRows, firstDifference, insertRow, moveRow, recordEdit, redoEdit, setCell, undoEdit } from './row-edits';
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

describe('edit history', () => {
  const fields = COMPARISON_LAYOUT.fields.map((f) => f.field);

  it('steps back and forward through changes, each step holding the whole list as it was', () => {
    const first = labelled('a', 'b');
    const second = setCell(first, first[0].uid, 'label', 'A');
    const third = deleteRows(second, new Set([second[1].uid]));
    let history = recordEdit(recordEdit(EMPTY_HISTORY, first), second);

    const back = undoEdit(history, third)!;
    expect(labels(back.rows)).toEqual(['A', 'b']);
    const backAgain = undoEdit(back.history, back.rows)!;
    expect(labels(backAgain.rows)).toEqual(['a', 'b']);
    expect(undoEdit(backAgain.history, backAgain.rows)).toBeNull();

    const forward = redoEdit(backAgain.history, backAgain.rows)!;
    expect(labels(forward.rows)).toEqual(['A', 'b']);
    const forwardAgain = redoEdit(forward.history, forward.rows)!;
    expect(labels(forwardAgain.rows)).toEqual(['A']);
    expect(redoEdit(forwardAgain.history, forwardAgain.rows)).toBeNull();

    history = recordEdit(back.history, back.rows);
    expect(history.future).toHaveLength(0);
  });

  it('forgets what could be redone once a new change is made', () => {
    const rows = labelled('a');
    const back = undoEdit(recordEdit(EMPTY_HISTORY, rows), labelled('b'))!;
    expect(back.history.future).toHaveLength(1);
    expect(recordEdit(back.history, back.rows).future).toHaveLength(0);
  });

  it('keeps only the latest steps up to the limit', () => {
    const lists = ['a', 'b', 'c', 'd'].map((l) => labelled(l));
    const history = lists.reduce((h, rows) => recordEdit(h, rows, 3), EMPTY_HISTORY);
    expect(history.past.map((rows) => rows[0]['label'])).toEqual(['b', 'c', 'd']);
  });

  it('finds the first changed cell, or the first field of a row that came or went', () => {
    const rows = labelled('a', 'b', 'c');
    expect(firstDifference(rows, setCell(rows, rows[1].uid, 'candidate', '4.4'), fields)).toEqual({ rowIndex: 1, field: 'candidate' });
    expect(firstDifference(deleteRows(rows, new Set([rows[1].uid])), rows, fields)).toEqual({ rowIndex: 1, field: 'label' });
    expect(firstDifference(rows, deleteRows(rows, new Set([rows[2].uid])), fields)).toEqual({ rowIndex: 1, field: 'label' });
    expect(firstDifference(rows, [...rows], fields)).toBeNull();
  });
});
