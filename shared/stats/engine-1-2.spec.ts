import { jStat } from 'jstat';
import { analyzeComparison } from './analyze-comparison';
import { analyzeInterval } from './analyze-interval';
import { binomialSf } from './binomial';
import { harrisBoyd } from './harris-boyd';
import { bootstrapTest } from './one-sample';
import { roundTo } from './precision';
import { Xor128 } from './rng';
import { MIN_TEST_VALUES } from './shifted-null-test';
import { slopeTable } from './slope-table';
import { verifyInterval } from './verify-interval';

// Unit tests of the defects fixed in engine 1.2 (issue 11), one block per defect, plus the reporting
// resolution. Each failed on engine 1.1.0.
const fast = { resamples: 1000, regressionResamples: 1000 };

/** Invented pairs with 1 or 2 decimals. */
function pairs(n: number, seed: string, decimals = 1): { x: number; y: number }[] {
  const s = new Xor128(seed);
  return Array.from({ length: n }, () => {
    const x = roundTo(3 + 40 * s.nextUniform(), decimals);
    return { x, y: roundTo(1.03 * x + 0.2 + (s.nextUniform() - 0.5), decimals) };
  });
}

/** The value in another unit, scaled by 10^exponent exactly in decimal. */
const shifted = (v: number, exponent: number): number => Number(`${v}e${exponent}`);

describe('defect 1: parametric limits at or below 0', () => {
  it('reports the Gaussian limit mean − 1.96·s when the data include values ≤ 0', () => {
    const values = [-1.2, -0.4, 0, 0.3, 0.8, 1.1, 1.5, 2.2, 2.9, 3.4, -0.8, 0.5, 1.9, 2.6, 0.1];
    const result = analyzeInterval(values.map((value) => ({ value })), { method: 'parametric', ...fast });
    const m = values.reduce((a, v) => a + v, 0) / values.length;
    const s = Math.sqrt(values.reduce((a, v) => a + (v - m) ** 2, 0) / (values.length - 1));
    expect(result.lower!.estimate!).toBeCloseTo(m + jStat.normal.inv(0.025, 0, 1) * s, 10);
    expect(result.lower!.ci).not.toBeNull();
    expect(result.lower!.distribution!.bins.reduce((t, b) => t + b.count, 0)).toBe(1000);
  });

  it('never takes a transformed limit’s CI from a subset of resamples without saying so', () => {
    const n = 30;
    const values = Array.from({ length: n }, (_, i) => roundTo(2.6 + 1.1 * jStat.normal.inv((i + 0.5) / n, 0, 1), 2));
    const result = analyzeInterval(values.map((value) => ({ value })), { method: 'parametric', ...fast, seed: 'near-zero' });
    const words = result.warnings.join(' ');
    expect(words).toMatch(/resamples the 2\.5th percentile limit fell at or below 0, where the Box–Cox transform cannot express it/);
    if (result.lower!.ci) expect(result.lower!.ci[0]).toBeLessThan(result.lower!.estimate!);
  });
});

describe('defect 3: very small values keep their differences', () => {
  it.each([-13, -16, 8])('scaling the data by 1e%s scales every estimate and leaves every test unchanged', (exponent) => {
    const data = pairs(60, 'scale', 2);
    const options = { ...fast, decisionLevels: [10, 30], seed: 'scale' };
    const a = analyzeComparison(data, options);
    const b = analyzeComparison(data.map((r) => ({ x: shifted(r.x, exponent), y: shifted(r.y, exponent) })), {
      ...options, decisionLevels: [10, 30].map((v) => shifted(v, exponent)),
    });
    const k = 10 ** exponent;
    const same = (u: number | null, v: number | null, factor: number): void => {
      expect(u).not.toBeNull();
      expect(Math.abs(v! - u! * factor)).toBeLessThanOrEqual(1e-9 * Math.abs(u! * factor) + 1e-300);
    };
    same(a.bias.median.estimate, b.bias.median.estimate, k);
    same(a.bias.mean.estimate, b.bias.mean.estimate, k);
    same(a.sd.estimate, b.sd.estimate, k);
    same(a.bias.median.ci![0], b.bias.median.ci![0], k);
    same(a.bias.mean.ci![1], b.bias.mean.ci![1], k);
    same(a.regression.slope.estimate, b.regression.slope.estimate, 1);
    same(a.regression.intercept.estimate, b.regression.intercept.estimate, k);
    same(a.decisionLevels[1].bias.estimate, b.decisionLevels[1].bias.estimate, k);
    expect(b.bias.median.pValue).toBe(a.bias.median.pValue);
    expect(b.bias.mean.pValue).toBe(a.bias.mean.pValue);
    expect(b.signTest).toEqual(a.signTest);
    expect(b.wilcoxon).toEqual(a.wilcoxon);
    expect(b.outliers).toEqual(a.outliers);
    expect(b.regression.slope.ci).toEqual(a.regression.slope.ci);
    expect(b.resolution.increment).toBeCloseTo(a.resolution.increment * k, 300);
  });
});

