import { DecimalMark, looksLikeNumber, readResult, ResultReading } from './result-text';
import { StudySettings, StudySettingsPatch } from './study.schema';

const ok = (value: number, text: string): ResultReading => ({ value, text });
const errorOf = (input: unknown, mark?: DecimalMark): string => {
  const r = readResult(input, mark);
  if (!('error' in r)) throw new Error(`${JSON.stringify(input)} was read as ${r.value}`);
  return r.error;
};

describe('readResult: plain values', () => {
  it('reads empty as null, and numbers with a point', () => {
    expect(readResult(null)).toEqual({ value: null, text: null });
    expect(readResult(undefined)).toEqual({ value: null, text: null });
    expect(readResult('  \u00a0')).toEqual({ value: null, text: null });
    expect(readResult(' 12 ')).toEqual(ok(12, '12'));
    expect(readResult('-0.45')).toEqual(ok(-0.45, '-0.45'));
    expect(readResult('+3.1')).toEqual(ok(3.1, '3.1'));
    expect(readResult('.5')).toEqual(ok(0.5, '.5'));
    expect(readResult('5.')).toEqual(ok(5, '5'));
  });

  it('keeps the reported precision in the text, so ties are judged as reported', () => {
    expect(readResult('5.20')).toEqual(ok(5.2, '5.20'));
    expect(readResult('7.0')).toEqual(ok(7, '7.0'));
    expect(readResult('5,20')).toEqual(ok(5.2, '5.20'));
  });

  it('reads exponents, and writes them with a plain "e"', () => {
    expect(readResult('1e3')).toEqual(ok(1000, '1e3'));
    expect(readResult('1.5E+2')).toEqual(ok(150, '1.5e2'));
    expect(readResult('2,5e-3')).toEqual(ok(0.0025, '2.5e-3'));
  });

  it('reads a negative zero as zero', () => {
    expect(Object.is((readResult('-0.0') as { value: number }).value, 0)).toBe(true);
  });

  it('keeps finite numbers given as numbers, with their shortest text', () => {
    expect(readResult(12)).toEqual(ok(12, '12'));
    expect(readResult(0.1)).toEqual(ok(0.1, '0.1'));
    expect(readResult(1e21)).toEqual(ok(1e21, '1e21'));
    expect(readResult(1e-7)).toEqual(ok(1e-7, '1e-7'));
  });

  it('refuses what is not a number', () => {
    expect(errorOf('5,x')).toBe('"5,x" is not a number');
    expect(errorOf('5 2')).toBe('"5 2" is not a number');
    expect(errorOf('.')).toBe('"." is not a number');
    expect(errorOf('1.2.3')).toBe('"1.2.3" is not a number');
    expect(errorOf('hemolysed')).toBe('"hemolysed" is not a number');
    expect(errorOf(true)).toBe('is not a number');
    expect(errorOf({ value: 1 })).toBe('is not a number');
  });

  it('refuses censored values with today\'s words', () => {
    expect(errorOf('<0.5')).toBe('"<0.5" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason');
    expect(errorOf('>100')).toMatch(/^">100" is censored/);
  });
});

describe('readResult: values a double cannot hold exactly', () => {
  it('refuses a value too large, instead of keeping Infinity', () => {
    expect(errorOf('1e309')).toBe('"1e309" is too large to be kept (the largest number is about 1.8e308)');
    expect(errorOf('-1.8e308')).toMatch(/too large/);
    expect(errorOf(Number.POSITIVE_INFINITY)).toBe('is not a finite number');
    expect(errorOf(Number.NaN)).toBe('is not a finite number');
    expect(readResult('1.7e308')).toEqual(ok(1.7e308, '1.7e308'));
  });

  it('refuses a value so close to zero it would become 0 or lose digits', () => {
    expect(errorOf('1e-400')).toBe('"1e-400" is too close to zero to be kept exactly (the smallest is about 2.2e-308)');
    expect(errorOf('1e-310')).toMatch(/too close to zero/);
    expect(errorOf(5e-324)).toMatch(/too close to zero/);
    expect(readResult('2.3e-308')).toEqual(ok(2.3e-308, '2.3e-308'));
    expect(readResult('0e-400')).toEqual(ok(0, '0e-400'));
  });

  it('refuses more than 15 significant digits when a double would silently round them', () => {
    expect(errorOf('1.00000000000000000001')).toBe('"1.00000000000000000001" has 21 significant digits, more than a number keeps exactly (at most 15 always are), so round it');
    expect(errorOf('12345678901234567890')).toMatch(/20 significant digits/);
    expect(errorOf('0.30000000000000001')).toMatch(/17 significant digits/);
    expect(errorOf('1.23456789012345678')).toMatch(/18 significant digits/);
  });

  it('keeps more than 15 digits that a double holds exactly: a spreadsheet\'s own number, or trailing zeros', () => {
    expect(readResult(0.1 + 0.2)).toEqual(ok(0.30000000000000004, '0.30000000000000004'));
    expect(readResult('0.30000000000000004')).toEqual(ok(0.30000000000000004, '0.30000000000000004'));
    expect(readResult('5.2000000000000000')).toEqual(ok(5.2, '5.2000000000000000'));
    expect(readResult('123456789012345')).toEqual(ok(123456789012345, '123456789012345'));
    expect(readResult('0.000123456789012345')).toEqual(ok(0.000123456789012345, '0.000123456789012345'));
  });
});

