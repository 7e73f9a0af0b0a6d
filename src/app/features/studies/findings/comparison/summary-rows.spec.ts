import type { ComparisonCore } from './engine-types';
import type { Units } from './comparison-result';
import { agreementRows, regressionName, regressionRows, sensitivityRows } from './summary-rows';

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

  it('gives slope and intercept, and names λ with its convention for Deming', () => {
    const rows = regressionRows(core(), units);
    expect(rows.map((r) => r.name)).toEqual(['Slope', 'Intercept', 'Correlation r (for reference only)']);
    expect(rows[0]).toMatchObject({ value: '1.012', ci: '0.990 to 1.030' });
    expect(regressionName(core(), 'λ = σ²(x error)/σ²(y error)')).toBe('Deming, λ = 1.500 (λ = σ²(x error)/σ²(y error))');
  });

  it('adds the linearity test for Passing–Bablok', () => {
    const pb = core();
    pb.regression = { ...pb.regression, method: 'passing-bablok', demingRatio: null, linearityP: 0.42 };
    expect(regressionRows(pb, units)[2]).toEqual({ name: 'Linearity (cusum test)', value: 'no sign of deviation', ci: '', p: '0.420' });
    pb.regression = { ...pb.regression, linearityP: 0.01 };
    expect(regressionRows(pb, units)[2].value).toBe('deviates from a straight line');
  });

  it('puts the words of a CI narrower than one step beside the estimates it names, and on no other', () => {
    const notes = { 'bias.median': 'CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.', 'regression.slope': 'slope note' };
    const agreement = agreementRows(core(), units, notes);
    expect(agreement.map((r) => r.note)).toEqual([undefined, notes['bias.median'], undefined, undefined, undefined]);
    expect(regressionRows(core(), units, notes).map((r) => r.note)).toEqual(['slope note', undefined, undefined]);
    expect(agreementRows(core(), units).every((r) => r.note === undefined)).toBe(true);
  });

  it('marks a limited estimate in the column of the findings, not in the column with every row', () => {
    const rows = sensitivityRows(core(), core(1), units, { 'bias.median': 'x', 'decisionLevels.0': 'y' });
    expect(rows[2]).toEqual({ name: 'Median bias', main: '0.15 mmol/L (0.10 to 0.20), CI narrower than one reporting step', all: '0.15 mmol/L (0.10 to 0.20)' });
    expect(rows.at(-1)!.main).toBe('0.13 mmol/L (0.05 to 0.20), CI narrower than one reporting step');
    expect(rows[1].main).toBe('0.20 mmol/L (0.10 to 0.30)');
  });

  it('puts the estimates without and with the excluded rows side by side, decision levels included', () => {
    const rows = sensitivityRows(core(), core(1), units);
    expect(rows[0]).toEqual({ name: 'Pairs', main: '40', all: '41' });
    expect(rows[1]).toEqual({ name: 'Mean bias', main: '0.20 mmol/L (0.10 to 0.30)', all: '1.20 mmol/L (0.10 to 0.30)' });
    expect(rows.at(-1)).toEqual({ name: 'Bias at 7.0 mmol/L', main: '0.13 mmol/L (0.05 to 0.20)', all: '0.13 mmol/L (0.05 to 0.20)' });
  });
});
