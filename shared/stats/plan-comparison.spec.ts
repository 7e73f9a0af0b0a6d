import { optionOf } from './option-of.testing';
import { mergePlans, planComparison, splitGrid, type ComparisonPlanOptions } from './plan-comparison';
import { regression } from './regression';
import type { RegressionMethod } from './regression-fitters';
import { streamFor, Xor128 } from './rng';

// Small runs (100 to 200 simulated studies of 100 resamples) keep this suite quick; the figures' agreement with
// normal theory and with α/2 is checked in reference-checks/plan.check.ts.
const base: ComparisonPlanOptions = {
  cvComparative: 2, cvCandidate: 2, low: 50, high: 150, regression: 'ols', decisionLevels: [100], allowableBias: 2,
  n: [20], simulations: 100, resamples: 100, seed: 'spec',
};


describe('planComparison options', () => {
  it.each<[string, string, ComparisonPlanOptions]>([
    ['cvComparative missing', 'cvComparative', { ...base, cvComparative: undefined }],
    ['cvCandidate 0', 'cvCandidate', { ...base, cvCandidate: 0 }],
    ['high equal to low', 'high', { ...base, high: 50 }],
    ['high below low', 'high', { ...base, high: 40 }],
    ['low missing', 'low', { ...base, low: undefined }],
    ['log-uniform from 0', 'low', { ...base, shape: 'log-uniform', low: 0 }],
    ['log-uniform from below 0', 'low', { ...base, shape: 'log-uniform', low: -5 }],
    ['no decision levels', 'decisionLevels', { ...base, decisionLevels: [] }],
    ['decision levels missing', 'decisionLevels', { ...base, decisionLevels: undefined }],
    ['no allowable bias', 'allowableBias', { ...base, allowableBias: null, allowableBiasPercent: undefined }],
    ['allowable bias 0', 'allowableBias', { ...base, allowableBias: 0 }],
    ['allowable bias % negative', 'allowableBiasPercent', { ...base, allowableBiasPercent: -1 }],
    ['n below 5', 'n', { ...base, n: [4] }],
    ['n not whole', 'n', { ...base, n: [40.5] }],
    ['n above 2000', 'n', { ...base, n: [2001] }],
    ['n empty', 'n', { ...base, n: [] }],
    ['13 grid points', 'n', { ...base, n: Array.from({ length: 13 }, (_, i) => 10 + i) }],
    ['values with one value', 'values', { ...base, shape: 'values', values: [80] }],
    ['values missing', 'values', { ...base, shape: 'values', values: undefined }],
    ['unknown shape', 'shape', { ...base, shape: 'triangle' as never }],
    ['unknown regression', 'regression', { ...base, regression: 'lasso' as never }],
    ['simulations below 100', 'simulations', { ...base, simulations: 50 }],
    ['resamples above 5000', 'resamples', { ...base, resamples: 5001 }],
    ['decimals above 6', 'decimals', { ...base, decimals: 7 }],
  ])('%s: names %s', (_what, option, options) => {
    expect(optionOf(() => planComparison(options))).toBe(option);
  });

  it('accepts the allowable bias as a % alone, and 12 grid points', () => {
    const r = planComparison({ ...base, allowableBias: null, allowableBiasPercent: 2, n: Array.from({ length: 12 }, (_, i) => 5 + i) });
    expect(r.rows).toHaveLength(12);
    expect(r.rows[0].levels[0].allowable).toBe(2);
  });

  it('draws from the values of an earlier study: the range is theirs', () => {
    const r = planComparison({ ...base, shape: 'values', values: [60, 140, 75, 90, 120], low: 1, high: 2 });
    expect([r.settings.low, r.settings.high]).toEqual([60, 140]);
    expect(r.settings.values).toEqual([60, 140, 75, 90, 120]);
    expect(r.rows[0].levels[0].powerAtZero).toBeGreaterThan(0);
  });

  it('sorts and de-duplicates the grid', () => {
    expect(planComparison({ ...base, n: [30, 10, 30] }).rows.map((r) => r.n)).toEqual([10, 30]);
  });
});

