import type { FindingsStatus, StudySettings, StudySummary } from '@shared/schemas';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS } from '@shared/schemas';

export const DIFFERENCE_LABELS: Record<StudySettings['differenceType'], string> = {
  absolute: 'Absolute: y − x',
  'percent-mean': 'Percent of the pair mean',
  'percent-x': 'Percent of x (comparative)',
};

export const REGRESSION_LABELS: Record<StudySettings['regression'], string> = {
  'passing-bablok': 'Passing–Bablok',
  deming: 'Deming',
  'weighted-deming': 'Weighted Deming',
  ols: 'Ordinary least squares',
};

export const INTERVAL_LABELS: Record<StudySettings['interval'], string> = {
  percentile: 'Percentile bootstrap',
  bca: 'BCa bootstrap',
};

export const FINDINGS_LABELS: Record<FindingsStatus, string> = {
  none: 'Not analysed yet',
  queued: 'Analysis waiting to start',
  running: 'Analysis running',
  current: 'Findings up to date',
  'out-of-date': 'Findings out of date',
  failed: 'Analysis failed',
};

/** True for the regression methods that need the error ratio λ. */
export function usesDemingRatio(regression: StudySettings['regression']): boolean {
  return regression === 'deming' || regression === 'weighted-deming';
}

export const kindLabel = (s: Pick<StudySummary, 'kind'>): string => STUDY_KIND_LABELS[s.kind];
export const stateLabel = (s: Pick<StudySummary, 'state'>): string => STUDY_STATE_LABELS[s.state];

