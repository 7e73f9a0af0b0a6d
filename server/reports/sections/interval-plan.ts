import { num, orDash, percent, withUnit } from '../format';
import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { INTERVAL_METHOD_WORDS, PARTITION_WORDS } from '../words';
import { decimalsOf } from './comparison-data';
import { planApprovalWords } from './plan';

/** The plan of a reference-interval study: population, percentiles or stated interval, rules. */
export function intervalPlan(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const d = decimalsOf(report).value;
  const unit = report.analyte.unit;
  const verifying = report.study.kind === 'interval-verify';
  const stated = `${withUnit(`${num(s.statedLower, d)} to ${num(s.statedUpper, d)}`, unit)}`;
  const pairs: [string, string][] = [
    ['Reference population', orDash(s.populationDescription)],
    ...(verifying
      ? [
        ['Stated interval', stated], ['Source of the stated interval', orDash(s.statedSource)],
        ['Rule the engine applies', 'Accept when at most 10% of the local values (2 of 20) fall outside the stated interval'],
      ] as [string, string][]
      : [
        ['Percentiles', s.percentiles.map((p) => `${p}th`).join(' and ')],
        ['Method', INTERVAL_METHOD_WORDS[s.intervalMethod]?.name ?? s.intervalMethod],
        ['Partitions tested', s.partitionFields.length ? s.partitionFields.map((f) => PARTITION_WORDS[f] ?? f).join(', ') : 'None'],
        ['Confidence level of the limits', percent(s.confidenceLevel)],
      ] as [string, string][]),
    ['Acceptance rule (as planned)', orDash(s.acceptanceRule)],
    ['Outlier rule', verifying ? 'Values are not screened; an exclusion needs a recorded reason' : 'Tukey fences (1.5 × IQR) and Dixon’s gap rule (D/R > 1/3); flags only'],
    ['Plan approval', planApprovalWords(report)],
  ];
  layout.heading('Plan and acceptance criteria', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
}