describe('planComparison reproducibility', () => {
  it('gives identical figures for the same seed and different figures for another', () => {
    const a = planComparison(base);
    const b = planComparison(base);
    const c = planComparison({ ...base, seed: 'another' });
    expect(b.rows).toEqual(a.rows);
    expect(c.rows).not.toEqual(a.rows);
    expect(a.seed).toBe('spec');
  });

  it('keeps the figures for one n when the grid around it changes (streams keyed by n and study)', () => {
    const alone = planComparison({ ...base, n: [20] });
    const among = planComparison({ ...base, n: [10, 20, 30] });
    expect(among.rows.find((r) => r.n === 20)).toEqual(alone.rows[0]);
  });

  it('gives the whole-grid plan when parts of the grid are run apart and merged (as the worker threads do)', () => {
    const options = { ...base, n: [10, 20, 30, 40], targetPower: 0.3 };
    const whole = planComparison(options);
    const parts = splitGrid(options.n, 2);
    expect(parts.flat().sort((a, b) => a - b)).toEqual(options.n);
    expect(parts).toHaveLength(2);
    const merged = mergePlans(parts.map((n) => planComparison({ ...options, n })));
    expect(merged).toEqual(whole);
  });

  it('splits the grid into parts of about equal work (the sum of n)', () => {
    const parts = splitGrid([40, 60, 80, 100, 120, 160, 200], 3);
    const work = parts.map((g) => g.reduce((a, b) => a + b, 0));
    expect(parts.flat().sort((a, b) => a - b)).toEqual([40, 60, 80, 100, 120, 160, 200]);
    expect(Math.max(...work) - Math.min(...work)).toBeLessThanOrEqual(40);
    expect(splitGrid([40], 4)).toEqual([[40]]);
  });

  it('reports progress up to 1', () => {
    const seen: number[] = [];
    planComparison({ ...base, n: [10, 20] }, (f) => seen.push(f));
    expect(seen.length).toBeGreaterThan(10);
    expect(seen[seen.length - 1]).toBe(1);
    expect(seen.every((f, i) => i === 0 || f >= seen[i - 1])).toBe(true);
  });
});

/** An invented study: true values uniform on 20 to 200, normal errors (SD 3, and 3% of the value for y), 2 decimals. */
function study(n: number, seed: string): { x: Float64Array; y: Float64Array } {
  const s = new Xor128(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - s.nextUniform())) * Math.cos(2 * Math.PI * s.nextUniform());
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = 20 + 180 * s.nextUniform();
    x[i] = Math.round((t + 3 * normal()) * 100) / 100;
    y[i] = Math.round((1.5 + 1.01 * t + 0.03 * t * normal()) * 100) / 100;
  }
  return { x, y };
}

function levelCis(method: RegressionMethod, x: Float64Array, y: Float64Array, levels: number[]): [number, number][] {
  const fit = regression(x, y, {
    method, lambda: 1, level: 0.95, interval: 'percentile', ciMethod: 'bootstrap', decisionLevels: levels,
    settings: { resamples: 200, stream: streamFor('equivariance', 'regression') }, bandPoints: 0,
  });
  return fit.decisionLevelBias.map((b) => b.ci as [number, number]);
}

describe('shift-equivariance that lets one analysis serve every true bias', () => {
  const levels = [25, 100, 190];
  // n = 40 uses Passing–Bablok's sorted slope table, n = 90 its slope selection.
  it.each<[RegressionMethod, number, string]>([
    ['ols', 40, 'a'], ['ols', 90, 'b'], ['deming', 40, 'c'], ['deming', 90, 'd'], ['passing-bablok', 40, 'e'], ['passing-bablok', 90, 'f'],
  ])('%s, n = %s (data %s): the CI on y + δ is the CI on y moved by δ', (method, n, seed) => {
    const { x, y } = study(n, seed);
    const at0 = levelCis(method, x, y, levels);
    for (const delta of [0.35, -1.7, 2.5]) {
      const moved = levelCis(method, x, y.map((v) => v + delta), levels);
      moved.forEach((ci, k) => {
        expect(Math.abs(ci[0] - (at0[k][0] + delta))).toBeLessThan(1e-9);
        expect(Math.abs(ci[1] - (at0[k][1] + delta))).toBeLessThan(1e-9);
      });
    }
  });

  it('does not hold for weighted Deming (its weights change with y), which is why it is re-analysed per truth', () => {
    const { x, y } = study(60, 'g');
    const at0 = levelCis('weighted-deming', x, y, levels);
    const moved = levelCis('weighted-deming', x, y.map((v) => v + 2.5), levels);
    const worst = Math.max(...moved.flatMap((ci, k) => [Math.abs(ci[0] - at0[k][0] - 2.5), Math.abs(ci[1] - at0[k][1] - 2.5)]));
    expect(worst).toBeGreaterThan(1e-6);
  });
});

