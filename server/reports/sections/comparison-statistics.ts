import type { Estimate, TestedEstimate } from '../../../shared/stats';
import { integer, NOT_AVAILABLE, num, percent, pValue, range } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable, type Column } from '../table';
import { CI_WORDS } from '../words';
import { decimalsOf, differenceUnit } from './comparison-data';

const estimateColumns = (ci: string, p: string): Column[] => [
  { header: 'Statistic', weight: 2.4 }, { header: 'Estimate', weight: 1, align: 'right' },
  { header: ci, weight: 1.5, align: 'right' }, { header: p, weight: 1.3, align: 'right' },
];

const row = (label: string, e: Estimate | TestedEstimate | undefined, d: number, p = ''): string[] =>
  [label, num(e?.estimate, d), range(e?.ci, d), p];

/** Bias, spread and agreement; the paired tests; the regression line. */
export function comparisonStatistics(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const d = decimalsOf(report).stat;
  const unit = differenceUnit(report, results);
  const level = percent(results.settings?.level ?? report.settings.confidenceLevel);
  const k = num(results.limitsOfAgreement?.multiplier ?? report.settings.loaMultiplier, 2);
  layout.heading('Statistics');
  layout.subheading(`Bias and agreement (differences in ${unit || 'result units'})`);
  drawTable(layout, estimateColumns(`${level} CI (${CI_WORDS[results.settings?.interval ?? report.settings.interval]?.toLowerCase() ?? 'bootstrap'})`, 'p-value (bootstrap, shifted null)'), [
    ['Pairs analysed (n)', integer(results.n), '', ''],
    ['Pairs excluded', integer(results.excluded?.count), '', ''],
    row('Mean bias', results.bias?.mean, d, pValue(results.bias?.mean?.pValue)),
    row('Median bias', results.bias?.median, d, pValue(results.bias?.median?.pValue)),
    row('SD of the differences', results.sd, d),
    row(`Lower limit of agreement (mean − ${k} SD)`, results.limitsOfAgreement?.lower, d),
    row(`Upper limit of agreement (mean + ${k} SD)`, results.limitsOfAgreement?.upper, d),
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
    row('Slope b', reg?.slope, 4),
    row('Intercept a', reg?.intercept, d),
    ['Linearity (Passing–Bablok cusum test)', reg?.linearityP === null || reg?.linearityP === undefined ? 'Not applicable' : linearity(reg.linearityP), '', pValue(reg?.linearityP)],
    ['Pearson r (for reference only)', num(reg?.correlation, 4), '', ''],
  ]);
  layout.paragraph('A high r shows the range was wide, not that the methods agree; agreement is judged from the bias and its CI.', { size: 7.5 });
}

function linearity(p: number): string {
  return p < 0.05 ? 'Not linear' : 'No departure';
}
