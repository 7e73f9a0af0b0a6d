import { applyPaste } from '../../specimens/apply-paste';
import { blankRow, fromStored, toInput } from '../../specimens/specimen-layout';
import type { SpecimenRow } from '@shared/schemas';
import { RANGE_LAYOUT, wideRangeRows } from './layout';

const cells = (text: string): string[][] => text.split('\n').map((line) => line.split('\t'));

describe('wideRangeRows: a block with one line per level and one column per replicate', () => {
  it('reads lines of a level and its results without a header, numbering the replicates 1, 2, …', () => {
    expect(wideRangeRows(cells('Level 3\t12.1\t12.3'))).toEqual([['Level 3', '1', '12.1'], ['Level 3', '2', '12.3']]);
    expect(wideRangeRows(cells('Level 1\t2.0\t2,1\t1.9\nLevel 2\t7.6\t7.7\t7.5'))).toEqual([
      ['Level 1', '1', '2.0'], ['Level 1', '2', '2,1'], ['Level 1', '3', '1.9'],
      ['Level 2', '1', '7.6'], ['Level 2', '2', '7.7'], ['Level 2', '3', '7.5'],
    ]);
  });

  it('reads a header of Level, Rep 1, Rep 2 … and numbers the replicates from it', () => {
    expect(wideRangeRows(cells('Level\tRep 1\tRep 2\nLow pool\t2\t3\nMix 50%\t16\t17'))).toEqual([
      ['Low pool', '1', '2'], ['Low pool', '2', '3'], ['Mix 50%', '1', '16'], ['Mix 50%', '2', '17'],
    ]);
    expect(wideRangeRows(cells('Dilution\tR1\tR2\tR3\n1\t5.1\t5.2\t5.0'))).toEqual([['1', '1', '5.1'], ['1', '2', '5.2'], ['1', '3', '5.0']]);
  });

  it('reads a censored result ("<0.5") as a result cell, by the shared number-shape test, so the grid marks it rather than the block being pasted whole', () => {
    expect(wideRangeRows(cells('Level 1\t<0.5\t0.6\nLevel 2\t7.6\t7.7'))).toEqual([
      ['Level 1', '1', '<0.5'], ['Level 1', '2', '0.6'], ['Level 2', '1', '7.6'], ['Level 2', '2', '7.7'],
    ]);
  });

  it('leaves out an empty result (a missing replicate), an empty line and empty cells at the end of a line', () => {
    expect(wideRangeRows(cells('Level 1\t5.1\t\t5.3\t\t\n\t\t\nLevel 2\t\t6.2\t6.1'))).toEqual([
      ['Level 1', '1', '5.1'], ['Level 1', '3', '5.3'], ['Level 2', '2', '6.2'], ['Level 2', '3', '6.1'],
    ]);
  });

  it.each([
    ['the grid’s own shape: level, replicate, result', 'Level 1\t1\t12.1\nLevel 1\t2\t12.3'],
    ['one line of the grid’s own shape', 'Level 3\t1\t12.1'],
    ['a long block with its own header', 'Level\tReplicate\tResult\nLevel 1\t1\t5.1'],
    ['one result after the level', 'Level 1\t5.1'],
    ['results alone (the first cell is a number)', '12.1\t12.3\t12.2'],
    ['a line with a word among the results', 'Level 1\t1\t12.1\tyes'],
    ['a header alone', 'Level\tRep 1\tRep 2'],
    ['replicates not numbered 1, 2, 3 …', 'Level\tRep 2\tRep 3\nL1\t5.1\t5.2'],
    ['a single cell', '12.1'],
  ])('leaves %s to be pasted as it stands', (_name, text) => {
    expect(wideRangeRows(cells(text))).toBeNull();
  });
});

describe('pasting into a reportable-range grid', () => {
  it('writes a wide block as long rows from the first column, whatever cell is focused, with the study decimal mark', () => {
    const rows = [blankRow(RANGE_LAYOUT)];
    const outcome = applyPaste(rows, RANGE_LAYOUT, { rowIndex: 0, field: 'value' }, 'Level 3\t12,1\t12,3\n', 'comma');
    expect(outcome).toMatchObject({ written: 2, added: 1, ignoredCells: 0 });
    expect(outcome.rows.map((r) => [r['level'], r['replicate'], r['value'], r['excluded']])).toEqual([
      ['Level 3', '1', '12,1', false], ['Level 3', '2', '12,3', false],
    ]);
  });

  it('pastes a long block as before: from the focused cell, its header left out', () => {
    const rows = [blankRow(RANGE_LAYOUT)];
    const outcome = applyPaste(rows, RANGE_LAYOUT, { rowIndex: 0, field: 'level' }, 'Level\tReplicate\tResult\nLevel 1\t1\t5.1');
    expect(outcome).toMatchObject({ written: 1, skippedHeader: true });
    expect(outcome.rows[0]).toMatchObject({ level: 'Level 1', replicate: '1', value: '5.1' });
  });
});

describe('RANGE_LAYOUT', () => {
  it('has the columns level, replicate, result, then excluded, its reason and a note', () => {
    expect(RANGE_LAYOUT.fields.map((f) => [f.field, f.header])).toEqual([
      ['level', 'Level'], ['replicate', 'Replicate'], ['value', 'Result'], ['excluded', 'Excluded'], ['exclusionReason', 'Exclusion reason'], ['note', 'Note'],
    ]);
  });

  it('reads a stored row with its own fields and sends the grid row back with empty texts as null', () => {
    const stored = {
      position: 1, label: '', comparative: null, candidate: null, value: 12.1, valueText: '12.10', level: 'Level 3', replicate: 2,
      excluded: false, exclusionReason: null, note: '',
    } as unknown as SpecimenRow;
    const row = fromStored(stored, RANGE_LAYOUT);
    expect(row).toMatchObject({ level: 'Level 3', replicate: '2', value: '12.10' });
    expect(toInput({ ...row, level: ' ', replicate: '' }, RANGE_LAYOUT)).toEqual({
      level: null, replicate: null, value: '12.10', excluded: false, exclusionReason: null, note: '',
    });
  });
});
