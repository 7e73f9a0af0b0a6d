import type { Estimate, TestedEstimate } from '../../../shared/stats';
import { integer, NOT_AVAILABLE, num, percent, pValue, range } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable, type Column } from '../table';
import { SIZE } from '../theme';
import { CI_WORDS } from '../words';
import { decimalsOf, differenceUnit, stepWords } from './comparison-data';
import { wrapAtSpaces } from '../text';

const WEIGHTS = [2.4, 1, 1.5, 1.3];
const estimateColumns = (ci: string, p: string): Column[] => [
  { header: 'Statistic', weight: WEIGHTS[0] }, { header: 'Estimate', weight: WEIGHTS[1], align: 'right' },
  { header: ci, weight: WEIGHTS[2], align: 'right' }, { header: p, weight: WEIGHTS[3], align: 'right' },
];

/** Bias, spread and agreement; the paired tests; the regression line. */
export function comparisonStatistics(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const d = decimalsOf(report).stat;
  const unit = differenceUnit(report, results);
  const level = percent(results.settings?.level ?? report.settings.confidenceLevel);
  const k = num(results.limitsOfAgreement?.multiplier ?? report.settings.loaMultiplier, 2);
  const { notes } = stepWords(report, results);
  // A CI narrower than one reporting step: its words go under the estimate's label, wrapped to the label's column (less its padding).
  const labelWidth = (layout.width * WEIGHTS[0]) / WEIGHTS.reduce((a, b) => a + b) - 8;
  const row = (label: string, e: Estimate | TestedEstimate | undefined, decimals: number, p = '', note?: string): string[] =>
    [note ? `${label}\n${wrapAtSpaces(layout.doc, note, SIZE.table, labelWidth)}` : label, num(e?.estimate, decimals), range(e?.ci, decimals), p];
  layout.heading('Statistics');
  layout.subheading(`Bias and agreement (differences in ${unit || 'result units'})`);
  drawTable(layout, estimateColumns(`${level} CI (${CI_WORDS[results.settings?.interval ?? report.settings.interval]?.toLowerCase() ?? 'bootstrap'})`, 'p-value (bootstrap, shifted null)'), [
    ['Pairs analysed (n)', integer(results.n), '', ''],
    ['Pairs excluded', integer(results.excluded?.count), '', ''],
    row('Mean bias', results.bias?.mean, d, pValue(results.bias?.mean?.pValue), notes['bias.mean']),
    row('Median bias', results.bias?.median, d, pValue(results.bias?.median?.pValue), notes['bias.median']),
    row('SD of the differences', results.sd, d, '', notes['sd']),
    row(`Lower limit of agreement (mean − ${k} SD)`, results.limitsOfAgreement?.lower, d, '', notes['limitsOfAgreement.lower']),
    row(`Upper limit of agreement (mean + ${k} SD)`, results.limitsOfAgreement?.upper, d, '', notes['limitsOfAgreement.upper']),
  ]);
  const sign = results.signTest;
  const w = results.wilcoxon;
  layout.subheading('Paired tests of the differences against zero');
  drawTable(layout, [{ header: 'Test', weight: 2.2 }, { header: 'Result', weight: 3 }, { header: 'p-value', weight: 1, align: 'right' }], [
    ['Sign test', sign ? `${sign.positive} positive, ${sign.negative} negative, ${sign.zeros} zero` : NOT_AVAILABLE, pValue(sign?.pValue)],
    ['Wilcoxon signed-rank', w ? `W = ${num(w.statistic, 1)}, n = ${w.n}${w.method ? `, ${w.method} method` : ''}` : NOT_AVAILABLE, pValue(w?.pValue)],
  ]);
  const reg = results.regression;
  layout.subheading('Regression (candidate y against comparative x)');
  const ciMethod = reg?.ciMethod ? ` (${(CI_WORDS[reg.ciMethod] ?? reg.ciMethod).toLowerCase()})` : '';
  drawTable(layout, estimateColumns(`${level} CI${ciMethod}`, 'p-value'), [
    row('Slope b', reg?.slope, 4, '', notes['regression.slope']),
    row('Intercept a', reg?.intercept, d, '', notes['regression.intercept']),
    ['Linearity (Passing–Bablok cusum test)', reg?.linearityP === null || reg?.linearityP === undefined ? 'Not applicable' : linearity(reg.linearityP), '', pValue(reg?.linearityP)],
    ['Pearson r (for reference only)', num(reg?.correlation, 4), '', ''],
  ]);
  layout.paragraph('A high r shows the range was wide, not that the methods agree; agreement is judged from the bias and its CI.', { size: 7.5 });
}

function linearity(p: number): string {
  return p < 0.05 ? 'Not linear' : 'No departure';
}
