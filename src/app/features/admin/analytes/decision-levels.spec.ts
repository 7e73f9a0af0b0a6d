import { allowableBiasText } from './analyte-text';
import { formatDecisionLevels, parseDecisionLevels } from './decision-levels';

describe('parseDecisionLevels', () => {
  it('reads numbers separated by commas, semicolons or spaces', () => {
    expect(parseDecisionLevels('5.6, 7.0;11.1  126')).toEqual([5.6, 7, 11.1, 126]);
  });

  it('reads an empty entry as no levels', () => {
    expect(parseDecisionLevels('  ')).toEqual([]);
  });

  it('accepts signs and a leading point', () => {
    expect(parseDecisionLevels('-2.5, +.5')).toEqual([-2.5, 0.5]);
  });

  it('refuses the whole list when one entry is not a number', () => {
    expect(parseDecisionLevels('5.6, seven')).toBeNull();
    expect(parseDecisionLevels('5,6.1.2')).toBeNull();
    expect(parseDecisionLevels('0x10')).toBeNull();
  });

  it('writes levels back in the form it reads', () => {
    expect(parseDecisionLevels(formatDecisionLevels([5.6, 7, 11.1]))).toEqual([5.6, 7, 11.1]);
  });
});

describe('allowableBiasText', () => {
  it('names the absolute limit with its unit, the percentage, or both', () => {
    expect(allowableBiasText({ unit: 'mmol/L', allowableBiasAbsolute: 0.3, allowableBiasPercent: null })).toBe('± 0.3 mmol/L');
    expect(allowableBiasText({ unit: 'g/L', allowableBiasAbsolute: null, allowableBiasPercent: 5 })).toBe('± 5 %');
    expect(allowableBiasText({ unit: 'g/L', allowableBiasAbsolute: 1, allowableBiasPercent: 5 })).toBe('± 1 g/L or ± 5 %');
  });
});
