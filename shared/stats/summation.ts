import { decimalMoments } from './decimal-moments';

/**
 * Sums and moments with controlled rounding. mean and sampleVariance work on the reported decimal values
 * exactly when they can (decimal-moments.ts); otherwise:
 * - neumaierSum: Kahan–Babuška compensated summation (A. Neumaier (1974), ZAMM 54, 39–51).
 * - sampleVariance: Welford's one-pass update (B. P. Welford (1962), Technometrics 4(3), 419–420),
 *   divisor n − 1.
 * Both keep the NIST StRD NumAcc certified values to their full 15 digits (reference-checks/nist-univariate).
 */
export function neumaierSum(values: ArrayLike<number>): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    const t = sum + v;
    compensation += Math.abs(sum) >= Math.abs(v) ? sum - t + v : v - t + sum;
    sum = t;
  }
  return sum + compensation;
}

export function mean(values: ArrayLike<number>): number {
  if (values.length === 0) throw new RangeError('mean requires at least one value');
  return decimalMoments(values)?.mean ?? neumaierSum(values) / values.length;
}

/** Sample variance (divisor n − 1) by Welford's update, refined once around the compensated mean. */
export function sampleVariance(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) throw new RangeError('sampleVariance requires at least two values');
  const exact = decimalMoments(values);
  if (exact) return exact.sumSquares / (n - 1);
  const centre = neumaierSum(values) / n;
  let runningMean = 0;
  let m2 = 0;
  for (let i = 0; i < n; i++) {
    const delta = values[i] - centre - runningMean;
    runningMean += delta / (i + 1);
    m2 += delta * (values[i] - centre - runningMean);
  }
  return m2 / (n - 1);
}

export function sampleSd(values: ArrayLike<number>): number {
  return Math.sqrt(sampleVariance(values));
}