describe('readResult: decimal comma, detected (auto)', () => {
  it('reads a comma that cannot separate thousands as the decimal mark', () => {
    expect(readResult('5,2')).toEqual(ok(5.2, '5.2'));
    expect(readResult('0,234')).toEqual(ok(0.234, '0.234'));
    expect(readResult('12,5')).toEqual(ok(12.5, '12.5'));
    expect(readResult('1,2345')).toEqual(ok(1.2345, '1.2345'));
    expect(readResult('1234,567')).toEqual(ok(1234.567, '1234.567'));
    expect(readResult(',5')).toEqual(ok(0.5, '.5'));
  });

  it('reads a point as the decimal mark, always', () => {
    expect(readResult('1.234')).toEqual(ok(1.234, '1.234'));
  });

  it('refuses "1,234", naming both readings and how to settle it', () => {
    expect(errorOf('1,234')).toBe(
      '"1,234" is unclear: it may be 1.234 (a decimal comma) or 1234 (a comma separating thousands); ' +
        "write 1.234 or 1234, or choose the decimal mark in the study's Setup",
    );
    expect(errorOf('-999,000')).toMatch(/may be -999.000 .* or -999000 /);
    expect(errorOf('123,456e2')).toMatch(/is unclear/);
  });

  it('refuses thousands separators, saying what to write instead', () => {
    expect(errorOf('1,234.5')).toBe(
      '"1,234.5" has a thousands separator, which is only read when the study says which mark is the decimal; ' +
        "write 1234.5, or choose the decimal mark in the study's Setup",
    );
    expect(errorOf('1.234,5')).toMatch(/write 1234\.5,/);
    expect(errorOf('1,234,567')).toMatch(/write 1234567,/);
    expect(errorOf('1,2,3')).toBe('"1,2,3" is not a number');
  });
});

describe('readResult: the study says which mark is the decimal', () => {
  it("'point': a comma separates thousands, in proper groups of three", () => {
    expect(readResult('1,234', 'point')).toEqual(ok(1234, '1234'));
    expect(readResult('1,234.5', 'point')).toEqual(ok(1234.5, '1234.5'));
    expect(readResult('-12,345,678.90', 'point')).toEqual(ok(-12345678.9, '-12345678.90'));
    expect(readResult('5.2', 'point')).toEqual(ok(5.2, '5.2'));
    const words = 'the decimal mark is a point, and a comma only separates thousands (as in 1,234.5)';
    expect(errorOf('12,34', 'point')).toBe(`"12,34" is not a number as this study reads results: ${words}`);
    expect(errorOf('5,2', 'point')).toMatch(/as this study reads results/);
    expect(errorOf('0,234', 'point')).toMatch(/as this study reads results/);
    expect(errorOf('1234,567', 'point')).toMatch(/as this study reads results/);
    expect(errorOf('1.234,5', 'point')).toMatch(/as this study reads results/);
    expect(errorOf('1,234.5.6', 'point')).toMatch(/as this study reads results/);
  });

  it("'comma': a point separates thousands; the text is written with a point", () => {
    expect(readResult('1,234', 'comma')).toEqual(ok(1.234, '1.234'));
    expect(readResult('1.234,5', 'comma')).toEqual(ok(1234.5, '1234.5'));
    expect(readResult('1.234', 'comma')).toEqual(ok(1234, '1234'));
    expect(readResult('5,20', 'comma')).toEqual(ok(5.2, '5.20'));
    expect(readResult('1234,5', 'comma')).toEqual(ok(1234.5, '1234.5'));
    expect(errorOf('5.2', 'comma')).toBe(
      '"5.2" is not a number as this study reads results: the decimal mark is a comma, and a point only separates thousands (as in 1.234,5)',
    );
    expect(errorOf('1,234.5', 'comma')).toMatch(/as this study reads results/);
  });

  it('applies the same exactness limits whatever the mark', () => {
    expect(errorOf('1.000.000.000.000.000.000,5', 'comma')).toMatch(/20 significant digits/);
    expect(errorOf('1e309', 'point')).toMatch(/too large/);
    expect(errorOf('1,5e-400', 'comma')).toMatch(/too close to zero/);
  });

  it('reads its own text again to the same value under the same mark (point and detect)', () => {
    for (const mark of ['auto', 'point'] as const) {
      for (const input of ['5,20', '1.234', '-0,45', '1e3', '0,234']) {
        const first = readResult(input, 'auto');
        if ('error' in first) throw new Error(first.error);
        expect(readResult(first.text, mark)).toEqual(first);
      }
    }
  });
});

describe('looksLikeNumber', () => {
  it('tells number-shaped text (readable or not) from words', () => {
    expect(looksLikeNumber('1,234')).toBe(true);
    expect(looksLikeNumber(' 1.234,5 ')).toBe(true);
    expect(looksLikeNumber('1e309')).toBe(true);
    expect(looksLikeNumber('Current')).toBe(false);
    expect(looksLikeNumber('')).toBe(false);
    expect(looksLikeNumber('.,')).toBe(false);
  });

  it('counts a censored result as number-shaped, so a pasted first line of "<0.5" is data, not a header', () => {
    expect(looksLikeNumber('<0.5')).toBe(true);
    expect(looksLikeNumber('> 100')).toBe(true);
    expect(looksLikeNumber('≤3')).toBe(true);
    expect(looksLikeNumber('<LoQ')).toBe(false);
  });
});

describe('the study setting decimalMark', () => {
  it("defaults to detecting the mark, and takes only 'auto', 'point' or 'comma'", () => {
    expect(StudySettings.parse({}).decimalMark).toBe('auto');
    expect(StudySettingsPatch.parse({ decimalMark: 'comma' })).toEqual({ decimalMark: 'comma' });
    const wrong = StudySettingsPatch.safeParse({ decimalMark: 'dot' });
    expect(wrong.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['decimalMark', 'Choose how a decimal mark is read: detect, point or comma'],
    ]);
  });
});