/**
 * The plan's figures recounted the long way: each study drawn again as plan-comparison.ts documents it (stream
 * `plan:n:j`, uniform concentration, Box–Muller normals, rounding to the decimals), then analysed afresh on the
 * shifted data y + δ for every truth (no equivariance shortcut) with the study's own resampling stream.
 */
function recount(o: ComparisonPlanOptions & { decimals: number }, n: number): { zero: number; half: number; full: number; medianHalfWidth: number }[] {
  const scale10 = 10 ** o.decimals;
  const counts = o.decisionLevels!.map(() => ({ zero: 0, half: 0, full: 0, medianHalfWidth: 0 }));
  const halfWidths = o.decisionLevels!.map(() => [] as number[]);
  for (let j = 0; j < o.simulations!; j++) {
    const s = streamFor(o.seed!, `plan:${n}:${j}`);
    const normal = () => Math.sqrt(-2 * Math.log((s.nextInt32() >>> 0) / 4294967296 + 1 / 8589934592)) * Math.cos(2 * Math.PI * s.nextUniform());
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const c = o.low! + (o.high! - o.low!) * s.nextUniform();
      const sd = o.errorModel === 'proportional' ? Math.abs(c) / 100 : 1;
      x[i] = Math.round((c + o.cvComparative! * sd * normal()) * scale10) / scale10;
      y[i] = Math.round((c + o.cvCandidate! * sd * normal()) * scale10) / scale10;
    }
    o.decisionLevels!.forEach((level, k) => {
      const allowable = Math.max(o.allowableBias ?? 0, ((o.allowableBiasPercent ?? 0) * Math.abs(level)) / 100);
      (['zero', 'half', 'full'] as const).forEach((truth, t) => {
        const delta = [0, 0.5, 1][t] * allowable;
        const fit = regression(x, y.map((v) => v + delta), {
          method: o.regression!, lambda: (o.cvComparative! / o.cvCandidate!) ** 2, level: 0.95, interval: 'percentile', ciMethod: 'bootstrap',
          decisionLevels: o.decisionLevels!, settings: { resamples: o.resamples!, stream: streamFor(o.seed!, `plan:${n}:${j}:regression`) }, bandPoints: 0,
        });
        const ci = fit.decisionLevelBias[k].ci!;
        if (ci[0] >= -allowable && ci[1] <= allowable) counts[k][truth]++;
        if (t === 0) halfWidths[k].push((ci[1] - ci[0]) / 2);
      });
    });
  }
  halfWidths.forEach((h, k) => {
    const sorted = h.sort((a, b) => a - b);
    counts[k].medianHalfWidth = sorted.length % 2 ? sorted[(sorted.length - 1) / 2] : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
  });
  return counts;
}

