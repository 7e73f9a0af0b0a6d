import type { Interval } from './confidence-interval';
import type { EngineInfo } from './engine';
import type { HistogramBin, Histogram } from './histogram';
import type { ResolvedComparisonOptions } from './comparison-options';
import type { RegressionMethod } from './regression-fitters';
import type { Verdict } from './decision-levels';
import type { ComparisonResolution } from './resolution';

/** One row of a method comparison: x = comparative method, y = candidate method. */
export interface ComparisonRow {
  x: number;
  y: number;
  label?: string;
  excluded?: boolean;
  exclusionReason?: string;
}

/** Non-finite numbers become null in results (json-clean.ts). */
export interface Estimate { estimate: number | null; ci: Interval | null }
export interface TestedEstimate extends Estimate { pValue: number | null; se: number | null }

export interface ComparisonRegression {
  method: RegressionMethod;
  /** Deming only: λ = σ²(x error)/σ²(y error). */
  demingRatio: number | null;
  slope: Estimate;
  intercept: Estimate;
  /** Passing–Bablok cusum linearity test; null for the other methods. */
  linearityP: number | null;
  /** How slope and intercept CIs were made: 'rank' (Passing–Bablok), 'bootstrap' or 'jackknife'. */
  ciMethod: 'rank' | 'bootstrap' | 'jackknife' | null;
  /** Pearson r of x and y, and the least-squares line, for reference. */
  correlation: number | null;
  /**
   * The fitted line and its pointwise CI at 21 values of x from the lowest to the highest comparative value,
   * from the same resamples (or jackknife fits) as the decision-level biases; null when there is no line,
   * absent from results of engines before 1.4.0.
   */
  band?: { x: number; fit: number | null; ci: Interval | null }[] | null;
}

export interface DecisionLevelResult {
  level: number;
  bias: Estimate;
  biasPercent: number | null;
  allowable: number | null;
  verdict: Verdict | null;
  /** The interval the verdict was judged on when the CI is narrower than the reporting step (estimate ± step/2 joined with the CI); null when judged on the CI. */
  judgedOn: Interval | null;
}

export interface NullDistributionPlot {
  bins: (HistogramBin & { tail: 'lower' | 'upper' | null })[];
  lowerCutoff: number;
  upperCutoff: number;
  observed: number;
  nullValue: number;
}

export interface ComparisonCore {
  n: number;
  bias: { mean: TestedEstimate; median: TestedEstimate };
  sd: Estimate;
  limitsOfAgreement: { multiplier: number; lower: Estimate; upper: Estimate };
  regression: ComparisonRegression;
  decisionLevels: DecisionLevelResult[];
}

export interface ComparisonResult extends ComparisonCore {
  kind: 'comparison';
  nTotal: number;
  excluded: { count: number; rows: { row: number; index: number; label: string | null; reason: string | null }[] };
  differenceType: ResolvedComparisonOptions['difference'];
  signTest: { positive: number; negative: number; zeros: number; pValue: number | null };
  wilcoxon: { statistic: number | null; n: number; method: 'exact' | 'normal' | null; pValue: number | null };
  biasTests: { median: TailTest | null; mean: TailTest | null };
  outliers: number[];
  outlierIndexes: number[];
  outlierTest: { method: 'generalized ESD (Rosner 1983)'; alpha: number; maxOutliers: number; steps: { row: number; statistic: number; critical: number }[] };
  plots: { medianBias: Histogram | null; meanBias: Histogram | null; medianNull: NullDistributionPlot | null };
  sensitivity: (ComparisonCore & { includesExcluded: true; excludedCount: number }) | null;
  settings: ResolvedComparisonOptions & { demingRatioConvention: string };
  /** The reporting step and the estimates whose CI is narrower than it (resolution.ts). */
  resolution: ComparisonResolution;
  warnings: string[];
  caution: string;
  engine: EngineInfo;
}

export interface TailTest {
  observed: number;
  nullValue: number;
  pValue: number;
  upperTail: number;
  lowerTail: number;
}

export const CAUTION =
  "Decision support only: final acceptance follows local accreditation rules and the laboratory director's professional judgement.";
export const DEMING_RATIO_CONVENTION = 'λ = σ²(x error) / σ²(y error): comparative method error variance over candidate method error variance';
