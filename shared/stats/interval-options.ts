import { DEFAULT_RESAMPLES, MAX_RESAMPLES, MIN_RESAMPLES } from './bootstrap';
import { choiceOption, decimalsOption, integerOption, isLevel, LEVEL_RULE, numberOption, OptionError, seedOption } from './options';
import type { ReferenceMethod } from './reference-limits';

export type PartitionField = 'group' | 'sex' | 'ageBand';

/** Options of analyzeInterval (reference-interval establishment). */
export interface IntervalOptions {
  resamples?: number;
  seed?: string;
  /** Confidence level of each limit's CI; default 0.90 (CLSI EP28-A3c practice). */
  level?: number;
  method?: ReferenceMethod;
  /** In percent: two values for a two-sided interval (default 2.5, 97.5); one value for one limit only. */
  percentiles?: number[];
  /** Fields to test for partitioning (Harris & Boyd); default ['group'] when any row has a group. */
  partitionFields?: PartitionField[];
  /** The analyte's reporting decimals: the results' step is 10^−decimals (resolution.ts); default: detected from the data. */
  decimals?: number;
}

export interface ResolvedIntervalOptions {
  resamples: number;
  seed: string;
  level: number;
  method: ReferenceMethod;
  percentiles: number[];
  /** Fractions: the lower and upper limit's p, null for a one-sided interval's missing side. */
  lowerP: number | null;
  upperP: number | null;
  partitionFields: PartitionField[];
  decimals: number | null;
}

/** A single percentile above 50 is an upper limit (lower null); one below 50 a lower limit (upper null). */
export function resolveIntervalOptions(o: IntervalOptions = {}, hasGroups = false): ResolvedIntervalOptions {
  const percentiles = o.percentiles ?? [2.5, 97.5];
  const ok = Array.isArray(percentiles) && percentiles.length >= 1 && percentiles.length <= 2 &&
    percentiles.every((p) => typeof p === 'number' && p > 0 && p < 100) && (percentiles.length === 1 || percentiles[0] < percentiles[1]);
  if (!ok) throw new OptionError('percentiles', 'must be one percentile or two ascending percentiles, each between 0 and 100');
  const single = percentiles.length === 1;
  const fields = o.partitionFields ?? (hasGroups ? ['group'] : []);
  if (!Array.isArray(fields) || !fields.every((f) => f === 'group' || f === 'sex' || f === 'ageBand')) {
    throw new OptionError('partitionFields', 'must list fields among group, sex, ageBand');
  }
  return {
    resamples: integerOption('resamples', o.resamples, DEFAULT_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES),
    seed: seedOption(o.seed),
    level: numberOption('level', o.level, 0.9, isLevel, LEVEL_RULE),
    method: choiceOption('method', o.method, 'nonparametric', ['nonparametric', 'robust', 'parametric'] as const),
    percentiles: [...percentiles],
    lowerP: single ? (percentiles[0] < 50 ? percentiles[0] / 100 : null) : percentiles[0] / 100,
    upperP: single ? (percentiles[0] >= 50 ? percentiles[0] / 100 : null) : percentiles[1] / 100,
    partitionFields: [...fields],
    decimals: decimalsOption(o.decimals),
  };
}
