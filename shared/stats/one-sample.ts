import { bootstrapStatistic, DEFAULT_RESAMPLES, MAX_RESAMPLES, MIN_RESAMPLES, type ProgressFn } from './bootstrap';
import { bcaFallbackWarning, summariseWithHistogram, type IntervalMethod } from './bootstrap-estimate';
import { medianFromCounts } from './counts-stats';
import { meanFromCounts } from './difference-bias';
import { engineInfo, type EngineInfo } from './engine';
import type { Histogram } from './histogram';
import type { Interval } from './confidence-interval';
import { jackknifeStatistic } from './jackknife';
import { jsonClean } from './json-clean';
import { choiceOption, integerOption, isLevel, LEVEL_RULE, numberOption, seedOption } from './options';
import { sortedCopy } from './quantile';
import { streamFor } from './rng';
import { shiftedNullTest, testRefusal, type CountsStatistic } from './shifted-null-test';
import { checkMagnitudes } from './magnitude';
import { resolutionStep, type Resolution } from './resolution';

/**
 * One-sample entry points: the shifted-null bootstrap test of the mean or median (or any shift-equivariant
 * statistic given as a counts reader) and the bootstrap CI of any statistic function.
 * Streams: 'bootstrap-test' and 'bootstrap-ci' under the seed.
 */
export interface BootstrapTestOptions { statistic?: 'mean' | 'median' | CountsStatistic; null?: number; resamples?: number; seed?: string }

export interface BootstrapTestResult {
  kind: 'bootstrap-test';
  n: number;
  statistic: string;
  observed: number;
  nullValue: number;
  /** Null (with the reason in warnings) when the test is refused: too few values or all equal. */
  pValue: number | null;
  upperTail: number | null;
  lowerTail: number | null;
  nullDistribution: { bins: { from: number; to: number; count: number; tail: 'lower' | 'upper' | null }[]; lowerCutoff: number; upperCutoff: number; observed: number } | null;
  resolution: Resolution;
  warnings: string[];
  engine: EngineInfo;
}

export function bootstrapTest(values: ArrayLike<number>, options: BootstrapTestOptions = {}, onProgress?: ProgressFn): BootstrapTestResult {
  const resamples = integerOption('resamples', options.resamples, DEFAULT_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES);
  const seed = seedOption(options.seed);
  const nullValue = numberOption('null', options.null, 0, () => true, 'a finite number');
  const chosen = options.statistic ?? 'median';
  const reader = typeof chosen === 'function' ? chosen : choiceOption('statistic', chosen, 'median', ['mean', 'median'] as const) === 'mean' ? meanFromCounts : medianFromCounts;
  if (values.length < 2) throw new RangeError('bootstrapTest requires at least 2 values');
  checkMagnitudes(values, 'bootstrapTest');
  const sorted = sortedCopy(values);
  const refusal = testRefusal(sorted);
  const resolution = { ...resolutionStep([values]), limitedEstimates: [] };
  const statistic = typeof chosen === 'function' ? 'custom' : chosen;
  if (refusal) {
    const ones = new Int32Array(sorted.length).fill(1);
    return jsonClean({
      kind: 'bootstrap-test', n: values.length, statistic, observed: reader(sorted, ones, sorted.length), nullValue,
      pValue: null, upperTail: null, lowerTail: null, nullDistribution: null, resolution, warnings: [refusal], engine: engineInfo(seed, resamples),
    });
  }
  const test = shiftedNullTest(sorted, reader, nullValue, { resamples, stream: streamFor(seed, 'bootstrap-test'), onProgress });
  return jsonClean({
    kind: 'bootstrap-test', n: values.length, statistic,
    observed: test.observed, nullValue, pValue: test.pValue, upperTail: test.upperTail, lowerTail: test.lowerTail,
    nullDistribution: test.nullDistribution, resolution, warnings: [], engine: engineInfo(seed, resamples),
  });
}

export interface BootstrapCiOptions { resamples?: number; seed?: string; level?: number; interval?: IntervalMethod }

/** Percentile or BCa (jackknife acceleration) CI of any statistic of a sample. */
export function bootstrapCi(
  values: ArrayLike<number>, statistic: (sample: Float64Array) => number, options: BootstrapCiOptions = {}, onProgress?: ProgressFn,
): { estimate: number; ci: Interval | null; se: number; distribution: Histogram; warnings: string[]; engine: EngineInfo } {
  const resamples = integerOption('resamples', options.resamples, DEFAULT_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES);
  const seed = seedOption(options.seed);
  const level = numberOption('level', options.level, 0.95, isLevel, LEVEL_RULE);
  const interval = choiceOption('interval', options.interval, 'percentile', ['percentile', 'bca'] as const);
  if (values.length < 2) throw new RangeError('bootstrapCi requires at least 2 values');
  checkMagnitudes(values, 'bootstrapCi');
  const data = Float64Array.from(values);
  const estimate = statistic(Float64Array.from(data));
  const replicates = bootstrapStatistic(data, statistic, { resamples, stream: streamFor(seed, 'bootstrap-ci'), onProgress });
  const jackknife = interval === 'bca' ? jackknifeStatistic(data, statistic) : undefined;
  const { bcaFailed, ...summary } = summariseWithHistogram(replicates, estimate, level, interval, jackknife);
  const fallback = bcaFailed ? bcaFallbackWarning(['the statistic']) : null;
  return jsonClean({ ...summary, warnings: fallback ? [fallback] : [], engine: engineInfo(seed, resamples) });
}