describe('defect 4: Passing–Bablok judges a slope of −1 at the reported precision', () => {
  it('leaves out the same pairs as the same data in whole units', () => {
    // (0.1, 0.3) and (0.2, 0.2): Δy/Δx is −1 in decimal, −0.9999999999999998 in binary.
    const x = [0.1, 0.2, 0.4, 0.5, 0.7, 0.9, 1.2];
    const y = [0.3, 0.2, 0.5, 0.4, 0.8, 1.0, 1.1];
    const decimal = slopeTable(x, y);
    const whole = slopeTable(x.map((v) => shifted(v, 1)), y.map((v) => shifted(v, 1)));
    expect(decimal.leftOut.length).toBe(whole.leftOut.length);
    expect(decimal.leftOut.length).toBeGreaterThanOrEqual(4);
    expect(Array.from(decimal.slopes)).toEqual(Array.from(whole.slopes));
  });
});

describe('defect 5: a BCa interval that cannot be formed', () => {
  it('says so and shows the percentile interval instead', () => {
    const data = Array.from({ length: 40 }, (_, i) => ({ x: 50 + i, y: 50 + i + (i % 13 === 0 ? 1 : 0) }));
    const result = analyzeComparison(data, { ...fast, interval: 'bca' });
    expect(result.bias.median.ci).not.toBeNull();
    expect(result.warnings.join(' ')).toContain('The BCa interval cannot be formed for the median bias');
    expect(result.warnings.join(' ')).toContain('The percentile interval is shown instead.');
  });
});

describe('defect 6: the shifted-null test is translation invariant', () => {
  it.each([1e7, -3e5, 123.45])('adding %s to every value and to the null leaves p unchanged', (offset) => {
    const s = new Xor128('translate');
    const values = Array.from({ length: 41 }, () => roundTo(0.15 + Math.exp(s.nextUniform() * 1.2) - 1.6, 2));
    for (const statistic of ['median', 'mean'] as const) {
      const base = bootstrapTest(values, { statistic, null: 0, resamples: 4000 });
      const moved = bootstrapTest(values.map((v) => roundTo(v + offset, 2)), { statistic, null: offset, resamples: 4000 });
      expect(moved.pValue).toBe(base.pValue);
      expect(moved.upperTail).toBe(base.upperTail);
    }
  });
});

describe('defect 7: Harris–Boyd with a subgroup whose SD is 0', () => {
  it('tests the pair and recommends partitioning for clearly different groups', () => {
    const rows = [
      ...Array.from({ length: 30 }, () => ({ value: 5.0, sex: 'F' })),
      ...Array.from({ length: 30 }, (_, i) => ({ value: roundTo(7 + (i % 7) * 0.4, 1), sex: 'M' })),
    ];
    const result = analyzeInterval(rows, { ...fast, partitionFields: ['sex'] });
    expect(result.partitions[0].pairs).toHaveLength(1);
    expect(result.partitions[0].recommended).toBe(true);
    expect(result.partitions[0].noSpread).toEqual(['F']);
    expect(result.warnings.join(' ')).toContain('subgroup F has no spread');
    expect(harrisBoyd({ group: 'a', n: 20, mean: 4, sd: 0 }, { group: 'b', n: 20, mean: 4, sd: 0 }).recommended).toBe(false);
  });
});

