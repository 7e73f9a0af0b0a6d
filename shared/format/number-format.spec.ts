import * as findings from '../types/findings-numbers';
import {
  estimateWithCi, formatChance, formatCi, formatCount, formatNumber, formatP, formatPercent, levelLabel, pInWords, withUnit,
} from './number-format';

describe('formatNumber: fixed decimals, a true minus sign, no sign on a rounded zero', () => {
  it.each([
    [1.25, 1, '1.3'], [-0.071, 2, '−0.07'], [-0.001, 2, '0.00'], [-0, 1, '0.0'], [0, 0, '0'], [1234.5, 0, '1235'],
    [2.5e-7, 3, '0.000'], [-12.345, 1, '−12.3'], [null, 2, '—'], [undefined, 2, '—'], [Number.NaN, 2, '—'], [Number.POSITIVE_INFINITY, 1, '—'],
  ])('%p with %p decimals → %p', (value, decimals, text) => {
    expect(formatNumber(value as number | null, decimals as number)).toBe(text);
  });
});

describe('CIs, p-values and units', () => {
  it('writes a CI as a range, and says when it could not be formed', () => {
    expect(formatCi([-0.19, 0.08], 2)).toBe('−0.19 to 0.08');
    expect(formatCi(null, 2)).toBe('not available');
    expect(estimateWithCi({ estimate: 0.2, ci: [0.1, 0.3] }, 2, 'mmol/L')).toBe('0.20 mmol/L (0.10 to 0.30)');
    expect(estimateWithCi({ estimate: null, ci: null }, 2, '')).toBe('— (CI not available)');
  });

  it('writes p to three decimals with a floor of "< 0.001", in a cell and in a sentence', () => {
    expect([formatP(0.0431), formatP(0.0004), formatP(0.001), formatP(1), formatP(null)]).toEqual(['0.043', '< 0.001', '0.001', '1.000', '—']);
    expect([pInWords(0.42), pInWords(0.0001)]).toEqual(['p = 0.420', 'p < 0.001']);
  });

  it('puts a unit after a value, never after a dash', () => {
    expect([withUnit('0.1', 'mmol/L'), withUnit('0.1', ''), withUnit('—', 'mmol/L')]).toEqual(['0.1 mmol/L', '0.1', '—']);
  });
});

describe('formatPercent: a share set by a person, up to two decimals, trailing zeros dropped', () => {
  it.each([
    [0.95, '95%'], [0.975, '97.5%'], [0.9, '90%'], [0.8, '80%'], [0.025, '2.5%'], [0.0125, '1.25%'], [0.9995, '99.95%'],
    [0, '0%'], [1, '100%'], [0.12345, '12.35%'], [-0.05, '−5%'], [null, '—'], [Number.NaN, '—'],
  ])('%p → %p', (fraction, text) => {
    expect(formatPercent(fraction as number | null)).toBe(text);
  });

  it('labels a confidence level by the same rule (levelLabel)', () => {
    expect([levelLabel(0.95), levelLabel(0.975), levelLabel(0.9995)]).toEqual(['95%', '97.5%', '99.95%']);
  });
});

describe('formatChance: a computed chance, one decimal kept, never a rounded certainty', () => {
  it.each([
    [0.677, '67.7%'], [0.37, '37.0%'], [0.8125, '81.3%'], [0.95, '95.0%'], [1, '100.0%'], [0, '0.0%'],
    [0.9995, '> 99.9%'], [0.99999, '> 99.9%'], [0.99949, '99.9%'], [0.0004, '< 0.1%'], [0.0005, '0.1%'], [null, '—'], [Number.NaN, '—'],
  ])('%p → %p', (p, text) => {
    expect(formatChance(p as number | null)).toBe(text);
  });
});

describe('formatCount: a whole number with a comma between thousands', () => {
  it.each([[2000, '2,000'], [999, '999'], [1234567, '1,234,567'], [19.6, '20'], [0, '0'], [-1500, '−1,500'], [null, '—']])('%p → %p', (n, text) => {
    expect(formatCount(n as number | null)).toBe(text);
  });
});

describe('one home', () => {
  it('the findings\' module hands out these same functions, not copies', () => {
    expect(findings.formatNumber).toBe(formatNumber);
    expect(findings.formatCi).toBe(formatCi);
    expect(findings.formatP).toBe(formatP);
    expect(findings.levelLabel).toBe(levelLabel);
    expect(findings.estimateWithCi).toBe(estimateWithCi);
    expect(findings.withUnit).toBe(withUnit);
  });
});
