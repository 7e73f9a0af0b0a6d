import { analyzeInterval } from '@shared/stats';
import { boxCoxFit, LAMBDA_BOUND } from '@shared/stats/box-cox';
import { fixture, logRelativeError, nistUnivariate } from './support';

// Reference checks for the defects fixed in engine 1.2 (issue 11). Values from
// make-fixtures/make_engine_1_2_fixtures.py (scipy 1.17, invented data) and NIST's own files.
const f = fixture('engine-1-2.json');
const scaled = (values: number[], exponent: number): number[] => values.map((v) => Number(`${v}e${exponent}`));

describe('Box–Cox λ against scipy.stats.boxcox_normmax (method "mle"), Box & Cox (1964)', () => {
  const inside = f.boxCox.lowCv.filter((s: any) => Math.abs(s.lambda) < LAMBDA_BOUND);
  const outside = f.boxCox.lowCv.filter((s: any) => Math.abs(s.lambda) >= LAMBDA_BOUND);

  it('has low-CV sets on both sides of the search bound', () => {
    expect(inside.length).toBeGreaterThanOrEqual(15);
    expect(outside.length).toBeGreaterThanOrEqual(15);
  });

  it.each(inside.map((s: any, k: number) => [k, s]) as [number, any][])('low-CV set %s: λ within 1e-5 of scipy', (_k, s) => {
    const fit = boxCoxFit(s.values);
    expect(Math.abs(fit.lambda - s.lambda)).toBeLessThan(1e-5);
    expect(fit.atBound).toBe(false);
  });

  it.each(outside.map((s: any, k: number) => [k, s]) as [number, any][])('low-CV set %s with scipy λ beyond ±5: ours stops at the bound on the same side and says so', (_k, s) => {
    const fit = boxCoxFit(s.values);
    expect(fit.lambda).toBe(Math.sign(s.lambda) * LAMBDA_BOUND);
    expect(fit.atBound).toBe(true);
  });

  it.each(f.boxCox.skewed.map((s: any, k: number) => [k, s]) as [number, any][])('skewed set %s: λ within 1e-5 of scipy', (_k, s) => {
    expect(Math.abs(boxCoxFit(s.values).lambda - s.lambda)).toBeLessThan(1e-5);
  });

  // λ of c·x equals λ of x (the profile likelihood changes by a constant, Box & Cox 1964), so scipy's value
  // for the set also holds for the set in another unit: near 1e-4 and near 1e200.
  it.each([-4, -7, 150, 196])('the same λ for the values × 1e%s (no false "all equal", no overflow)', (exponent) => {
    for (const s of [...inside.slice(0, 5), ...f.boxCox.skewed.slice(0, 5)]) {
      expect(Math.abs(boxCoxFit(scaled(s.values, exponent)).lambda - s.lambda)).toBeLessThan(1e-5);
    }
  });
});

describe('parametric limits of data at or below 0: the Gaussian limits mean ± z·s (NIST StRD Lew)', () => {
  // Lew holds 200 values from −579 to 300; certified mean and SD from NIST's file, z(0.975) from
  // scipy.stats.norm.ppf. Before engine 1.2 both limits came out null.
  const lew = nistUnivariate('Lew');
  const result = analyzeInterval(lew.values.map((value) => ({ value })), { method: 'parametric', resamples: 2000, seed: 'lew' });
  const z = f.normalQuantile975;

  it('reports both limits to at least 12 digits of the certified values', () => {
    expect(logRelativeError(result.lower!.estimate!, lew.mean - z * lew.sd)).toBeGreaterThanOrEqual(12);
    expect(logRelativeError(result.upper!.estimate!, lew.mean + z * lew.sd)).toBeGreaterThanOrEqual(12);
  });

  it('gives each limit a CI from every resample around it, and says no transform was used', () => {
    for (const limit of [result.lower!, result.upper!]) {
      expect(limit.ci).not.toBeNull();
      expect(limit.ci![0]).toBeLessThan(limit.estimate!);
      expect(limit.ci![1]).toBeGreaterThan(limit.estimate!);
      expect(limit.distribution!.bins.reduce((s, b) => s + b.count, 0)).toBe(2000);
    }
    expect(result.boxCoxLambda).toBeNull();
    expect(result.warnings.join(' ')).toContain('Gaussian limits mean ± z·SD of the untransformed values');
  });
});
