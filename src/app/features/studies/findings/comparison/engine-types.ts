/// <reference path="../../../../../../shared/stats/jstat.d.ts" />
/**
 * The statistics engine's result types, as the API returns its results. Types only: nothing of the
 * engine reaches the browser's bundle, which computes no result of its own.
 */
export type {
  ComparisonCore, ComparisonResult, DecisionLevelResult, Estimate, Histogram, HistogramBin, Interval, NullDistributionPlot,
  TestedEstimate, Verdict,
} from '@shared/stats';
export type { ComparisonRegression } from '@shared/stats/comparison-types';
