import { analyzeComparison } from './analyze-comparison';
import { CAUTION } from './comparison-types';
import { OptionError } from './options';
import { Xor128 } from './rng';

function rows(n: number, seed = 'cmp'): { x: number; y: number }[] {
  const s = new Xor128(seed);
  return Array.from({ length: n }, () => {
    const x = Math.round((3 + 40 * s.nextUniform()) * 10) / 10;
    return { x, y: Math.round((1.03 * x + 0.2 + (s.nextUniform() - 0.5)) * 10) / 10 };
  });
}
const fast = { resamples: 1000, regressionResamples: 1000 };

describe('analyzeComparison', () => {
  it('gives bit-identical JSON for the same rows, settings and seed', () => {
    const data = rows(50);
    const a = JSON.stringify(analyzeComparison(data, { ...fast, seed: 'x', decisionLevels: [10] }));
    expect(JSON.stringify(analyzeComparison(data, { ...fast, seed: 'x', decisionLevels: [10] }))).toBe(a);
    expect(JSON.stringify(analyzeComparison(data, { ...fast, seed: 'y', decisionLevels: [10] }))).not.toBe(a);
  });

  it('leaves the input rows unchanged and returns plain JSON', () => {
    const data = rows(45);
    const copy = JSON.stringify(data);
    const result = analyzeComparison(data, fast);
    expect(JSON.stringify(data)).toBe(copy);
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
    expect(result.caution).toBe(CAUTION);
    expect(result.engine).toMatchObject({ version: 'parallax-stats 1.4.0 (xor128)', resamples: 1000 });
  });

  it('leaves excluded rows out, counts them, and shows the estimates with them in sensitivity', () => {
    const data = [...rows(44), { x: 20, y: 35, excluded: true, exclusionReason: 'clotted' }];
    const result = analyzeComparison(data, fast);
    expect(result.n).toBe(44);
    expect(result.excluded).toEqual({ count: 1, rows: [{ row: 45, index: 44, label: null, reason: 'clotted' }] });
    expect(result.sensitivity!.n).toBe(45);
    expect(result.sensitivity!.bias.mean.estimate!).toBeGreaterThan(result.bias.mean.estimate!);
  });

  it('flags a planted outlier by input row (1-based and 0-based), without excluding it', () => {
    const data = rows(60);
    data[17] = { x: 20, y: 31 };
    const result = analyzeComparison(data, fast);
    expect(result.outlierIndexes).toEqual([17]);
    expect(result.outliers).toEqual([18]);
    expect(result.n).toBe(60);
    expect(result.warnings).toContain('Generalized ESD flags 1 possible outlier in the differences (row 18); exclude only with a documented reason.');
  });

  it('judges decision levels against the allowable bias', () => {
    const result = analyzeComparison(rows(80), { ...fast, decisionLevels: [5, 40], allowableBias: 0.1, allowableBiasPercent: 50 });
    expect(result.decisionLevels.map((d) => d.allowable)).toEqual([2.5, 20]);
    expect(result.decisionLevels.every((d) => d.verdict === 'within')).toBe(true);
  });

  it('says exceeds where the whole CI lies beyond the allowable bias and inconclusive where it straddles it, on either side', () => {
    // y = x + bias with a wobble of at most ±0.05 (mean 0), 80 pairs over 2–41.5 given to 2 decimals (step 0.01): the
    // predicted bias is the same at every level, and its CI is a few hundredths wide around it. The goal is 10 % of
    // the level: 0.5 at 5 (the CI lies wholly beyond it), 1.0 at 10 (the CI straddles it), 4.0 at 40 (wholly inside).
    const shifted = (bias: number) => Array.from({ length: 80 }, (_, i) => {
      const x = 2 + i * 0.5;
      return { x, y: Number((x + bias + (((i * 7) % 11) - 5) * 0.01).toFixed(2)) };
    });
    for (const bias of [1, -1]) {
      const result = analyzeComparison(shifted(bias), { ...fast, decisionLevels: [5, 10, 40], allowableBiasPercent: 10 });
      expect(result.decisionLevels.map((d) => d.allowable)).toEqual([0.5, 1, 4]);
      expect(result.decisionLevels.map((d) => d.verdict)).toEqual(['exceeds', 'inconclusive', 'within']);
      expect(result.decisionLevels.map((d) => d.judgedOn)).toEqual([null, null, null]);
      for (const d of result.decisionLevels) {
        expect(d.bias.estimate).toBeCloseTo(bias, 10);
        const [lo, hi] = d.bias.ci!;
        expect(hi - lo).toBeGreaterThan(0.01);
        expect(hi - lo).toBeLessThan(0.1);
      }
      // the reasons, read off the CIs: at 10 one end lies on each side of the limit
      const [atFive, atTen] = result.decisionLevels.map((d) => d.bias.ci!.map(Math.abs).sort((a, b) => a - b));
      expect(atFive[0]).toBeGreaterThan(0.5);
      expect(atTen[0]).toBeLessThan(1);
      expect(atTen[1]).toBeGreaterThan(1);
    }
  });

  it('reports null regression with a warning when x has no spread, and still the bias', () => {
    const result = analyzeComparison([1, 2, 3, 4, 5].map((k) => ({ x: 5, y: 5 + k / 10 })), fast);
    expect(result.regression.slope.estimate).toBeNull();
    expect(result.warnings.join(' ')).toMatch(/no spread/);
    expect(result.bias.median.estimate).toBeCloseTo(0.3, 12);
  });

  it('reports nulls with warnings for fewer than 3 pairs', () => {
    const result = analyzeComparison([{ x: 1, y: 2 }, { x: 2, y: 2 }], fast);
    expect(result.bias.mean.estimate).toBeNull();
    expect(result.warnings.join(' ')).toMatch(/at least 3 pairs/);
  });

  it('names a bad option', () => {
    expect(() => analyzeComparison(rows(10), { resamples: 10 })).toThrow(OptionError);
    expect(() => analyzeComparison(rows(10), { regression: 'x' as never })).toThrow(/option regression/);
  });

  it('reports progress from 0 to 1', () => {
    const seen: number[] = [];
    analyzeComparison(rows(40), fast, (f) => seen.push(f));
    expect(seen[seen.length - 1]).toBe(1);
    expect(seen.every((f, i) => i === 0 || f >= seen[i - 1] - 1e-12)).toBe(true);
  });

  it('makes BCa intervals and Deming regression on request', () => {
    const result = analyzeComparison(rows(50), { ...fast, interval: 'bca', regression: 'deming', demingRatio: 2, decisionLevels: [20] });
    expect(result.regression).toMatchObject({ method: 'deming', demingRatio: 2, ciMethod: 'bootstrap' });
    expect(result.bias.median.ci![0]).toBeLessThanOrEqual(result.bias.median.estimate!);
    expect(result.decisionLevels[0].bias.ci).not.toBeNull();
  });
});
