import { forEachResample, type ProgressFn } from './bootstrap';
import { summariseReplicates } from './bootstrap-estimate';
import { histogram } from './histogram';
import type { Interval } from './confidence-interval';
import { boxCoxFit, LAMBDA_BOUND, type BoxCoxFit } from './box-cox';
import type { Histogram } from './histogram';
import type { ResolvedIntervalOptions } from './interval-options';
import { rankInRange, sortedCopy } from './quantile';
import { binomialRankCi, type RankInterval } from './rank-ci';
import { limitContext, limitFromCounts } from './reference-limits';
import { streamFor } from './rng';

/**
 * One reference interval: the limits of the chosen method (reference-limits.ts), each with a percentile
 * bootstrap CI at the chosen level (stream `${seed}:${part}`, resamples as counts over the sorted values,
 * one pass for both limits) and, for the nonparametric method, the binomial-rank CI (rank-ci.ts).
 * Parametric limits keep the Box–Cox λ of the data in every resample (the CI is conditional on λ).
 * A resample whose back-transformed limit is undefined (λy + 1 ≤ 0: for λ > 0 a limit at or below 0,
 * for λ < 0 one beyond every finite value) is kept, at that end of the distribution, so the CI is taken
 * from every resample; a CI bound that falls among such resamples is not given, with a warning.
 */
export interface LimitResult {
  percentile: number;
  estimate: number | null;
  ci: Interval | null;
  rankCi: Interval | null;
  ranks: RankInterval | null;
  distribution: Histogram | null;
}

export interface IntervalCore {
  n: number;
  lower: LimitResult | null;
  upper: LimitResult | null;
  boxCoxLambda: number | null;
  /** The transform used for the parametric method (null: none). */
  boxCox: BoxCoxFit | null;
  warnings: string[];
}

export function referenceInterval(values: Float64Array, o: ResolvedIntervalOptions, part: string, onProgress?: ProgressFn): IntervalCore {
  const sorted = sortedCopy(values);
  const n = sorted.length;
  const warnings: string[] = [];
  const minimum = minimumFor(o.method);
  if (n < minimum) {
    warnings.push(`The ${o.method} method needs at least ${minimum} values (have ${n}); no limits are estimated.`);
    return { n, lower: null, upper: null, boxCoxLambda: null, boxCox: null, warnings };
  }
  const fit = o.method === 'parametric' ? transformFit(sorted, warnings) : null;
  const ctx = limitContext(o.method, sorted, fit);
  const ps = [o.lowerP, o.upperP];
  const reps = ps.map((p) => (p === null ? null : new Float64Array(o.resamples)));
  forEachResample(n, { resamples: o.resamples, stream: streamFor(o.seed, part), onProgress }, (counts, b) => {
    for (let k = 0; k < 2; k++) if (reps[k]) reps[k]![b] = limitFromCounts(ctx, counts, ps[k]!);
  });
  const ones = new Int32Array(n).fill(1);
  const [lower, upper] = ps.map((p, k) => (p === null ? null : limitResult(sorted, p, limitFromCounts(ctx, ones, p), reps[k]!, o, fit, warnings)));
  if (o.method === 'robust') warnings.push(ROBUST_NOTE);
  return { n, lower, upper, boxCoxLambda: fit ? fit.lambda : null, boxCox: fit, warnings };
}

/** Point estimates of the limits only (no resampling); null where not estimable. */
export function pointLimits(values: Float64Array, o: ResolvedIntervalOptions): { lower: number | null; upper: number | null } {
  const sorted = sortedCopy(values);
  const n = sorted.length;
  if (n < minimumFor(o.method)) return { lower: null, upper: null };
  const ctx = limitContext(o.method, sorted, o.method === 'parametric' ? transformFit(sorted, []) : null);
  const ones = new Int32Array(n).fill(1);
  const at = (p: number | null): number | null => {
    if (p === null || (o.method === 'nonparametric' && !rankInRange(n, p))) return null;
    const v = limitFromCounts(ctx, ones, p);
    return Number.isFinite(v) ? v : null;
  };
  return { lower: at(o.lowerP), upper: at(o.upperP) };
}