describe('planComparison figures', () => {
  it.each<[RegressionMethod, 'constant' | 'proportional']>([['ols', 'constant'], ['passing-bablok', 'constant'], ['weighted-deming', 'proportional']])(
    '%s (%s errors): the figures are the counts of studies analysed afresh at each true bias', (method, errorModel) => {
      // Proportional errors from 2 to 40 with a goal of 15% at 3: the shift is large against the low values, where
      // weighted Deming's weights move most (its CIs on y + δ are far from those on y moved by δ).
      const o = errorModel === 'constant'
        ? { cvComparative: 3, cvCandidate: 3, errorModel, low: 20, high: 120, regression: method, decisionLevels: [40, 110], allowableBias: 3, n: [25], simulations: 100, resamples: 100, decimals: 2, seed: `recount ${method}` }
        : { cvComparative: 5, cvCandidate: 5, errorModel, low: 2, high: 40, regression: method, decisionLevels: [3, 30], allowableBiasPercent: 15, n: [25], simulations: 100, resamples: 100, decimals: 3, seed: `recount ${method}` };
      const figures = planComparison(o).rows[0].levels;
      const counts = recount(o, 25);
      expect(figures.map((l) => [l.powerAtZero, l.powerAtHalf, l.falsePass])).toEqual(counts.map((c) => [c.zero / 100, c.half / 100, c.full / 100]));
      figures.forEach((l, k) => expect(l.medianHalfWidth).toBeCloseTo(counts[k].medianHalfWidth, 12));
      // Informative: not every figure 0 or 1.
      expect(figures.some((l) => l.powerAtHalf > 0.05 && l.powerAtHalf < 0.95)).toBe(true);
    });


  it('runs weighted Deming (proportional errors) with figures in [0, 1] ordered power at 0 ≥ at A/2 ≥ false pass', () => {
    const r = planComparison({
      cvComparative: 2, cvCandidate: 2, errorModel: 'proportional', low: 20, high: 200, regression: 'weighted-deming',
      decisionLevels: [50, 150], allowableBiasPercent: 6, n: [40], simulations: 100, resamples: 100, seed: 'weighted',
    });
    for (const l of r.rows[0].levels) {
      for (const v of [l.powerAtZero, l.powerAtHalf, l.falsePass]) {
        expect(v).toBeGreaterThanOrEqual(0);
        expect(v).toBeLessThanOrEqual(1);
      }
      expect(l.powerAtZero).toBeGreaterThan(0.5);
      expect(l.powerAtZero).toBeGreaterThanOrEqual(l.powerAtHalf);
      expect(l.powerAtHalf).toBeGreaterThan(l.falsePass);
      expect(l.falsePass).toBeLessThan(0.15);
      expect(l.medianHalfWidth).toBeGreaterThan(0);
    }
    // The allowable bias is 6% of each level.
    expect(r.rows[0].levels.map((l) => l.allowable)).toEqual([3, 9]);
    expect(r.settings.demingRatio).toBe(1);
  });

  it('orders the figures the same way for Passing–Bablok and Deming on a clear case, and power grows with n', () => {
    for (const method of ['passing-bablok', 'deming'] as const) {
      const r = planComparison({ ...base, regression: method, allowableBias: 3, n: [20, 80] });
      const [small, large] = r.rows.map((row) => row.levels[0]);
      expect(small.powerAtZero).toBeGreaterThanOrEqual(small.powerAtHalf);
      expect(small.powerAtHalf).toBeGreaterThan(small.falsePass);
      expect(large.powerAtHalf).toBeGreaterThan(small.powerAtHalf);
      expect(large.medianHalfWidth!).toBeLessThan(small.medianHalfWidth!);
      expect(large.falsePass).toBeLessThan(0.1);
    }
  });
});

describe('recommendedN', () => {
  // Least squares, candidate SD 5, x nearly error-free on 50 to 150, allowable bias 3.5 at 100: normal theory
  // gives power at A/2 about 0.59 at n = 40 and 0.94 at n = 100 (see reference-checks/plan.check.ts).
  const clear: ComparisonPlanOptions = {
    cvComparative: 1e-3, cvCandidate: 5, low: 50, high: 150, regression: 'ols', decisionLevels: [100], allowableBias: 3.5,
    n: [40, 100], simulations: 200, resamples: 100, seed: 'recommend',
  };

  it('is the smallest grid n meeting both targets', () => {
    const r = planComparison(clear);
    const [n40, n100] = r.rows.map((row) => row.levels[0]);
    expect(n40.powerAtHalf).toBeLessThan(0.8);
    expect(n100.powerAtHalf).toBeGreaterThanOrEqual(0.8);
    expect(n100.falsePass).toBeLessThanOrEqual(0.05);
    expect(r.recommendedN).toBe(100);
    expect(r.reason).toMatch(/^100 specimens/);
    expect(planComparison({ ...clear, targetPower: 0.4 }).recommendedN).toBe(40);
  });

  it('is null when the false-pass target is not met, and says so', () => {
    const r = planComparison({ ...clear, maxFalsePass: 0.001 });
    expect(r.rows.every((row) => row.levels[0].falsePass > 0.001)).toBe(true);
    expect(r.recommendedN).toBeNull();
    expect(r.reason).toMatch(/a bias equal to the goal still passes/);
  });

  it('is null over a narrow range, with a reason naming the level and the narrow range', () => {
    const narrow: ComparisonPlanOptions = { ...base, regression: 'deming', low: 9, high: 11, decisionLevels: [11], allowableBias: 0.15, cvComparative: 0.1, cvCandidate: 0.1, n: [20, 40] };
    const r = planComparison(narrow);
    expect(r.recommendedN).toBeNull();
    expect(r.reason).toContain('at 11 the power is');
    expect(r.reason).toContain('the range is narrow (highest/lowest 1.22');
    expect(r.reason).not.toContain('imprecision');
    // The same methods over a range ten times as wide fix the slope better: more power at 11, and no "narrow".
    const wide = planComparison({ ...narrow, low: 1, high: 21 });
    expect(wide.rows[1].levels[0].powerAtHalf).toBeGreaterThan(r.rows[1].levels[0].powerAtHalf + 0.2);
    expect(wide.reason).not.toContain('narrow');
  });

  it('is null when the imprecision is large against the goal, with a reason saying so (and not "narrow")', () => {
    const r = planComparison({ ...base, cvComparative: 10, cvCandidate: 10, allowableBias: 2, decisionLevels: [70], n: [20] });
    expect(r.recommendedN).toBeNull();
    expect(r.reason).toContain('at 70 the power is');
    expect(r.reason).toContain('imprecision (combined SD 14.1)');
    expect(r.reason).not.toContain('narrow');
  });
});

