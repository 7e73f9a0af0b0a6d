import type { IntervalPlan } from './require-fields';
import type { SetupGuidance } from '../../setup/setup-guidance';

/** The plan a new establishment starts with (CLSI EP28-A3c practice as DOMAIN.md quotes it); every field stays editable. */
export const ESTABLISH_PLAN: IntervalPlan = {
  confidenceLevel: 0.9,
  plannedSpecimens: 120,
  outlierRule: "Tukey's fences (Q1 − 1.5·IQR, Q3 + 1.5·IQR) and Dixon's rule (gap over 1/3 of the range); flags only, exclusion needs a reason",
  acceptanceRule: 'At least 120 reference individuals per partition; limits with their 90% CIs; separate limits where the Harris & Boyd test recommends them',
};

/** The plan a new verification (transference) starts with. */
export const VERIFY_PLAN: IntervalPlan = {
  confidenceLevel: 0.9,
  plannedSpecimens: 20,
  outlierRule: 'No outlier screen: every value counts; an individual is excluded only for a documented reason',
  acceptanceRule: 'Accept the stated interval when at most 2 of 20 (10%) fall outside it; otherwise test 20 more, and establish locally if that also fails',
};

/**
 * The Setup form's words for an establishment. DOMAIN.md: 120 reference individuals per partition for a
 * nonparametric 2.5th–97.5th percentile interval with 90% CIs (CLSI EP28-A3c practice, as quoted by Ozarda et al.,
 * Clin Chem Lab Med 2019;57:30). The engine reads the level, resamples and seed; each limit's bootstrap is a percentile one.
 */
export const ESTABLISH_GUIDANCE: SetupGuidance = {
  analyteHint: 'Brings its unit and decimals; you may change them for this study.',
  plannedLabel: 'Planned reference individuals',
  plannedHint: 'At least 120 healthy reference individuals per partition (CLSI EP28-A3c practice); a sex or age band with limits of its own needs its 120.',
  analysis: 'limits',
  analysisNote: "Each limit's CI is a percentile bootstrap at this level; the nonparametric method adds a CI from the ranks.",
};

/**
 * The Setup form's words for a verification (transference). DOMAIN.md: 20 local healthy individuals; accept when
 * at most 2 of 20 (10%) fall outside; with 3 or more, test 20 more (CLSI EP28-A3c practice). The count takes no
 * confidence level, resamples or seed, so none are shown.
 */
export const VERIFY_GUIDANCE: SetupGuidance = {
  analyteHint: 'Brings its unit and decimals; you may change them for this study.',
  plannedLabel: 'Planned reference individuals',
  plannedHint: '20 local healthy individuals; the stated interval is accepted when at most 2 of them fall outside it (CLSI EP28-A3c practice).',
  analysis: 'none',
  analysisNote: 'The findings count the values outside the stated interval; there is no bootstrap, so no confidence level, resamples or seed to set.',
};
