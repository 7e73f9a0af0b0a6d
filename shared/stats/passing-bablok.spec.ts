import { passingBablok } from './passing-bablok';
import { weightedPassingBablok } from './passing-bablok-weighted';
import { Xor128 } from './rng';
import { slopeTable } from './slope-table';
import { cusumLinearity } from './cusum-linearity';

const x = [2.1, 3.4, 4.4, 5.0, 6.3, 7.7, 8.1, 9.6, 10.2, 11.9, 12.5, 14.0, 15.2, 16.8, 18.1];
const y = [2.3, 3.3, 4.9, 5.1, 6.6, 8.2, 8.3, 10.3, 10.4, 12.6, 12.7, 14.9, 15.6, 17.9, 18.6];

describe('passingBablok', () => {
  it('recovers an exact line y = 1.5x − 2', () => {
    const xs = [1, 2, 3, 4, 5, 6, 7];
    const fit = passingBablok(xs, xs.map((v) => 1.5 * v - 2));
    expect(fit.slope).toBeCloseTo(1.5, 12);
    expect(fit.intercept).toBeCloseTo(-2, 12);
  });

  it('shifts the median by K, the number of slopes below −1', () => {
    const fit = passingBablok([1, 2, 3, 4], [4, 1, 3, 5]);
    expect(fit.belowMinusOne).toBe(1);
    // slopes sorted: −3, −0.5, 1/3, 2, 2, 2 (N = 6, K = 1): ½[S(3 + 1) + S(4 + 1)] = 2 (unshifted it would be 7/6)
    expect(fit.slope).toBe(2);
  });

  it('gives a slope CI that contains the slope and an intercept CI from the slope limits', () => {
    const fit = passingBablok(x, y);
    expect(fit.slopeCi![0]).toBeLessThanOrEqual(fit.slope);
    expect(fit.slopeCi![1]).toBeGreaterThanOrEqual(fit.slope);
    expect(fit.interceptCi![0]).toBeLessThanOrEqual(fit.intercept);
  });

  it('reads the same slope off the sorted table as from the resample recomputed (weighted walk)', () => {
    const table = slopeTable(x, y);
    const stream = new Xor128('pb');
    const counts = new Int32Array(x.length);
    const scratch = new Float64Array(x.length);
    for (let rep = 0; rep < 30; rep++) {
      stream.fillCounts(counts, x.length);
      const rx: number[] = [];
      const ry: number[] = [];
      counts.forEach((c, i) => { for (let k = 0; k < c; k++) { rx.push(x[i]); ry.push(y[i]); } });
      const direct = passingBablok(rx, ry);
      const walked = weightedPassingBablok(table, x, y, counts, scratch);
      expect(walked.slope).toBeCloseTo(direct.slope, 12);
      expect(walked.intercept).toBeCloseTo(direct.intercept, 12);
    }
  });

  it('finds no departure from linearity on a straight band and one on a curve (cusum test)', () => {
    const fit = passingBablok(x, y);
    expect(cusumLinearity(x, y, fit.slope, fit.intercept).pValue!).toBeGreaterThan(0.05);
    const xs = Array.from({ length: 60 }, (_, i) => 1 + i);
    const ys = xs.map((v, i) => 0.02 * v * v + (i % 2 ? 0.3 : -0.3));
    const curved = passingBablok(xs, ys);
    expect(cusumLinearity(xs, ys, curved.slope, curved.intercept).pValue!).toBeLessThan(0.05);
  });
});
