import type { CellClassParams, ColDef, ITooltipParams } from 'ag-grid-community';
import { INTERVAL_LAYOUT } from '../intervals/interval-layout';
import { GridContext, POSITION_COLUMN, SPECIMEN_ROW_CLASSES, headerWidth, resultHeadings, specimenColumns } from './specimen-columns';
import { COMPARISON_LAYOUT, GridRow, blankRow } from './specimen-layout';

const context: GridContext = {
  problemAt: (row, field) => (row === 13 && field === 'candidate' ? 'Candidate result is not a number' : null),
  repeatAt: (row) => (row === 2 || row === 16 ? 'Label repeated on rows 3 and 17' : null),
};
const params = (rowIndex: number, data?: Partial<GridRow>) =>
  ({ node: { rowIndex }, context, data: { ...blankRow(COMPARISON_LAYOUT), ...data } }) as unknown as CellClassParams<GridRow> & ITooltipParams<GridRow>;
const comparisonStudy = {
  analyteUnit: 'mmol/L',
  settings: { unit: '' },
  comparativeInstrument: { id: 1, name: 'Chemistry line 1' },
  candidateInstrument: { id: 2, name: 'Chemistry line 2' },
  instrument: null,
} satisfies Parameters<typeof resultHeadings>[0];

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
    expect(column(cols, 'note')).toMatchObject({ flex: 1, minWidth: 150 });
    expect(column(cols, 'candidate')).toMatchObject({ width: 175 });
  });

  it('makes nothing editable on a study that no longer changes', () => {
    expect(specimenColumns(COMPARISON_LAYOUT, false).every((c) => !c.editable)).toBe(true);
  });

  it('marks a repeated label and names the rows in its tooltip; a problem comes first', () => {
    const label = column(cols, 'label');
    const rule = label.cellClassRules!['cell-repeated'] as (p: CellClassParams<GridRow>) => boolean;
    expect(rule(params(16))).toBe(true);
    expect(rule(params(3))).toBe(false);
    expect(label.tooltipValueGetter!(params(2))).toBe('Label repeated on rows 3 and 17');
    expect(label.tooltipValueGetter!(params(3))).toBeNull();
    expect(column(cols, 'note').cellClassRules!['cell-repeated']).toBeUndefined();
  });

  it('gives the reason on hover over the results of an excluded row', () => {
    const comparative = column(cols, 'comparative');
    expect(comparative.tooltipValueGetter!(params(4, { excluded: true, exclusionReason: 'haemolysed, repeat not possible' }))).toBe(
      'Excluded: haemolysed, repeat not possible',
    );
    expect(comparative.tooltipValueGetter!(params(4, { excluded: true, exclusionReason: ' ' }))).toBe('Excluded (no reason given yet)');
    expect(comparative.tooltipValueGetter!(params(4, { excluded: false, exclusionReason: 'old reason' }))).toBeNull();
    expect(column(cols, 'candidate').tooltipValueGetter!(params(13, { excluded: true, exclusionReason: 'clotted' }))).toBe('Candidate result is not a number');
  });

  it('marks excluded rows with a row class', () => {
    const rule = SPECIMEN_ROW_CLASSES['row-excluded'] as (p: { data?: GridRow }) => boolean;
    expect(rule({ data: { ...blankRow(COMPARISON_LAYOUT), excluded: true } })).toBe(true);
    expect(rule({ data: blankRow(COMPARISON_LAYOUT) })).toBe(false);
    expect(rule({})).toBe(false);
  });

  it('wraps the free-text columns so a long exclusion reason is read in full', () => {
    expect(column(cols, 'exclusionReason')).toMatchObject({ wrapText: true, autoHeight: true, cellClass: 'cell-wrap' });
    expect(column(cols, 'label').wrapText).toBeUndefined();
  });

  it('names the result columns by method and unit, with the instrument as the header tooltip', () => {
    const headed = specimenColumns(COMPARISON_LAYOUT, true, resultHeadings(comparisonStudy));
    expect(column(headed, 'comparative')).toMatchObject({ headerName: 'Comparative (mmol/L)', headerTooltip: 'Comparative method: Chemistry line 1' });
    expect(column(headed, 'candidate')).toMatchObject({ headerName: 'Candidate (mmol/L)', headerTooltip: 'Candidate method: Chemistry line 2' });
    expect(column(headed, 'candidate').width).toBe(headerWidth('Candidate (mmol/L)', 175));
    expect(column(headed, 'comparative').width).toBeGreaterThanOrEqual(175);
    expect(column(headed, 'label').headerName).toBe('Specimen label');
  });

  it('heads a reference-interval study\'s values "Result (unit)"', () => {
    const headed = specimenColumns(INTERVAL_LAYOUT, true, resultHeadings({ ...comparisonStudy, comparativeInstrument: null, candidateInstrument: null, instrument: { id: 3, name: 'Analyser A' }, settings: { unit: 'g/L' } }));
    expect(column(headed, 'value')).toMatchObject({ headerName: 'Result (g/L)', headerTooltip: 'Measured on Analyser A' });
  });
});

describe('resultHeadings', () => {
  it('takes the study\'s own unit before the analyte\'s', () => {
    expect(resultHeadings({ ...comparisonStudy, settings: { unit: 'mg/dL' } })['comparative'].name).toBe('Comparative (mg/dL)');
  });

  it('says "result" without a unit, and leaves the tooltip out when the instrument is not known', () => {
    const headings = resultHeadings({ ...comparisonStudy, analyteUnit: '', candidateInstrument: null });
    expect(headings['comparative'].name).toBe('Comparative result');
    expect(headings['candidate']).toEqual({ name: 'Candidate result', tooltip: null });
    expect(headings['value'].name).toBe('Result');
  });

  it('has nothing to say before the study is loaded', () => {
    expect(resultHeadings(null)).toEqual({});
  });

  it('leaves the column headers as the layout names them without headings', () => {
    expect(column(specimenColumns(COMPARISON_LAYOUT, true), 'comparative')).toMatchObject({ headerName: 'Comparative result', width: 175 });
    expect(column(specimenColumns(COMPARISON_LAYOUT, true), 'comparative').headerTooltip).toBeUndefined();
  });
});
