import type { SetupGuidance } from '../../setup/setup-guidance';

/**
 * The Setup form's words for a precision verification. DOMAIN.md (CLSI EP15-A3 practice, quoted from memory there):
 * per material 5 days × 5 replicates in one run a day, at least 2 materials near the decision levels. The engine is a
 * one-way analysis of variance by day with χ² limits; nothing is resampled, so no bootstrap settings are shown.
 */
export const PRECISION_GUIDANCE: SetupGuidance = {
  analyteHint: 'Brings its unit and decimals; you may change them for this study.',
  plannedLabel: 'Planned results in all',
  plannedHint: 'Per material 5 days × 5 replicates, one run a day; at least 2 materials near the decision levels (CLSI EP15 practice). Follows the days, replicates and materials below until you change it.',
  analysis: 'none',
  analysisNote: 'The findings come from a one-way analysis of variance by day for each material (repeatability, between-day and within-laboratory SDs against the claims at the chosen α); nothing is resampled, so there is no confidence level, resamples or seed to set.',
};

/** The rules a new precision study starts with in place of the comparison's (shared with the server). */
export { PRECISION_RULES } from '@shared/kinds/precision/meta';
