import type { UploadPreview } from '@shared/schemas';
import { COMPARISON_LAYOUT } from '../specimen-layout';
import { defaultMode, importWarnings, labelCheckOf, mappableFields, mappingProblems, startingMapping } from './upload-mapping';

describe('upload mapping', () => {
  const fields = mappableFields(COMPARISON_LAYOUT);

  it('offers label, both results and note, with the results required', () => {
    expect(fields.map((f) => [f.field, f.required])).toEqual([
      ['label', false], ['comparative', true], ['candidate', true], ['note', false],
    ]);
  });

  it("starts from the server's suggestion, dropping columns that do not exist", () => {
    const mapping = startingMapping(fields, { comparative: 'Old', candidate: 'New', label: 'Gone' }, ['Sample', 'Old', 'New']);
    expect(mapping).toEqual({ comparative: 'Old', candidate: 'New' });
  });

  it('asks for the missing results and refuses one column for two fields', () => {
    expect(mappingProblems(fields, { comparative: 'A' })).toEqual(['Choose the column for candidate result.']);
    expect(mappingProblems(fields, { comparative: 'A', candidate: 'A' })).toEqual(['The column "A" is mapped to more than one field.']);
    expect(mappingProblems(fields, { comparative: 'A', candidate: 'B', label: 'C' })).toEqual([]);
  });

  describe('warnings and the default of replace or append', () => {
    const repeats = '45 rows repeat labels already in the study (S001, S002, S003, S004, S005 and 40 more)';
    const preview: UploadPreview = {
      uploadId: 7, fileName: 'run.csv', sha256: 'ab', columns: ['Individual', 'Code', 'Current', 'New', 'Comment'], preview: [], rowCount: 45,
      suggestedMapping: { label: 'Individual', comparative: 'Current', candidate: 'New', note: 'Comment' }, warnings: [repeats], suggestedMode: 'replace',
      labelChecks: {
        Individual: { warnings: [repeats], repeatsMostOfStudy: true },
        Code: { warnings: ['Label K1 appears more than once in the file (2 rows)'], repeatsMostOfStudy: false },
      },
    };
    const mapped = { label: 'Individual', comparative: 'Current', candidate: 'New', note: 'Comment' };

    it("shows the repeats of the column mapped to the label, following the user's choice of column", () => {
      expect(importWarnings(fields, preview, mapped)).toEqual([repeats]);
      expect(importWarnings(fields, preview, { ...mapped, label: 'Code' })).toEqual(['Label K1 appears more than once in the file (2 rows)']);
    });

    it('says which optional fields are left unmapped', () => {
      expect(importWarnings(fields, preview, { comparative: 'Current', candidate: 'New' })).toEqual([
        'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
        'Not mapped: note — no column of the file is chosen for it; the rows come in without it',
      ]);
    });

    it('replaces by default when the file repeats most of the study, adds after rows otherwise, and replaces an empty grid', () => {
      expect(defaultMode(45, labelCheckOf(preview, mapped))).toBe('replace');
      expect(defaultMode(45, labelCheckOf(preview, { ...mapped, label: 'Code' }))).toBe('append');
      expect(defaultMode(45, labelCheckOf(preview, { comparative: 'Current', candidate: 'New' }))).toBe('append');
      expect(defaultMode(0, null)).toBe('replace');
    });
  });
});
