import type { DecisionLevelResult } from './engine-types';
import type { Units } from './comparison-result';
import { levelSentence, medianSentence, overallSentence, verdictView } from './verdict-wording';

const units: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 2, differenceDecimals: 2, percent: false };
const level = (verdict: DecisionLevelResult['verdict'], ci: [number, number] | null, allowable: number | null = 0.28): DecisionLevelResult => ({
  level: 7, bias: { estimate: 0.12, ci }, biasPercent: 1.7, allowable, verdict,
});

describe('verdict wording', () => {
  it('pairs every verdict with a word and an icon, never colour alone', () => {
    expect(verdictView('within')).toEqual({ tone: 'within', word: 'Within', icon: 'check_circle' });
    expect(verdictView('inconclusive').word).toBe('Inconclusive');
    expect(verdictView('exceeds')).toMatchObject({ word: 'Exceeds', icon: 'cancel' });
    expect(verdictView(null).word).toBe('No verdict');
  });

  it('says a level is within when the whole CI lies inside the allowable bias', () => {
    expect(levelSentence(level('within', [0.05, 0.19]), units, 0.95)).toBe(
      'At 7.0 mmol/L the predicted bias is 0.12 mmol/L (95% CI 0.05 to 0.19): the whole CI lies within the allowable ±0.28 mmol/L.',
    );
  });

  it('says the data cannot settle it when the CI crosses the limit, and names exceeding', () => {
    expect(levelSentence(level('inconclusive', [0.2, 0.35]), units, 0.9)).toContain('(90% CI 0.20 to 0.35): the CI crosses the allowable ±0.28 mmol/L');
    expect(levelSentence(level('exceeds', [-0.5, -0.3]), units, 0.95)).toContain('CI \u22120.50 to \u22120.30): the whole CI lies beyond');
  });

  it('explains why there is no verdict', () => {
    expect(levelSentence(level(null, [0, 0.2], null), units, 0.95)).toContain('No allowable bias is set for this study');
    expect(levelSentence(level(null, null), units, 0.95)).toContain('CI not available). The CI could not be formed');
  });

  it('sums up the levels', () => {
    expect(overallSentence([level('within', [0, 1]), level('within', [0, 1]), level('inconclusive', [0, 1])])).toBe(
      'Within the allowable bias at 2 of 3 decision levels; inconclusive at 1.',
    );
    expect(overallSentence([level('exceeds', [0, 1])])).toBe('Within the allowable bias at 0 of 1 decision level; exceeds it at 1.');
    expect(overallSentence([])).toMatch(/No medical decision levels are set/);
  });

  it('writes the median bias with its CI and the shifted-null p-value', () => {
    const median = { estimate: 0.1, ci: [0.1, 0.3] as [number, number], pValue: 0.39016, se: 0.08 };
    expect(medianSentence(median, units, 0.95, 10000)).toBe(
      'Median bias 0.10 mmol/L (95% CI 0.10 to 0.30). Shifted-null bootstrap test of a median bias of 0: p = 0.390 (10,000 resamples).',
    );
    expect(medianSentence({ ...median, pValue: 0.0001 }, units, 0.95, 2000)).toContain('p < 0.001 (2,000 resamples)');
  });
});
