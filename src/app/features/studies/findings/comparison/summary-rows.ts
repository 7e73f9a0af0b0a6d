import type { ComparisonCore, ComparisonResult } from './engine-types';
import { Units, sharedUnits } from './comparison-result';
import { formatCi, formatNumber, formatP } from './number-format';
import { withUnit } from '@shared/types/findings-numbers';
import { agreementRows as sharedAgreement, sensitivityLines, testRows as sharedTests, type FindingsRow } from '@shared/types/findings-rows';
import { regressionSection as sharedRegression, type RegressionSection } from '@shared/types/regression-words';

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

/** A shared row as the page writes it; the PDF writes the same row with the same functions. */
function asText(r: FindingsRow, notes: StepNotes): SummaryRow {
  const line: SummaryRow = {
    name: r.name,
    value: r.words ?? withUnit(formatNumber(r.estimate, r.decimals), r.unit),
    ci: r.ci === undefined ? '' : formatCi(r.ci, r.decimals),
    p: r.p === undefined ? '' : formatP(r.p),
  };
  const note = notes[r.path];
  return note ? { ...line, note } : line;
}

/** Bias and agreement: mean and median bias (with their shifted-null p-values), SD, limits of agreement. */
export function agreementRows(core: ComparisonCore, u: Units, notes: StepNotes = {}): SummaryRow[] {
  return sharedAgreement(core, sharedUnits(u)).map((r) => asText(r, notes));
}

/** The tests of the differences against zero, each with its result in words and its p-value. */
export function testRows(result: Pick<ComparisonResult, 'biasTests' | 'signTest' | 'wilcoxon'>, u: Units): SummaryRow[] {
  return sharedTests(result, sharedUnits(u)).map((r) => asText(r, {}));
}

/** A statement of the regression section with the reporting step's words after it, where its CI is narrower than one step. */
export interface RegressionStatementView {
  key: string;
  label: string;
  sentence: string;
  note?: string;
}

/** The regression section, in its order and words (shared/types/regression-words.ts, which the PDF prints too). */
export function regressionView(result: ComparisonResult, u: Units, notes: StepNotes = {}): Omit<RegressionSection, 'statements'> & { statements: RegressionStatementView[] } {
  const section = sharedRegression({
    regression: result.regression, level: result.settings.level, units: sharedUnits(u),
    interval: result.settings.interval, demingRatioConvention: result.settings.demingRatioConvention,
  });
  return {
    ...section,
    statements: section.statements.map((s) => {
      const note = s.path ? notes[s.path] : undefined;
      return note ? { key: s.key, label: s.label, sentence: s.sentence, note } : { key: s.key, label: s.label, sentence: s.sentence };
    }),
  };
}

/** Main estimates side by side: without the excluded rows (the findings) and with every row. */
export interface SensitivityRow {
  name: string;
  main: string;
  all: string;
}

/** `notes` name the main estimates whose CI is narrower than one step; the main column says so in short (the rows with every row are another analysis). */
export function sensitivityRows(main: ComparisonCore, all: ComparisonCore, u: Units, notes: StepNotes = {}): SensitivityRow[] {
  return sensitivityLines(main, all, sharedUnits(u), notes).map(({ name, main: m, all: a }) => ({ name, main: m, all: a }));
}
