import { bcaInterval, percentileInterval, type Interval } from './confidence-interval';
import { bootstrapSe } from './bootstrap';
import { histogram, type Histogram } from './histogram';

export type IntervalMethod = 'percentile' | 'bca';

/**
 * An estimate with its bootstrap CI (the method the caller chose) and bootstrap standard error.
 * bcaFailed: BCa was asked for but cannot be formed (every replicate on one side of the estimate, so the
 * bias correction z0 is infinite); ci then holds the percentile interval and the caller says so in a warning
 * (bcaFallbackWarning).
 */
export interface BootstrapEstimate {
  estimate: number;
  ci: Interval | null;
  se: number;
  bcaFailed?: boolean;
}

/**
 * Summarises the replicates of one statistic: sorts them once (not per resample), then the percentile
 * or BCa interval of confidence-interval.ts. BCa needs the jackknife values; when BCa cannot be formed
 * (every replicate on one side of the estimate) ci is the percentile interval and bcaFailed is true.
 * The replicates array is sorted in place.
 */
export function summariseReplicates(
  replicates: Float64Array, estimate: number, level: number, method: IntervalMethod,
  jackknife?: ArrayLike<number>,
): BootstrapEstimate {
  const se = bootstrapSe(replicates);
  replicates.sort();
  if (replicates.length === 0) return { estimate, ci: null, se };
  if (method === 'bca') {
    if (!jackknife) throw new RangeError('summariseReplicates requires jackknife values for BCa');
    const ci = bcaInterval(replicates, estimate, jackknife, level);
    if (ci) return { estimate, ci, se };
    return { estimate, ci: percentileInterval(replicates, level), se, bcaFailed: true };
  }
  return { estimate, ci: percentileInterval(replicates, level), se };
}

/** The warning for estimates whose BCa interval could not be formed, naming them. */
export function bcaFallbackWarning(names: string[]): string | null {
  if (names.length === 0) return null;
  return `The BCa interval cannot be formed for ${names.join(', ')}: every resample fell on one side of the estimate (as when most differences are equal), so its bias correction is infinite. The percentile interval is shown instead.`;
}

/** The same, plus histogram bins of the distribution (computed before the sort changes nothing). */
export function summariseWithHistogram(
  replicates: Float64Array, estimate: number, level: number, method: IntervalMethod,
  jackknife?: ArrayLike<number>,
): BootstrapEstimate & { distribution: Histogram } {
  const distribution = histogram(replicates);
  return { ...summariseReplicates(replicates, estimate, level, method, jackknife), distribution };
}
