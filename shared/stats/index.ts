/**
 * Parallax statistics engine: pure TypeScript, no I/O. See README.md for the API and result shapes.
 */
export { analyzeComparison } from './analyze-comparison';
export { analyzeInterval } from './analyze-interval';
export { outsideStated, sideOfStated, verifyInterval, type StatedLimits, type VerifyIntervalResult } from './verify-interval';
// Precision verification (CLSI EP15-A3 practice): see README.md "Precision".
export { analyzePrecision } from './analyze-precision';
export type { PrecisionResult, PrecisionRow, PrecisionOptions, PrecisionMaterialSetting, PrecisionMaterialResult, PrecisionComponent, PrecisionVerdict } from './precision-types';
export { bootstrapTest, bootstrapCi, type BootstrapTestOptions, type BootstrapTestResult, type BootstrapCiOptions } from './one-sample';
export { resolveComparisonOptions, REGRESSION_METHODS, DIFFERENCE_TYPES, type ComparisonOptions, type ResolvedComparisonOptions } from './comparison-options';
export { resolveIntervalOptions, type IntervalOptions, type ResolvedIntervalOptions, type PartitionField } from './interval-options';
export { CAUTION, DEMING_RATIO_CONVENTION } from './comparison-types';
export type { ComparisonResult, ComparisonRow, ComparisonCore, Estimate, TestedEstimate, DecisionLevelResult, NullDistributionPlot, TailTest } from './comparison-types';
export type { IntervalResult, IntervalRow, PartitionResult, PartitionGroup } from './interval-types';
export type { LimitResult } from './reference-interval';
export type { Histogram, HistogramBin } from './histogram';
export type { Interval } from './confidence-interval';
export type { IntervalMethod } from './bootstrap-estimate';
export type { RegressionMethod } from './regression-fitters';
export type { DifferenceType } from './differences';
export type { ReferenceMethod } from './reference-limits';
export type { Verdict } from './decision-levels';
export type { ProgressFn } from './bootstrap';
export { OptionError, DEFAULT_SEED } from './options';
export { ENGINE_VERSION, GENERATOR, type EngineInfo } from './engine';
export { DEFAULT_RESAMPLES, DEFAULT_REGRESSION_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES } from './bootstrap';
// Building blocks, for callers that need one method on its own.
export { passingBablok } from './passing-bablok';
export { deming, ols } from './deming';
export { weightedDeming } from './weighted-deming';
export { signTest } from './sign-test';
export { wilcoxonSignedRank } from './wilcoxon';
export { generalizedEsd } from './generalized-esd';
export { binomialRankCi } from './rank-ci';
export { harrisBoyd } from './harris-boyd';
export { quantileSorted, median } from './quantile';
export { mean, sampleSd, sampleVariance } from './summation';
