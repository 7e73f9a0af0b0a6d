import type { Interval } from './confidence-interval';
import type { EngineInfo } from './engine';
import type { Resolution } from './resolution';

/**
 * The result contract of a reportable-range study (linearity and recovery; the CLI, API, page and PDF read the
 * same JSON). Results, fitted values, deviations and goals are in the analyte's unit; percentages are of the
 * straight line's value at the level.
 */

/** One row of a reportable-range study as the engine reads it (excluded rows are counted, never used). */
/** CLSI EP06 practice (DOMAIN.md "Reportable range", from memory): 5 to 11 levels; a study is submitted with at least the fewest. */
export const RANGE_LEVELS = { fewest: 5, most: 11 } as const;

export interface RangeRow {
  level: string;
  replicate: number | null;
  value: number;
  excluded?: boolean;
  exclusionReason?: string;
  /** The grid row (1-based) the row came from; errors name it. */
  position?: number;
}

export interface RangeLevelSetting {
  name: string;
  assigned?: number | null;
  fraction?: number | null;
}

export interface RangeOptions {
  levels: RangeLevelSetting[];
  /** The pools' assigned values, when levels are mixing fractions (both or neither). */
  poolLow?: number | null;
  poolHigh?: number | null;
  /** Planned replicates per level (2 by default): what the warnings compare with. */
  replicates?: number;
  allowableNonlinearity?: number | null;
  allowableNonlinearityPercent?: number | null;
  claimedLow?: number | null;
  claimedHigh?: number | null;
  /** Significance level of the t-tests of the top coefficients (0.05 by default). */
  alpha?: number;
  /** Confidence level of the deviations' bootstrap CIs (0.95 by default). */
  confidenceLevel?: number;
  resamples?: number;
  seed?: string;
  decimals?: number | null;
  /** The analyte's unit, for the verdict in words. */
  unit?: string;
}

/** 'assigned': x is each level's assigned value (given, or from its fraction and the pools); 'fraction': x is the high pool's fraction. */
export type RangeBasis = 'assigned' | 'fraction';

export interface RangeLevelResult {
  /** The level's name. */
  level: string;
  /** Its x: the assigned value ('assigned' basis) or the mixing fraction ('fraction' basis). */
  x: number;
  /** The assigned value, null on the 'fraction' basis. */
  assigned: number | null;
  /** The mixing fraction, where the level was given as one. */
  fraction: number | null;
  /** Included results, in replicate order. */
  values: number[];
  n: number;
  mean: number;
  /** SD of the level's included results; null with fewer than 2. */
  sd: number | null;
  /** The best-fitting polynomial and the straight line at x. */
  fitted: number;
  linear: number;
  /** fitted − linear, and in % of linear (null where linear is 0). */
  deviation: number;
  deviationPercent: number | null;
  /** Percentile bootstrap CI of the deviation (replicates resampled within each level); null when the straight line fits best. */
  deviationCi: Interval | null;
  /** The allowable deviation here: the larger of the absolute goal and the % goal of |linear|. */
  goal: number;
  /** 100 · mean / assigned; null on the 'fraction' basis or where the assigned value is 0. */
  recoveryPercent: number | null;
  /** |deviation| ≤ goal (CLSI EP06 practice judges the point estimate; the CI is shown beside it). */
  within: boolean;
  /** The CI reaches beyond the goal though the deviation is within it (a caution, not a verdict). */
  ciBeyondGoal: boolean;
}

export interface RangeFit {
  degree: number;
  /** b0, b1, …, b_degree of y = b0 + b1·x + … on the raw x. */
  coefficients: number[];
  se: number[];
  /** Two-sided p of the t-test that the top coefficient is 0; null for the straight line. */
  p: number | null;
  /** Residual sum of squares, residual df and residual SD (Sy.x). */
  rss: number;
  df: number;
  syx: number;
  /** The top coefficient differs from 0 at α (always false for the straight line). */
  significant: boolean;
}

export type RangeVerdict = 'range-verified' | 'range-shortened' | 'range-not-verified';

export interface RangeResult {
  kind: 'reportable-range';
  basis: RangeBasis;
  /** In order of x. */
  levels: RangeLevelResult[];
  /** Degrees 1, 2 and 3 where the data allow them (a degree needs degree + 2 levels). */
  fits: RangeFit[];
  bestDegree: number;
  /**
   * The longest run of consecutive levels within the goal (ties: the lowest): its ends as assigned values (or, on
   * the 'fraction' basis, the end levels' mean results) and the levels' names; null when no level is within.
   */
  verifiedRange: { low: number; high: number; lowLevel: string; highLevel: string } | null;
  verdict: RangeVerdict;
  /** The verdict in one sentence. */
  verdictWords: string;
  /** The allowable nonlinearity; `source` is the study's record-only words, added where results are served (never by the engine). */
  goal: { absolute: number | null; percent: number | null; source?: string };
  claimed: { low: number | null; high: number | null };
  /** Whether the verified range reaches the claimed interval's ends (null when no claim is given or nothing is verified). */
  coversClaim: boolean | null;
  alpha: number;
  confidenceLevel: number;
  /** The level Cochran's test flags for its replicate scatter (α = 0.01), or null. */
  scatterFlag: { level: string; c: number; critical: number } | null;
  excludedCount: number;
  warnings: string[];
  caution: string;
  engine: EngineInfo;
  resolution: Resolution;
}
