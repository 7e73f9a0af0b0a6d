import { issuesOnGrid, rowsToSend } from './rows-to-send';
import { COMPARISON_LAYOUT, GridRow, blankRow } from './specimen-layout';

const row = (values: Partial<Record<string, string | boolean>>): GridRow => ({ ...blankRow(COMPARISON_LAYOUT), ...values });

describe('rowsToSend and issuesOnGrid', () => {
  const grid = [row({ comparative: '1', candidate: '1.1' }), row({}), row({ comparative: '2', candidate: '2,x' })];

  it('leaves blank rows out and remembers where each sent row sits in the grid', () => {
    const sent = rowsToSend(grid, COMPARISON_LAYOUT);
    expect(sent.rows).toHaveLength(2);
    expect(sent.rows[1]).toMatchObject({ comparative: '2', candidate: '2,x' });
    expect(sent.gridIndex).toEqual([0, 2]);
  });

  it('puts a server issue on its grid row and renumbers the message to match the grid', () => {
    const sent = rowsToSend(grid, COMPARISON_LAYOUT);
    const issues = issuesOnGrid([{ path: 'rows.1.candidate', message: 'row 2: candidate result is not a number' }], sent);
    expect(issues).toEqual([{ rowIndex: 2, field: 'candidate', message: 'row 3: candidate result is not a number' }]);
  });

  it('keeps an issue that names no row as it is', () => {
    const sent = rowsToSend(grid, COMPARISON_LAYOUT);
    expect(issuesOnGrid([{ path: 'version', message: 'Give the version' }], sent)).toEqual([
      { rowIndex: null, field: null, message: 'Give the version' },
    ]);
  });
});
