/**
 * The verdict panel's words beside the picture: the median bias with its test, and why a p-value is no verdict.
 * The decision levels' words (verdict, sentence, conclusion) are shared with the PDF: shared/types/decision-track.ts.
 */
import type { TestedEstimate } from './engine-types';
import { formatCi, formatNumber, formatP, levelLabel } from './number-format';
import { Units, withUnit } from './comparison-result';
import { narrowCiSentence } from '@shared/types/resolution-words';

/** The median bias with its CI and the shifted-null bootstrap test against zero; `narrowStep`, the step its CI is narrower than. */
export function medianSentence(median: TestedEstimate, units: Units, level: number, resamples: number, narrowStep = ''): string {
  const bias = withUnit(formatNumber(median.estimate, units.differenceDecimals), units.difference);
  const ci = formatCi(median.ci, units.differenceDecimals);
  const p = formatP(median.pValue);
  const resampled = resamples.toLocaleString('en-US');
  const narrow = narrowStep ? ` ${narrowCiSentence(narrowStep)}` : '';
  const test = median.pValue === null || median.pValue === undefined
    ? `Shifted-null bootstrap test of a median bias of 0: ${NO_P_VALUE}.`
    : `Shifted-null bootstrap test of a median bias of 0: p ${p.startsWith('<') ? p : `= ${p}`} (${resampled} resamples).`;
  return `Median bias ${bias} (${levelLabel(level)} CI ${ci}).${narrow} ${test}`;
}

/** Why a shifted-null test shows no p-value: the engine refuses it (fewer than 6 differences, or all equal) and says so in the warnings. */
export const NO_P_VALUE = 'no p-value, since there are too few differences or all are equal (see the warnings)';

/** The reminder under the test: a p-value is not a verdict. */
export const NOT_EQUIVALENCE =
  'A large p-value does not show that the methods agree, and a small one need not matter clinically: judge the CI against the allowable bias.';
