import type { Signature, Study } from '@shared/schemas';

const lastWhere = (list: readonly Signature[], keep: (s: Signature) => boolean): Signature | null =>
  [...list].reverse().find(keep) ?? null;

/** The director's latest approval of the plan, if any. */
export const planApprovalOf = (list: readonly Signature[]): Signature | null => lastWhere(list, (s) => s.meaning === 'plan-approved');

/** The sign-off itself (accepted or not accepted), if the study was signed. */
export const signOffOf = (list: readonly Signature[]): Signature | null => lastWhere(list, (s) => s.meaning !== 'plan-approved');

/** The analysis a review shows: the one signed, else the current findings, else the latest run. */
export function analysisToShow(study: Pick<Study, 'currentAnalysisId' | 'latestAnalysisId'>, list: readonly Signature[]): number | null {
  return signOffOf(list)?.analysisId ?? study.currentAnalysisId ?? study.latestAnalysisId;
}
