import { pairedDifferences } from '../../../shared/stats/differences';
import type { ComparisonFindings, ReportRow, StudyReport } from '../report-model';

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

/** Decimals of the analyte's results, and one more for derived statistics. */
export function decimalsOf(report: StudyReport): { value: number; stat: number } {
  const value = report.settings.decimals ?? 1;
  return { value, stat: value + 1 };
}

/** The unit of a difference: the analyte's unit, or % for percent differences. */
export function differenceUnit(report: StudyReport, results: ComparisonFindings | null): string {
  const type = results?.differenceType ?? report.settings.differenceType;
  return type === 'absolute' ? report.analyte.unit : '%';
}
