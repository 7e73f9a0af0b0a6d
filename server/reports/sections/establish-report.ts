import { valueBins } from '@shared/types/plot-axes';
import type { LimitResult } from '@shared/stats';
import type { Layout } from '../layout';
import { histogramPlot } from '../plots/histogram-plot';
import { plotRow } from '../plots/plot-box';
import type { EstablishFindings, StudyReport } from '../report-model';
import { COLOR } from '../theme';
import { integer, num, orDash, withUnit } from '../format';
import { INTERVAL_METHOD_WORDS, PARTITION_WORDS } from '../words';
import { amendments } from './amendments';
import { cautionCallout } from './caution';
import { decimalsOf, isNumber } from './comparison-data';
import { signatureBlock } from './signature';
import { studyBlock } from './title';
import { establishFindings } from './establish-findings';
import { plural } from '@shared/types/plural';
import { establishScreening } from './establish-screening';
import { intervalPlan } from './interval-plan';
import { intervalRows, exclusions } from './specimen-rows';
import { warningsList } from './warnings';

/**
 * The body of a reference-interval establishment report. Page 1 leads with the conclusion (the interval and
 * whether separate intervals are recommended), the counts, the caution, the sign-off and the plan; what was
 * studied and the details follow.
 */
export function establishReport(layout: Layout, report: StudyReport, results: EstablishFindings | null): void {
  if (!results) {
    layout.conclusion('Conclusion', 'There is no current analysis of these values and settings, so no findings are shown.');
    cautionCallout(layout);
    signatureBlock(layout, report);
    intervalPlan(layout, report);
    amendments(layout, report);
    studyBlock(layout, report);
    intervalRows(layout, report, new Set());
    return;
  }
  layout.conclusion('Conclusion', establishConclusion(report, results));
  layout.keyValues([['Values', `${integer(results.n)} analysed of ${integer(report.rows.length)} entered; ${integer(results.excludedCount)} excluded`]], 60);
  cautionCallout(layout);
  signatureBlock(layout, report);
  intervalPlan(layout, report);
  amendments(layout, report);
  const used = report.rows.filter((r) => isNumber(r.value));
  const flagged = results.outlierPositions ?? (results.outliers ?? []).map((k) => used[k - 1]?.position).filter(isNumber);
  establishFindings(layout, report, results);
  studyBlock(layout, report);
  valuesHistogram(layout, report, results);
  establishScreening(layout, report, results, [...flagged].sort((a, b) => a - b));
  warningsList(layout, results.warnings);
  exclusions(layout, report);
  intervalRows(layout, report, new Set(flagged));
}

/**
 * The interval in one or two sentences: "The reference interval is 135.0 to 145.0 mmol/L: the 2.5th and
 * 97.5th percentiles of 121 values (nonparametric)." and what the partition test says.
 */
export function establishConclusion(report: StudyReport, results: EstablishFindings): string {
  const d = decimalsOf(report);
  const unit = report.analyte.unit;
  const { lower, upper } = results;
  const method = (INTERVAL_METHOD_WORDS[results.method]?.name ?? orDash(results.method)).replace(/ \(.*$/, '').toLowerCase();
  const percentiles = [lower?.percentile, upper?.percentile].filter(isNumber).map((p) => `${p}th`).join(' and ');
  const first = isNumber(lower?.estimate) && isNumber(upper?.estimate)
    ? `The reference interval is ${withUnit(`${num(lower!.estimate, d.stat)} to ${num(upper!.estimate, d.stat)}`, unit)}: the ${percentiles} percentiles of ${plural(results.n ?? 0, 'value')} (${method}).`
    : 'No reference interval could be estimated from these values; see the warnings.';
  const partitions = results.partitions ?? [];
  if (!partitions.length) return first;
  const fields = (list: typeof partitions): string => list.map((p) => (PARTITION_WORDS[p.field] ?? p.field).toLowerCase()).join(' and ');
  const recommended = partitions.filter((p) => p.recommended);
  const second = recommended.length
    ? `The Harris & Boyd test recommends separate intervals by ${fields(recommended)}; they are given with the findings.`
    : `The Harris & Boyd test does not recommend separate intervals by ${fields(partitions)}, so one interval serves.`;
  return `${first} ${second}`;
}

/**
 * The histogram of the analysed reference values by the rule the findings page draws with (valueBins,
 * shared/types/plot-axes.ts): bins at half-steps of the reporting step, and that step as the axis's finest tick.
 */
export function referenceBins(report: StudyReport, results: EstablishFindings): ReturnType<typeof valueBins> {
  const values = report.rows.filter((r) => !r.excluded && isNumber(r.value)).map((r) => r.value!);
  return valueBins(values, results.resolution?.increment);
}

function valuesHistogram(layout: Layout, report: StudyReport, results: EstablishFindings): void {
  const values = Float64Array.from(report.rows.filter((r) => !r.excluded && isNumber(r.value)).map((r) => r.value!));
  if (!values.length) return;
  const limits = [results.lower, results.upper].filter((l): l is LimitResult & { estimate: number } => isNumber(l?.estimate));
  layout.heading('Distribution of the reference values', 200);
  const [box] = plotRow(layout, 1, 200);
  const unit = report.analyte.unit;
  const { bins, step } = referenceBins(report, results);
  histogramPlot(layout.doc, box, {
    title: `Histogram of ${plural(values.length, 'value')}`, xLabel: unit ? `${report.analyte.name} (${unit})` : report.analyte.name,
    bins, resolution: step,
    markers: limits.map((l) => ({ value: l.estimate, color: COLOR.warm })),
    bands: limits.flatMap((l) => (l.ci ? [{ span: l.ci, color: COLOR.warm }] : [])),
    // The legend names the limits with their values, in the tables' decimals, as the findings page does.
    legend: [
      ...(limits.length ? [{ label: `${limits.length === 2 ? 'limits' : 'limit'} ${limits.map((l) => withUnit(num(l.estimate, decimalsOf(report).stat), unit)).join(' and ')}`, color: COLOR.warm, kind: 'line' as const }] : []),
      ...(limits.some((l) => l.ci) ? [{ label: `${Math.round(100 * (results.settings?.level ?? 0.9))}% CI of each limit`, color: COLOR.warm, kind: 'band' as const }] : []),
    ],
  }, 'Count');
}
