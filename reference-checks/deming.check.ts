import { deming, weightedDeming } from '@shared/stats';
import { fixture } from './support';

// Sources, all on invented data from make-fixtures/make_scipy_fixtures.py:
// - the Deming closed form as Cornbleet & Gochman (1979, Clin Chem 25:432) write it, with
//   δ = σ²(y error)/σ²(x error) = 1/λ, evaluated by numpy (checks our λ convention): tolerance 1e-12;
// - scipy.odr (ODRPACK) with weights wd = 1/λ on x and we = 1 on y: ODRPACK stops near the optimum, so the
//   tolerance is loose, 1e-6 relative;
// - weighted Deming (Linnet 1990): the same reweighting iteration with ODRPACK as the inner solver: 1e-6.
// Weighted Deming without any closed form of the Deming line (fixtures/outside-r.json and outside-scipy.json, on
// R's invented data): each round minimises the errors-in-variables weighted sum of squares
// Σ w_i[(x_i − X_i)²/λ + (y_i − a − bX_i)²] over a, b and every true value X_i with a general-purpose optimiser,
// then reweights from the optimiser's own X_i:
// - R 4.2 nlminb (PORT, analytic gradient and Hessian; make-fixtures/make_outside_r.R): slope 1e-10 relative,
//   intercept 1e-8 (measured 1.2e-11 and 3.6e-10);
// - scipy 1.17 optimize.least_squares (trust-region reflective; make-fixtures/make_outside_scipy.py): the same
//   tolerances (measured 3.5e-12 and 1.1e-10);
// - scipy 1.17 odr (ODRPACK) as the inner solver: ODRPACK stops short, the reweighting settles only to ~5e-9, so
//   1e-7 relative and 1e-5 for the intercept (measured 6.6e-9 and 7.1e-7).
const { deming: dem, weightedDeming: wd } = fixture('scipy.json');
const wdR = fixture('outside-r.json').weightedDeming;
const wdScipy = fixture('outside-scipy.json').weightedDeming;

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

describe('weighted Deming against general-purpose optimisers of the errors-in-variables criterion', () => {
  const fit = weightedDeming(wdR.x, wdR.y, wdR.lambda);

  it.each([
    ['R nlminb', wdR, 1e-10, 1e-8],
    ['scipy least_squares', wdScipy.leastSquares, 1e-10, 1e-8],
    ['scipy odr', wdScipy.odr, 1e-7, 1e-5],
  ] as [string, any, number, number][])('agrees with %s', (_name, ref, slopeTol, interceptTol) => {
    expect(Math.abs(fit.slope / ref.slope - 1)).toBeLessThan(slopeTol);
    expect(Math.abs(fit.intercept - ref.intercept)).toBeLessThan(interceptTol);
  });

  it('is not plain (unweighted) Deming on these data, so the weights are tested', () => {
    const plain = deming(wdR.x, wdR.y, wdR.lambda);
    expect(Math.abs(plain.slope / wdR.slope - 1)).toBeGreaterThan(1e-3);
  });
});
