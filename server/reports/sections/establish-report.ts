import { histogram, type HistogramBin } from '../../../shared/stats/histogram';
import type { LimitResult } from '../../../shared/stats';
import type { Layout } from '../layout';
import { histogramPlot } from '../plots/histogram-plot';
import { plotRow } from '../plots/plot-box';
import type { EstablishFindings, StudyReport } from '../report-model';
import { COLOR } from '../theme';
import { amendments } from './amendments';
import { isNumber } from './comparison-data';
import { establishFindings } from './establish-findings';
import { plural } from '../../../shared/types/plural';
import { establishScreening } from './establish-screening';
import { intervalPlan } from './interval-plan';
import { intervalRows, exclusions } from './specimen-rows';
import { warningsList } from './warnings';

/** The body of a reference-interval establishment report. */
export function establishReport(layout: Layout, report: StudyReport, results: EstablishFindings | null): void {
  intervalPlan(layout, report);
  amendments(layout, report);
  if (!results) {
    layout.heading('Findings');
    layout.paragraph('There is no current analysis of these values and settings, so no findings are shown.');
    intervalRows(layout, report, new Set());
    return;
  }
  const used = report.rows.filter((r) => isNumber(r.value));
  const flagged = results.outlierPositions ?? (results.outliers ?? []).map((k) => used[k - 1]?.position).filter(isNumber);
  establishFindings(layout, report, results);
  valuesHistogram(layout, report, results);
  establishScreening(layout, report, results, [...flagged].sort((a, b) => a - b));
  warningsList(layout, results.warnings);
  exclusions(layout, report);
  intervalRows(layout, report, new Set(flagged));
}

function valuesHistogram(layout: Layout, report: StudyReport, results: EstablishFindings): void {
  const values = Float64Array.from(report.rows.filter((r) => !r.excluded && isNumber(r.value)).map((r) => r.value!));
  if (!values.length) return;
  const limits = [results.lower, results.upper].filter((l): l is LimitResult & { estimate: number } => isNumber(l?.estimate));
  layout.heading('Distribution of the reference values', 200);
  const [box] = plotRow(layout, 1, 200);
  const unit = report.analyte.unit;
  histogramPlot(layout.doc, box, {
    title: `Histogram of ${plural(values.length, 'value')}`, xLabel: unit ? `${report.analyte.name} (${unit})` : report.analyte.name,
    bins: valueBins(values),
    markers: limits.map((l) => ({ value: l.estimate, color: COLOR.warm })),
    bands: limits.flatMap((l) => (l.ci ? [{ span: l.ci, color: COLOR.warm }] : [])),
    legend: [{ label: 'limits', color: COLOR.warm, kind: 'line' }, { label: 'CI of each limit', color: COLOR.warm, kind: 'band' }],
  }, 'Count');
}

/**
 * Bins for reported values: one bin per distinct value when there are few (rounded results would
 * otherwise leave empty gaps between bars), else equal-width bins.
 */
function valueBins(values: Float64Array): HistogramBin[] {
  const distinct = [...new Set(values)].sort((a, b) => a - b);
  if (distinct.length > 40 || distinct.length < 2) return histogram(values, Math.min(40, Math.max(8, Math.round(2 * Math.sqrt(values.length))))).bins;
  const step = Math.min(...distinct.slice(1).map((v, k) => v - distinct[k]));
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return distinct.map((v) => ({ from: v - step / 2, to: v + step / 2, count: counts.get(v)! }));
}
