import { DEFAULT_REGRESSION_RESAMPLES, DEFAULT_RESAMPLES, MAX_RESAMPLES, MIN_RESAMPLES } from './bootstrap';
import type { IntervalMethod } from './bootstrap-estimate';
import type { DifferenceType } from './differences';
import type { RegressionMethod } from './regression-fitters';
import {
  choiceOption, decimalsOption, integerOption, isLevel, LEVEL_RULE, numberListOption, numberOption, optionalNumber, seedOption,
} from './options';

/** Options of analyzeComparison; every field optional, defaults in resolveComparisonOptions. */
export interface ComparisonOptions {
  resamples?: number;
  regressionResamples?: number;
  seed?: string;
  level?: number;
  interval?: IntervalMethod;
  loaMultiplier?: number;
  difference?: DifferenceType;
  regression?: RegressionMethod;
  /** λ = σ²(x error)/σ²(y error), comparative over candidate; default 1. */
  demingRatio?: number;
  regressionCi?: 'bootstrap' | 'jackknife';
  decisionLevels?: number[];
  allowableBias?: number;
  allowableBiasPercent?: number;
  esdAlpha?: number;
  esdMax?: number;
  /** The analyte's reporting decimals: the results' step is 10^−decimals (resolution.ts); default: detected from the data. */
  decimals?: number;
}

export type ResolvedComparisonOptions = Required<Omit<ComparisonOptions, 'allowableBias' | 'allowableBiasPercent' | 'esdMax' | 'decimals'>> & {
  allowableBias: number | null;
  allowableBiasPercent: number | null;
  esdMax: number | null;
  decimals: number | null;
};

export const REGRESSION_METHODS: readonly RegressionMethod[] = ['passing-bablok', 'deming', 'weighted-deming', 'ols'];
export const DIFFERENCE_TYPES: readonly DifferenceType[] = ['absolute', 'percent-mean', 'percent-x'];

/** @throws OptionError naming the first bad option */
export function resolveComparisonOptions(o: ComparisonOptions = {}): ResolvedComparisonOptions {
  const positive = (v: number): boolean => v > 0;
  return {
    resamples: integerOption('resamples', o.resamples, DEFAULT_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES),
    regressionResamples: integerOption('regressionResamples', o.regressionResamples, DEFAULT_REGRESSION_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES),
    seed: seedOption(o.seed),
    level: numberOption('level', o.level, 0.95, isLevel, LEVEL_RULE),
    interval: choiceOption('interval', o.interval, 'percentile', ['percentile', 'bca'] as const),
    loaMultiplier: numberOption('loaMultiplier', o.loaMultiplier, 1.96, positive, 'a positive number'),
    difference: choiceOption('difference', o.difference, 'absolute', DIFFERENCE_TYPES),
    regression: choiceOption('regression', o.regression, 'passing-bablok', REGRESSION_METHODS),
    demingRatio: numberOption('demingRatio', o.demingRatio, 1, positive, 'a positive number'),
    regressionCi: choiceOption('regressionCi', o.regressionCi, 'bootstrap', ['bootstrap', 'jackknife'] as const),
    decisionLevels: numberListOption('decisionLevels', o.decisionLevels, () => true, 'finite'),
    allowableBias: optionalNumber('allowableBias', o.allowableBias, (v) => v >= 0, 'a number ≥ 0'),
    allowableBiasPercent: optionalNumber('allowableBiasPercent', o.allowableBiasPercent, (v) => v >= 0, 'a number ≥ 0'),
    esdAlpha: numberOption('esdAlpha', o.esdAlpha, 0.05, isLevel, LEVEL_RULE),
    esdMax: o.esdMax === undefined || o.esdMax === null ? null : integerOption('esdMax', o.esdMax, 1, 1, 1_000_000),
    decimals: decimalsOption(o.decimals),
  };
}
