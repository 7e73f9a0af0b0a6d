import { integer, num, orDash, withUnit } from '../format';
import type { Layout } from '../layout';
import { plotRow } from '../plots/plot-box';
import { stripPlot } from '../plots/strip-plot';
import type { StudyReport, VerifyFindings } from '../report-model';
import { COLOR } from '../theme';
import { amendments } from './amendments';
import { cautionCallout } from './caution';
import { decimalsOf, isNumber } from './comparison-data';
import { intervalPlan } from './interval-plan';
import { nounFor, plural } from '../../../shared/types/plural';
import { exclusions, intervalRows } from './specimen-rows';
import { warningsList } from './warnings';

const OUTSIDE = 'Outside the stated interval';

/** The body of a verification (transference) report: the count outside, the decision in words, the strip plot. */
export function verifyReport(layout: Layout, report: StudyReport, results: VerifyFindings | null): void {
  intervalPlan(layout, report);
  amendments(layout, report);
  const outside = new Set(results?.outsidePositions ?? []);
  if (!results) {
    layout.heading('Findings');
    layout.paragraph('There is no current analysis of these values and the stated interval, so no findings are shown.');
    intervalRows(layout, report, outside, OUTSIDE);
    return;
  }
  const d = decimalsOf(report).value;
  const unit = report.analyte.unit;
  const lower = results.stated?.lower ?? report.settings.statedLower;
  const upper = results.stated?.upper ?? report.settings.statedUpper;
  layout.heading('Verification of the stated interval', 230);
  layout.callout(results.advice ?? '', {
    fill: results.accepted ? '#e3efe5' : '#f6e0e0', edge: results.accepted ? COLOR.good : COLOR.bad,
    title: `${results.accepted ? 'Accepted' : 'Not accepted'}: ${integer(results.outside)} of ${integer(results.n)} ${nounFor(results.n ?? 0, 'value')} outside the stated interval (at most ${integer(results.allowedOutside)} allowed)`,
  });
  layout.keyValues([
    ['Stated interval', withUnit(`${num(lower, d)} to ${num(upper, d)}`, unit)],
    ['Source of the stated interval', orDash(results.stated?.source || report.settings.statedSource)],
    ['Values tested (n)', `${integer(results.n)}${results.excludedCount ? `; ${integer(results.excludedCount)} excluded` : ''}`],
    ['Outside the interval', `${integer(results.outside)} (${integer(results.below)} below, ${integer(results.above)} above); at most ${integer(results.allowedOutside)} allowed`],
    ['Binomial probability', `P = ${num(results.probability, 3)} of ${integer(results.outside)} or more outside if the stated interval fits this population (95% coverage)`],
    ['Power of the rule', `If in truth 10% of this population fell outside, the rule would still accept it ${num(100 * results.passRiskAt10Percent, 0)}% of the time`],
  ]);
  cautionCallout(layout);
  const values = report.rows.filter((r) => !r.excluded && isNumber(r.value)).map((r) => r.value!);
  if (values.length) {
    layout.heading('Values against the stated interval', 150);
    const [box] = plotRow(layout, 1, 140);
    stripPlot(layout.doc, box, { title: plural(values.length, 'local value'), xLabel: unit ? `${report.analyte.name} (${unit})` : report.analyte.name, values, lower, upper });
  }
  warningsList(layout, results.warnings);
  exclusions(layout, report);
  intervalRows(layout, report, outside, OUTSIDE);
}
