import type { CellClassParams, ColDef, ITooltipParams } from 'ag-grid-community';
import { GridRow, SpecimenLayout } from './specimen-layout';

/** What the grid asks of the page for one cell: its problem in words, or null. */
export interface GridContext {
  problemAt(rowIndex: number, field: string): string | null;
}

export const POSITION_COLUMN = 'position';

function problemOf(params: CellClassParams<GridRow> | ITooltipParams<GridRow>, field: string): string | null {
  const rowIndex = params.node?.rowIndex;
  const context = params.context as GridContext | undefined;
  return rowIndex === null || rowIndex === undefined || !context ? null : context.problemAt(rowIndex, field);
}

/**
 * The specimen grid's columns: the row number, then one column per field of the layout. A cell with a
 * problem gets the class `cell-problem` and a tooltip saying what is wrong; results are right-aligned.
 */
export function specimenColumns(layout: SpecimenLayout, editable: boolean): ColDef<GridRow>[] {
  const position: ColDef<GridRow> = {
    colId: POSITION_COLUMN,
    headerName: '#',
    valueGetter: (p) => (p.node?.rowIndex ?? 0) + 1,
    width: 70,
    editable: false,
    sortable: false,
    suppressMovable: true,
    cellClass: 'cell-position',
  };
  const fields = layout.fields.map<ColDef<GridRow>>((f) => ({
    field: f.field,
    headerName: f.header,
    ...(f.grow ? { flex: 1, minWidth: f.width } : { width: f.width }),
    editable,
    sortable: false,
    suppressMovable: true,
    cellDataType: f.kind === 'flag' ? 'boolean' : 'text',
    ...(f.kind === 'flag' ? { cellRenderer: 'agCheckboxCellRenderer', cellEditor: 'agCheckboxCellEditor' } : { cellEditor: 'agTextCellEditor' }),
    cellClass: f.kind === 'result' ? 'cell-result' : undefined,
    cellClassRules: { 'cell-problem': (p) => problemOf(p, f.field) !== null },
    tooltipValueGetter: (p) => problemOf(p, f.field),
  }));
  return [position, ...fields];
}
