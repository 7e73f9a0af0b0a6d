import { deming, weightedDeming } from '@shared/stats';
import { fixture } from './support';

// Sources, all on invented data from make-fixtures/make_scipy_fixtures.py:
// - the Deming closed form as Cornbleet & Gochman (1979, Clin Chem 25:432) write it, with
//   δ = σ²(y error)/σ²(x error) = 1/λ, evaluated by numpy (checks our λ convention): tolerance 1e-12;
// - scipy.odr (ODRPACK) with weights wd = 1/λ on x and we = 1 on y: ODRPACK stops near the optimum, so the
//   tolerance is loose, 1e-6 relative;
// - weighted Deming (Linnet 1990): the same reweighting iteration with ODRPACK as the inner solver: 1e-6.
const { deming: dem, weightedDeming: wd } = fixture('scipy.json');

describe('Deming regression', () => {
  it.each(dem.cases.map((c: any) => [c.lambda, c]) as [number, any][])('λ = %s: equals the closed form of Cornbleet & Gochman (1979)', (_l, c: any) => {
    const fit = deming(dem.x, dem.y, c.lambda);
    expect(fit.slope).toBeCloseTo(c.closedSlope, 12);
    expect(fit.intercept).toBeCloseTo(c.closedIntercept, 10);
  });

  it.each(dem.cases.map((c: any) => [c.lambda, c]) as [number, any][])('λ = %s: agrees with scipy.odr (ODRPACK) within 1e-6', (_l, c: any) => {
    const fit = deming(dem.x, dem.y, c.lambda);
    expect(Math.abs(fit.slope / c.odrSlope - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.intercept - c.odrIntercept)).toBeLessThan(1e-5);
  });

  it('weighted Deming agrees with the reweighting iteration solved by scipy.odr within 1e-6', () => {
    const fit = weightedDeming(wd.x, wd.y, wd.lambda);
    expect(Math.abs(fit.slope / wd.slope - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.intercept - wd.intercept)).toBeLessThan(1e-4);
  });
});
