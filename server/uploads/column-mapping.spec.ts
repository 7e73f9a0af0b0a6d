import { headerWords, importFields, suggestMapping, unmappedNotes } from './column-mapping';

const rows = [['A1', '5.1', '5.2', 'F', '30-39', '']];

describe('column mapping by header', () => {
  it.each([
    'Specimen', 'Sample', 'Sample ID', 'sample_id', 'ID', 'Label', 'Patient', 'Patient no.', 'Individual', 'Subject', 'Subject #',
    'Donor', 'Participant', 'Accession number', 'Barcode', 'Bar-code', 'Specimen label', 'Lab no', 'SID', 'Tube',
  ])('takes a column headed "%s" for the specimen label', (header) => {
    expect(suggestMapping('method-comparison', [header, 'Current', 'New'], [['A1', '5.1', '5.2']]).label).toBe(header);
  });

  it.each(['Sample value', 'Comment', 'Individual result', 'Date'])('does not take "%s" for the label', (header) => {
    expect(suggestMapping('interval-establish', [header, 'Result'], [['x', '5.1']]).label).toBeUndefined();
  });

  it('maps a method comparison: label, both results by their names, and the note', () => {
    expect(suggestMapping('method-comparison', ['Individual', 'Current analyzer', 'New analyzer', 'Remarks'], rows)).toEqual({
      label: 'Individual', comparative: 'Current analyzer', candidate: 'New analyzer', note: 'Remarks',
    });
  });

  it('maps both interval kinds: label, value, sex, age band and note', () => {
    const columns = ['Subject ID', 'Result', 'Gender', 'Age group', 'Notes'];
    const expected = { label: 'Subject ID', value: 'Result', sex: 'Gender', ageBand: 'Age group', note: 'Notes' };
    expect(suggestMapping('interval-establish', columns, rows)).toEqual(expected);
    expect(suggestMapping('interval-verify', columns, rows)).toEqual(expected);
  });

  it('falls back to the numeric columns for results when no header names them', () => {
    expect(suggestMapping('method-comparison', ['Donor', 'A', 'B'], [['D1', '4.1', '4.3']])).toEqual({ label: 'Donor', comparative: 'A', candidate: 'B' });
    expect(suggestMapping('interval-verify', ['Participant', 'mmol/L'], [['P1', '4.1']])).toEqual({ label: 'Participant', value: 'mmol/L' });
  });

  it('reads headers without regard to case, separators or spaces', () => {
    expect(headerWords('  Sample_ID ')).toBe('sample id');
    expect(headerWords('Subject  No.')).toBe('subject no');
    expect(headerWords('Bar-Code')).toBe('bar code');
  });

  it('reports the fields left unmapped for each kind of study', () => {
    expect(importFields('method-comparison')).toEqual(['label', 'comparative', 'candidate', 'note']);
    expect(unmappedNotes('method-comparison', { comparative: 'x', candidate: 'y' })).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
      'Not mapped: note — no column of the file is chosen for it; the rows come in without it',
    ]);
    expect(unmappedNotes('interval-establish', { label: 'Subject', value: 'Result' })).toEqual([
      'Not mapped: sex, age band, note — no column of the file is chosen for them; the rows come in without them',
    ]);
    expect(unmappedNotes('interval-verify', { value: 'Result', sex: 'Sex', ageBand: 'Age', note: 'Note' })).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
    ]);
  });
});
