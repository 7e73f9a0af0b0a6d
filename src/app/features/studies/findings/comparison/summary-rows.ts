import type { ComparisonCore, Estimate } from './engine-types';
import { REGRESSION_LABELS } from '../../study-text';
import { Units, withUnit } from './comparison-result';
import { formatCi, formatNumber, formatP } from './number-format';
import { NARROW_CI_SHORT } from '../../../../../../shared/types/resolution-words';

/** Words beside the estimates whose CI is narrower than one reporting step, keyed by path ('bias.median'); see narrowCiNotes. */
export type StepNotes = Readonly<Partial<Record<string, string>>>;

/** One line of a findings table: what it is, the estimate with its unit, its CI, a p-value where there is one, and a note on its CI. */
export interface SummaryRow {
  name: string;
  value: string;
  ci: string;
  p: string;
  /** Set when the CI is narrower than one reporting step: the words to show right under the row. */
  note?: string;
}

function row(name: string, e: Estimate & { pValue?: number | null }, decimals: number, unit: string, note?: string): SummaryRow {
  const line: SummaryRow = { name, value: withUnit(formatNumber(e.estimate, decimals), unit), ci: formatCi(e.ci, decimals), p: e.pValue === undefined ? '' : formatP(e.pValue) };
  return note ? { ...line, note } : line;
}

/** Bias and agreement: mean and median bias (with their shifted-null p-values), SD, limits of agreement. */
export function agreementRows(core: ComparisonCore, u: Units, notes: StepNotes = {}): SummaryRow[] {
  const d = u.differenceDecimals;
  const k = formatNumber(core.limitsOfAgreement.multiplier, 2);
  return [
    row('Mean bias', core.bias.mean, d, u.difference, notes['bias.mean']),
    row('Median bias', core.bias.median, d, u.difference, notes['bias.median']),
    row('SD of the differences', core.sd, d, u.difference, notes['sd']),
    row(`Lower limit of agreement (mean − ${k} SD)`, core.limitsOfAgreement.lower, d, u.difference, notes['limitsOfAgreement.lower']),
    row(`Upper limit of agreement (mean + ${k} SD)`, core.limitsOfAgreement.upper, d, u.difference, notes['limitsOfAgreement.upper']),
  ];
}

/** The regression: slope and intercept with CIs; the linearity test only for Passing–Bablok. */
export function regressionRows(core: ComparisonCore, u: Units, notes: StepNotes = {}): SummaryRow[] {
  const r = core.regression;
  const rows = [row('Slope', r.slope, 3, '', notes['regression.slope']), row('Intercept', r.intercept, u.decimals, u.unit, notes['regression.intercept'])];
  if (r.method === 'passing-bablok') {
    const words = r.linearityP === null ? 'not tested' : r.linearityP < 0.05 ? 'deviates from a straight line' : 'no sign of deviation';
    rows.push({ name: 'Linearity (cusum test)', value: words, ci: '', p: formatP(r.linearityP) });
  }
  rows.push({ name: 'Correlation r (for reference only)', value: formatNumber(r.correlation, 4), ci: '', p: '' });
  return rows;
}

/** The method's name, with λ and its convention for the Deming methods. */
export function regressionName(core: ComparisonCore, convention: string): string {
  const r = core.regression;
  const name = REGRESSION_LABELS[r.method];
  return r.demingRatio === null ? name : `${name}, λ = ${formatNumber(r.demingRatio, 3)} (${convention})`;
}

/** Main estimates side by side: without the excluded rows (the findings) and with every row. */
export interface SensitivityRow {
  name: string;
  main: string;
  all: string;
}

/** `notes` name the main estimates whose CI is narrower than one step; the main column says so in short (the rows with every row are another analysis). */
export function sensitivityRows(main: ComparisonCore, all: ComparisonCore, u: Units, notes: StepNotes = {}): SensitivityRow[] {
  const both = (name: string, path: string, pick: (c: ComparisonCore) => Estimate, decimals: number, unit: string): SensitivityRow => {
    const text = (e: Estimate): string => `${withUnit(formatNumber(e.estimate, decimals), unit)} (${formatCi(e.ci, decimals)})`;
    return { name, main: notes[path] ? `${text(pick(main))}, ${NARROW_CI_SHORT}` : text(pick(main)), all: text(pick(all)) };
  };
  const d = u.differenceDecimals;
  const rows: SensitivityRow[] = [
    { name: 'Pairs', main: String(main.n), all: String(all.n) },
    both('Mean bias', 'bias.mean', (c) => c.bias.mean, d, u.difference),
    both('Median bias', 'bias.median', (c) => c.bias.median, d, u.difference),
    both('Lower limit of agreement', 'limitsOfAgreement.lower', (c) => c.limitsOfAgreement.lower, d, u.difference),
    both('Upper limit of agreement', 'limitsOfAgreement.upper', (c) => c.limitsOfAgreement.upper, d, u.difference),
    both('Slope', 'regression.slope', (c) => c.regression.slope, 3, ''),
    both('Intercept', 'regression.intercept', (c) => c.regression.intercept, u.decimals, u.unit),
  ];
  main.decisionLevels.forEach((level, i) => {
    const at = withUnit(formatNumber(level.level, u.decimals - 1), u.unit);
    rows.push(both(`Bias at ${at}`, `decisionLevels.${i}`, (c) => c.decisionLevels[i]?.bias ?? { estimate: null, ci: null }, u.decimals, u.unit));
  });
  return rows;
}
