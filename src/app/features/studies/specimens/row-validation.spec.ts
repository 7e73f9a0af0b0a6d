import { kindMeta } from '@shared/kinds/kinds';
import { RESULT_CASES, emptyMessage, refusedMessage } from '@shared/results/result-cases.testing';
import { allProblems, cellProblem, rowProblems } from './row-validation';
import { COMPARISON_LAYOUT, GridRow, SpecimenLayout, blankRow } from './specimen-layout';

const layout = COMPARISON_LAYOUT;
const row = (values: Partial<Record<string, string | boolean>>): GridRow => ({ ...blankRow(layout), ...values });
const allowNegative = { canBeNegative: true, decimalMark: 'auto' as const };
const noNegative = { canBeNegative: false, decimalMark: 'auto' as const };

describe('rowProblems', () => {
  it('finds nothing wrong with a complete row in either decimal style', () => {
    expect(rowProblems(row({ label: 'S1', comparative: '5.2', candidate: '5,3' }), 0, layout, noNegative)).toEqual([]);
  });

  it('names the row (counted from 1) and the field of a result that is not a number', () => {
    const problems = rowProblems(row({ comparative: '5.1', candidate: '5,x' }), 13, layout, noNegative);
    expect(problems).toEqual([
      { rowIndex: 13, field: 'candidate', message: 'row 14: candidate result "5,x" is not a number', text: 'Candidate result "5,x" is not a number' },
    ]);
  });

  it('marks the cells the server refuses, in its words: "1,234" unless the study says which mark is the decimal', () => {
    const r = row({ comparative: '1,234', candidate: '1.5' });
    expect(rowProblems(r, 2, layout, noNegative).map((p) => p.message)).toEqual([
      'row 3: comparative result "1,234" is unclear: it may be 1.234 (a decimal comma) or 1234 (a comma separating thousands); '
        + "write 1.234 or 1234, or choose the decimal mark in the study's Setup",
    ]);
    expect(rowProblems(r, 2, layout, { canBeNegative: false, decimalMark: 'point' })).toEqual([]);
    expect(rowProblems(row({ comparative: '1,234', candidate: '1,5' }), 2, layout, { canBeNegative: false, decimalMark: 'comma' })).toEqual([]);
    expect(rowProblems(r, 2, layout, { canBeNegative: false, decimalMark: 'comma' }).map((p) => p.field)).toEqual(['candidate']);
  });

  it('marks values a number cannot keep exactly', () => {
    const r = row({ comparative: '1e309', candidate: '1.00000000000000000001' });
    expect(rowProblems(r, 0, layout, noNegative).map((p) => p.message)).toEqual([
      'row 1: comparative result "1e309" is too large to be kept (the largest number is about 1.8e308)',
      'row 1: candidate result "1.00000000000000000001" has 21 significant digits, more than a number keeps exactly (at most 15 always are), so round it',
    ]);
  });

  it('flags a negative result only where the analyte cannot be negative', () => {
    const r = row({ comparative: '-0.2', candidate: '0.1' });
    expect(rowProblems(r, 2, layout, noNegative).map((p) => p.message)).toEqual([
      'row 3: comparative result is negative, which this analyte cannot be',
    ]);
    expect(rowProblems(r, 2, layout, allowNegative)).toEqual([]);
  });

  it('asks for a reason when a row is excluded', () => {
    const r = row({ comparative: '4', candidate: '4.4', excluded: true, exclusionReason: '  ' });
    expect(rowProblems(r, 4, layout, noNegative)).toEqual([
      expect.objectContaining({ field: 'exclusionReason', message: 'row 5: excluded without a reason; give the reason' }),
    ]);
    expect(rowProblems({ ...r, exclusionReason: 'clotted' }, 4, layout, noNegative)).toEqual([]);
  });

  it('says an included row\'s empty result keeps it from the analysis, in the analysis\'s words; not of an excluded row, nor a blank one', () => {
    expect(rowProblems(row({ label: 'S9', comparative: '6.0' }), 8, layout, noNegative).map((p) => p.message)).toEqual([
      'row 9: the candidate result is empty; fill it or exclude the row with a reason',
    ]);
    expect(rowProblems(row({ label: 'S9', comparative: '6.0', excluded: true, exclusionReason: 'haemolysed' }), 8, layout, noNegative)).toEqual([]);
    expect(rowProblems(row({}), 8, layout, noNegative)).toEqual([]);
  });

  it('judges every cell of the shared table (shared/results/result-cases.testing.ts) as the server does, in the same words', () => {
    for (const c of RESULT_CASES) {
      const messages = rowProblems(row({ label: 'S1', comparative: '4.1', candidate: c.input }), 0, layout, noNegative).map((p) => p.message);
      expect([c.input, messages]).toEqual([c.input, c.error ? [refusedMessage(1, c)] : c.read?.value === null ? [emptyMessage(1)] : []]);
    }
  });

  it('with the kind\'s fields, checks a replicate and a required text field as the server does', () => {
    const fields = kindMeta('precision').rowFields;
    const precision: SpecimenLayout = { fields: ['material', 'day', 'replicate', 'value'].map((f) => ({ field: f, header: f, kind: f === 'value' ? 'result' : 'text', words: f })) };
    const r: GridRow = { uid: 1, material: 'Level 1', day: '', replicate: '1.5', value: '<0.5' };
    expect(rowProblems(r, 0, precision, { ...noNegative, fields }).map((p) => p.message)).toEqual([
      'row 1: the day is empty; fill it or exclude the row with a reason',
      'row 1: replicate "1.5" must be a whole number from 1',
      'row 1: result "<0.5" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason',
    ]);
  });
});

describe('allProblems and cellProblem', () => {
  it('lists the problems by row and finds the one of a cell', () => {
    const rows = [row({ comparative: 'x', candidate: '1' }), row({ comparative: '1', candidate: '1' }), row({ comparative: '2', candidate: '' })];
    const problems = allProblems(rows, layout, noNegative);
    expect(problems.map((p) => p.message)).toEqual([
      'row 1: comparative result "x" is not a number', 'row 3: the candidate result is empty; fill it or exclude the row with a reason',
    ]);
    expect(cellProblem(problems, 2, 'candidate')?.text).toBe('The candidate result is empty; fill it or exclude the row with a reason');
    expect(cellProblem(problems, 1, 'candidate')).toBeUndefined();
  });
});
