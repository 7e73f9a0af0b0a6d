import type { ComparisonResult } from '../stats/comparison-types';
import { findingsDecimals } from './findings-numbers';
import { agreementRows, type ComparisonUnits, NO_TEST_P, outlierRuleWords, sensitivityLines, testRows } from './findings-rows';

const units: ComparisonUnits = { unit: 'mmol/L', difference: 'mmol/L', decimals: findingsDecimals(1) };
const result = {
  n: 40,
  bias: { mean: { estimate: 0.2, ci: [0.1, 0.3], pValue: 0.0004, se: 0.05 }, median: { estimate: 0.15, ci: [0.1, 0.2], pValue: 0.02, se: 0.04 } },
  sd: { estimate: 0.3, ci: [0.25, 0.36] },
  limitsOfAgreement: { multiplier: 1.96, lower: { estimate: -0.39, ci: [-0.5, -0.3] }, upper: { estimate: 0.79, ci: null } },
  biasTests: { median: { observed: 0.15, nullValue: 0, pValue: 0.02, upperTail: 0.01, lowerTail: 0.99 }, mean: null },
  signTest: { positive: 30, negative: 8, zeros: 2, pValue: 0.0003 },
  wilcoxon: { statistic: 655.5, n: 38, method: 'normal', pValue: 0.0001 },
} as unknown as ComparisonResult;

describe('the rows of the comparison tables', () => {
  it('names bias and agreement, with the difference decimals and unit, and p only where there is a test', () => {
    const rows = agreementRows(result, units);
    expect(rows.map((r) => r.name)).toEqual([
      'Mean bias', 'Median bias', 'SD of the differences', 'Lower limit of agreement (mean − 1.96 SD)', 'Upper limit of agreement (mean + 1.96 SD)',
    ]);
    expect(rows[0]).toEqual({ path: 'bias.mean', name: 'Mean bias', estimate: 0.2, ci: [0.1, 0.3], p: 0.0004, unit: 'mmol/L', decimals: 2 });
    expect(rows[2]).not.toHaveProperty('p');
    expect(rows[4].ci).toBeNull();
  });

  it('writes percent differences in % with two decimals', () => {
    const percent: ComparisonUnits = { unit: 'mmol/L', difference: '%', decimals: findingsDecimals(0, 'percent-x') };
    expect(agreementRows(result, percent)[0]).toMatchObject({ unit: '%', decimals: 2 });
  });

  it('names the tests of the differences and says their results in words', () => {
    const rows = testRows(result, units);
    expect(rows.map((r) => [r.name, r.words, r.p])).toEqual([
      ['Shifted-null bootstrap test, median bias = 0', 'observed 0.15 mmol/L', 0.02],
      ['Shifted-null bootstrap test, mean bias = 0', NO_TEST_P, null],
      ['Sign test', '30 above zero, 8 below, 2 at zero', 0.0003],
      ['Wilcoxon signed-rank test', 'V = 655.5, n = 38, normal approximation', 0.0001],
    ]);
  });
});

describe('the with-and-without table', () => {
  const core = (shift: number) => ({
    ...result, n: 40 + shift,
    regression: { method: 'deming', demingRatio: 1, slope: { estimate: 1.012, ci: [0.99, 1.03] }, intercept: { estimate: 0.05, ci: null }, linearityP: null, ciMethod: 'bootstrap', correlation: 0.99 },
    decisionLevels: [{ level: 7, bias: { estimate: 0.13 + shift, ci: [0.05, 0.2] }, biasPercent: 1.9, allowable: 0.28, verdict: shift ? 'inconclusive' : 'within', judgedOn: null }],
  }) as unknown as ComparisonResult;

  it('writes both columns alike, in the decimals of the tables, with the verdict at each decision level', () => {
    const lines = sensitivityLines(core(0), core(1), units);
    expect(lines.map((l) => [l.name, l.main, l.all])).toEqual([
      ['Pairs', '40', '41'],
      ['Mean bias', '0.20 mmol/L (0.10 to 0.30)', '0.20 mmol/L (0.10 to 0.30)'],
      ['Median bias', '0.15 mmol/L (0.10 to 0.20)', '0.15 mmol/L (0.10 to 0.20)'],
      ['SD of the differences', '0.30 mmol/L (0.25 to 0.36)', '0.30 mmol/L (0.25 to 0.36)'],
      ['Lower limit of agreement', '−0.39 mmol/L (−0.50 to −0.30)', '−0.39 mmol/L (−0.50 to −0.30)'],
      ['Upper limit of agreement', '0.79 mmol/L (CI not available)', '0.79 mmol/L (CI not available)'],
      ['Slope', '1.012 (0.990 to 1.030)', '1.012 (0.990 to 1.030)'],
      ['Intercept', '0.05 mmol/L (CI not available)', '0.05 mmol/L (CI not available)'],
      ['Bias at 7.0 mmol/L', '0.13 mmol/L (0.05 to 0.20): within the allowable bias', '1.13 mmol/L (0.05 to 0.20): inconclusive, the CI crosses the allowable bias'],
    ]);
  });

  it('marks an estimate whose CI is narrower than one step in the column of the findings only', () => {
    const lines = sensitivityLines(core(0), core(1), units, { 'bias.median': 'note' });
    expect(lines[2]).toMatchObject({ main: '0.15 mmol/L (0.10 to 0.20), CI narrower than one reporting step', all: '0.15 mmol/L (0.10 to 0.20)' });
  });
});

describe('the outlier rule', () => {
  it('is written as applied, with α to three decimals and the cap', () => {
    expect(outlierRuleWords({ method: 'generalized ESD (Rosner 1983)', alpha: 0.05, maxOutliers: 3 })).toBe('Generalized ESD (Rosner 1983) on the differences, α = 0.050, at most 3 flagged');
    expect(outlierRuleWords(null)).toBe('Generalized ESD on the differences');
  });
});
