import type { ComparisonCore, ComparisonResult, Estimate } from '../stats/comparison-types';
import { VERDICT_IN_LINE } from '../text/verdict-words';
import { estimateWithCi, type FindingsDecimals, formatNumber, NOT_AVAILABLE, withUnit } from './findings-numbers';
import { NARROW_CI_SHORT } from './resolution-words';

/**
 * The rows of a method comparison's findings tables as data: what each estimate is called, its value, CI,
 * p-value, unit and decimals. The findings page and the PDF write them as text, the full-record workbook
 * stores the numbers; all three take the names and the decimals from here, so they say the same thing.
 */
export interface FindingsRow {
  /** The estimate's path in the result ('bias.mean'); the reporting step's notes are keyed by it. */
  path: string;
  name: string;
  estimate: number | null;
  /** Absent: the row has no CI (a count, a test); null: the CI could not be formed. */
  ci?: readonly [number, number] | null;
  /** Absent: the row has no p-value; null: the test could not be run. */
  p?: number | null;
  unit: string;
  decimals: number;
  /** The result in words, where the row is a test or a state rather than an estimate. */
  words?: string;
}

/** How a comparison writes its numbers: the unit of results and of differences, and the decimals of each. */
export interface ComparisonUnits {
  unit: string;
  /** The analyte's unit, or % for percent differences. */
  difference: string;
  decimals: FindingsDecimals;
}

/** The unit of a difference: the result unit, or % for percent differences. */
export const differenceUnitOf = (differenceType: string, unit: string): string => (differenceType === 'absolute' ? unit : '%');

/** The CI method of the bias, SD and limits of agreement, by the option's value. */
export const BIAS_CI_WORDS: Record<string, string> = {
  percentile: 'percentile bootstrap',
  bca: 'BCa bootstrap (bias-corrected and accelerated)',
};

/** What the p-values of the bias rows test, said once under or over the table. */
export const BIAS_P_WORDS = 'p-values test a bias of 0 by the shifted-null bootstrap';

/** Where a shifted-null test gave no p-value. */
export const NO_TEST_P = 'no p-value, since there are too few differences or all are equal (see the warnings)';

/** Bias and agreement: mean and median bias (with their shifted-null p-values), SD, limits of agreement. */
export function agreementRows(core: ComparisonCore, u: ComparisonUnits): FindingsRow[] {
  const d = u.decimals.difference;
  // Results stored by an older engine may lack a part: its row then says "not available" rather than failing.
  const k = formatNumber(core.limitsOfAgreement?.multiplier, 2);
  const row = (path: string, name: string, e: { estimate: number | null; ci: readonly [number, number] | null; pValue?: number | null } | undefined, tested = false): FindingsRow => ({
    path, name, estimate: e?.estimate ?? null, ci: e?.ci ?? null, ...(tested ? { p: e?.pValue ?? null } : {}), unit: u.difference, decimals: d,
  });
  return [
    row('bias.mean', 'Mean bias', core.bias?.mean, true),
    row('bias.median', 'Median bias', core.bias?.median, true),
    row('sd', 'SD of the differences', core.sd),
    row('limitsOfAgreement.lower', `Lower limit of agreement (mean − ${k} SD)`, core.limitsOfAgreement?.lower),
    row('limitsOfAgreement.upper', `Upper limit of agreement (mean + ${k} SD)`, core.limitsOfAgreement?.upper),
  ];
}

