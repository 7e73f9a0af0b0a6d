import { orDash } from '../format';
import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { drawTable } from '../table';
import { laboratoryTime } from '@shared/types/lab-time';

/** Criteria changed after the plan was approved: who, when, what, from what to what, and why. */
export function amendments(layout: Layout, report: StudyReport): void {
  if (!report.amendments.length) return;
  layout.heading('Criteria changed after approval', 50);
  layout.paragraph('These plan fields changed after the plan was approved. Each change is kept in the study history with its reason.');
  drawTable(layout, [
    { header: 'When', weight: 1.6 }, { header: 'By', weight: 1.1 }, { header: 'Field', weight: 1.1 },
    { header: 'From', weight: 1 }, { header: 'To', weight: 1 }, { header: 'Reason', weight: 2 },
  ], report.amendments.map((a) => [
    laboratoryTime(a.at, report.laboratory.timeZone), a.by, a.field, orDash(a.from), orDash(a.to), orDash(a.reason),
  ]));
}
