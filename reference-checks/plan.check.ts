import { jStat } from 'jstat';
import { planComparison } from '@shared/stats/plan-comparison';
import { expectedOrderStatistic, planEstablish } from '@shared/stats/plan-establish';
import { planTransference } from '@shared/stats/plan-transference';
import { binomialRankCi } from '@shared/stats/rank-ci';
import { Xor128 } from '@shared/stats/rng';
import { fixture } from './support';

// Sources of the planning checks:
// a. transference acceptance: scipy.stats.binom.cdf (fixtures/plan-scipy.json, make-fixtures/make_plan_fixtures.py);
//    1e-11 absolute and 1e-9 relative (the engine sums the pmf term by term from jStat's log-gamma).
// b. expected order statistics and the establish plan: scipy.integrate.quad of x·f_(k)(x) over the real line for
//    normal and log-normal populations (cross-checked in the script by a second integral on the probability
//    scale, agreement recorded in the fixture), span from scipy.stats.beta means, ranks from scipy.stats.binom;
//    1e-9 relative. Published expected normal order statistics: the largest of 10 is 1.53875 and of 20 is
//    1.86748 (Harter's 1961 tables of expected normal order statistics, **from memory**; the scipy integrals
//    agree to 5 decimals); the largest of 2 is 1/√π and of 3 is 3/(2√π), closed forms (E max(Z1, Z2) =
//    E|Z1 − Z2|/2 with Z1 − Z2 ~ N(0, 2); the n = 3 form from memory, David & Nagaraja, Order Statistics).
//    Ranks 1–7 of 120 for the 2.5th percentile at 90%: CLSI EP28-A3c practice (as quoted by Ozarda et al.,
//    Clin Chem Lab Med 2019;57:30).
// c. the comparison simulation against normal theory for least squares with (essentially) error-free x: the SE of
//    the predicted value at Xc is σ·sqrt(1/n + (Xc − x̄)²/Sxx) (any regression text, e.g. Draper & Smith, Applied
//    Regression Analysis, ch. 3, from memory), and with a CI of half-width z·SE a bias estimate ~ N(δ, SE²) ends
//    "within" ±A with probability Φ((A − δ)/SE − z) − Φ((−A − δ)/SE + z), at least 0.
// d. the risk of a false pass at the edge of the goal for a CI-based rule at large n: α/2 = 0.025 (the upper
//    end of a two-sided 95% CI lies below the true value 2.5% of the time).
const f = fixture('plan-scipy.json');

describe('transference acceptance as scipy.stats.binom gives it', () => {
  it.each(f.transference.cases.map((c: any) => [c.n, c.maxOutside, c.retest, c]) as [number, number, number, any][])(
    'n = %s, at most %s outside, retest %s', (_n, _k, _m, c: any) => {
      const r = planTransference({ n: c.n, maxOutside: c.maxOutside, retest: c.retest, outside: c.rows.map((row: any) => row.trueOutside) });
      expect(r.rows).toHaveLength(c.rows.length);
      r.rows.forEach((row, i) => {
        const want = c.rows[i];
        expect(row.trueOutside).toBe(want.trueOutside);
        for (const key of ['acceptFirst', 'acceptWithRetest'] as const) {
          expect(Math.abs(row[key] - want[key])).toBeLessThanOrEqual(1e-11 + 1e-9 * want[key]);
        }
      });
    });

  it('takes k = 10% of n by default (2 of 20, 4 of 40, 6 of 60), as the scipy cases with k = floor(0.1 n)', () => {
    for (const n of [20, 40, 60]) {
      const want = f.transference.cases.find((c: any) => c.n === n && c.retest === n && c.maxOutside === Math.floor(0.1 * n));
      const r = planTransference({ n, outside: want.rows.map((row: any) => row.trueOutside) });
      expect(r.maxOutside).toBe(Math.floor(0.1 * n));
      r.rows.forEach((row, i) => expect(row.acceptWithRetest).toBeCloseTo(want.rows[i].acceptWithRetest, 11));
    }
  });
});

