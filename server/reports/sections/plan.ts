import { num, orDash, withUnit } from '../format';
import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { laboratoryTime } from '@shared/types/lab-time';
import { decimalsOf } from './comparison-data';
import { samplePlanSection } from './sample-plan';

/** "0.3 mmol/L or 5% of the level, whichever is greater", as the engine applies it. */
export function allowableBiasWords(report: StudyReport): string {
  const s = report.settings;
  const d = decimalsOf(report).stat;
  const absolute = s.allowableBiasAbsolute !== null ? withUnit(`±${num(s.allowableBiasAbsolute, d)}`, report.analyte.unit) : null;
  const percent = s.allowableBiasPercent !== null ? `±${s.allowableBiasPercent}% of the decision level` : null;
  if (absolute && percent) return `${absolute} or ${percent}, whichever is greater`;
  return absolute ?? percent ?? 'Not set: no verdict can be given';
}

export function planApprovalWords(report: StudyReport): string {
  const a = report.planApproval;
  if (!a) return 'No plan approval recorded';
  const when = laboratoryTime(a.signedAt, report.laboratory.timeZone);
  return `Approved by ${a.signerName}, ${when}${a.comment ? `: “${a.comment}”` : ''}`;
}

/** The plan of a method comparison, fixed before the data: levels, goal and its source, rules; and its sample size by simulation, when one is set. */
export function comparisonPlan(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const d = decimalsOf(report).value;
  const pairs: [string, string][] = [
    ['Medical decision levels', s.decisionLevels.length ? s.decisionLevels.map((l) => withUnit(num(l, d), report.analyte.unit)).join('; ') : 'None set'],
    ['Allowable bias', allowableBiasWords(report)],
    ['Source of the allowable bias', orDash(s.allowableBiasSource)],
    ['Acceptance rule', orDash(s.acceptanceRule)],
    ['Outlier rule', orDash(s.outlierRule)],
    ['Plan approval', planApprovalWords(report)],
  ];
  layout.heading('Plan and acceptance criteria', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
  samplePlanSection(layout, report);
}
