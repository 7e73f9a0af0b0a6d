import type { EngineInfo } from './engine';
import type { Resolution } from './resolution';

/**
 * The result contract of a precision verification (the CLI, API, page and PDF read the same JSON).
 * SDs are in the analyte's unit, CVs in %. Verdicts in words: 'verified' (s ≤ claim), 'consistent'
 * (claim < s ≤ UVL: consistent with the claim), 'not-verified' (s > UVL).
 */
export type PrecisionVerdict = 'verified' | 'consistent' | 'not-verified';

/** One row of a precision study as the engine reads it (excluded rows are reported, never used). */
export interface PrecisionRow {
  material: string;
  /** A date (YYYY-MM-DD) or a run number as text; results of one day share it. */
  day: string;
  replicate: number | null;
  value: number;
  excluded?: boolean;
  exclusionReason?: string;
  /** The grid row (1-based) the row came from; outliers are reported by it. */
  position?: number;
}

export interface PrecisionMaterialSetting {
  name: string;
  claimRepeatability: number;
  claimWithinLab: number;
  claimAs: 'sd' | 'cv';
  assignedValue?: number | null;
  assignedUncertainty?: number | null;
  assignedSource?: string;
}

export interface PrecisionOptions {
  materials: PrecisionMaterialSetting[];
  /** Planned days and replicates per day (5 × 5 by default): the design the warnings compare with. */
  days?: number;
  replicates?: number;
  /** Significance level of the verification (0.05 by default). */
  alpha?: number;
  /**
   * Flag a replicate when |x − day mean| > outlierFactor · s_r (5.5 by default), with x left out of its day's
   * mean and of s_r (kept in, one result can never reach 5.5·s_r in a 5 × 5 design; replicate-outliers.ts).
   */
  outlierFactor?: number;
  decimals?: number;
  seed?: string;
}

/** An SD with its CV, degrees of freedom and two-sided (1 − α) χ² CI of the SD. */
export interface PrecisionComponent {
  sd: number;
  cv: number;
  df: number;
  ci: { lower: number; upper: number };
}

export interface PrecisionMaterialResult {
  name: string;
  /** Included results, days with at least one result. */
  n: number;
  days: number;
  mean: number;
  /** The one-way ANOVA by day. */
  anova: { msBetween: number; msWithin: number; dfBetween: number; dfWithin: number; n0: number; balanced: boolean };
  /** Each day's results, for the plot (included only). */
  byDay: { day: string; values: number[]; mean: number }[];
  repeatability: PrecisionComponent;
  betweenDay: { sd: number; cv: number };
  withinLab: PrecisionComponent;
  /** The claims as given: SDs in the unit when `as` is 'sd', CVs in % when 'cv'; each estimate is judged in those terms. */
  claims: { repeatability: number; withinLab: number; as: 'sd' | 'cv' };
  /** Upper verification limits, in the claim's terms (SD or CV %). */
  uvl: { repeatability: number; withinLab: number };
  verdicts: { repeatability: PrecisionVerdict; withinLab: PrecisionVerdict };
  /**
   * Against an assigned value, where one is given (precision-trueness.ts). `se` is the SE of the grand mean;
   * `df` the degrees of freedom of the t multiplier of √(se² + uncertainty²) (Welch–Satterthwaite with the
   * uncertainty's df taken as infinite; equal to `seDf` when uncertainty is 0); `seDf` the SE's own
   * Satterthwaite df (k − 1 in a balanced design); `multiplier` t(1 − α/(2ℓ); df). biasPercent is 100·bias/|assigned|.
   */
  trueness: {
    assigned: number; uncertainty: number; source: string; bias: number; biasPercent: number; se: number; df: number;
    interval: { lower: number; upper: number }; verdict: 'verified' | 'not-verified';
    seDf?: number; multiplier?: number;
  } | null;
  /** Flagged replicates (never removed silently). */
  outliers: { position?: number; day: string; replicate: number | null; value: number; why: string }[];
  /** Notes for this material: unbalanced design, too few days or results. */
  notes: string[];
}

export interface PrecisionResult {
  kind: 'precision';
  /** In the order of the settings; a material with no included results is left out (with a warning). */
  materials: PrecisionMaterialResult[];
  /** α and the number of materials ℓ the UVL is adjusted for (the materials analysed). */
  alpha: number;
  materialsTested: number;
  excludedCount: number;
  warnings: string[];
  caution: string;
  engine: EngineInfo;
  resolution: Resolution;
}
