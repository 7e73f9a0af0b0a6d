import { labelKey, namedLabels, repeatedLabels, repeatedLabelsSentence } from './repeated-labels';

const rows = (...labels: (string | [string, boolean])[]) =>
  labels.map((l) => (typeof l === 'string' ? { label: l, excluded: false } : { label: l[0], excluded: l[1] }));

describe('repeated specimen labels', () => {
  it('compares labels trimmed and in any case, and never counts an empty label', () => {
    expect(labelKey('  S01 ')).toBe('s01');
    expect(repeatedLabels(rows('S01', ' s01', 'S02', '', '  ', 'S03', 'S01'))).toEqual([{ label: 'S01', indexes: [0, 1, 6] }]);
  });

  it('leaves excluded rows out: an excluded row resolves its repeat', () => {
    expect(repeatedLabels(rows('S01', ['S01', true], 'S02', 'S02'))).toEqual([{ label: 'S02', indexes: [2, 3] }]);
    expect(repeatedLabels(rows('S01', ['S01', true]))).toEqual([]);
  });

  it('names the labels in one sentence, with the right number of words and rows', () => {
    expect(repeatedLabelsSentence([])).toBeNull();
    expect(repeatedLabelsSentence(repeatedLabels(rows('S01', 'S01')))).toBe('Label S01 appears more than once (2 rows)');
    expect(repeatedLabelsSentence(repeatedLabels(rows('S01', 'S07', 'S01', 'S07', 'S09')), ' in the file'))
      .toBe('Labels S01, S07 appear more than once in the file (4 rows)');
  });

  it('caps a long list of labels with a count of the rest', () => {
    const many = Array.from({ length: 45 }, (_, i) => `S${String(i + 1).padStart(2, '0')}`);
    expect(namedLabels(many)).toBe('S01, S02, S03, S04, S05 and 40 more');
    expect(namedLabels(many.slice(0, 5))).toBe('S01, S02, S03, S04, S05');
    expect(repeatedLabelsSentence(repeatedLabels(rows(...many, ...many)))).toBe('Labels S01, S02, S03, S04, S05 and 40 more appear more than once (90 rows)');
  });
});
