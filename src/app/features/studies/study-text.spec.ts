import { formatWhen, usesDemingRatio } from './study-text';

describe('study text', () => {
  it('tells a time in the laboratory time zone', () => {
    expect(formatWhen('2026-12-03T13:05:00Z', 'Europe/Berlin')).toBe('3 Dec 2026, 14:05');
    expect(formatWhen('2026-12-03T13:05:00Z', 'America/New_York')).toBe('3 Dec 2026, 08:05');
  });

  it('says nothing for a time it cannot read', () => {
    expect(formatWhen('not a time', 'UTC')).toBe('');
  });

  it('asks for the error ratio only for the Deming methods', () => {
    expect(usesDemingRatio('deming')).toBe(true);
    expect(usesDemingRatio('weighted-deming')).toBe(true);
    expect(usesDemingRatio('passing-bablok')).toBe(false);
    expect(usesDemingRatio('ols')).toBe(false);
  });
});
