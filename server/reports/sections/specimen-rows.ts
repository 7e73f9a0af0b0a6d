import { kindMeta } from '@shared/kinds/kinds';
import { num, orDash } from '../format';
import type { Layout } from '../layout';
import type { ReportRow, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR } from '../theme';
import { decimalsOf, type Pair } from './comparison-data';

const valueText = (text: string | null | undefined, value: number | null, decimals: number): string => text ?? num(value, decimals);

const FLAGGED = 'Flagged as possible outlier';

function status(row: ReportRow, flagged: Set<number>, flagLabel = FLAGGED): string {
  if (row.excluded) return `Excluded: ${orDash(row.exclusionReason)}`;
  return flagged.has(row.position) ? flagLabel : '';
}

/** Every row as entered, excluded ones included, in grid order. */
export function comparisonRows(layout: Layout, report: StudyReport, pairs: Pair[], flagged: Set<number>): void {
  const d = decimalsOf(report);
  const byPosition = new Map(pairs.map((p) => [p.row.position, p]));
  layout.heading('Specimen results', 60);
  drawTable(layout, [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Specimen', weight: 1.2 },
    { header: 'Comparative', weight: 1, align: 'right' }, { header: 'Candidate', weight: 1, align: 'right' },
    { header: 'Difference', weight: 0.9, align: 'right' }, { header: 'Status', weight: 2 }, { header: 'Note', weight: 1.6 },
  ], report.rows.map((r) => [
    String(r.position), r.label, valueText(r.comparativeText, r.comparative, d.value), valueText(r.candidateText, r.candidate, d.value),
    num(byPosition.get(r.position)?.difference, d.difference), status(r, flagged), r.note,
  ]), { color: (k, c) => (c === 5 && report.rows[k].excluded ? COLOR.bad : undefined) });
}

export function intervalRows(layout: Layout, report: StudyReport, flagged: Set<number>, flagLabel = FLAGGED): void {
  const d = decimalsOf(report);
  layout.heading('Reference values', 60);
  drawTable(layout, [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Specimen', weight: 1.3 }, { header: 'Value', weight: 0.9, align: 'right' },
    { header: 'Sex', weight: 0.6 }, { header: 'Age band', weight: 0.8 }, { header: 'Status', weight: 2 }, { header: 'Note', weight: 1.6 },
  ], report.rows.map((r) => [
    String(r.position), r.label, valueText(r.valueText, r.value, d.value), orDash(r.sex), orDash(r.ageBand), status(r, flagged, flagLabel), r.note,
  ]), { color: (k, c) => (c === 5 && report.rows[k].excluded ? COLOR.bad : undefined) });
}

/** The excluded rows with their reasons, listed on their own so none is missed. */
export function exclusions(layout: Layout, report: StudyReport): void {
  const excluded = report.rows.filter((r) => r.excluded);
  layout.heading('Exclusions', 40);
  if (!excluded.length) {
    layout.paragraph('No row was excluded.');
    return;
  }
  const d = decimalsOf(report);
  // A kind with two results a row (a comparison's x and y) shows both.
  const comparison = kindMeta(report.study.kind).rowFields.filter((f) => f.type === 'result').length > 1;
  const result = (r: ReportRow): string => comparison
    ? `${valueText(r.comparativeText, r.comparative, d.value)} / ${valueText(r.candidateText, r.candidate, d.value)}`
    : valueText(r.valueText, r.value, d.value);
  drawTable(layout, [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Specimen', weight: 1.2 },
    { header: comparison ? 'Results x / y' : 'Value', weight: 1.2, align: 'right' }, { header: 'Reason', weight: 4 },
  ], excluded.map((r) => [String(r.position), r.label, result(r), orDash(r.exclusionReason)]));
}
