import { forEachResample } from '@shared/stats/bootstrap';
import { percentileInterval } from '@shared/stats/confidence-interval';
import { medianFromCounts } from '@shared/stats/counts-stats';
import { meanFromCounts } from '@shared/stats/difference-bias';
import { streamFor, Xor128 } from '@shared/stats/rng';
import { shiftedNullTest } from '@shared/stats/shifted-null-test';
import { coverageVerdict } from './coverage-bounds';

// Calibration by seeded simulation (our own check; the tolerances come from the simulation size):
// 1. under a true null the shifted-null test's p-values are close to uniform: the rejection rates at 0.05
//    and 0.10 lie within 4 binomial SE, sqrt(α(1 − α)/M), of α; for the mean also the Kolmogorov–Smirnov
//    distance to U(0, 1) is below the 1% critical value 1.63/sqrt(M) (asymptotic KS table) plus the p-value
//    grid 1/(B + 1). The median's p-values are lumpy (its bootstrap distribution has atoms; at n = 31 no
//    p-value falls between 0.9 and 1), so for the median only the rejection rates are checked;
// 2. percentile CIs of the mean of normal data cover near their level (coverage-bounds.ts): at least 0.95 − 4
//    binomial SE − 1.5 percentage points for the known small-sample shortfall of the percentile interval (it is
//    somewhat narrow at n = 30: Efron & Tibshirani 1993, ch. 13, from memory), and at most 0.95 + 4 SE with no
//    allowance, so a CI that covers too often fails too. With M_COVERAGE = 2000 trials the band is
//    [0.9155, 0.9695]. The same trials widened 3× about each CI's midpoint, (−∞, ∞), and narrowed to half are
//    rejected by the same band: the check can fail in both directions.
const M = 400;
const M_COVERAGE = 2000;
const B = 999;
const SHORTFALL = 0.015;

function normalSample(stream: Xor128, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i += 2) {
    const u = 1 - stream.nextUniform();
    const v = stream.nextUniform();
    const r = Math.sqrt(-2 * Math.log(u));
    out[i] = r * Math.cos(2 * Math.PI * v);
    if (i + 1 < n) out[i + 1] = r * Math.sin(2 * Math.PI * v);
  }
  return out.sort();
}

function ksToUniform(p: number[]): number {
  const s = [...p].sort((a, b) => a - b);
  return Math.max(...s.map((v, i) => Math.max((i + 1) / s.length - v, v - i / s.length)));
}

describe('calibration of the bootstrap under a true null (seeded simulation)', () => {
  it.each([
    ['mean', meanFromCounts, 30],
    ['median', medianFromCounts, 31],
  ] as const)('%s test: p-values close to uniform, rejection near 5%% and 10%%', (name, reader, n) => {
    const data = streamFor('calibration', `data-${name}`);
    const pValues: number[] = [];
    for (let k = 0; k < M; k++) {
      const sample = normalSample(data, n);
      pValues.push(shiftedNullTest(sample, reader, 0, { resamples: B, stream: streamFor('calibration', `${name}-${k}`) }).pValue);
    }
    if (name === 'mean') expect(ksToUniform(pValues)).toBeLessThan(1.63 / Math.sqrt(M) + 1 / (B + 1));
    for (const alpha of [0.05, 0.1]) {
      const rate = pValues.filter((p) => p <= alpha).length / M;
      expect(Math.abs(rate - alpha)).toBeLessThan(4 * Math.sqrt((alpha * (1 - alpha)) / M));
    }
  });

  // One simulation, four intervals per trial: the percentile CI, the same CI 3× and ½× as wide about its
  // midpoint, and the interval that always covers.
  const coverage = { percentile: 0, wide: 0, narrow: 0, always: 0 };
  beforeAll(() => {
    const data = streamFor('calibration', 'coverage');
    const replicates = new Float64Array(B);
    const covers = (lo: number, hi: number): number => (lo <= 0 && 0 <= hi ? 1 : 0);
    for (let k = 0; k < M_COVERAGE; k++) {
      const sample = normalSample(data, 30);
      forEachResample(30, { resamples: B, stream: streamFor('calibration', `coverage-${k}`) }, (counts, b) => {
        replicates[b] = meanFromCounts(sample, counts, 30);
      });
      const [lo, hi] = percentileInterval(replicates.sort(), 0.95);
      const mid = (lo + hi) / 2;
      const half = (hi - lo) / 2;
      coverage.percentile += covers(lo, hi);
      coverage.wide += covers(mid - 3 * half, mid + 3 * half);
      coverage.narrow += covers(mid - half / 2, mid + half / 2);
      coverage.always += covers(-Infinity, Infinity);
    }
  });

  it('percentile CIs of the mean of normal data (n = 30) cover near 95%: within [0.95 − 4 SE − 1.5 points, 0.95 + 4 SE]', () => {
    const verdict = coverageVerdict(coverage.percentile, M_COVERAGE, 0.95, SHORTFALL);
    expect(verdict.low).toBeCloseTo(0.9155, 4);
    expect(verdict.high).toBeCloseTo(0.9695, 4);
    expect(verdict.coverage).toBeGreaterThanOrEqual(verdict.low);
    expect(verdict.coverage).toBeLessThanOrEqual(verdict.high);
  });

  it('rejects the same CIs made 3× as wide and the interval that always covers (coverage above 0.95 + 4 SE)', () => {
    for (const count of [coverage.wide, coverage.always]) {
      const verdict = coverageVerdict(count, M_COVERAGE, 0.95, SHORTFALL);
      expect(verdict.coverage).toBeGreaterThan(verdict.high);
      expect(verdict.within).toBe(false);
    }
    expect(coverage.always).toBe(M_COVERAGE);
  });

  it('rejects the same CIs made half as wide (coverage below 0.95 − 4 SE − 1.5 points)', () => {
    const verdict = coverageVerdict(coverage.narrow, M_COVERAGE, 0.95, SHORTFALL);
    expect(verdict.coverage).toBeLessThan(verdict.low);
    expect(verdict.within).toBe(false);
  });
});

describe('the coverage band (coverage-bounds.ts)', () => {
  it('accepts counts inside [L − 4 SE − shortfall, L + 4 SE] and rejects one count beyond either end', () => {
    // M = 400, L = 0.95: SE = 0.010897, band [0.8914, 0.9936] with a 1.5-point shortfall, i.e. 357..397 covered.
    expect(coverageVerdict(397, 400, 0.95, 0.015).within).toBe(true);
    expect(coverageVerdict(398, 400, 0.95, 0.015).within).toBe(false);
    expect(coverageVerdict(357, 400, 0.95, 0.015).within).toBe(true);
    expect(coverageVerdict(356, 400, 0.95, 0.015).within).toBe(false);
    expect(coverageVerdict(400, 400, 0.95).within).toBe(false);
  });
});
