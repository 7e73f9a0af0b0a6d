import { agreementRows, BIAS_CI_WORDS, BIAS_P_WORDS, testRows, type FindingsRow } from '@shared/types/findings-rows';
import { levelLabel } from '@shared/types/findings-numbers';
import { regressionSection } from '@shared/types/regression-words';
import { plural } from '@shared/types/plural';
import { integer, num, pValue, range, withUnit } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable, type Column } from '../table';
import { COLOR, SIZE } from '../theme';
import { comparisonUnits, differenceUnit, stepWords } from './comparison-data';
import { wrapAtSpaces } from '../text';

const WEIGHTS = [2.4, 1.3, 1.5, 0.8];
/**
 * Room left when lines are broken at spaces beforehand: pdfkit wraps a word only when it fits with the space
 * after it, so a line measured to the exact width would break once more and leave one word on a line.
 */
const WRAP_SLACK = 6;
/** The width of the short labels beside the regression's sentences. */
const STATEMENT_LABEL = 120;
const estimateColumns = (ci: string): Column[] => [
  { header: 'Estimate', weight: WEIGHTS[0] }, { header: 'Value', weight: WEIGHTS[1], align: 'right' },
  { header: ci, weight: WEIGHTS[2], align: 'right' }, { header: 'p', weight: WEIGHTS[3], align: 'right' },
];

/**
 * The statistics, in the order and words of the findings page (shared/types/findings-rows.ts and
 * regression-words.ts): bias and agreement; how the candidate reads across the range (the regression in
 * sentences, the correlation as a details line); the tests of the differences against zero.
 */
export function comparisonStatistics(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const units = comparisonUnits(report, results);
  const unit = differenceUnit(report, results);
  const level = results.settings?.level ?? report.settings.confidenceLevel;
  const { notes } = stepWords(report, results);
  // A CI narrower than one reporting step: its words go under the estimate's label, wrapped to the label's column (less its padding).
  const labelWidth = (layout.width * WEIGHTS[0]) / WEIGHTS.reduce((a, b) => a + b) - 8 - WRAP_SLACK;
  const label = (name: string, note: string | undefined): string => (note ? `${name}\n${wrapAtSpaces(layout.doc, note, SIZE.table, labelWidth)}` : name);
  const cells = (r: FindingsRow): string[] => [
    label(r.name, notes[r.path]), r.words ?? withUnit(num(r.estimate, r.decimals), r.unit), r.ci === undefined ? '' : range(r.ci, r.decimals), r.p === undefined ? '' : pValue(r.p),
  ];

  layout.heading('Statistics');
  layout.subheading(`Bias and agreement (differences in ${unit || 'result units'})`);
  const excluded = results.excluded?.count ?? 0;
  const interval = results.settings?.interval ?? report.settings.interval;
  layout.paragraph(wrapAtSpaces(layout.doc,
    `${plural(results.n ?? 0, 'pair')} analysed${excluded ? ` (${integer(excluded)} excluded)` : ''}. CIs by ${BIAS_CI_WORDS[interval] ?? interval}; ${BIAS_P_WORDS}.`,
    8, layout.width - WRAP_SLACK), { size: 8, color: COLOR.muted });
  drawTable(layout, estimateColumns(`${levelLabel(level)} CI`), agreementRows(results, units).map(cells));

  const reg = results.regression;
  if (reg) {
    const section = regressionSection({
      regression: reg, level, units, interval: results.settings?.interval ?? report.settings.interval,
      demingRatioConvention: results.settings?.demingRatioConvention,
    });
    // Lines break at spaces only, so "mmol/L" never splits at its slash.
    const wrap = (text: string, size: number, width = layout.width): string => wrapAtSpaces(layout.doc, text, size, width - WRAP_SLACK);
    layout.subheading(section.heading, 90);
    layout.paragraph(wrap(section.method, 8), { size: 8, color: COLOR.muted });
    layout.keyValues(section.statements.map((s): [string, string] => {
      const note = s.path ? notes[s.path] : undefined;
      return [s.label, wrap(note ? `${s.sentence} ${note}` : s.sentence, SIZE.body, layout.width - STATEMENT_LABEL)];
    }), STATEMENT_LABEL);
    layout.paragraph(wrap(`Details: ${section.details}`, 7.5), { size: 7.5, color: COLOR.muted });
  }

  layout.subheading('Tests of the differences against zero');
  drawTable(layout, [{ header: 'Test', weight: 2.2 }, { header: 'Result', weight: 3 }, { header: 'p', weight: 0.8, align: 'right' }],
    testRows(results, units).map((t) => [t.name, t.words ?? '', pValue(t.p)]));
}
