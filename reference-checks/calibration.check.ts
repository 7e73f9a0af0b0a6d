import { forEachResample } from '@shared/stats/bootstrap';
import { percentileInterval } from '@shared/stats/confidence-interval';
import { medianFromCounts } from '@shared/stats/counts-stats';
import { meanFromCounts } from '@shared/stats/difference-bias';
import { streamFor, Xor128 } from '@shared/stats/rng';
import { shiftedNullTest } from '@shared/stats/shifted-null-test';

// Calibration by seeded simulation (our own check; the tolerances come from the simulation size):
// 1. under a true null the shifted-null test's p-values are close to uniform: the rejection rates at 0.05
//    and 0.10 lie within 4 binomial SE, sqrt(α(1 − α)/M), of α; for the mean also the Kolmogorov–Smirnov
//    distance to U(0, 1) is below the 1% critical value 1.63/sqrt(M) (asymptotic KS table) plus the p-value
//    grid 1/(B + 1). The median's p-values are lumpy (its bootstrap distribution has atoms; at n = 31 no
//    p-value falls between 0.9 and 1), so for the median only the rejection rates are checked;
// 2. percentile CIs of the mean of normal data cover near their level: within 4 binomial SE of 0.95 plus
//    1.5 percentage points for the known small-sample shortfall of the percentile interval (it is somewhat
//    narrow at n = 30: Efron & Tibshirani 1993, ch. 13, from memory).
const M = 400;
const B = 999;

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

  it('percentile CIs of the mean of normal data (n = 30) cover near 95%', () => {
    const data = streamFor('calibration', 'coverage');
    let covered = 0;
    const replicates = new Float64Array(B);
    for (let k = 0; k < M; k++) {
      const sample = normalSample(data, 30);
      forEachResample(30, { resamples: B, stream: streamFor('calibration', `coverage-${k}`) }, (counts, b) => {
        replicates[b] = meanFromCounts(sample, counts, 30);
      });
      const [lo, hi] = percentileInterval(replicates.sort(), 0.95);
      if (lo <= 0 && 0 <= hi) covered++;
    }
    const coverage = covered / M;
    expect(Math.abs(coverage - 0.95)).toBeLessThan(4 * Math.sqrt((0.95 * 0.05) / M) + 0.015);
  });
});
