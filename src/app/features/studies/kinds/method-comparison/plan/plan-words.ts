import { formatChance, formatPercent } from '@shared/format/number-format';
import type { ApiIssue } from '@shared/schemas';
import type { PlanValues } from './plan-form';

/** A probability as the plan's table and sentences write it, as the PDF does: 0.677 → "67.7%", 0.9996 → "> 99.9%" (formatChance). */
export const percent = (p: number): string => formatChance(p);

/** A target or a limit as set, as the PDF writes it: 0.8 → "80%", 0.025 → "2.5%" (formatPercent). */
export const target = (p: number): string => formatPercent(p);

/** A server message without the path it starts with: "settings.samplePlan.low: The low end …" → "The low end …". */
export function withoutPath(message: string): string {
  const text = message.replace(/^[\w.]+: /, '');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The Setup fields a plan reads, in the words Setup labels them with, and what to do when one keeps the plan from running. */
const SETUP_FIELDS: Record<string, { label: string; fix?: string }> = {
  'settings.decisionLevels': { label: 'Medical decision levels', fix: 'Set at least one medical decision level in Setup above: the plan judges the bias there.' },
  'settings.allowableBiasAbsolute': { label: 'Allowable bias', fix: 'Set the allowable bias (± in the unit, ± %, or both) in Setup above: the plan judges the bias against it.' },
  'settings.allowableBiasPercent': { label: 'Allowable bias %', fix: 'Set the allowable bias (± in the unit, ± %, or both) in Setup above: the plan judges the bias against it.' },
  'settings.regression': { label: 'Regression' },
  'settings.differenceType': { label: 'Difference' },
  'settings.demingRatio': { label: 'Deming error ratio λ' },
  'settings.seed': { label: 'Seed' },
  'settings.confidenceLevel': { label: 'Confidence level' },
  'settings.decimals': { label: 'Decimals shown' },
};

/** Where one issue of an answer belongs: a field of the plan, the reason for changing an approved plan, or Setup. */
export type IssuePlace = { field: keyof PlanValues } | { reason: true } | { setup: string };

const PLAN_PREFIX = 'settings.samplePlan.';

export function issuePlace(issue: ApiIssue, fields: readonly string[]): IssuePlace {
  if (issue.path === 'reason') return { reason: true };
  if (issue.path.startsWith(PLAN_PREFIX)) {
    const field = issue.path.slice(PLAN_PREFIX.length).split('.')[0];
    if (fields.includes(field)) return { field: field as keyof PlanValues };
  }
  const setup = SETUP_FIELDS[issue.path];
  if (setup) return { setup: setup.fix ?? `${setup.label} (in Setup above): ${withoutPath(issue.message)}` };
  return { setup: withoutPath(issue.message) };
}
