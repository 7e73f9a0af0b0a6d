import { isNumberText, normaliseDecimal, parseResult } from './result-number';

describe('parseResult', () => {
  it('reads a decimal point and a decimal comma alike', () => {
    expect(parseResult('5.2')).toBe(5.2);
    expect(parseResult('5,2')).toBe(5.2);
    expect(parseResult(' -0,45 ')).toBe(-0.45);
    expect(parseResult('.5')).toBe(0.5);
    expect(parseResult('1e3')).toBe(1000);
  });

  it('tells an empty cell (null) from text that is not a number (NaN)', () => {
    expect(parseResult('')).toBeNull();
    expect(parseResult(' \u00a0')).toBeNull();
    expect(parseResult('5,x')).toBeNaN();
    expect(parseResult('<0.5')).toBeNaN();
    expect(parseResult('1.234,5')).toBeNaN();
    expect(parseResult('5 2')).toBeNaN();
  });
});

describe('normaliseDecimal', () => {
  it('rewrites a decimal comma as a point and keeps the reported decimals', () => {
    expect(normaliseDecimal('5,20')).toBe('5.20');
    expect(normaliseDecimal(' 7.0 ')).toBe('7.0');
  });

  it('leaves text that is not a number as it was, so the mistake stays visible', () => {
    expect(normaliseDecimal('5,x')).toBe('5,x');
    expect(normaliseDecimal('hemolysed')).toBe('hemolysed');
  });

  it('isNumberText agrees with parseResult', () => {
    expect(isNumberText('3,1')).toBe(true);
    expect(isNumberText('3,1,2')).toBe(false);
    expect(isNumberText('')).toBe(false);
  });
});
