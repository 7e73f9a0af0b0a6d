import { boxCoxLambda } from '@shared/stats/box-cox';
import { kolmogorovSurvival } from '@shared/stats/cusum-linearity';
import { quantileSorted } from '@shared/stats';
import { fixture } from './support';

// Sources, from make-fixtures/make_scipy_fixtures.py on invented data:
// - numpy.percentile(method='weibull'), Hyndman & Fan (1996) definition 6, the p(n + 1) rank: 1e-12;
// - scipy.special.kolmogorov, the Kolmogorov survival function used for the Passing–Bablok cusum test: 1e-10;
// - scipy.stats.boxcox_normmax(method='mle'), the maximum-likelihood Box–Cox λ: 1e-5 (both optimisers
//   stop near the maximum of a flat profile likelihood).
const f = fixture('scipy.json');

describe('building blocks against numpy and scipy', () => {
  it.each(f.quantiles.p.map((p: number, k: number) => [p, f.quantiles.type6[k]]) as [number, number][])('definition-6 quantile at p = %s as numpy weibull', (p, expected) => {
    expect(quantileSorted(Float64Array.from(f.quantiles.values).sort(), p as number)).toBeCloseTo(expected as number, 12);
  });

  it.each(f.kolmogorov.map((c: any) => [c.h, c.q]) as [number, number][])('Kolmogorov survival at h = %s as scipy.special.kolmogorov', (h, q) => {
    expect(kolmogorovSurvival(h as number)).toBeCloseTo(q as number, 10);
  });

  it('maximum-likelihood Box–Cox λ as scipy.stats.boxcox_normmax', () => {
    expect(boxCoxLambda(f.boxCox.values)).toBeCloseTo(f.boxCox.lambda, 5);
  });
});
