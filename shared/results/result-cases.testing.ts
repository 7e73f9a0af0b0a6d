/**
 * Result cells both sides must judge alike, with the exact answer of the shared rule (row-checks.ts) for the
 * candidate result of a method comparison whose analyte cannot be negative and whose decimal mark is detected
 * ('auto'). The shared spec checks the rule against it; the grid's spec (client) and the specimens API spec
 * (server) check that each side gives these same words for the same cells.
 */
export interface ResultCase {
  /** The cell as typed, pasted or imported. */
  input: string;
  /** Read: the stored value and its text as reported (null, null: no result). */
  read?: { value: number | null; text: string | null };
  /** Refused: the words after the field's name ("candidate result …"). */
  error?: string;
}

export const RESULT_CASES: readonly ResultCase[] = [
  { input: '<0.5', error: '"<0.5" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason' },
  { input: '> 100', error: '"> 100" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason' },
  { input: '', read: { value: null, text: null } },
  { input: ' ', read: { value: null, text: null } },
  { input: '\u00a0\t', read: { value: null, text: null } },
  {
    input: '1,234',
    error: '"1,234" is unclear: it may be 1.234 (a decimal comma) or 1234 (a comma separating thousands); '
      + "write 1.234 or 1234, or choose the decimal mark in the study's Setup",
  },
  { input: '1.2.3', error: '"1.2.3" is not a number' },
  { input: '-0', read: { value: 0, text: '-0' } },
  { input: '1e3', read: { value: 1000, text: '1e3' } },
  { input: 'NaN', error: '"NaN" is not a number' },
  { input: 'Infinity', error: '"Infinity" is not a number' },
  { input: '5\t 2', error: '"5 2" is not a number' },
  { input: '-0.4', error: 'is negative, which this analyte cannot be' },
  { input: ' 4,25 ', read: { value: 4.25, text: '4.25' } },
];

/** The message a row gets for a refused case: "row 1: candidate result …". */
export const refusedMessage = (row: number, c: ResultCase): string => `row ${row}: candidate result ${c.error}`;

/** The message an included row with no result gets: the analysis refuses it so, and the grid marks it so. */
export const emptyMessage = (row: number): string => `row ${row}: the candidate result is empty; fill it or exclude the row with a reason`;
