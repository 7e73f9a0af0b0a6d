import { jStat } from 'jstat';
import { analyzePrecision, type PrecisionResult } from '@shared/stats';
import { sdConfidenceInterval } from '@shared/stats/precision-components';
import { upperVerificationLimit } from '@shared/stats/precision-verification';
import { fixture } from './support';

// Source: fixtures/precision.json, made once by make-fixtures/make_precision_fixture.R with R 4.2.2 and
// nlme 3.1-162 on four invented precision studies (balanced 5 × 5; unbalanced 5 days with 3 results lost;
// balanced with MS_B < MS_W, so the between-day component is clipped to 0; 6 runs of 2 to 5 results).
// From R itself: the ANOVA table (aov), χ² and t quantiles (qchisq, qt) and, for the balanced set, the REML
// components and SE of the grand mean (nlme::lme; REML equals the ANOVA estimators there).
// The EP15-A3 practice formulas (DOMAIN.md "Precision": n0, s_b, Satterthwaite df, χ² CIs, UVL, trueness
// interval) are evaluated in R on aov's mean squares with R's quantiles.
// Tolerances (relative): mean squares, components and df 1e-12; χ² CIs and UVLs 1e-10 (jStat's χ² quantile
// agrees with R's to about 1e-12); the t multiplier and the trueness interval 1e-7 (jStat's t quantile, as in
// esd-rosner.check.ts); REML 1e-8 (nlme's optimiser).
interface Study {
  name: string; day: string[]; value: number[];
  aov: { dfBetween: number; dfWithin: number; msBetween: number; msWithin: number };
  mean: number; n0: number; clipped: boolean; sr: number; sb: number; swl: number; dfWL: number;
  ciR: [number, number]; ciWL: [number, number];
  claims: { repeatability: number; withinLab: number; as: 'sd' };
  uvl: Record<'1' | '2' | '3', [number, number]>;
  trueness: { assigned: number; uncertainty: number; se: number; seDf: number; df: number; multiplier: number; materials: number };
  reml?: { sb: number; sr: number; seMean: number };
}
const f = fixture<{ generator: string; alpha: number; studies: Study[]; quantiles: { p: number; nu: number; chisq: number; t: number }[] }>('precision.json');

const near = (actual: number | null | undefined, expected: number, tolerance: number): void => {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(tolerance * Math.max(Math.abs(expected), 1e-300));
};

/** The study as `materials` copies of one material (ℓ = materials), the first with the assigned value. */
function run(s: Study, materials: number): PrecisionResult {
  const names = ['A', 'B', 'C'].slice(0, materials);
  const rows = names.flatMap((material) => s.value.map((value, i) => ({ material, day: s.day[i], replicate: null, value })));
  return analyzePrecision(rows, {
    alpha: f.alpha,
    materials: names.map((name, i) => ({
      name, claimRepeatability: s.claims.repeatability, claimWithinLab: s.claims.withinLab, claimAs: 'sd' as const,
      assignedValue: i === 0 ? s.trueness.assigned : null, assignedUncertainty: i === 0 ? s.trueness.uncertainty : null,
    })),
  });
}

