import type { SpecimenRow } from '@shared/schemas';
import { COMPARISON_LAYOUT, blankRow, fromStored, isBlank, toInput } from './specimen-layout';

const stored: SpecimenRow = {
  position: 1, label: 'S1', comparative: 7, candidate: 7.25, value: null, comparativeText: '7.0', candidateText: '7.25',
  valueText: null, sex: null, ageBand: null, excluded: true, exclusionReason: 'clotted', note: '', uploadId: null,
};

describe('specimen layout', () => {
  it('shows a stored row with the reported text of each result', () => {
    expect(fromStored(stored, COMPARISON_LAYOUT)).toMatchObject({
      label: 'S1', comparative: '7.0', candidate: '7.25', excluded: true, exclusionReason: 'clotted', note: '',
    });
  });

  it('falls back to the number when no text was stored', () => {
    const row = fromStored({ ...stored, comparativeText: null }, COMPARISON_LAYOUT);
    expect(row['comparative']).toBe('7');
  });

  it('sends trimmed text, null for an empty result and for an empty exclusion reason', () => {
    const row = { ...blankRow(COMPARISON_LAYOUT), label: ' S2 ', comparative: ' 5,1', candidate: '' };
    expect(toInput(row, COMPARISON_LAYOUT)).toEqual({
      label: 'S2', comparative: '5,1', candidate: null, excluded: false, exclusionReason: null, note: '',
    });
  });

  it('knows a blank row from one with anything in it', () => {
    const row = blankRow(COMPARISON_LAYOUT);
    expect(isBlank(row, COMPARISON_LAYOUT)).toBe(true);
    expect(isBlank({ ...row, excluded: true }, COMPARISON_LAYOUT)).toBe(false);
    expect(isBlank({ ...row, note: ' ' }, COMPARISON_LAYOUT)).toBe(true);
  });
});
