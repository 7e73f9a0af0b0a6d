import { CellProblem } from '../row-validation';
import { pasteSummary, problemSummary } from './specimens-text';

describe('pasteSummary', () => {
  it('says how many rows were pasted, how many are new, and what was left out', () => {
    expect(pasteSummary({ rows: [], written: 40, added: 39, skippedHeader: true, ignoredCells: 0 })).toBe(
      'Pasted 40 rows (39 new); the header line was left out.',
    );
    expect(pasteSummary({ rows: [], written: 1, added: 0, skippedHeader: false, ignoredCells: 2 })).toBe(
      'Pasted 1 row; 2 cells beyond the last column were left out.',
    );
    expect(pasteSummary({ rows: [], written: 2, added: 2, skippedHeader: false, ignoredCells: 1 })).toBe(
      'Pasted 2 rows (2 new); 1 cell beyond the last column was left out.',
    );
  });
});

describe('problemSummary', () => {
  const problem = (row: number): CellProblem => ({ rowIndex: row - 1, field: 'candidate', message: `row ${row}: candidate result is not a number`, text: '' });

  it('is null when every row is fine', () => {
    expect(problemSummary([])).toBeNull();
  });

  it('says "1 problem" for one', () => {
    expect(problemSummary([problem(3)])?.title).toBe('1 problem');
  });

  it('lists the first problems by row and counts the rest', () => {
    const summary = problemSummary([problem(3), problem(14), problem(20)], 2);
    expect(summary).toEqual({
      title: '3 problems',
      lines: ['row 3: candidate result is not a number', 'row 14: candidate result is not a number'],
      more: 1,
    });
  });
});
