import { COMPARISON_LAYOUT } from '../specimen-layout';
import { mappableFields, mappingProblems, startingMapping } from './upload-mapping';

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
});
