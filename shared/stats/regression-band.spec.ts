import { jStat } from 'jstat';
import { analyzeComparison } from './analyze-comparison';
import { BAND_POINTS } from './regression';
import { Xor128 } from './rng';

// The fitted line's CI band on the scatter (regression.band).

/** Invented pairs with a constant error SD, so the classical least-squares band applies. */
function homoscedastic(n: number, seed: string): { x: number; y: number }[] {
  const s = new Xor128(seed);
  return Array.from({ length: n }, () => {
    const x = 5 + 95 * s.nextUniform();
    const normal = Math.sqrt(-2 * Math.log(1 - s.nextUniform())) * Math.cos(2 * Math.PI * s.nextUniform()); // Box–Muller
    return { x, y: 1 + 1.02 * x + 2 * normal };
  });
}

describe('regression band', () => {
  it('spans the comparative range in 21 steps, and at a decision level equals that level plus its bias CI', () => {
    const data = homoscedastic(60, 'band-a');
    const xs = data.map((d) => d.x);
    const lo = Math.min(...xs);
    const hi = Math.max(...xs);
    const result = analyzeComparison(data, { resamples: 1000, regressionResamples: 1000, regression: 'deming', decisionLevels: [lo, hi] });
    const band = result.regression.band!;
    expect(band).toHaveLength(BAND_POINTS);
    expect(band[0].x).toBe(lo);
    expect(band[BAND_POINTS - 1].x).toBe(hi);
    const { slope, intercept } = result.regression;
    for (const p of band) expect(p.fit!).toBeCloseTo(intercept.estimate! + slope.estimate! * p.x, 9);
    // The band is the same statistic as the decision-level bias, shifted by x (bias = a + (b − 1)·x).
    for (const [k, g] of [[0, 0], [1, BAND_POINTS - 1]]) {
      const ci = result.decisionLevels[k].bias.ci!;
      expect(band[g].ci![0]).toBeCloseTo(band[g].x + ci[0], 9);
      expect(band[g].ci![1]).toBeCloseTo(band[g].x + ci[1], 9);
    }
    // Narrowest near the middle of the data, widest at an end.
    const widths = band.map((p) => p.ci![1] - p.ci![0]);
    const narrowest = widths.indexOf(Math.min(...widths));
    expect(narrowest).toBeGreaterThan(3);
    expect(narrowest).toBeLessThan(BAND_POINTS - 4);
  });

  it('agrees with the classical least-squares confidence band for the mean response', () => {
    // Source: the textbook band ŷ(x) ± t(n − 2; 0.975)·s·√(1/n + (x − x̄)²/Sxx) for least squares with
    // constant error variance (NIST/SEMATECH e-Handbook of Statistical Methods, §4.5.2.1, from memory).
    // The bootstrap of pairs estimates the same width for this design; 200 pairs, 4,000 resamples: within 10% (seen: 0.97 to 1.03).
    const data = homoscedastic(200, 'band-b');
    const result = analyzeComparison(data, { resamples: 1000, regressionResamples: 4000, regression: 'ols', decisionLevels: [] });
    const n = data.length;
    const mx = data.reduce((t, d) => t + d.x, 0) / n;
    const sxx = data.reduce((t, d) => t + (d.x - mx) ** 2, 0);
    const a = result.regression.intercept.estimate!;
    const b = result.regression.slope.estimate!;
    const s = Math.sqrt(data.reduce((t, d) => t + (d.y - a - b * d.x) ** 2, 0) / (n - 2));
    const t = jStat.studentt.inv(0.975, n - 2);
    for (const p of result.regression.band!) {
      const classical = t * s * Math.sqrt(1 / n + (p.x - mx) ** 2 / sxx);
      const half = (p.ci![1] - p.ci![0]) / 2;
      expect(half / classical).toBeGreaterThan(0.9);
      expect(half / classical).toBeLessThan(1.1);
    }
  });

  it('is null when there is no line', () => {
    const result = analyzeComparison([{ x: 1, y: 1 }, { x: 2, y: 2 }], { resamples: 1000, regressionResamples: 1000 });
    expect(result.regression.band).toBeNull();
  });
});
