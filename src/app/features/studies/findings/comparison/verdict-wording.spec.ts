import type { Units } from './comparison-result';
import { medianSentence } from './verdict-wording';

const units: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 2, differenceDecimals: 2, percent: false };
const sodium: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 1, differenceDecimals: 1, percent: false };

describe('verdict wording', () => {
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
