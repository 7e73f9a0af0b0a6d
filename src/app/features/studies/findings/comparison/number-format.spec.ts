import * as shared from '@shared/format/number-format';
import { chance, share } from '../../intervals/setup/plan/transference-data';
import { percent, target } from '../../kinds/method-comparison/plan/plan-words';
import { formatChance, formatCi, formatCount, formatNumber, formatP, formatPercent, levelLabel } from './number-format';

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

describe('the screen writes numbers by the one shared rule the PDF uses (shared/format/number-format.ts)', () => {
  it('re-exports the shared functions themselves, not copies', () => {
    expect([formatNumber, formatCi, formatP, levelLabel, formatPercent, formatChance, formatCount])
      .toEqual([shared.formatNumber, shared.formatCi, shared.formatP, shared.levelLabel, shared.formatPercent, shared.formatChance, shared.formatCount]);
  });

  it('writes the plans\' chances and set shares as the PDF does: one decimal and no rounded certainty; set shares to two decimals', () => {
    expect([percent(0.677), percent(0.9996), percent(0.0004), percent(0.37)]).toEqual(['67.7%', '> 99.9%', '< 0.1%', '37.0%']);
    expect([chance(0.9996), chance(0.0004)]).toEqual(['> 99.9%', '< 0.1%']);
    expect([target(0.8), target(0.025), share(0.0125), share(0.1)]).toEqual(['80%', '2.5%', '1.25%', '10%']);
  });
});
