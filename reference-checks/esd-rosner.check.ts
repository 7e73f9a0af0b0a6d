import { generalizedEsd } from '@shared/stats';
import { fixture } from './support';

// Source: B. Rosner (1983), Technometrics 25(2), 165–172, example data of 54 values as printed in the
// NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.5.17.3. The handbook's conclusion (from memory):
// with r = 10 and α = 0.05 the test finds 3 outliers. R_i recomputed with numpy and λ_i with scipy's
// t quantiles (make-fixtures/make_scipy_fixtures.py); tolerance 1e-9 for R_i and 1e-7 for λ_i (jStat's
// t quantile, used by the engine, is accurate to about 1e-9).
const esd = fixture('scipy.json').esd;

describe('generalized ESD on Rosner (1983) example data', () => {
  const result = generalizedEsd(esd.values, esd.alpha, esd.maxOutliers);

  it('finds the 3 outliers 6.01, 5.42 and 5.34 (NIST/SEMATECH e-Handbook example, memory)', () => {
    expect(result.outliers.map((i) => esd.values[i])).toEqual([6.01, 5.42, 5.34]);
  });

  it('computes each R_i and λ_i as numpy and scipy do', () => {
    expect(result.steps).toHaveLength(10);
    result.steps.forEach((step, k) => {
      expect(esd.values[step.index]).toBe(esd.steps[k].value);
      expect(step.statistic).toBeCloseTo(esd.steps[k].statistic, 9);
      expect(step.critical).toBeCloseTo(esd.steps[k].critical, 7);
    });
  });
});