describe('planComparison warnings', () => {
  it('warns of a decision level outside the planned range, and only then', () => {
    const outside = planComparison({ ...base, decisionLevels: [100, 180] });
    expect(outside.warnings.some((w) => w.includes('Decision level 180 outside the planned range 50 to 150'))).toBe(true);
    const inside = planComparison(base);
    expect(inside.warnings.some((w) => w.includes('outside the planned range'))).toBe(false);
  });

  it('warns of negative simulated results at the low end with a constant SD, and only then', () => {
    expect(planComparison({ ...base, low: 3 }).warnings.some((w) => w.includes('negative'))).toBe(true);
    expect(planComparison(base).warnings.some((w) => w.includes('negative'))).toBe(false);
  });
});

describe('planComparison with least squares and with a goal of 0', () => {
  it('says least squares ignores the comparative error: a warning, and a cause when no n will do; Deming gets neither', () => {
    const narrowOls: ComparisonPlanOptions = { ...base, low: 9, high: 11, decisionLevels: [11], allowableBias: 0.15, cvComparative: 0.2, cvCandidate: 0.2, n: [20] };
    const ols = planComparison(narrowOls);
    expect(ols.warnings.some((w) => w.startsWith('Least squares assumes the comparative method has no error'))).toBe(true);
    expect(ols.recommendedN).toBeNull();
    expect(ols.reason).toContain('least squares ignores the comparative method\'s error');
    const deming = planComparison({ ...narrowOls, regression: 'deming' });
    expect(deming.warnings.some((w) => w.startsWith('Least squares'))).toBe(false);
    expect(deming.reason).not.toContain('least squares');
  });

  it('refuses a decision level whose allowable bias is 0 (only a percentage goal at level 0), naming the decision levels', () => {
    expect(optionOf(() => planComparison({ ...base, decisionLevels: [0, 100], allowableBias: null, allowableBiasPercent: 5 }))).toBe('decisionLevels');
    // With an absolute goal as well, the level 0 has a goal and runs.
    expect(planComparison({ ...base, decisionLevels: [0, 100], allowableBias: 2, allowableBiasPercent: 5 }).rows[0].levels[0].allowable).toBe(2);
  });
});

describe('planComparison on coarse results', () => {
  it('judges a CI narrower than the reporting step on the estimate ± step/2, as the analysis does: a collapsed CI does not pass a bias equal to the goal', () => {
    // Whole-number results and tiny errors: the bias CI at the level collapses to about one value. Judged on that CI
    // moved by the goal it would sit on the goal's edge and count as "within" nearly always; widened to ± 0.5 it cannot.
    const coarse = planComparison({ ...base, regression: 'deming', cvComparative: 0.02, cvCandidate: 0.02, decimals: 0, allowableBias: 0.6, n: [40] });
    const level = coarse.rows[0].levels[0];
    expect(level.medianHalfWidth!).toBeLessThan(0.5);
    expect(level.falsePass).toBe(0);
    expect(level.powerAtZero).toBe(1);
  });
});
