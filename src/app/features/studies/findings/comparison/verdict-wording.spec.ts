import type { DecisionLevelResult } from './engine-types';
import type { Units } from './comparison-result';
import { levelSentence, medianSentence, overallSentence, verdictView } from './verdict-wording';

const units: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 2, differenceDecimals: 2, percent: false };
const level = (verdict: DecisionLevelResult['verdict'], ci: [number, number] | null, allowable: number | null = 0.28): DecisionLevelResult => ({
  level: 7, bias: { estimate: 0.12, ci }, biasPercent: 1.7, allowable, verdict, judgedOn: null,
});
const sodium: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 1, differenceDecimals: 1, percent: false };
const collapsed = (verdict: DecisionLevelResult['verdict'], judgedOn: [number, number] | null): DecisionLevelResult => ({
  level: 130, bias: { estimate: 1, ci: [1, 1] }, biasPercent: 0.8, allowable: verdict === 'exceeds' ? 0.4 : verdict === 'inconclusive' ? 1.2 : 2, verdict, judgedOn,
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

  it('says the verdict was judged on the estimate ± half a step when the CI is narrower than the step', () => {
    expect(levelSentence(collapsed('within', [0.5, 1.5]), sodium, 0.95, '1 mmol/L')).toBe(
      'At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L), ' +
        'so the verdict is judged on 0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies within the allowable ±2.0 mmol/L.',
    );
    expect(levelSentence(collapsed('exceeds', [0.5, 1.5]), sodium, 0.95, '1 mmol/L')).toContain('judged on 0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies beyond the allowable ±0.4 mmol/L.');
    expect(levelSentence(collapsed('inconclusive', [0.5, 1.5]), sodium, 0.95, '1 mmol/L')).toContain('that interval crosses the allowable ±1.2 mmol/L, so these data cannot settle it.');
  });

  it('judges on the CI itself, saying nothing of the step, when judgedOn is null or absent (results of engine 1.1.0)', () => {
    const judged = levelSentence(collapsed('within', null), sodium, 0.95, '1 mmol/L');
    expect(judged).toBe('At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0): the whole CI lies within the allowable ±2.0 mmol/L.');
    const { judgedOn: _, ...old } = collapsed('within', null);
    expect(levelSentence(old as DecisionLevelResult, sodium, 0.95)).toBe(judged);
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

  it('says why there is no p-value when the engine refused the test', () => {
    const median = { estimate: 1, ci: [1, 1] as [number, number], pValue: null, se: 0 };
    expect(medianSentence(median, units, 0.95, 2000)).toBe(
      'Median bias 1.00 mmol/L (95% CI 1.00 to 1.00). Shifted-null bootstrap test of a median bias of 0: no p-value, since there are too few differences or all are equal (see the warnings).',
    );
  });

  it('says after the median bias when its CI is narrower than one reporting step', () => {
    const median = { estimate: 1, ci: [1, 1] as [number, number], pValue: 0.0005, se: 0 };
    expect(medianSentence(median, sodium, 0.95, 2000, '1 mmol/L')).toBe(
      'Median bias 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step. ' +
        'Shifted-null bootstrap test of a median bias of 0: p < 0.001 (2,000 resamples).',
    );
    expect(medianSentence(median, sodium, 0.95, 2000)).not.toContain('step');
  });
});
