import { COMPARISON_LAYOUT, type GridRow } from '../../studies/specimens/specimen-layout';
import { exclusionRows } from './exclusion-rows';

const row = (label: string, comparative: string, candidate: string, excluded = false, exclusionReason = ''): GridRow =>
  ({ uid: 1, label, comparative, candidate, excluded, exclusionReason, note: '' });

describe('exclusionRows', () => {
  it('lists only the excluded rows, by their position, with their results and reasons', () => {
    const rows = [row('VH-001', '3.0', '3.1'), row('VH-002', '4.2', '6.9', true, 'Clotted on the candidate run'), row('VH-003', '5.0', '5.0')];
    expect(exclusionRows(rows, COMPARISON_LAYOUT)).toEqual([
      { position: 2, label: 'VH-002', results: 'Comparative result 4.2 · Candidate result 6.9', reason: 'Clotted on the candidate run' },
    ]);
  });

  it('says when an excluded row has no reason or no label', () => {
    const [only] = exclusionRows([row('  ', '', '7.7', true, '  ')], COMPARISON_LAYOUT);
    expect(only).toEqual({ position: 1, label: '—', results: 'Comparative result — · Candidate result 7.7', reason: 'No reason given' });
  });

  it('is empty when nothing is excluded', () => {
    expect(exclusionRows([row('A', '1', '1')], COMPARISON_LAYOUT)).toEqual([]);
  });
});