describe('defect 8: degenerate tests refuse the p-value', () => {
  it('justifies the minimum: the resampled median hits the extreme value with ≥ 2.5% at n = 5, < 2.5% at n = 6', () => {
    const extreme = (n: number): number => binomialSf(Math.floor(n / 2) + 1, n, 1 / n);
    expect(extreme(MIN_TEST_VALUES - 1)).toBeGreaterThan(0.025);
    expect(extreme(MIN_TEST_VALUES)).toBeLessThan(0.025);
  });

  it.each([
    ['two values', [1.2, 3.4]],
    ['five values', [0.1, 0.4, 0.9, 1.3, 2.0]],
    ['all values equal', [1, 1, 1, 1, 1, 1, 1, 1, 1, 1]],
  ])('%s: no p-value, with the reason', (_name, values) => {
    const result = bootstrapTest(values as number[], { resamples: 1000 });
    expect(result.pValue).toBeNull();
    expect(result.warnings[0]).toMatch(/^No p-value: /);
  });

  it('a comparison whose differences are all equal gives no p-value and says why', () => {
    const result = analyzeComparison(Array.from({ length: 40 }, (_, i) => ({ x: 10 + i, y: 11 + i })), fast);
    expect(result.bias.median.pValue).toBeNull();
    expect(result.bias.mean.pValue).toBeNull();
    expect(result.biasTests.median).toBeNull();
    expect(result.warnings.join(' ')).toContain('No p-value: all 40 differences are equal');
  });
});

describe('defect 9: values the engine cannot compute with', () => {
  it.each([1e300, -2e150, 3e-200])('refuses %s naming the row and the reason', (value) => {
    const data = pairs(10, 'big');
    data[2] = { x: value, y: value };
    expect(() => analyzeComparison(data, fast)).toThrow(/row 3: .* is outside the range the engine computes in/);
    expect(() => analyzeInterval([{ value: 1 }, { value: 2 }, { value }], fast)).toThrow(/row 3: /);
  });
});

describe('the robust method says its constants are unverified', () => {
  it('warns in the findings', () => {
    const values = Array.from({ length: 40 }, (_, i) => ({ value: roundTo(4 + Math.sin(i) * 0.8, 2) }));
    expect(analyzeInterval(values, { ...fast, method: 'robust' }).warnings.join(' ')).toContain('have not been checked against a published worked example');
  });
});

describe('resolution: what coarse results allow', () => {
  // Sodium in whole mmol/L: most candidate results 1 above the comparative result.
  const sodium = Array.from({ length: 60 }, (_, i) => {
    const x = 128 + (i % 25);
    return { x, y: x + (i % 10 === 0 ? 0 : i % 17 === 0 ? 2 : 1) };
  });

  it('names the estimates whose CI is narrower than one step and judges the verdict on ± half a step', () => {
    const result = analyzeComparison(sodium, { ...fast, decimals: 0, decisionLevels: [130, 150], allowableBias: 1.2 });
    expect(result.resolution).toMatchObject({ increment: 1, source: 'analyte', differenceIncrement: 1 });
    expect(result.resolution.limitedEstimates).toEqual(expect.arrayContaining(['bias.median', 'decisionLevels.0', 'decisionLevels.1']));
    const level = result.decisionLevels[0];
    expect(level.bias.ci![1] - level.bias.ci![0]).toBeLessThan(1);
    expect(level.judgedOn).toEqual([Math.min(level.bias.ci![0], level.bias.estimate! - 0.5), Math.max(level.bias.ci![1], level.bias.estimate! + 0.5)]);
    // the collapsed CI [1, 1] lies within ±1.2; the interval no narrower than 1 ± 0.5 does not
    expect(level.verdict).toBe('inconclusive');
  });

  it('detects the step from the data when the analyte gives none', () => {
    const result = analyzeComparison(sodium, fast);
    expect(result.resolution).toMatchObject({ increment: 1, source: 'data' });
    expect(analyzeComparison(pairs(50, 'fine', 2), fast).resolution.increment).toBe(0.01);
  });

  it('shows nothing for fine-grained data', () => {
    const result = analyzeComparison(pairs(80, 'fine', 2), { ...fast, decisionLevels: [10, 30], allowableBias: 2 });
    expect(result.resolution.limitedEstimates).toEqual([]);
    expect(result.decisionLevels.every((d) => d.judgedOn === null)).toBe(true);
  });

  it('is carried by every kind', () => {
    const coarse = Array.from({ length: 120 }, (_, i) => ({ value: 135 + (i % 7) + (i % 11 === 0 ? 3 : 0) }));
    const interval = analyzeInterval(coarse, { ...fast, decimals: 0 });
    expect(interval.resolution).toMatchObject({ increment: 1, source: 'analyte' });
    expect(interval.resolution.limitedEstimates.length).toBeGreaterThan(0);
    expect(verifyInterval([1.25, 2.5, 3.75], { lower: 1, upper: 4 }).resolution).toEqual({ increment: 0.01, source: 'data', limitedEstimates: [] });
    expect(bootstrapTest([1.5, 2, 2.5, 3, 4, 5], { resamples: 1000 }).resolution.increment).toBe(0.1);
  });
});
