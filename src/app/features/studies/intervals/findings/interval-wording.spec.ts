import { acceptanceWords, outsideWords, partitionWords, powerWords } from './interval-wording';

describe('interval wording', () => {
  it('says an accepted transference with the count outside and the number allowed', () => {
    expect(acceptanceWords({ accepted: true, outside: 1, n: 20, allowedOutside: 2 })).toBe('Accepted: 1 of 20 outside; at most 2 allowed.');
  });

  it('says a refused transference', () => {
    expect(acceptanceWords({ accepted: false, outside: 3, n: 20, allowedOutside: 2 })).toBe('Not accepted: 3 of 20 outside; at most 2 allowed.');
  });

  it('names where the values outside lie against the stated limits', () => {
    expect(outsideWords({ below: 1, above: 0, stated: { lower: 3.5, upper: 5.1, source: '' } }, 1)).toBe('1 below and 0 above the stated interval 3.5 to 5.1.');
  });

  it('turns the pass risk at 10% outside into a percentage', () => {
    expect(powerWords(0.677)).toContain('pass it 68% of the time');
  });

  it('recommends a partition by sex when z exceeds z*', () => {
    expect(partitionWords({ field: 'sex', z: 7.412, zCritical: 3, sdRatio: 1.2, recommended: true })).toBe(
      'By sex: separate intervals recommended (z = 7.41 > z* = 3.00; larger SD / smaller SD = 1.20).',
    );
  });

  it('recommends a partition on the SD ratio alone, naming it', () => {
    expect(partitionWords({ field: 'ageBand', z: 1.1, zCritical: 2.12, sdRatio: 1.8, recommended: true })).toBe(
      'By age band: separate intervals recommended (z = 1.10 ≤ z* = 2.12; larger SD / smaller SD = 1.80 > 1.5).',
    );
  });

  it('keeps one interval when neither ground holds, and says when a field was not tested', () => {
    expect(partitionWords({ field: 'sex', z: 0.5, zCritical: 3, sdRatio: 1.1, recommended: false })).toMatch(/^By sex: one common interval is enough/);
    expect(partitionWords({ field: 'sex', z: null, zCritical: null, sdRatio: null, recommended: false })).toBe('By sex: not tested; each subgroup needs at least 2 values.');
  });
});
