import { analyzeReportableRange } from '@shared/stats/analyze-reportable-range';
import { fitPolynomial } from '@shared/stats/polynomial-fit';
import type { RangeResult } from '@shared/stats/reportable-range-types';
import { fixture } from './support';

// Source: fixtures/reportable-range-r.json, made once by make-fixtures/make_reportable_range_fixture.R with R 4.2.2
// (base and stats only) on three invented linearity studies typed into the script: "bent-top" (7 assigned levels ×
// 3 replicates, falling short at the top; R's best degree 3), "straight" (7 × 2 on a line; best degree 1) and
// "fractions" (6 mixing fractions, 2 replicates but one level with 3 and one with a single result; best degree 2).
// From R itself: lm(y ~ x), lm(y ~ x + I(x^2)), lm(y ~ x + I(x^2) + I(x^3)) on raw x (coefficients, standard errors,
// the top coefficient's t and two-sided p from summary.lm, RSS from deviance, residual df), predict() of each fit at
// every level's x, and the best degree by the rule analyze-reportable-range.ts documents (step 2: the highest of 2
// and 3 whose top coefficient has p < α, else 1) applied to summary.lm's p-values.
// Tolerances (relative): coefficients, SEs, t, RSS, fitted values 1e-10 (measured ≤ 2.3e-13); p 1e-8 (jStat's t
// distribution; measured ≤ 1.1e-9); deviations to 1e-10 of the line's value there (a deviation may be near 0).
// Tiny slope p-values (R: 1.1e-30, 5.9e-27, 1.5e-14) are held to the same 1e-8 relative: fitPolynomial takes p
// from the lower tail, 2·F(−|t|), which keeps their digits.
//
// Bootstrap CI of the deviation: an independent bootstrap in R with R's own generator (set.seed, sample.int): each
// of B = 200000 resamples draws every level's results with replacement within the level (a single result kept),
// refits the best degree and the line (qr.fitted on the fixed design) and takes fitted − line at each level; the
// percentile CI is quantile(type = 6) of the B deviations. R also records the Monte Carlo SE of each CI end (batch
// means: 20 batches of 10000). The engine runs with the same B but its own draws, so its CI ends and R's are two
// independent estimates of one bootstrap quantile, each with about that SE: their difference has SD ≈ √2·SE. The
// check allows 5·√2·SE plus 0.2% of the CI's width (with 2 or 3 results a level the bootstrap distribution has
// atoms, 810 distinct deviations for "fractions", where batch means can understate the error), and asserts that
// this allowance stays below 5% of the width, so a CI from the wrong resampling scheme, degree or level cannot pass.
// Measured: |engine − R| ≤ 1.4·SE on "bent-top" (allowance 1.3% of the width); identical atoms on "fractions".
interface RFit { degree: number; coefficients: number[]; se: number[]; t: number; p: number; rss: number; df: number }
interface RLevel {
  name: string; x: number; values: number[]; mean: number; sd: number | null;
  linear: number; fitted: number[]; deviation2: number; deviation3: number; deviation: number;
  ci: [number, number] | null; mcSe: [number, number] | null;
}
interface RStudy { name: string; basis: 'assigned' | 'fraction'; bestDegree: number; fits: RFit[]; levels: RLevel[] }
const f = fixture<{ generator: string; alpha: number; level: number; resamples: number; batches: number; studies: RStudy[] }>('reportable-range-r.json');

/** Each study's allowable nonlinearity (absolute, in its unit): chosen so that some levels are within and some not. */
const GOALS: Record<string, number> = { 'bent-top': 3, straight: 0.05, fractions: 7 };

const near = (actual: number | null | undefined, expected: number, tolerance: number, scale = Math.abs(expected)): void => {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(tolerance * Math.max(scale, 1e-300));
};
const nearP = (actual: number | null | undefined, expected: number): void => near(actual, expected, 1e-8);

const results = new Map<string, RangeResult>();
function analysed(s: RStudy): RangeResult {
  if (!results.has(s.name)) {
    const rows = s.levels.flatMap((l) => l.values.map((value, i) => ({ level: l.name, replicate: i + 1, value })));
    results.set(s.name, analyzeReportableRange(rows, {
      levels: s.levels.map((l) => (s.basis === 'assigned' ? { name: l.name, assigned: l.x } : { name: l.name, fraction: l.x })),
      replicates: 2,
      allowableNonlinearity: GOALS[s.name],
      alpha: f.alpha,
      confidenceLevel: f.level,
      resamples: f.resamples,
      seed: 'reportable-range-r-check',
    }));
  }
  return results.get(s.name)!;
}

