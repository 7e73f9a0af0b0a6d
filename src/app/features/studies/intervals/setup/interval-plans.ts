import type { IntervalPlan } from './require-fields';

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