describe('expected order statistics and the establish plan as scipy integrates them', () => {
  it.each(f.orderStatistics.cases.map((c: any) => [c.shape, c.lower, c.upper, c.n, c.k, c]) as any[])(
    '%s population %s to %s: E[x(k)] of n = %s, k = %s', (_s, _l, _u, _n, _k, c: any) => {
      const v = expectedOrderStatistic({ shape: c.shape, lower: c.lower, upper: c.upper }, c.n, c.k);
      expect(Math.abs(v - c.expected)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(c.expected)));
    });

  it('gives published expected normal order statistics (Harter 1961, from memory; closed forms for n = 2, 3)', () => {
    const standard = { shape: 'normal' as const, lower: -1.959963984540054, upper: 1.959963984540054 };
    expect(expectedOrderStatistic(standard, 2, 2)).toBeCloseTo(1 / Math.sqrt(Math.PI), 10);
    expect(expectedOrderStatistic(standard, 3, 3)).toBeCloseTo(3 / (2 * Math.sqrt(Math.PI)), 10);
    expect(expectedOrderStatistic(standard, 10, 10)).toBeCloseTo(1.53875, 5);
    expect(expectedOrderStatistic(standard, 20, 20)).toBeCloseTo(1.86748, 5);
    expect(expectedOrderStatistic(standard, 20, 1)).toBeCloseTo(-1.86748, 5);
    // A population given by its central 95%: mean 4.4 and SD 0.9/1.96; E[x(20)] of 20 = 4.4 + SD·1.86748.
    expect(expectedOrderStatistic({ shape: 'normal', lower: 3.5, upper: 5.3 }, 20, 20)).toBeCloseTo(4.4 + (0.9 / 1.959963984540054) * 1.86748, 5);
  });

  it.each(f.establish.plans.map((p: any) => [p.population.shape, p.population.lower, p.population.upper, p]) as any[])(
    '%s population %s to %s: ranks, expected span and width per n', (_s, _l, _u, plan: any) => {
      const r = planEstablish({ n: plan.rows.map((row: any) => row.n), level: plan.level, population: plan.population });
      expect(r.rows.map((row) => row.n)).toEqual(plan.rows.map((row: any) => row.n));
      r.rows.forEach((row, i) => row.limits.forEach((l, j) => {
        const want = plan.rows[i].limits[j];
        expect([l.percentile, l.lowerRank, l.upperRank]).toEqual([want.percentile, want.lowerRank, want.upperRank]);
        if (want.expectedSpan === null) {
          expect([l.expectedSpan, l.expectedWidth]).toEqual([null, null]);
        } else {
          expect(Math.abs(l.expectedSpan! - want.expectedSpan)).toBeLessThanOrEqual(1e-12 * 100);
          expect(Math.abs(l.expectedWidth! - want.expectedWidth)).toBeLessThanOrEqual(1e-9 * Math.abs(want.expectedWidth));
        }
      }));
    });

  it('uses ranks 1–7 and 114–120 at n = 120 (CLSI EP28-A3c practice) and none below n = 119', () => {
    const r = planEstablish({ n: [118, 120] });
    expect(r.rows[0].limits.map((l) => [l.lowerRank, l.upperRank])).toEqual([[null, null], [null, null]]);
    expect(r.rows[1].limits.map((l) => [l.lowerRank, l.upperRank])).toEqual([[1, 7], [114, 120]]);
    expect(binomialRankCi(120, 0.025, 0.9)).toMatchObject({ lowerRank: 1, upperRank: 7 });
    // Beta-mean identity: E[F(x(k))] = k/(n + 1), so ranks 1 to 7 span 6/121 of the population on average.
    expect(r.rows[1].limits[0].expectedSpan).toBeCloseTo((100 * 6) / 121, 12);
  });
});

// ---- c. the simulated comparison against normal theory -------------------------------------------------------
const Z = 1.959963984540054;
const Phi = (v: number) => jStat.normal.cdf(v, 0, 1) as number;
/** P(a CI of half-width c·z·SE round an estimate ~ N(δ, SE²) lies within ±A). */
const pWithin = (A: number, delta: number, se: number, c: number) => Math.max(0, Phi((A - delta) / se - c * Z) - Phi((-A - delta) / se + c * Z));

/**
 * Normal theory for least squares on x uniform on [low, high], averaged over the random design (x̄ and Sxx vary
 * from study to study: `designs` designs are drawn and the conditional probabilities averaged; that average has
 * a Monte Carlo error far below the simulation's, since the conditional probability varies little with the design).
 * Two half-widths: z·SE (normal theory, the reference), and z·SE·sqrt(1 − Σw_i²h_ii/Σw_i²), where w_i are the
 * weights of the prediction at Xc and h_ii the leverages: the bootstrap of pairs estimates the variance by the
 * sandwich Σw_i²e_i² (Efron & Tibshirani 1993, ch. 9, from memory), whose expectation under equal error variances
 * is σ²Σw_i²(1 − h_ii), so the bootstrap CI is expected that much narrower at finite n.
 */
function normalTheory(n: number, xc: number, allowable: number, sigma: number, low: number, high: number, designs = 2000) {
  const s = new Xor128('normal-theory designs');
  const x = new Float64Array(n);
  const plain = [0, 0, 0];
  const narrowed = [0, 0, 0];
  let halfPlain = 0;
  let halfNarrowed = 0;
  for (let d = 0; d < designs; d++) {
    let mean = 0;
    for (let i = 0; i < n; i++) { x[i] = low + (high - low) * s.nextUniform(); mean += x[i] / n; }
    let sxx = 0;
    for (let i = 0; i < n; i++) sxx += (x[i] - mean) ** 2;
    let v = 0;
    let wh = 0;
    for (let i = 0; i < n; i++) {
      const w = 1 / n + ((xc - mean) * (x[i] - mean)) / sxx;
      v += w * w;
      wh += w * w * (1 / n + (x[i] - mean) ** 2 / sxx);
    }
    const se = sigma * Math.sqrt(v);
    const c = Math.sqrt(1 - wh / v);
    [0, 0.5, 1].forEach((frac, k) => {
      plain[k] += pWithin(allowable, frac * allowable, se, 1) / designs;
      narrowed[k] += pWithin(allowable, frac * allowable, se, c) / designs;
    });
    halfPlain += (Z * se) / designs;
    halfNarrowed += (Z * se * c) / designs;
  }
  return { plain, narrowed, halfPlain, halfNarrowed };
}