/** The tests of the differences against zero: the shifted-null bootstrap tests, the sign test and the Wilcoxon signed-rank test. */
export function testRows(r: Pick<ComparisonResult, 'biasTests' | 'signTest' | 'wilcoxon'>, u: ComparisonUnits): FindingsRow[] {
  const d = u.decimals.difference;
  const shifted = (which: 'median' | 'mean'): FindingsRow => {
    const t = r.biasTests?.[which];
    return {
      path: `biasTests.${which}`, name: `Shifted-null bootstrap test, ${which} bias = 0`, estimate: t?.observed ?? null, p: t?.pValue ?? null,
      unit: u.difference, decimals: d, words: t ? `observed ${withUnit(formatNumber(t.observed, d), u.difference)}` : NO_TEST_P,
    };
  };
  const s = r.signTest;
  const w = r.wilcoxon;
  return [
    shifted('median'),
    shifted('mean'),
    { path: 'signTest', name: 'Sign test', estimate: null, p: s?.pValue ?? null, unit: '', decimals: 0, words: s ? `${s.positive} above zero, ${s.negative} below, ${s.zeros} at zero` : NOT_AVAILABLE },
    {
      path: 'wilcoxon', name: 'Wilcoxon signed-rank test', estimate: w?.statistic ?? null, p: w?.pValue ?? null, unit: '', decimals: 1,
      words: !w ? NOT_AVAILABLE : w.statistic === null ? 'not run: no difference other than zero' : `V = ${formatNumber(w.statistic, 1)}, n = ${w.n}, ${w.method === 'exact' ? 'exact' : 'normal approximation'}`,
    },
  ];
}


/** One line of the with-and-without table: the estimate without the excluded rows (the findings) and with every row, as text. */
export interface SensitivityLine {
  path: string;
  name: string;
  main: string;
  all: string;
}


/**
 * The main estimates without the excluded rows (as analysed) and with every row, side by side. `notes` (the
 * reporting step's words, keyed by path) describe the analysed rows only, so only the main column is marked.
 */
export function sensitivityLines(main: ComparisonCore, all: ComparisonCore, u: ComparisonUnits, notes: Readonly<Partial<Record<string, string>>> = {}): SensitivityLine[] {
  const d = u.decimals;
  const line = (path: string, name: string, text: (c: ComparisonCore) => string): SensitivityLine => ({
    path, name, main: notes[path] ? `${text(main)}, ${NARROW_CI_SHORT}` : text(main), all: text(all),
  });
  const estimate = (pick: (c: ComparisonCore) => Estimate | undefined, decimals: number, unit: string) => (c: ComparisonCore): string => estimateWithCi(pick(c), decimals, unit);
  return [
    { path: 'n', name: 'Pairs', main: String(main.n), all: String(all.n) },
    line('bias.mean', 'Mean bias', estimate((c) => c.bias?.mean, d.difference, u.difference)),
    line('bias.median', 'Median bias', estimate((c) => c.bias?.median, d.difference, u.difference)),
    line('sd', 'SD of the differences', estimate((c) => c.sd, d.difference, u.difference)),
    line('limitsOfAgreement.lower', 'Lower limit of agreement', estimate((c) => c.limitsOfAgreement?.lower, d.difference, u.difference)),
    line('limitsOfAgreement.upper', 'Upper limit of agreement', estimate((c) => c.limitsOfAgreement?.upper, d.difference, u.difference)),
    line('regression.slope', 'Slope', estimate((c) => c.regression?.slope, d.slope, '')),
    line('regression.intercept', 'Intercept', estimate((c) => c.regression?.intercept, d.stat, u.unit)),
    ...(main.decisionLevels ?? []).map((level, k) => line(`decisionLevels.${k}`, `Bias at ${withUnit(formatNumber(level.level, d.value), u.unit)}`, (c) => {
      const at = c.decisionLevels?.[k];
      if (!at) return NOT_AVAILABLE;
      return `${estimateWithCi(at.bias, d.stat, u.unit)}: ${at.verdict ? VERDICT_IN_LINE[at.verdict] : 'no verdict'}`;
    })),
  ];
}

/** The outlier rule as it was applied: "Generalized ESD (Rosner 1983) on the differences, α = 0.050, at most 3 flagged". */
export function outlierRuleWords(test: Pick<ComparisonResult['outlierTest'], 'method' | 'alpha' | 'maxOutliers'> | null | undefined): string {
  if (!test) return 'Generalized ESD on the differences';
  const method = test.method.charAt(0).toUpperCase() + test.method.slice(1);
  return `${method} on the differences, α = ${formatNumber(test.alpha, 3)}, at most ${test.maxOutliers} flagged`;
}

/** What a flag means, said wherever flags are listed. */
export const FLAG_IS_NOT_A_REASON = 'A flag is not a reason: a row leaves the analysis only when it is excluded with a documented cause.';
