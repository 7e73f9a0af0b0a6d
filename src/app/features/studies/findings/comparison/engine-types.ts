/// <reference path="../../../../../../shared/stats/jstat.d.ts" />
/**
 * The statistics engine's result types, as the API returns its results. Types only: the findings shown are
 * always the server's stored run. (The browser does run a few exact, closed-form parts of shared/stats for
 * Setup's planning panels and for drawing fitted curves; it never computes a finding that is signed.)
 */
export type {
  ComparisonCore, ComparisonResult, DecisionLevelResult, Estimate, Histogram, HistogramBin, Interval, NullDistributionPlot,
  TestedEstimate, Verdict,
} from '@shared/stats';
export type { ComparisonRegression } from '@shared/stats/comparison-types';
