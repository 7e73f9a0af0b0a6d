import { labelCheck, labelChecks } from './label-checks';

const labels = (n: number, prefix = 'S') => Array.from({ length: n }, (_, i) => `${prefix}${String(i + 1).padStart(3, '0')}`);

describe('labels an upload would repeat', () => {
  it('counts the file rows that repeat labels already in the study, with the right words', () => {
    expect(labelCheck(['S001', 'N1', 'N2'], labels(10))).toEqual({
      warnings: ['1 row repeats a label already in the study (S001)'], repeatsMostOfStudy: false,
    });
    expect(labelCheck([' s001', 'S002 ', 'N3'], labels(3))).toEqual({
      warnings: ['2 rows repeat labels already in the study (s001, S002)'], repeatsMostOfStudy: true,
    });
  });

  it('takes the same file again as most of the study: replacing is the safer default', () => {
    const check = labelCheck(labels(45), labels(45));
    expect(check.warnings).toEqual([
      '45 rows repeat labels already in the study (S001, S002, S003, S004, S005 and 40 more)',
    ]);
    expect(check.repeatsMostOfStudy).toBe(true);
  });

  it('needs more than half of the study labels for "most"', () => {
    expect(labelCheck(labels(2), labels(4)).repeatsMostOfStudy).toBe(false);
    expect(labelCheck(labels(3), labels(4)).repeatsMostOfStudy).toBe(true);
    expect(labelCheck(labels(3), []).repeatsMostOfStudy).toBe(false);
  });

  it('warns of labels the file itself repeats, and ignores empty labels', () => {
    expect(labelCheck(['B1', 'B2', 'b1', '', '', 'B2', 'B3'], [])).toEqual({
      warnings: ['Labels B1, B2 appear more than once in the file (4 rows)'], repeatsMostOfStudy: false,
    });
  });

  it('checks every column and leaves out the ones that repeat nothing', () => {
    const rows = [['S001', '5.1', 'x'], ['S002', '5.1', 'y']];
    expect(labelChecks(['Sample', 'Result', 'Note'], rows, ['S001', 'S002'])).toEqual({
      Sample: { warnings: ['2 rows repeat labels already in the study (S001, S002)'], repeatsMostOfStudy: true },
      Result: { warnings: ['Label 5.1 appears more than once in the file (2 rows)'], repeatsMostOfStudy: false },
    });
  });
});
