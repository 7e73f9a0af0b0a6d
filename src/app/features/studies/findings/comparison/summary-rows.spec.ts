import type { ComparisonCore, ComparisonResult } from './engine-types';
import type { Units } from './comparison-result';
import { agreementRows, regressionView, sensitivityRows, testRows } from './summary-rows';

const units: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 2, differenceDecimals: 2, percent: false };
const core = (shift = 0): ComparisonCore => ({
  n: 40 + shift,
  bias: { mean: { estimate: 0.2 + shift, ci: [0.1, 0.3], pValue: 0.0004, se: 0.05 }, median: { estimate: 0.15, ci: [0.1, 0.2], pValue: 0.02, se: 0.04 } },
  sd: { estimate: 0.3, ci: [0.25, 0.36] },
  limitsOfAgreement: { multiplier: 1.96, lower: { estimate: -0.39, ci: [-0.5, -0.3] }, upper: { estimate: 0.79, ci: null } },
  regression: { method: 'deming', demingRatio: 1.5, slope: { estimate: 1.012, ci: [0.99, 1.03] }, intercept: { estimate: 0.05, ci: [-0.1, 0.2] }, linearityP: null, ciMethod: 'bootstrap', correlation: 0.99876 },
  decisionLevels: [{ level: 7, bias: { estimate: 0.13, ci: [0.05, 0.2] }, biasPercent: 1.9, allowable: 0.28, verdict: 'within', judgedOn: null }],
});

describe('summary rows', () => {
  it('writes bias and agreement with units, CIs and p-values', () => {
    const rows = agreementRows(core(), units);
    expect(rows[0]).toEqual({ name: 'Mean bias', value: '0.20 mmol/L', ci: '0.10 to 0.30', p: '< 0.001' });
    expect(rows[2]).toMatchObject({ name: 'SD of the differences', p: '' });
    expect(rows[3].name).toBe('Lower limit of agreement (mean − 1.96 SD)');
    expect(rows[4].ci).toBe('not available');
  });

  it('writes percent differences in %', () => {
    expect(agreementRows(core(), { ...units, difference: '%' })[0].value).toBe('0.20 %');
  });

  const asResult = (c: ComparisonCore): ComparisonResult => ({ ...c, settings: { level: 0.95, interval: 'percentile', demingRatioConvention: 'λ = σ²(x error)/σ²(y error)' } }) as unknown as ComparisonResult;

  it('says how the candidate reads across the range: slope per unit, offset, linearity, then r as details', () => {
    const view = regressionView(asResult(core()), units);
    expect(view.heading).toBe('How the candidate reads across the range');
    expect(view.method).toBe('Deming regression of the candidate (y) on the comparative method (x), λ = 1.500 (λ = σ²(x error)/σ²(y error)); 95% CIs of slope and intercept: percentile bootstrap of resampled pairs.');
    expect(view.statements.map((s) => s.label)).toEqual(['Per unit (slope)', 'Offset (intercept)', 'Straight line (linearity)']);
    expect(view.statements[0].sentence).toBe('The candidate reads 1.2% higher per unit (slope 1.012, 95% CI 0.990 to 1.030, that is −1.0% to +3.0%). The CI includes 1: a proportional difference is not shown.');
    expect(view.statements[1].sentence).toMatch(/^At zero the candidate reads 0\.05 mmol\/L higher, a constant offset \(intercept 0\.05 mmol\/L, 95% CI −0\.10 to 0\.20 mmol\/L\)/);
    expect(view.details).toMatch(/^Pearson r = 0\.9988, for reference only/);
  });

  it('names the cusum test for Passing–Bablok in its linearity sentence', () => {
    const pb = core();
    pb.regression = { ...pb.regression, method: 'passing-bablok', demingRatio: null, linearityP: 0.01, ciMethod: 'rank' };
    expect(regressionView(asResult(pb), units).statements[2].sentence).toMatch(/^The cusum test for linearity of Passing–Bablok finds the points depart from a straight line \(p = 0\.010\)/);
  });

  it('writes the tests of the differences in words', () => {
    const result = { ...asResult(core()), signTest: { positive: 30, negative: 8, zeros: 2, pValue: 0.0003 }, wilcoxon: { statistic: 655.5, n: 38, method: 'exact', pValue: 0.0001 }, biasTests: { median: null, mean: null } } as ComparisonResult;
    expect(testRows(result, units).map((r) => [r.name, r.value, r.p]).slice(2)).toEqual([
      ['Sign test', '30 above zero, 8 below, 2 at zero', '< 0.001'],
      ['Wilcoxon signed-rank test', 'V = 655.5, n = 38, exact', '< 0.001'],
    ]);
  });

  it('puts the words of a CI narrower than one step beside the estimates it names, and on no other', () => {
    const notes = { 'bias.median': 'CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.', 'regression.slope': 'slope note' };
    const agreement = agreementRows(core(), units, notes);
    expect(agreement.map((r) => r.note)).toEqual([undefined, notes['bias.median'], undefined, undefined, undefined]);
    expect(regressionView(asResult(core()), units, notes).statements.map((r) => r.note)).toEqual(['slope note', undefined, undefined]);
    expect(agreementRows(core(), units).every((r) => r.note === undefined)).toBe(true);
  });

  it('marks a limited estimate in the column of the findings, not in the column with every row', () => {
    const rows = sensitivityRows(core(), core(1), units, { 'bias.median': 'x', 'decisionLevels.0': 'y' });
    expect(rows[2]).toEqual({ name: 'Median bias', main: '0.15 mmol/L (0.10 to 0.20), CI narrower than one reporting step', all: '0.15 mmol/L (0.10 to 0.20)' });
    expect(rows.at(-1)!.main).toBe('0.13 mmol/L (0.05 to 0.20): within the allowable bias, CI narrower than one reporting step');
    expect(rows[1].main).toBe('0.20 mmol/L (0.10 to 0.30)');
  });

  it('puts the estimates without and with the excluded rows side by side, decision levels included', () => {
    const rows = sensitivityRows(core(), core(1), units);
    expect(rows[0]).toEqual({ name: 'Pairs', main: '40', all: '41' });
    expect(rows[1]).toEqual({ name: 'Mean bias', main: '0.20 mmol/L (0.10 to 0.30)', all: '1.20 mmol/L (0.10 to 0.30)' });
    expect(rows.at(-1)).toEqual({ name: 'Bias at 7.0 mmol/L', main: '0.13 mmol/L (0.05 to 0.20): within the allowable bias', all: '0.13 mmol/L (0.05 to 0.20): within the allowable bias' });
    expect(rows.map((r) => r.name)).toContain('SD of the differences');
  });
});
