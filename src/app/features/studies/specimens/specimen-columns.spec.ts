import type { CellClassParams, ColDef, ITooltipParams } from 'ag-grid-community';
import { GridContext, POSITION_COLUMN, specimenColumns } from './specimen-columns';
import { COMPARISON_LAYOUT, GridRow } from './specimen-layout';

const context: GridContext = { problemAt: (row, field) => (row === 13 && field === 'candidate' ? 'Candidate result is not a number' : null) };
const params = (rowIndex: number) => ({ node: { rowIndex }, context }) as unknown as CellClassParams<GridRow> & ITooltipParams<GridRow>;
const column = (cols: ColDef<GridRow>[], field: string) => cols.find((c) => c.field === field)!;

describe('specimenColumns', () => {
  const cols = specimenColumns(COMPARISON_LAYOUT, true);

  it('starts with the row number, then the fields in layout order', () => {
    expect(cols.map((c) => c.colId ?? c.field)).toEqual([POSITION_COLUMN, 'label', 'comparative', 'candidate', 'excluded', 'exclusionReason', 'note']);
    const getter = cols[0].valueGetter as (p: unknown) => number;
    expect(getter({ node: { rowIndex: 4 } })).toBe(5);
  });

  it('marks a cell with a problem and says the problem in its tooltip', () => {
    const candidate = column(cols, 'candidate');
    const rule = candidate.cellClassRules!['cell-problem'] as (p: CellClassParams<GridRow>) => boolean;
    expect(rule(params(13))).toBe(true);
    expect(rule(params(12))).toBe(false);
    const tooltip = candidate.tooltipValueGetter!;
    expect(tooltip(params(13))).toBe('Candidate result is not a number');
    expect(tooltip(params(12))).toBeNull();
  });

  it('edits the excluded flag with a checkbox and every other field as text', () => {
    expect(column(cols, 'excluded')).toMatchObject({ cellDataType: 'boolean', cellEditor: 'agCheckboxCellEditor' });
    expect(column(cols, 'comparative')).toMatchObject({ cellDataType: 'text', cellEditor: 'agTextCellEditor', cellClass: 'cell-result' });
  });

  it('lets the free-text columns take the room left over', () => {
    expect(column(cols, 'note')).toMatchObject({ flex: 1, minWidth: 200 });
    expect(column(cols, 'candidate')).toMatchObject({ width: 175 });
  });

  it('makes nothing editable on a study that no longer changes', () => {
    expect(specimenColumns(COMPARISON_LAYOUT, false).every((c) => !c.editable)).toBe(true);
  });
});
