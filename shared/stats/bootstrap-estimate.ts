import { bcaInterval, percentileInterval, type Interval } from './confidence-interval';
import { bootstrapSe } from './bootstrap';
import { histogram, type Histogram } from './histogram';

export type IntervalMethod = 'percentile' | 'bca';

/** An estimate with its bootstrap CI (the method the caller chose) and bootstrap standard error. */
export interface BootstrapEstimate {
  estimate: number;
  ci: Interval | null;
  se: number;
}

/**
 * Summarises the replicates of one statistic: sorts them once (not per resample), then the percentile
 * or BCa interval of confidence-interval.ts. BCa needs the jackknife values; when BCa cannot be formed
 * (every replicate on one side of the estimate) ci is null and the caller warns.
 * The replicates array is sorted in place.
 */
export function summariseReplicates(
  replicates: Float64Array, estimate: number, level: number, method: IntervalMethod,
  jackknife?: ArrayLike<number>,
): BootstrapEstimate {
  const se = bootstrapSe(replicates);
  replicates.sort();
  let ci: Interval | null;
  if (method === 'bca') {
    if (!jackknife) throw new RangeError('summariseReplicates requires jackknife values for BCa');
    ci = bcaInterval(replicates, estimate, jackknife, level);
  } else {
    ci = percentileInterval(replicates, level);
  }
  return { estimate, ci, se };
}

/** The same, plus histogram bins of the distribution (computed before the sort changes nothing). */
export function summariseWithHistogram(
  replicates: Float64Array, estimate: number, level: number, method: IntervalMethod,
  jackknife?: ArrayLike<number>,
): BootstrapEstimate & { distribution: Histogram } {
  const distribution = histogram(replicates);
  return { ...summariseReplicates(replicates, estimate, level, method, jackknife), distribution };
}
