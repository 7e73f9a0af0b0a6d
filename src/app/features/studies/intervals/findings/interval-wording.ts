import type { PartitionResult } from '@shared/stats/interval-types';
import { formatNumber } from '../../findings/comparison/number-format';
import type { VerifyResult } from './interval-result';

export const PARTITION_FIELD_WORDS: Record<string, string> = { sex: 'sex', ageBand: 'age band', group: 'group' };

/** How each method estimates the limits, and when it fits (shown in Setup and beside the limits). */
export const METHOD_WORDS: Record<string, string> = {
  nonparametric: 'Nonparametric: the limits are the ranked values at p(n + 1), with no assumption about the shape; it needs at least 120 individuals per partition.',
  robust: 'Robust: biweight estimates of location and spread (Horn, Pesce & Copeland), for 20 to 119 individuals per partition.',
  parametric: 'Parametric: mean ± z·SD after a Box–Cox transformation that makes the values close to normal.',
};

/** "Accepted: 1 of 20 outside; at most 2 allowed." or "Not accepted: 3 of 20 outside; at most 2 allowed." */
export function acceptanceWords(r: Pick<VerifyResult, 'accepted' | 'outside' | 'n' | 'allowedOutside'>): string {
  return `${r.accepted ? 'Accepted' : 'Not accepted'}: ${r.outside} of ${r.n} outside; at most ${r.allowedOutside} allowed.`;
}

/** Where the values outside lie: "1 below, 0 above the stated interval 3.5 to 5.1". */
export function outsideWords(r: Pick<VerifyResult, 'below' | 'above' | 'stated'>, decimals: number): string {
  return `${r.below} below and ${r.above} above the stated interval ${formatNumber(r.stated.lower, decimals)} to ${formatNumber(r.stated.upper, decimals)}.`;
}

/** The rule's low power in words, from the chance of passing when 10% truly fall outside. */
export function powerWords(passRiskAt10Percent: number): string {
  const pct = Math.round(passRiskAt10Percent * 100);
  return `The rule has little power: if 10% of this population truly fell outside the stated interval, 20 individuals would still pass it ${pct}% of the time.`;
}

/**
 * The Harris & Boyd partition test of one field in words: whether separate intervals are recommended,
 * and on which ground (z against z*, or the ratio of the SDs above 1.5).
 */
export function partitionWords(p: Pick<PartitionResult, 'field' | 'z' | 'zCritical' | 'sdRatio' | 'recommended'>): string {
  const field = PARTITION_FIELD_WORDS[p.field] ?? p.field;
  if (p.z === null || p.zCritical === null) return `By ${field}: not tested; each subgroup needs at least 2 values.`;
  const zText = `z = ${formatNumber(p.z, 2)} ${p.z > p.zCritical ? '>' : '≤'} z* = ${formatNumber(p.zCritical, 2)}`;
  const sdText = p.sdRatio === null ? '' : `; larger SD / smaller SD = ${formatNumber(p.sdRatio, 2)}${p.sdRatio > 1.5 ? ' > 1.5' : ''}`;
  return p.recommended
    ? `By ${field}: separate intervals recommended (${zText}${sdText}).`
    : `By ${field}: one common interval is enough (${zText}${sdText}).`;
}
