import { applyPaste } from './apply-paste';
import { COMPARISON_LAYOUT, GridRow, blankRow } from './specimen-layout';

const layout = COMPARISON_LAYOUT;
const rows = (n: number): GridRow[] => Array.from({ length: n }, () => blankRow(layout));

describe('applyPaste', () => {
  it('writes a block from the focused cell rightwards and downwards, adding rows past the end', () => {
    const before = rows(1);
    const out = applyPaste(before, layout, { rowIndex: 0, field: 'label' }, 'S1\t5,2\t5.4\nS2\t6.1\t6,0\n');
    expect(out.rows).toHaveLength(2);
    expect(out.added).toBe(1);
    expect(out.written).toBe(2);
    expect(out.rows[0]).toMatchObject({ label: 'S1', comparative: '5.2', candidate: '5.4' });
    expect(out.rows[1]).toMatchObject({ label: 'S2', comparative: '6.1', candidate: '6.0' });
    expect(before[0]['label']).toBe('');
  });

  it('reads results with the study\'s decimal mark, and leaves an unclear one as pasted so it is marked', () => {
    const text = 'S1\t1,234\t1.234,5\n';
    expect(applyPaste(rows(1), layout, { rowIndex: 0, field: 'label' }, text).rows[0]).toMatchObject({ comparative: '1,234', candidate: '1.234,5' });
    expect(applyPaste(rows(1), layout, { rowIndex: 0, field: 'label' }, text, 'comma').rows[0]).toMatchObject({ comparative: '1,234', candidate: '1234,5' });
    expect(applyPaste(rows(1), layout, { rowIndex: 0, field: 'label' }, 'S1\t1,234\t5.20', 'point').rows[0]).toMatchObject({ comparative: '1234', candidate: '5.20' });
  });

  it('skips a header line and says so', () => {
    const out = applyPaste(rows(0), layout, { rowIndex: 0, field: 'label' }, 'Specimen\tOld\tNew\r\nA\t3.1\t3.3\r\n');
    expect(out.skippedHeader).toBe(true);
    expect(out.rows).toHaveLength(1);
    expect(out.rows[0]).toMatchObject({ label: 'A', comparative: '3.1', candidate: '3.3' });
  });

  it('starts at a middle column: two result columns pasted at "comparative"', () => {
    const start = rows(3).map((r, i) => ({ ...r, label: `L${i + 1}` }));
    const out = applyPaste(start, layout, { rowIndex: 1, field: 'comparative' }, '4.0\t4.2\n5.0\t5,x');
    expect(out.rows.map((r) => [r['label'], r['comparative'], r['candidate']])).toEqual([
      ['L1', '', ''],
      ['L2', '4.0', '4.2'],
      ['L3', '5.0', '5,x'],
    ]);
    expect(out.added).toBe(0);
  });

  it('fills only the cells a ragged line has and counts cells beyond the last column', () => {
    const start = rows(2).map((r) => ({ ...r, note: 'kept' }));
    const out = applyPaste(start, layout, { rowIndex: 0, field: 'exclusionReason' }, 'clotted\tseen twice\textra\nlipaemic');
    expect(out.rows[0]).toMatchObject({ exclusionReason: 'clotted', note: 'seen twice' });
    expect(out.rows[1]).toMatchObject({ exclusionReason: 'lipaemic', note: 'kept' });
    expect(out.ignoredCells).toBe(1);
  });

  it('reads the excluded column as yes/no', () => {
    const out = applyPaste(rows(2), layout, { rowIndex: 0, field: 'excluded' }, 'yes\tclotted\nno\t');
    expect(out.rows[0]['excluded']).toBe(true);
    expect(out.rows[1]['excluded']).toBe(false);
  });
});
