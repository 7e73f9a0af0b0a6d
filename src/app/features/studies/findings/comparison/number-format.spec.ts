import { formatCi, formatNumber, formatP, levelLabel } from './number-format';

describe('number formatting', () => {
  it('fixes the decimals and writes a true minus sign', () => {
    expect(formatNumber(0.12345, 2)).toBe('0.12');
    expect(formatNumber(-1.5, 1)).toBe('\u22121.5');
    expect(formatNumber(-0.001, 2)).toBe('0.00');
    expect(formatNumber(null, 2)).toBe('—');
    expect(formatNumber(Number.NaN, 2)).toBe('—');
  });

  it('writes a CI as a range and says when it is missing', () => {
    expect(formatCi([-0.123, 0.3], 2)).toBe('\u22120.12 to 0.30');
    expect(formatCi(null, 2)).toBe('not available');
  });

  it('writes small p-values as below 0.001', () => {
    expect(formatP(0.0004)).toBe('< 0.001');
    expect(formatP(0.39016)).toBe('0.390');
    expect(formatP(null)).toBe('—');
  });

  it('labels the confidence level', () => {
    expect(levelLabel(0.95)).toBe('95%');
    expect(levelLabel(0.9)).toBe('90%');
    expect(levelLabel(0.975)).toBe('97.5%');
  });
});
