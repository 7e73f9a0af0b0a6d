import {
  estimateWithCi, findingsDecimals, formatCi, formatNumber, formatP, levelLabel, numberFormat, pInWords, withUnit,
} from './findings-numbers';

describe('how findings write their numbers', () => {
  it('fixes the decimals and writes a true minus sign; a rounded zero has none', () => {
    expect(formatNumber(0.12345, 2)).toBe('0.12');
    expect(formatNumber(-1.5, 1)).toBe('\u22121.5');
    expect(formatNumber(-0.001, 2)).toBe('0.00');
    expect(formatNumber(-0.4, 0)).toBe('0');
    expect(formatNumber(null, 2)).toBe('—');
    expect(formatNumber(Number.NaN, 2)).toBe('—');
  });

  it('writes a CI as a range and says when it is missing', () => {
    expect(formatCi([-0.123, 0.3], 2)).toBe('\u22120.12 to 0.30');
    expect(formatCi(null, 2)).toBe('not available');
    expect(estimateWithCi({ estimate: 0.2, ci: [0.1, 0.3] }, 2, 'mmol/L')).toBe('0.20 mmol/L (0.10 to 0.30)');
    expect(estimateWithCi({ estimate: 0.2, ci: null }, 2, '')).toBe('0.20 (CI not available)');
  });

  it('writes small p-values as below 0.001, in a cell and in a sentence', () => {
    expect([formatP(0.0004), formatP(0.39016), formatP(null)]).toEqual(['< 0.001', '0.390', '—']);
    expect([pInWords(0.0004), pInWords(0.42)]).toEqual(['p < 0.001', 'p = 0.420']);
  });

  it('labels the confidence level and puts a unit after a value, not after a dash', () => {
    expect([levelLabel(0.95), levelLabel(0.9), levelLabel(0.975)]).toEqual(['95%', '90%', '97.5%']);
    expect([withUnit('0.1', 'mmol/L'), withUnit('0.1', ''), withUnit('—', 'mmol/L')]).toEqual(['0.1 mmol/L', '0.1', '—']);
  });

  it('has one rule for the decimals: results as reported, estimates one more, percent differences 2, slope 3, r 4', () => {
    expect(findingsDecimals(1)).toEqual({ value: 1, stat: 2, difference: 2, slope: 3, percent: 1, correlation: 4 });
    expect(findingsDecimals(0, 'absolute')).toMatchObject({ value: 0, stat: 1, difference: 1 });
    expect(findingsDecimals(3, 'percent-mean')).toMatchObject({ stat: 4, difference: 2 });
    expect(findingsDecimals(undefined)).toMatchObject({ value: 1, stat: 2 });
  });

  it('gives the spreadsheet format of those decimals', () => {
    expect([numberFormat(0), numberFormat(2), numberFormat(4)]).toEqual(['0', '0.00', '0.0000']);
  });
});
