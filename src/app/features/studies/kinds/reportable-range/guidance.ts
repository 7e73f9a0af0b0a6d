import type { SetupGuidance } from '../../setup/setup-guidance';

/**
 * The Setup form's words for a reportable-range study. DOMAIN.md (CLSI EP06 practice, quoted from memory there): 5 to 11
 * levels across the claimed measuring interval, mixtures of a low and a high pool or materials with assigned values, 2 to 3
 * replicates each, in one run. The engine fits polynomials of degree 1 to 3 and resamples the replicates within each level
 * for the CI of each deviation (a percentile bootstrap), so the level, resamples and seed are shown.
 */
export const RANGE_GUIDANCE: SetupGuidance = {
  analyteHint: 'Brings its unit and decimals; you may change them for this study.',
  plannedLabel: 'Planned results in all',
  plannedHint: '5 to 11 levels across the claimed measuring interval, 2 or 3 replicates of each, in one run (CLSI EP06 practice). Follows the levels and replicates below until you change it.',
  analysis: 'limits',
  confidenceLabel: 'Confidence level of the deviations',
  analysisNote: 'The CI of the deviation at each level is a percentile bootstrap: the replicates are resampled within each level at this level of confidence. The verdict judges the deviation itself against the goal; the CI is shown beside it.',
};

/** The rules a new reportable-range study starts with in place of the comparison's (shared with the server). */
export { RANGE_RULES } from '@shared/kinds/reportable-range/meta';