function minimumFor(method: ResolvedIntervalOptions['method']): number {
  return method === 'robust' ? 20 : method === 'parametric' ? 10 : 2;
}

/**
 * The robust method's constants (biweight c = 3.7 and 9, the t quantile and √(1 + 1/n)) are our statement of
 * Horn, Pesce & Copeland (1998) from memory; no published worked example was available to check them against.
 */
export const ROBUST_NOTE =
  'The robust method\'s constants (biweight tuning 3.7 for location and 9 for scale, the t quantile and the factor √(1 + 1/n)) are stated from memory of Horn, Pesce and Copeland (1998) and have not been checked against a published worked example; treat these limits as unverified and compare them with the nonparametric limits.';

function transformFit(sorted: Float64Array, warnings: string[]): BoxCoxFit | null {
  if (!(sorted[0] > 0 && sorted[0] < sorted[sorted.length - 1])) {
    warnings.push('Box–Cox needs positive values that are not all equal; the parametric limits are the Gaussian limits mean ± z·SD of the untransformed values.');
    return null;
  }
  const fit = boxCoxFit(sorted);
  if (fit.atBound) warnings.push(`The Box–Cox λ reached the bound of its search (${fit.lambda > 0 ? '' : '−'}${LAMBDA_BOUND}): the likelihood still rises beyond it, so no power transform makes these values look normal; prefer the nonparametric or robust method.`);
  return fit;
}

function limitResult(
  sorted: Float64Array, p: number, estimate: number, reps: Float64Array, o: ResolvedIntervalOptions, fit: BoxCoxFit | null, warnings: string[],
): LimitResult {
  const n = sorted.length;
  const percentile = 100 * p;
  if (o.method === 'nonparametric' && !rankInRange(n, p)) {
    warnings.push(`The ${percentile}th percentile needs rank p(n + 1) within 1..n; with n = ${n} it is not estimable nonparametrically.`);
    return { percentile, estimate: null, ci: null, rankCi: null, ranks: null, distribution: null };
  }
  const finite = reps.filter(Number.isFinite);
  const distribution = histogram(finite);
  const undefinedCount = reps.length - finite.length;
  // An undefined back-transform lies beyond one end: below every value for λ > 0, above for λ < 0.
  const end = fit && fit.lambda > 0 ? -Infinity : fit && fit.lambda < 0 ? Infinity : NaN;
  const whole = undefinedCount > 0 && !Number.isNaN(end) ? reps.map((v) => (Number.isFinite(v) ? v : end)) : reps;
  let ci = undefinedCount > 0 && Number.isNaN(end) ? null : summariseReplicates(whole, estimate, o.level, 'percentile').ci;
  if (ci && !(Number.isFinite(ci[0]) && Number.isFinite(ci[1]))) ci = null;
  if (!Number.isFinite(estimate)) {
    warnings.push(`The ${percentile}th percentile limit is not defined on the Box–Cox scale (it would fall ${end < 0 ? 'at or below 0' : 'beyond every finite value'}); no estimate is given. Use the nonparametric or robust method.`);
  } else if (undefinedCount > 0) {
    const where = end < 0 ? 'at or below 0' : end > 0 ? 'beyond every finite value' : 'nowhere';
    warnings.push(ci
      ? `In ${undefinedCount} of ${reps.length} resamples the ${percentile}th percentile limit fell ${where}, where the Box–Cox transform cannot express it; they are counted at that end, and the CI uses every resample.`
      : `In ${undefinedCount} of ${reps.length} resamples the ${percentile}th percentile limit fell ${where}, where the Box–Cox transform cannot express it; a CI bound falls among them, so no CI is given.`);
  }
  const ranks = o.method === 'nonparametric' ? binomialRankCi(n, p, o.level) : null;
  if (o.method === 'nonparametric' && !ranks) warnings.push(`No binomial-rank ${100 * o.level}% CI exists for the ${percentile}th percentile at n = ${n}.`);
  return {
    percentile,
    estimate: Number.isFinite(estimate) ? estimate : null,
    ci: Number.isFinite(estimate) ? ci : null,
    rankCi: ranks ? [sorted[ranks.lowerRank - 1], sorted[ranks.upperRank - 1]] : null,
    ranks,
    distribution,
  };
}
