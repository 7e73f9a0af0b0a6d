import { COMPARISON_LAYOUT, GridRow, blankRow } from '../specimen-layout';
import { enterAddsRow, tabTarget } from './grid-navigation';

const fields = COMPARISON_LAYOUT.fields.map((f) => f.field);

describe('tabTarget', () => {
  it('moves along the row, and from the last field to the first field of the next row', () => {
    expect(tabTarget({ rowIndex: 2, field: 'comparative' }, false, fields, 5)).toEqual({ rowIndex: 2, field: 'candidate' });
    expect(tabTarget({ rowIndex: 2, field: 'note' }, false, fields, 5)).toEqual({ rowIndex: 3, field: 'label' });
  });

  it('goes back along the row with Shift, and from the first field to the last field of the row before', () => {
    expect(tabTarget({ rowIndex: 2, field: 'candidate' }, true, fields, 5)).toEqual({ rowIndex: 2, field: 'comparative' });
    expect(tabTarget({ rowIndex: 2, field: 'label' }, true, fields, 5)).toEqual({ rowIndex: 1, field: 'note' });
  });

  it('leaves the grid past its last and first cells', () => {
    expect(tabTarget({ rowIndex: 4, field: 'note' }, false, fields, 5)).toBeNull();
    expect(tabTarget({ rowIndex: 0, field: 'label' }, true, fields, 5)).toBeNull();
  });

  it('goes from the row number or tick box to the first field, or back to the row before', () => {
    expect(tabTarget({ rowIndex: 3, field: 'position' }, false, fields, 5)).toEqual({ rowIndex: 3, field: 'label' });
    expect(tabTarget({ rowIndex: 3, field: 'ag-Grid-SelectionColumn' }, true, fields, 5)).toEqual({ rowIndex: 2, field: 'note' });
    expect(tabTarget({ rowIndex: 0, field: 'position' }, true, fields, 5)).toBeNull();
  });
});

describe('enterAddsRow', () => {
  const row = (label: string): GridRow => ({ ...blankRow(COMPARISON_LAYOUT), label });

  it('adds a row on the last row when it holds something', () => {
    expect(enterAddsRow(2, [row('a'), row('b'), row('c')], COMPARISON_LAYOUT)).toBe(true);
  });

  it('adds nothing above the last row, or below an empty last row', () => {
    expect(enterAddsRow(1, [row('a'), row('b'), row('c')], COMPARISON_LAYOUT)).toBe(false);
    expect(enterAddsRow(1, [row('a'), row('')], COMPARISON_LAYOUT)).toBe(false);
    expect(enterAddsRow(0, [], COMPARISON_LAYOUT)).toBe(false);
  });
});