describe(`least-squares polynomials against R lm (${f.generator})`, () => {
  const cases = f.studies.flatMap((s) => s.fits.map((r) => [s.name, r.degree, s, r] as const));
  it.each(cases)('%s, degree %i: coefficients, SEs, t, p, RSS and df as summary.lm', (_name, degree, s, r) => {
    const x = s.levels.flatMap((l) => l.values.map(() => l.x));
    const y = s.levels.flatMap((l) => l.values);
    const fit = fitPolynomial(x, y, degree);
    expect(fit.df).toBe(r.df);
    fit.coefficients.forEach((b, k) => near(b, r.coefficients[k], 1e-10));
    fit.se.forEach((se, k) => near(se, r.se[k], 1e-10));
    near(fit.t, r.t, 1e-10);
    nearP(fit.p, r.p);
    near(fit.rss, r.rss, 1e-10);
    near(fit.syx, Math.sqrt(r.rss / r.df), 1e-10);
  });
});

describe(`analyzeReportableRange against R (${f.generator})`, () => {
  it.each(f.studies.map((s) => [s.name, s] as const))('%s: the fits of degrees 1–3 and the best degree as R finds them', (_name, s) => {
    const res = analysed(s);
    expect(res.basis).toBe(s.basis);
    expect(res.bestDegree).toBe(s.bestDegree);
    expect(res.fits.map((ft) => ft.degree)).toEqual(s.fits.map((r) => r.degree));
    res.fits.forEach((ft, k) => {
      const r = s.fits[k];
      expect(ft.df).toBe(r.df);
      ft.coefficients.forEach((b, j) => near(b, r.coefficients[j], 1e-10));
      ft.se.forEach((se, j) => near(se, r.se[j], 1e-10));
      near(ft.rss, r.rss, 1e-10);
      near(ft.syx, Math.sqrt(r.rss / r.df), 1e-10);
      if (r.degree === 1) {
        expect(ft.p).toBeNull();
        expect(ft.significant).toBe(false);
      } else {
        nearP(ft.p, r.p);
        expect(ft.significant).toBe(r.p < f.alpha);
      }
    });
  });

  it.each(f.studies.map((s) => [s.name, s] as const))('%s: each level\'s mean, SD, line, best fit and deviation as predict() gives them', (_name, s) => {
    const res = analysed(s);
    expect(res.levels.map((l) => l.level)).toEqual(s.levels.map((l) => l.name));
    res.levels.forEach((l, i) => {
      const r = s.levels[i];
      expect(l.x).toBe(r.x);
      expect(l.values).toEqual(r.values);
      expect(l.n).toBe(r.values.length);
      near(l.mean, r.mean, 1e-13);
      if (r.sd === null) expect(l.sd).toBeNull();
      else near(l.sd, r.sd, 1e-12);
      near(l.linear, r.linear, 1e-10);
      near(l.fitted, r.fitted[s.bestDegree - 1], 1e-10);
      near(l.deviation, r.deviation, 1e-10, Math.abs(r.linear));
      // the deviation is the best degree's: for the straight study 0 exactly, though R's degree-2 and degree-3 curves differ from the line
      if (s.bestDegree === 1) expect(l.deviation).toBe(0);
      if (s.bestDegree === 2) near(l.deviation, r.deviation2, 1e-10, Math.abs(r.linear));
      if (s.bestDegree === 3) near(l.deviation, r.deviation3, 1e-10, Math.abs(r.linear));
      near(l.deviationPercent, (100 * r.deviation) / Math.abs(r.linear), 1e-9, Math.max(Math.abs((100 * r.deviation) / r.linear), 1e-6));
      expect(l.goal).toBe(GOALS[s.name]);
      expect(l.within).toBe(Math.abs(r.deviation) <= GOALS[s.name]);
    });
    // the goals were chosen so that the check sees both answers where the deviation is not 0
    if (s.bestDegree > 1) expect(new Set(res.levels.map((l) => l.within)).size).toBe(2);
  });

  it.each(f.studies.map((s) => [s.name, s] as const))('%s: percentile bootstrap CI of each deviation within Monte Carlo error of R\'s own bootstrap', (_name, s) => {
    const res = analysed(s);
    expect(res.engine.resamples).toBe(s.bestDegree === 1 ? 0 : f.resamples);
    res.levels.forEach((l, i) => {
      const r = s.levels[i];
      if (r.ci === null) {
        expect(s.bestDegree).toBe(1);
        expect(l.deviationCi).toBeNull();
        return;
      }
      expect(l.deviationCi).not.toBeNull();
      const width = r.ci[1] - r.ci[0];
      expect(width).toBeGreaterThan(0);
      for (const end of [0, 1]) {
        const allowance = 5 * Math.SQRT2 * r.mcSe![end] + 0.002 * width;
        expect(allowance).toBeLessThan(0.05 * width);
        expect(Math.abs(l.deviationCi![end] - r.ci[end])).toBeLessThanOrEqual(allowance);
      }
      // and the CI holds the deviation itself here (none of these levels is at a boundary of the bootstrap distribution)
      expect(l.deviationCi![0]).toBeLessThan(l.deviation);
      expect(l.deviationCi![1]).toBeGreaterThan(l.deviation);
    });
  });
});
