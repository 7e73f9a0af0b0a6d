/**
 * What the shared Setup form says and shows for one kind of study: the analyte's hint, the planned number
 * and its rule of thumb, and which analysis settings the kind's engine reads (the others are not shown).
 * Each kind's view (kinds/<kind>/index.ts) names its guidance; the numbers are those of the design notes' DOMAIN.md.
 */
export interface SetupGuidance {
  analyteHint: string;
  plannedLabel: string;
  plannedHint: string;
  /**
   * The analysis settings shown: `regression` all four (level, CI method, resamples, seed); `limits` the
   * level, resamples and seed of each limit's percentile bootstrap; `none` no section (the count needs none).
   */
  analysis: 'regression' | 'limits' | 'none';
  /** What the confidence level is of, when not of the regression or the limits: "Confidence level of the deviations". */
  confidenceLabel?: string;
  /** A sentence under the analysis settings, or under the plan when the kind has none. */
  analysisNote: string;
}