describe('simulated comparison studies against normal theory (least squares, error-free x)', () => {
  // Candidate SD 5, x uniform on 50 to 150, allowable bias 3.5 at the middle (SE ≈ 5/√n) and at the top end
  // (SE ≈ 2·5/√n): figures between 0.1 and 0.98, so the comparison is informative. x carries an error SD of 1e-6
  // and 6 decimals: essentially error-free, as least squares' normal theory assumes.
  const S = 2000;
  const settings = { cvComparative: 1e-6, cvCandidate: 5, low: 50, high: 150, regression: 'ols' as const, decisionLevels: [100, 150], allowableBias: 3.5, n: [40, 100], simulations: S, resamples: 200, decimals: 6, seed: 'normal theory' };
  const plan = planComparison(settings);

  it.each([[40, 100], [40, 150], [100, 100], [100, 150]])('n = %s at Xc = %s: P(within) at true bias 0, A/2 and A', (n, xc) => {
    const figures = plan.rows.find((r) => r.n === n)!.levels.find((l) => l.level === xc)!;
    const theory = normalTheory(n, xc, 3.5, 5, 50, 150);
    const simulated = [figures.powerAtZero, figures.powerAtHalf, figures.falsePass];
    simulated.forEach((p, k) => {
      // Tolerance: 4 Monte Carlo SE of a proportion of S studies, plus 0.02 for what neither half-width holds:
      // the percentile ends of 200 resamples scatter by about 0.19 SE (sqrt(0.025·0.975/200)/φ(1.96)), which
      // raises a tail probability (convexity) and a probability clipped at 0; and the bootstrap distribution's
      // own shape at finite n. The simulated figure must lie in the band from normal theory to the narrowed
      // half-width, widened by that tolerance.
      const lo = Math.min(theory.plain[k], theory.narrowed[k]);
      const hi = Math.max(theory.plain[k], theory.narrowed[k]);
      const mc = 4 * Math.sqrt((Math.max(lo, 0.005) * (1 - Math.min(hi, 0.995))) / S) + 0.02;
      expect(p).toBeGreaterThanOrEqual(lo - mc);
      expect(p).toBeLessThanOrEqual(hi + mc);
    });
    // The median CI half-width: between the narrowed and the plain normal-theory half-width, within 3%.
    expect(figures.medianHalfWidth!).toBeGreaterThan(0.97 * theory.halfNarrowed);
    expect(figures.medianHalfWidth!).toBeLessThan(1.03 * theory.halfPlain);
  });

  it('the normal-theory references are informative (not all 0 or 1) and differ between the levels', () => {
    const mid = normalTheory(40, 100, 3.5, 5, 50, 150).plain;
    const top = normalTheory(40, 150, 3.5, 5, 50, 150).plain;
    expect(mid[1]).toBeGreaterThan(0.4);
    expect(mid[1]).toBeLessThan(0.8);
    expect(top[1]).toBeGreaterThan(0.05);
    expect(top[1]).toBeLessThan(0.3);
  });
});

describe('the risk of a false pass at the edge of the goal is α/2 at large n (Deming, 2,000 studies)', () => {
  it('falsePass lies within 4 Monte Carlo SE of 0.025, and is not 0', () => {
    const S = 2000;
    const plan = planComparison({ cvComparative: 5, cvCandidate: 5, low: 50, high: 150, regression: 'deming', decisionLevels: [120], allowableBias: 5, n: [300], simulations: S, resamples: 200, decimals: 3, seed: 'edge of the goal' });
    const { falsePass, powerAtHalf } = plan.rows[0].levels[0];
    // The lower end of the CI never binds at the edge: the goal is about 6 SE of the bias from −A (power at A/2 is 1).
    expect(powerAtHalf).toBeGreaterThan(0.99);
    const se = Math.sqrt((0.025 * 0.975) / S);
    // 0.003 allowance: at n = 300 the bootstrap CI is narrower than normal theory by about 1/n (+0.0004) and the
    // scatter of 200-resample percentile ends adds about 0.002 by convexity (see c.).
    expect(falsePass).toBeGreaterThan(0.025 - 4 * se);
    expect(falsePass).toBeLessThan(0.025 + 4 * se + 0.003);
  });
});
