import { notMappedNotes } from './mapping-notes';

describe('notes on fields an import leaves unmapped', () => {
  const comparison = ['label', 'comparative', 'candidate', 'note'];
  const interval = ['label', 'value', 'sex', 'ageBand', 'note'];

  it('says the rows come in unlabelled when no column is the label', () => {
    expect(notMappedNotes(comparison, { comparative: 'x', candidate: 'y', note: 'Comment' })).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
    ]);
  });

  it('groups the other optional fields, and says nothing of results or of mapped fields', () => {
    expect(notMappedNotes(comparison, { label: 'Specimen', comparative: 'x' })).toEqual([
      'Not mapped: note — no column of the file is chosen for it; the rows come in without it',
    ]);
    expect(notMappedNotes(interval, { value: 'Result' })).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
      'Not mapped: sex, age band, note — no column of the file is chosen for them; the rows come in without them',
    ]);
    expect(notMappedNotes(interval, { label: 'Subject', value: 'Result', sex: 'Sex', ageBand: 'Age', note: 'Notes' })).toEqual([]);
  });
});
