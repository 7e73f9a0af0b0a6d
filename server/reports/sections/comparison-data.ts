import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import { pairedDifferences } from '@shared/stats/differences';
import { stepWords as wordsOfStep, type StepWords } from '@shared/types/resolution-words';
import { findingsDecimals, type FindingsDecimals } from '@shared/types/findings-numbers';
import { differenceUnitOf, type ComparisonUnits } from '@shared/types/findings-rows';
import type { Layout } from '../layout';
import type { ComparisonFindings, EstablishFindings, ReportRow, StudyReport } from '../report-model';
import { wrapAtSpaces } from '../text';
import { COLOR, SIZE } from '../theme';

export interface Pair {
  row: ReportRow;
  x: number;
  y: number;
  /** The difference of the study's difference type, and the plot's x for it. */
  difference: number;
  at: number;
}

/** The analysed pairs of a comparison (rows with both results), with their differences, as the engine saw them. */
export function comparisonPairs(report: StudyReport, results: ComparisonFindings | null): Pair[] {
  const rows = report.rows.filter((r) => isNumber(r.comparative) && isNumber(r.candidate));
  if (!rows.length) return [];
  const x = rows.map((r) => r.comparative!);
  const y = rows.map((r) => r.candidate!);
  const type = results?.differenceType ?? report.settings.differenceType;
  let diffs: ReturnType<typeof pairedDifferences>;
  try {
    diffs = pairedDifferences(x, y, type);
  } catch {
    return []; // a percent difference with a zero base: the engine refuses it too, so there is nothing to plot
  }
  return rows.map((row, k) => ({
    row, x: x[k], y: y[k], difference: diffs.differences[k], at: type === 'percent-x' ? x[k] : diffs.means[k],
  }));
}

/** Grid positions of the rows the outlier test flags. */
export function outlierPositions(results: ComparisonFindings, pairs: Pair[]): Set<number> {
  const positions = results.outlierPositions ?? (results.outliers ?? []).map((k) => pairs[k - 1]?.row.position);
  return new Set(positions.filter((p): p is number => p !== undefined));
}

export const isNumber = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * The decimals of each kind of number, by the findings' one rule (shared/types/findings-numbers.ts): `value`
 * as reported, `stat` one more for estimates, `difference`, `slope`, `percent`, `correlation`. Without the
 * results the differences follow the study's difference type.
 */
export function decimalsOf(report: StudyReport, results?: ComparisonFindings | null): FindingsDecimals {
  const type = report.study.kind === methodComparisonMeta.kind ? results?.differenceType ?? report.settings.differenceType : 'absolute';
  return findingsDecimals(report.settings.decimals, type);
}

/** The unit of a difference: the analyte's unit, or % for percent differences. */
export function differenceUnit(report: StudyReport, results: ComparisonFindings | null): string {
  return differenceUnitOf(results?.differenceType ?? report.settings.differenceType, report.analyte.unit);
}

/** How a comparison writes its numbers, in the shape the shared rows and sentences take (the findings page passes the same). */
export function comparisonUnits(report: StudyReport, results: ComparisonFindings): ComparisonUnits {
  return { unit: report.analyte.unit, difference: differenceUnit(report, results), decimals: decimalsOf(report, results) };
}

/**
 * What the reporting step allows (DOMAIN.md, "Coarse results"): the words beside each estimate whose CI is
 * narrower than one step, keyed by its path ('bias.median'); the rule to state once (null when nothing is
 * limited); and the step of an estimate in words. Results stored before the engine reported its step have
 * no resolution, and then all three say nothing.
 */
export function stepWords(report: StudyReport, results: ComparisonFindings | EstablishFindings): StepWords {
  const unit = report.analyte.unit;
  return wordsOfStep(results.resolution, unit, results.kind === methodComparisonMeta.resultKind ? differenceUnit(report, results) : unit);
}

/** The rule of the reporting step in a box of its own, once, at the top of the findings. */
export function stepRule(layout: Layout, rule: string | null): void {
  if (rule) layout.callout(wrapAtSpaces(layout.doc, rule, SIZE.body, layout.width - 20), { fill: COLOR.tint, edge: COLOR.accent, title: 'Reporting step' });
}

/** A paragraph of the step's words under a table, its lines broken at spaces only. */
export function stepParagraph(layout: Layout, text: string): void {
  layout.paragraph(wrapAtSpaces(layout.doc, text, 8, layout.width), { size: 8 });
}
