import { forEachResample, type ProgressFn } from './bootstrap';
import { summariseWithHistogram } from './bootstrap-estimate';
import type { Interval } from './confidence-interval';
import { boxCoxLambda } from './box-cox';
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
  warnings: string[];
}

export function referenceInterval(values: Float64Array, o: ResolvedIntervalOptions, part: string, onProgress?: ProgressFn): IntervalCore {
  const sorted = sortedCopy(values);
  const n = sorted.length;
  const warnings: string[] = [];
  const minimum = minimumFor(o.method);
  if (n < minimum) {
    warnings.push(`The ${o.method} method needs at least ${minimum} values (have ${n}); no limits are estimated.`);
    return { n, lower: null, upper: null, boxCoxLambda: null, warnings };
  }
  const lambda = o.method === 'parametric' ? transformLambda(sorted, warnings) : 1;
  const ctx = limitContext(o.method, sorted, lambda);
  const ps = [o.lowerP, o.upperP];
  const reps = ps.map((p) => (p === null ? null : new Float64Array(o.resamples)));
  forEachResample(n, { resamples: o.resamples, stream: streamFor(o.seed, part), onProgress }, (counts, b) => {
    for (let k = 0; k < 2; k++) if (reps[k]) reps[k]![b] = limitFromCounts(ctx, counts, ps[k]!);
  });
  const ones = new Int32Array(n).fill(1);
  const [lower, upper] = ps.map((p, k) => (p === null ? null : limitResult(sorted, p, limitFromCounts(ctx, ones, p), reps[k]!, o, warnings)));
  return { n, lower, upper, boxCoxLambda: o.method === 'parametric' ? lambda : null, warnings };
}

/** Point estimates of the limits only (no resampling); null where not estimable. */
export function pointLimits(values: Float64Array, o: ResolvedIntervalOptions): { lower: number | null; upper: number | null } {
  const sorted = sortedCopy(values);
  const n = sorted.length;
  if (n < minimumFor(o.method)) return { lower: null, upper: null };
  const ctx = limitContext(o.method, sorted, o.method === 'parametric' ? transformLambda(sorted, []) : 1);
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

function transformLambda(sorted: Float64Array, warnings: string[]): number {
  if (sorted[0] > 0 && sorted[0] < sorted[sorted.length - 1]) return boxCoxLambda(sorted);
  warnings.push('Box–Cox needs positive values that are not all equal; the parametric limits use the untransformed values.');
  return 1;
}

function limitResult(sorted: Float64Array, p: number, estimate: number, reps: Float64Array, o: ResolvedIntervalOptions, warnings: string[]): LimitResult {
  const n = sorted.length;
  const percentile = 100 * p;
  if (o.method === 'nonparametric' && !rankInRange(n, p)) {
    warnings.push(`The ${percentile}th percentile needs rank p(n + 1) within 1..n; with n = ${n} it is not estimable nonparametrically.`);
    return { percentile, estimate: null, ci: null, rankCi: null, ranks: null, distribution: null };
  }
  const finite = reps.filter(Number.isFinite);
  const summary = summariseWithHistogram(finite, estimate, o.level, 'percentile');
  const ranks = o.method === 'nonparametric' ? binomialRankCi(n, p, o.level) : null;
  if (o.method === 'nonparametric' && !ranks) warnings.push(`No binomial-rank ${100 * o.level}% CI exists for the ${percentile}th percentile at n = ${n}.`);
  return {
    percentile,
    estimate: Number.isFinite(estimate) ? estimate : null,
    ci: summary.ci,
    rankCi: ranks ? [sorted[ranks.lowerRank - 1], sorted[ranks.upperRank - 1]] : null,
    ranks,
    distribution: summary.distribution,
  };
}
