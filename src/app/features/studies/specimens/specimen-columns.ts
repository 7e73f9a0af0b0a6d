import type { CellClassParams, ColDef, ITooltipParams, RowClassRules } from 'ag-grid-community';
import type { Study } from '@shared/schemas';
import { GridRow, SpecimenLayout } from './specimen-layout';

/** What the grid asks of the page for one cell: its problem in words, or null; and a row's repeated label. */
export interface GridContext {
  problemAt(rowIndex: number, field: string): string | null;
  /** "Label repeated on rows 3 and 17" when the row's label is carried by another included row, else null. */
  repeatAt(rowIndex: number): string | null;
}

/** A column's header: its name and, where known, what the header's tooltip adds (the instrument). */
export interface ColumnHeading {
  name: string;
  tooltip: string | null;
}

export const POSITION_COLUMN = 'position';
/**
 * The least width of a free-text column: they share the room left over, and may shrink to this, so the
 * grid needs no sideways scrolling on a 1366-pixel screen (a long text wraps instead).
 */
export const TEXT_MIN_WIDTH = 150;
/** The field whose repeats are marked. */
export const LABEL_FIELD = 'label';

function problemOf(params: CellClassParams<GridRow> | ITooltipParams<GridRow>, field: string): string | null {
  const rowIndex = params.node?.rowIndex;
  const context = params.context as GridContext | undefined;
  return rowIndex === null || rowIndex === undefined || !context ? null : context.problemAt(rowIndex, field);
}

function repeatOf(params: CellClassParams<GridRow> | ITooltipParams<GridRow>): string | null {
  const rowIndex = params.node?.rowIndex;
  const context = params.context as GridContext | undefined;
  return rowIndex === null || rowIndex === undefined || !context ? null : context.repeatAt(rowIndex);
}

const isExcluded = (data: GridRow | undefined): boolean => data?.['excluded'] === true;

/** What a result cell of an excluded row says on hover: the reason, so it can be read beside the struck-through value. */
function exclusionOf(data: GridRow | undefined): string | null {
  if (!isExcluded(data)) return null;
  const reason = String(data?.['exclusionReason'] ?? '').trim();
  return reason === '' ? 'Excluded (no reason given yet)' : `Excluded: ${reason}`;
}

/**
 * The headers of the result columns, saying which method and unit each holds: "Comparative (mmol/L)" and
 * "Candidate (mmol/L)" with the instrument as the header's tooltip, or "Result (mmol/L)" for a
 * reference-interval study. The unit is the study's (Setup may change it), else the analyte's.
 * Fields the study's kind does not have are simply not used by its layout.
 */
export function resultHeadings(
  study: Pick<Study, 'analyteUnit' | 'comparativeInstrument' | 'candidateInstrument' | 'instrument'> & { settings?: { unit?: string } } | null,
): Record<string, ColumnHeading> {
  if (!study) return {};
  const unit = (study.settings?.unit ?? '').trim() || study.analyteUnit.trim();
  const named = (word: string): string => (unit ? `${word} (${unit})` : `${word} result`);
  return {
    comparative: { name: named('Comparative'), tooltip: study.comparativeInstrument ? `Comparative method: ${study.comparativeInstrument.name}` : null },
    candidate: { name: named('Candidate'), tooltip: study.candidateInstrument ? `Candidate method: ${study.candidateInstrument.name}` : null },
    value: { name: unit ? `Result (${unit})` : 'Result', tooltip: study.instrument ? `Measured on ${study.instrument.name}` : null },
  };
}

/** A width that shows a header in full (14px semi-bold text plus the header's padding), at least `min`. */
export function headerWidth(name: string, min = 0): number {
  return Math.max(min, Math.ceil(name.length * 7.8 + 30));
}

/** Rows marked excluded get `row-excluded`: their results are dimmed and struck through (see the grid's styles). */
export const SPECIMEN_ROW_CLASSES: RowClassRules<GridRow> = {
  'row-excluded': (p) => isExcluded(p.data),
};

/**
 * The specimen grid's columns: the row number, then one column per field of the layout. A cell with a
 * problem gets the class `cell-problem` and a tooltip saying what is wrong; a label another included row
 * carries gets `cell-repeated` and a tooltip naming the rows; results are right-aligned, and on an excluded
 * row their tooltip gives the reason; free-text columns wrap so a long reason is read in full.
 */
export function specimenColumns(layout: SpecimenLayout, editable: boolean, headings: Record<string, ColumnHeading> = {}): ColDef<GridRow>[] {
  const position: ColDef<GridRow> = {
    colId: POSITION_COLUMN,
    headerName: '#',
    valueGetter: (p) => (p.node?.rowIndex ?? 0) + 1,
    width: 60,
    editable: false,
    sortable: false,
    suppressMovable: true,
    cellClass: 'cell-position',
  };
  const fields = layout.fields.map<ColDef<GridRow>>((f) => {
    const heading = f.kind === 'result' ? headings[f.field] : undefined;
    const name = heading?.name ?? f.header;
    const wraps = f.kind === 'text' && f.grow === true;
    const tooltip = f.field === LABEL_FIELD
      ? (p: ITooltipParams<GridRow>) => problemOf(p, f.field) ?? repeatOf(p)
      : f.kind === 'result'
        ? (p: ITooltipParams<GridRow>) => problemOf(p, f.field) ?? exclusionOf(p.data)
        : (p: ITooltipParams<GridRow>) => problemOf(p, f.field);
    return {
      field: f.field,
      headerName: name,
      ...(heading?.tooltip ? { headerTooltip: heading.tooltip } : {}),
      ...(f.grow ? { flex: 1, minWidth: Math.min(f.width ?? TEXT_MIN_WIDTH, TEXT_MIN_WIDTH) } : { width: heading ? headerWidth(name, f.width) : f.width }),
      editable,
      sortable: false,
      suppressMovable: true,
      cellDataType: f.kind === 'flag' ? 'boolean' : 'text',
      ...(f.kind === 'flag' ? { cellRenderer: 'agCheckboxCellRenderer', cellEditor: 'agCheckboxCellEditor' } : { cellEditor: 'agTextCellEditor' }),
      ...(wraps ? { wrapText: true, autoHeight: true } : {}),
      cellClass: f.kind === 'result' ? 'cell-result' : wraps ? 'cell-wrap' : undefined,
      cellClassRules: {
        'cell-problem': (p) => problemOf(p, f.field) !== null,
        ...(f.field === LABEL_FIELD ? { 'cell-repeated': (p: CellClassParams<GridRow>) => repeatOf(p) !== null } : {}),
      },
      tooltipValueGetter: tooltip,
    };
  });
  return [position, ...fields];
}