describe(`precision statistics against R (${f.generator})`, () => {
  it.each(f.studies.map((s) => [s.name, s] as const))('%s: ANOVA table as R aov, components and ν_WL by the EP15-A3 formulas', (_name, s) => {
    const m = run(s, 1).materials[0];
    expect(m.anova.dfBetween).toBe(s.aov.dfBetween);
    expect(m.anova.dfWithin).toBe(s.aov.dfWithin);
    near(m.anova.msBetween, s.aov.msBetween, 1e-12);
    near(m.anova.msWithin, s.aov.msWithin, 1e-12);
    near(m.anova.n0, s.n0, 1e-14);
    near(m.mean, s.mean, 1e-14);
    near(m.repeatability.sd, s.sr, 1e-12);
    expect(m.repeatability.df).toBe(s.aov.dfWithin);
    if (s.clipped) expect(m.betweenDay.sd).toBe(0);
    else near(m.betweenDay.sd, s.sb, 1e-12);
    near(m.withinLab.sd, s.swl, 1e-12);
    near(m.withinLab.df, s.dfWL, 1e-12);
    if (s.clipped) expect(m.withinLab.df).toBe(s.aov.dfWithin);
  });

  it.each(f.studies.map((s) => [s.name, s] as const))('%s: χ² CIs of s_r and s_WL, UVLs for 1, 2 and 3 materials with R qchisq', (_name, s) => {
    for (const l of [1, 2, 3] as const) {
      const result = run(s, l);
      expect(result.materialsTested).toBe(l);
      for (const m of result.materials) {
        near(m.repeatability.ci.lower, s.ciR[0], 1e-10);
        near(m.repeatability.ci.upper, s.ciR[1], 1e-10);
        near(m.withinLab.ci.lower, s.ciWL[0], 1e-10);
        near(m.withinLab.ci.upper, s.ciWL[1], 1e-10);
        near(m.uvl.repeatability, s.uvl[l][0], 1e-10);
        near(m.uvl.withinLab, s.uvl[l][1], 1e-10);
      }
    }
  });

  it.each(f.studies.map((s) => [s.name, s] as const))('%s: trueness SE, Satterthwaite df and interval with R qt', (_name, s) => {
    const t = run(s, s.trueness.materials).materials[0].trueness!;
    near(t.se, s.trueness.se, 1e-12);
    near(t.seDf!, s.trueness.seDf, 1e-12);
    near(t.df, s.trueness.df, 1e-12);
    near(t.multiplier!, s.trueness.multiplier, 1e-7);
    const half = s.trueness.multiplier * Math.sqrt(s.trueness.se ** 2 + s.trueness.uncertainty ** 2);
    near(t.interval.lower, s.trueness.assigned - half, 1e-7);
    near(t.interval.upper, s.trueness.assigned + half, 1e-7);
    expect(t.verdict).toBe(s.mean >= s.trueness.assigned - half && s.mean <= s.trueness.assigned + half ? 'verified' : 'not-verified');
  });

  it('balanced set: s_r, s_b and the SE of the mean equal the REML estimates of nlme::lme', () => {
    const s = f.studies.find((x) => x.reml)!;
    const m = run(s, 2).materials[0];
    near(m.repeatability.sd, s.reml!.sr, 1e-8);
    near(m.betweenDay.sd, s.reml!.sb, 1e-8);
    near(m.trueness!.se, s.reml!.seMean, 1e-8);
    expect(m.trueness!.seDf).toBeCloseTo(s.aov.dfBetween, 10);
  });

  it.each(f.quantiles.map((q) => [q.p, q.nu, q] as const))('χ²(%s; ν = %s) and t as R qchisq and qt (jStat, non-integer ν included)', (_p, _nu, q) => {
    near(jStat.chisquare.inv(q.p, q.nu), q.chisq, 1e-10);
    near(Math.abs(jStat.studentt.inv(q.p, q.nu)), Math.abs(q.t), 1e-7);
  });
});

// Source: fixtures/precision-scipy.json, made once by make-fixtures/make_precision_scipy.py with scipy 1.17.1
// (scipy.stats.chi2.ppf, scipy.stats.t.ppf): the UVL and CI factors of a claim σ = 1 at the points a 5 × 5
// verification uses (ν = 20 for repeatability, ν = 4 for the days, Satterthwaite ν for s_WL), ℓ = 1 … 4.
// It stands in for a printed χ² table; no published worked example with its data was found. Tolerances as above.
const sp = fixture<{ generator: string; alpha: number; points: { nu: number; materials: number; uvlFactor: number; ciLowerFactor: number; ciUpperFactor: number; tMultiplier: number }[] }>('precision-scipy.json');

describe(`UVL and CI factors against ${sp.generator}`, () => {
  it.each(sp.points.map((q) => [q.nu, q.materials, q] as const))('ν = %s, ℓ = %s: UVL factor, χ² CI factors and t(1 − α/(2ℓ); ν) as scipy', (_nu, _l, q) => {
    near(upperVerificationLimit(1, q.nu, sp.alpha, q.materials), q.uvlFactor, 1e-10);
    const ci = sdConfidenceInterval(1, q.nu, sp.alpha);
    near(ci.lower, q.ciLowerFactor, 1e-10);
    near(ci.upper, q.ciUpperFactor, 1e-10);
    near(jStat.studentt.inv(1 - sp.alpha / (2 * q.materials), q.nu), q.tMultiplier, 1e-7);
  });
});
