import { applyPaste } from '../../specimens/apply-paste';
import { blankRow, fromStored, toInput } from '../../specimens/specimen-layout';
import type { SpecimenRow } from '@shared/schemas';
import { PRECISION_LAYOUT, widePrecisionRows } from './layout';

const cells = (text: string): string[][] => text.split('\n').map((line) => line.split('\t'));

describe('widePrecisionRows: a block with one column per replicate', () => {
  it('reads Material, Day, Rep 1 … as one row per result, numbering the replicates from the header', () => {
    const rows = widePrecisionRows(cells('Material\tDay\tRep 1\tRep 2\tRep 3\nLevel 1\t2026-03-02\t5.1\t5.2\t5.0\nLevel 2\t2026-03-02\t12.4\t12.6\t12.5'));
    expect(rows).toEqual([
      ['Level 1', '2026-03-02', '1', '5.1'], ['Level 1', '2026-03-02', '2', '5.2'], ['Level 1', '2026-03-02', '3', '5.0'],
      ['Level 2', '2026-03-02', '1', '12.4'], ['Level 2', '2026-03-02', '2', '12.6'], ['Level 2', '2026-03-02', '3', '12.5'],
    ]);
  });

  it('reads Day, 1, 2 … with the material cells left empty, and a corner cell as the material of every line', () => {
    expect(widePrecisionRows(cells('Day\t1\t2\n1\t5.1\t5.2\n2\t5.3\t5.0'))).toEqual([
      ['', '1', '1', '5.1'], ['', '1', '2', '5.2'], ['', '2', '1', '5.3'], ['', '2', '2', '5.0'],
    ]);
    expect(widePrecisionRows(cells('Level 1 (low)\tR1\tR2\nRun 1\t5.1\t5.2'))).toEqual([
      ['Level 1 (low)', 'Run 1', '1', '5.1'], ['Level 1 (low)', 'Run 1', '2', '5.2'],
    ]);
  });

  it('leaves out an empty result (a missing replicate), an empty line and empty cells after the header', () => {
    expect(widePrecisionRows(cells('Date\tReplicate 1\tReplicate 2\t\t\n2026-03-02\t5.1\t\n\t\t\n2026-03-03\t\t5.4'))).toEqual([
      ['', '2026-03-02', '1', '5.1'], ['', '2026-03-03', '2', '5.4'],
    ]);
  });

  it.each([
    ['a single line', 'Day\t1\t2'],
    ['one replicate column', 'Day\tRep 1\n1\t5.1'],
    ['a long block with its own header', 'Material\tDay\tReplicate\tResult\nLevel 1\t1\t1\t5.1'],
    ['results without a header (the corner is a number)', '1\t1\t2\n2\t5.1\t5.2'],
    ['replicates not numbered 1, 2, 3 …', 'Day\t4\t5\t4\n1\t5.1\t5.2\t5.0'],
    ['a header that is not a replicate', 'Day\tRep 1\tMean\n1\t5.1\t5.1'],
  ])('leaves %s to be pasted as it stands', (_name, text) => {
    expect(widePrecisionRows(cells(text))).toBeNull();
  });
});

describe('pasting into a precision grid', () => {
  it('writes a wide block as long rows from the first column, whatever cell is focused, with the study decimal mark', () => {
    const rows = [blankRow(PRECISION_LAYOUT)];
    const outcome = applyPaste(rows, PRECISION_LAYOUT, { rowIndex: 0, field: 'value' }, 'Material\tDay\tRep 1\tRep 2\nLevel 1\t1\t5,1\t5,2\n', 'comma');
    expect(outcome).toMatchObject({ written: 2, added: 1, skippedHeader: true, ignoredCells: 0 });
    expect(outcome.rows.map((r) => [r['material'], r['day'], r['replicate'], r['value'], r['excluded']])).toEqual([
      ['Level 1', '1', '1', '5,1', false], ['Level 1', '1', '2', '5,2', false],
    ]);
  });

  it('pastes a long block as before: from the focused cell, its header left out', () => {
    const rows = [blankRow(PRECISION_LAYOUT)];
    const outcome = applyPaste(rows, PRECISION_LAYOUT, { rowIndex: 0, field: 'material' }, 'Material\tDay\tReplicate\tResult\nLevel 1\t1\t1\t5.1');
    expect(outcome).toMatchObject({ written: 1, skippedHeader: true });
    expect(outcome.rows[0]).toMatchObject({ material: 'Level 1', day: '1', replicate: '1', value: '5.1' });
  });
});

describe('PRECISION_LAYOUT', () => {
  it('reads a stored row with its own fields and sends the grid row back with empty texts as null', () => {
    const stored = {
      position: 1, label: '', comparative: null, candidate: null, value: 5.1, valueText: '5.10', material: 'Level 1', day: '2026-03-02', replicate: 3,
      excluded: false, exclusionReason: null, note: '',
    } as unknown as SpecimenRow;
    const row = fromStored(stored, PRECISION_LAYOUT);
    expect(row).toMatchObject({ material: 'Level 1', day: '2026-03-02', replicate: '3', value: '5.10' });
    expect(toInput({ ...row, day: ' ', replicate: '' }, PRECISION_LAYOUT)).toEqual({
      material: 'Level 1', day: null, replicate: null, value: '5.10', excluded: false, exclusionReason: null, note: '',
    });
  });
});
