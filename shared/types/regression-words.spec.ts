import type { ComparisonRegression } from '../stats/comparison-types';
import { findingsDecimals } from './findings-numbers';
import type { ComparisonUnits } from './findings-rows';
import {
  correlationDetails, interceptSentence, linearitySentence, regressionCiWords, regressionMethod, regressionRows, regressionSection, slopeSentence,
} from './regression-words';

// Fixed inputs written out by hand: glucose in mmol/L reported to 1 decimal, so estimates carry 2.
const units: ComparisonUnits = { unit: 'mmol/L', difference: 'mmol/L', decimals: findingsDecimals(1) };
const line = (more: Partial<ComparisonRegression> = {}): ComparisonRegression => ({
  method: 'passing-bablok', demingRatio: null,
  slope: { estimate: 1.007, ci: [0.998, 1.016] }, intercept: { estimate: 0.05, ci: [-0.1, 0.2] },
  linearityP: 0.42, ciMethod: 'rank', correlation: 0.99876, ...more,
});

describe('the regression section in words', () => {
  describe('the slope, as how much higher or lower the candidate reads per unit', () => {
    it('reads higher, with a CI that includes 1', () => {
      expect(slopeSentence(line(), 0.95, units)).toBe(
        'The candidate reads 0.7% higher per unit (slope 1.007, 95% CI 0.998 to 1.016, that is −0.2% to +1.6%). The CI includes 1: a proportional difference is not shown.',
      );
    });

    it('reads lower, with a CI that excludes 1 on the low side', () => {
      expect(slopeSentence(line({ slope: { estimate: 0.9768, ci: [0.962, 0.991] } }), 0.9, units)).toBe(
        'The candidate reads 2.3% lower per unit (slope 0.977, 90% CI 0.962 to 0.991, that is −3.8% to −0.9%). The CI excludes 1: the candidate reads proportionally lower.',
      );
    });

    it('reads higher, with a CI that excludes 1 on the high side', () => {
      expect(slopeSentence(line({ slope: { estimate: 1.031, ci: [1.02, 1.043] } }), 0.95, units)).toContain(
        'The candidate reads 3.1% higher per unit (slope 1.031, 95% CI 1.020 to 1.043, that is +2.0% to +4.3%). The CI excludes 1: the candidate reads proportionally higher.',
      );
    });

    it('reads neither higher nor lower when the difference rounds to nothing', () => {
      expect(slopeSentence(line({ slope: { estimate: 0.99996, ci: [0.995, 1.004] } }), 0.95, units)).toBe(
        'The candidate reads neither higher nor lower per unit (slope 1.000, 95% CI 0.995 to 1.004, that is −0.5% to +0.4%). The CI includes 1: a proportional difference is not shown.',
      );
    });

    it('says what a missing CI or a missing slope means', () => {
      expect(slopeSentence(line({ slope: { estimate: 1.007, ci: null } }), 0.95, units)).toBe(
        'The candidate reads 0.7% higher per unit (slope 1.007). No CI could be formed, so a proportional difference can be neither shown nor ruled out.',
      );
      expect(slopeSentence(line({ slope: { estimate: null, ci: null } }), 0.95, units)).toMatch(/^The slope could not be estimated/);
    });
  });

  describe('the intercept, as an offset at zero with its unit', () => {
    it('reads higher, with a CI that includes 0', () => {
      expect(interceptSentence(line(), 0.95, units)).toBe(
        'At zero the candidate reads 0.05 mmol/L higher, a constant offset (intercept 0.05 mmol/L, 95% CI −0.10 to 0.20 mmol/L). The CI includes 0: a constant offset is not shown.',
      );
    });

    it('reads lower, with a CI that excludes 0', () => {
      expect(interceptSentence(line({ intercept: { estimate: -0.234, ci: [-0.31, -0.15] } }), 0.95, units)).toBe(
        'At zero the candidate reads 0.23 mmol/L lower, a constant offset (intercept −0.23 mmol/L, 95% CI −0.31 to −0.15 mmol/L). The CI excludes 0: a constant offset is shown, the candidate reading lower.',
      );
    });

    it('reads neither higher nor lower when the offset rounds to zero, and keeps no sign on a rounded zero', () => {
      expect(interceptSentence(line({ intercept: { estimate: -0.001, ci: [-0.08, 0.07] } }), 0.95, units)).toBe(
        'At zero the candidate reads neither higher nor lower: no offset (intercept 0.00 mmol/L, 95% CI −0.08 to 0.07 mmol/L). The CI includes 0: a constant offset is not shown.',
      );
    });

    it('writes no unit where the study has none', () => {
      expect(interceptSentence(line(), 0.95, { ...units, unit: '' })).toContain('(intercept 0.05, 95% CI −0.10 to 0.20)');
    });
  });

  describe('the linearity check, naming its test', () => {
    it('finds no departure from a straight line', () => {
      expect(linearitySentence(line())).toBe(
        'The cusum test for linearity of Passing–Bablok finds no departure from a straight line (p = 0.420), so one slope and intercept describe the range studied.',
      );
    });

    it('finds a departure, and says where to look', () => {
      expect(linearitySentence(line({ linearityP: 0.0004 }))).toBe(
        'The cusum test for linearity of Passing–Bablok finds the points depart from a straight line (p < 0.001): one slope and intercept may not describe the whole range; judge it from the scatter and the difference plot.',
      );
    });

    it('says when the test could not be run, and that Deming has none', () => {
      expect(linearitySentence(line({ linearityP: null }))).toMatch(/could not be run/);
      expect(linearitySentence(line({ method: 'deming', demingRatio: 1.5, linearityP: null, ciMethod: 'bootstrap' }))).toBe(
        'Not tested: the cusum test for linearity of Passing–Bablok belongs to that method, not to Deming regression; judge it from the scatter and the difference plot.',
      );
    });
  });

  it('moves the correlation to a details line, for reference only', () => {
    expect(correlationDetails(line(), units)).toBe(
      'Pearson r = 0.9988, for reference only: a high r shows the range was wide, not that the methods agree; agreement is judged from the bias and its CI.',
    );
    expect(correlationDetails(line({ correlation: null }), units)).toMatch(/^Pearson r could not be computed/);
  });

  it('names the line, λ with its convention, and the CI method the report and the workbook name', () => {
    expect(regressionMethod({ regression: line(), level: 0.95, units })).toBe(
      'Passing–Bablok regression of the candidate (y) on the comparative method (x); 95% CIs of slope and intercept: rank-based (Passing & Bablok 1983).',
    );
    const deming = line({ method: 'deming', demingRatio: 1.5, ciMethod: 'bootstrap' });
    expect(regressionMethod({ regression: deming, level: 0.9, units, interval: 'bca', demingRatioConvention: 'λ = σ²(x error) / σ²(y error)' })).toBe(
      'Deming regression of the candidate (y) on the comparative method (x), λ = 1.500 (λ = σ²(x error) / σ²(y error)); 90% CIs of slope and intercept: BCa bootstrap of resampled pairs.',
    );
    expect([regressionCiWords('bootstrap', 'percentile'), regressionCiWords('jackknife'), regressionCiWords(null)]).toEqual([
      'percentile bootstrap of resampled pairs', 'jackknife', 'none formed',
    ]);
  });

  it('puts the section in its order: slope, intercept, linearity, with the step notes keyed by path', () => {
    const section = regressionSection({ regression: line(), level: 0.95, units });
    expect(section.heading).toBe('How the candidate reads across the range');
    expect(section.statements.map((s) => [s.label, s.path])).toEqual([
      ['Per unit (slope)', 'regression.slope'], ['Offset (intercept)', 'regression.intercept'], ['Straight line (linearity)', undefined],
    ]);
    expect(section.details).toMatch(/^Pearson r = 0\.9988/);
  });

  it('gives the numbers as rows in the decimals of the tables: slope 3, intercept as estimates, r 4', () => {
    expect(regressionRows(line(), units)).toEqual([
      { path: 'regression.slope', name: 'Slope', estimate: 1.007, ci: [0.998, 1.016], unit: '', decimals: 3 },
      { path: 'regression.intercept', name: 'Intercept', estimate: 0.05, ci: [-0.1, 0.2], unit: 'mmol/L', decimals: 2 },
      { path: 'regression.linearityP', name: 'Linearity (the cusum test for linearity of Passing–Bablok)', estimate: null, p: 0.42, unit: '', decimals: 0, words: 'no departure from a straight line' },
      { path: 'regression.correlation', name: 'Pearson r (for reference only)', estimate: 0.99876, unit: '', decimals: 4, words: undefined },
    ]);
    expect(regressionRows(line({ method: 'ols', ciMethod: 'bootstrap', linearityP: null }), units).map((r) => r.name)).toEqual(['Slope', 'Intercept', 'Pearson r (for reference only)']);
  });
});
