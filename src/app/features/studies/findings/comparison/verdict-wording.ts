import type { DecisionLevelResult, TestedEstimate, Verdict } from './engine-types';
import { formatCi, formatNumber, formatP, levelLabel } from './number-format';
import { Units, withUnit } from './comparison-result';
import { judgedOnSentence, narrowCiSentence } from '../../../../../../shared/types/resolution-words';
import { plural } from '../../../../../../shared/types/plural';

export type Tone = Verdict | 'none';

/** A verdict as the page shows it: a word, an icon and a tone; never colour alone. */
export interface VerdictView {
  tone: Tone;
  word: string;
  icon: string;
}

const VIEWS: Record<Tone, VerdictView> = {
  within: { tone: 'within', word: 'Within', icon: 'check_circle' },
  inconclusive: { tone: 'inconclusive', word: 'Inconclusive', icon: 'help' },
  exceeds: { tone: 'exceeds', word: 'Exceeds', icon: 'cancel' },
  none: { tone: 'none', word: 'No verdict', icon: 'remove_circle_outline' },
};

export function verdictView(verdict: Verdict | null): VerdictView {
  return VIEWS[verdict ?? 'none'];
}

/**
 * One decision level in a sentence: the predicted bias, its CI and what that says against the allowable bias.
 * When the CI is narrower than the reporting step the verdict was judged on `judgedOn` (the CI widened to the
 * estimate ± half a step), and the sentence says so; `step` is that step in words ("1 mmol/L").
 */
export function levelSentence(d: DecisionLevelResult, units: Units, level: number, step = ''): string {
  const at = withUnit(formatNumber(d.level, units.decimals - 1), units.unit);
  const bias = withUnit(formatNumber(d.bias.estimate, units.decimals), units.unit);
  const ci = `${levelLabel(level)} CI ${formatCi(d.bias.ci, units.decimals)}`;
  const head = `At ${at} the predicted bias is ${bias} (${ci})`;
  const limit = d.allowable === null ? '' : `±${withUnit(formatNumber(d.allowable, units.decimals), units.unit)}`;
  if (d.judgedOn && d.verdict) {
    const judged = `${head}. ${judgedOnSentence(withUnit(formatCi(d.judgedOn, units.decimals), units.unit), step)}`;
    if (d.verdict === 'within') return `${judged}: that whole interval lies within the allowable ${limit}.`;
    if (d.verdict === 'exceeds') return `${judged}: that whole interval lies beyond the allowable ${limit}.`;
    return `${judged}: that interval crosses the allowable ${limit}, so these data cannot settle it.`;
  }
  switch (d.verdict) {
    case 'within':
      return `${head}: the whole CI lies within the allowable ${limit}.`;
    case 'exceeds':
      return `${head}: the whole CI lies beyond the allowable ${limit}.`;
    case 'inconclusive':
      return `${head}: the CI crosses the allowable ${limit}, so these data cannot settle it.`;
    default:
      return d.allowable === null
        ? `${head}. No allowable bias is set for this study, so there is no verdict.`
        : `${head}. The CI could not be formed, so there is no verdict.`;
  }
}

/** All decision levels in one line: "Within the allowable bias at 2 of 3 decision levels; inconclusive at 1." */
export function overallSentence(levels: readonly DecisionLevelResult[]): string {
  if (levels.length === 0) return 'No medical decision levels are set; add them in Setup to judge the bias where it matters.';
  const count = (v: Verdict | null): number => levels.filter((d) => d.verdict === v).length;
  const of = plural(levels.length, 'decision level');
  const parts = [`Within the allowable bias at ${count('within')} of ${of}`];
  if (count('inconclusive')) parts.push(`inconclusive at ${count('inconclusive')}`);
  if (count('exceeds')) parts.push(`exceeds it at ${count('exceeds')}`);
  if (count(null)) parts.push(`no verdict at ${count(null)}`);
  return `${parts.join('; ')}.`;
}

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
