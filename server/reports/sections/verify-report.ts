import { integer, num, orDash, withUnit } from '../format';
import type { Layout } from '../layout';
import { plotRow } from '../plots/plot-box';
import { stripPlot } from '../plots/strip-plot';
import type { StudyReport, VerifyFindings } from '../report-model';
import { amendments } from './amendments';
import { cautionCallout } from './caution';
import { decimalsOf, isNumber } from './comparison-data';
import { intervalPlan } from './interval-plan';
import { nounFor, plural } from '@shared/types/plural';
import { signatureBlock } from './signature';
import { exclusions, intervalRows } from './specimen-rows';
import { studyBlock } from './title';
import { warningsList } from './warnings';

const OUTSIDE = 'Outside the stated interval';

/**
 * The body of a verification (transference) report. Page 1 leads with the conclusion (accepted or not, the
 * count outside and the advice), the caution, the sign-off and the plan; the numbers, the strip plot, what
 * was studied and the rows follow.
 */
export function verifyReport(layout: Layout, report: StudyReport, results: VerifyFindings | null): void {
  const outside = new Set(results?.outsidePositions ?? []);
  if (!results) {
    layout.conclusion('Conclusion', 'There is no current analysis of these values and the stated interval, so no findings are shown.');
    cautionCallout(layout);
    signatureBlock(layout, report);
    intervalPlan(layout, report);
    amendments(layout, report);
    studyBlock(layout, report);
    intervalRows(layout, report, outside, OUTSIDE);
    return;
  }
  const d = decimalsOf(report).value;
  const unit = report.analyte.unit;
  const lower = results.stated?.lower ?? report.settings.statedLower;
  const upper = results.stated?.upper ?? report.settings.statedUpper;
  layout.conclusion('Conclusion', verifyConclusion(results));
  layout.keyValues([['Values', valueCounts(report, results)]], 60);
  cautionCallout(layout);
  signatureBlock(layout, report);
  intervalPlan(layout, report);
  amendments(layout, report);
  const pairs: [string, string][] = [
    ['Stated interval', withUnit(`${num(lower, d)} to ${num(upper, d)}`, unit)],
    ['Source of the stated interval', orDash(results.stated?.source || report.settings.statedSource)],
    ['Values tested (n)', valueCounts(report, results)],
    ['Outside the interval', `${integer(results.outside)} (${integer(results.below)} below, ${integer(results.above)} above); at most ${integer(results.allowedOutside)} allowed`],
    ['Binomial probability', `P = ${num(results.probability, 3)} of ${integer(results.outside)} or more outside if the stated interval fits this population (95% coverage)`],
    ['Power of the rule', `If in truth 10% of this population fell outside, the rule would still accept it ${num(100 * results.passRiskAt10Percent, 0)}% of the time`],
  ];
  layout.heading('Verification of the stated interval', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
  const values = report.rows.filter((r) => !r.excluded && isNumber(r.value)).map((r) => r.value!);
  if (values.length) {
    layout.heading('Values against the stated interval', 150);
    const [box] = plotRow(layout, 1, 140);
    stripPlot(layout.doc, box, { title: plural(values.length, 'local value'), xLabel: unit ? `${report.analyte.name} (${unit})` : report.analyte.name, values, lower, upper });
  }
  warningsList(layout, results.warnings);
  studyBlock(layout, report);
  exclusions(layout, report);
  intervalRows(layout, report, outside, OUTSIDE);
}

/** "19 tested of 20 entered; 1 excluded". */
function valueCounts(report: StudyReport, results: VerifyFindings): string {
  return `${integer(results.n)} tested of ${integer(report.rows.length)} entered; ${integer(results.excludedCount ?? 0)} excluded`;
}

/** "Not accepted: 5 of 19 values outside the stated interval (at most 2 allowed). Advice: test 20 more …" */
export function verifyConclusion(results: VerifyFindings): string {
  const head = `${results.accepted ? 'Accepted' : 'Not accepted'}: ${integer(results.outside)} of ${integer(results.n)} ${nounFor(results.n ?? 0, 'value')} ` +
    `outside the stated interval (at most ${integer(results.allowedOutside)} allowed).`;
  const advice = (results.advice ?? '').replace(/^(Not accepted|Accepted):\s*/, '');
  return advice ? `${head} Advice: ${advice}` : head;
}
