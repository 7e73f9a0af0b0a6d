import { RESULT_CASES } from '@shared/results/result-cases.testing';
import { CsvError, parseNumber } from './csv';

const refusal = (text: string): string => {
  try {
    parseNumber(text, 'row 1 (line 2), column x');
  } catch (err) {
    if (err instanceof CsvError) return err.message;
    throw err;
  }
  throw new Error(`"${text}" was read`);
};

describe("the command line reads a CSV value with the server's result parser (the mark detected, as a study's default)", () => {
  it('refuses what the grid and the API refuse, in their words, naming the row, line and column', () => {
    expect(refusal('<0.5')).toBe('row 1 (line 2), column x: "<0.5" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason');
    expect(refusal('1e309')).toBe('row 1 (line 2), column x: "1e309" is too large to be kept (the largest number is about 1.8e308)');
    expect(refusal('1.2.3')).toBe('row 1 (line 2), column x: "1.2.3" is not a number');
    expect(refusal('NaN')).toBe('row 1 (line 2), column x: "NaN" is not a number');
    expect(refusal(' ')).toBe('row 1 (line 2), column x: the value is empty');
    expect(refusal('1,234')).toMatch(/^row 1 \(line 2\), column x: "1,234" is unclear: it may be 1\.234 \(a decimal comma\) or 1234/);
  });

  it('reads the shared table\'s numbers as the API stores them', () => {
    const numbers = RESULT_CASES.filter((k) => k.read && k.read.value !== null);
    expect(numbers.map((c) => parseNumber(c.input, 'x'))).toEqual(numbers.map((c) => c.read!.value));
  });
});
