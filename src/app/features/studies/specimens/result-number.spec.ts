import { gridNumber, isNumberText, normaliseDecimal, parseResult, resultProblem, rewriteForMark } from './result-number';

describe('parseResult', () => {
  it('reads a decimal point, and a decimal comma that cannot separate thousands', () => {
    expect(parseResult('5.2')).toBe(5.2);
    expect(parseResult('5,2')).toBe(5.2);
    expect(parseResult(' -0,45 ')).toBe(-0.45);
    expect(parseResult('.5')).toBe(0.5);
    expect(parseResult('1e3')).toBe(1000);
  });

  it('tells an empty cell (null) from text the server refuses (NaN)', () => {
    expect(parseResult('')).toBeNull();
    expect(parseResult(' \u00a0')).toBeNull();
    for (const refused of ['5,x', '<0.5', '1.234,5', '5 2', '1,234', '1e309', '1e-400', '1.00000000000000000001']) {
      expect(parseResult(refused)).toBeNaN();
    }
  });

  it("reads with the study's decimal mark", () => {
    expect(parseResult('1,234', 'comma')).toBe(1.234);
    expect(parseResult('1,234', 'point')).toBe(1234);
    expect(parseResult('1.234,5', 'comma')).toBe(1234.5);
    expect(parseResult('5.2', 'comma')).toBeNaN();
  });

  it("gives the server's words for a refused result", () => {
    expect(resultProblem('1,234')).toMatch(/^"1,234" is unclear: it may be 1.234 \(a decimal comma\) or 1234/);
    expect(resultProblem('1,234', 'comma')).toBeNull();
    expect(resultProblem('')).toBeNull();
  });
});

describe('normaliseDecimal', () => {
  it('writes a result that reads with a point and keeps the reported decimals, where the mark is detected or a point', () => {
    expect(normaliseDecimal('5,20')).toBe('5.20');
    expect(normaliseDecimal(' 7.0 ')).toBe('7.0');
    expect(normaliseDecimal('1,234.50', 'point')).toBe('1234.50');
  });

  it('writes it with a comma, and without thousands separators, where the mark is a comma', () => {
    expect(normaliseDecimal('1.234,50', 'comma')).toBe('1234,50');
    expect(normaliseDecimal('5,2', 'comma')).toBe('5,2');
    expect(normaliseDecimal('1.234', 'comma')).toBe('1234');
  });

  it('leaves text that does not read as it was, so the mistake stays visible and is marked', () => {
    expect(normaliseDecimal('5,x')).toBe('5,x');
    expect(normaliseDecimal('hemolysed')).toBe('hemolysed');
    expect(normaliseDecimal('1,234')).toBe('1,234');
    expect(normaliseDecimal('5.2', 'comma')).toBe('5.2');
  });

  it('gives text that reads back to the same number under the same mark', () => {
    for (const mark of ['auto', 'point', 'comma'] as const) {
      for (const typed of ['5,20', '1.234', '1,234', '1.234,5', '1,234.5', '0,5', '-12']) {
        const value = parseResult(typed, mark);
        if (value === null || Number.isNaN(value)) continue;
        expect(parseResult(normaliseDecimal(typed, mark), mark)).toBe(value);
      }
    }
  });
});

describe('rewriteForMark', () => {
  it('rewrites stored text (a point) for a study that writes a comma, and back', () => {
    expect(rewriteForMark('1.234', 'point', 'comma')).toBe('1,234');
    expect(rewriteForMark('1,234', 'comma', 'auto')).toBe('1.234');
    expect(rewriteForMark('1234,5', 'comma', 'point')).toBe('1234.5');
    expect(parseResult(rewriteForMark('1.234', 'point', 'comma'), 'comma')).toBe(1.234);
  });

  it('leaves text that does not read under the old mark, to be judged by the new one', () => {
    expect(rewriteForMark('1,234', 'auto', 'comma')).toBe('1,234');
    expect(rewriteForMark('5,x', 'auto', 'comma')).toBe('5,x');
  });
});

describe('isNumberText and gridNumber', () => {
  it('isNumberText sees the shape of a number, readable or not, so a header is told from data', () => {
    expect(isNumberText('3,1')).toBe(true);
    expect(isNumberText('1,234')).toBe(true);
    expect(isNumberText('1.234,5')).toBe(true);
    expect(isNumberText('Current')).toBe(false);
    expect(isNumberText('')).toBe(false);
  });

  it('gridNumber reads a cell as the grid writes it (one decimal mark, no thousands separators) for plots', () => {
    expect(gridNumber('1,234')).toBe(1.234);
    expect(gridNumber('1234.5')).toBe(1234.5);
    expect(gridNumber('5,20')).toBe(5.2);
    expect(gridNumber('')).toBeNull();
    expect(gridNumber('5,x')).toBeNaN();
  });
});
