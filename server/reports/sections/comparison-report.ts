import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { amendments } from './amendments';
import { comparisonPairs, outlierPositions } from './comparison-data';
import { comparisonFlags } from './comparison-flags';
import { comparisonPlots } from './comparison-plots';
import { comparisonSensitivity } from './comparison-sensitivity';
import { comparisonSettings } from './comparison-settings';
import { comparisonStatistics } from './comparison-statistics';
import { comparisonVerdict } from './comparison-verdict';
import { comparisonPlan } from './plan';
import { comparisonRows, exclusions } from './specimen-rows';

/** The body of a method-comparison report, in reading order. */
export function comparisonReport(layout: Layout, report: StudyReport, results: ComparisonFindings | null): void {
  comparisonPlan(layout, report);
  amendments(layout, report);
  const pairs = comparisonPairs(report, results);
  if (!results) {
    layout.heading('Findings');
    layout.paragraph('There is no current analysis of these rows and settings, so no findings are shown.');
    comparisonSettings(layout, report, null);
    comparisonRows(layout, report, pairs, new Set());
    return;
  }
  const flagged = outlierPositions(results, pairs);
  comparisonVerdict(layout, report, results);
  comparisonSettings(layout, report, results);
  comparisonStatistics(layout, report, results);
  comparisonFlags(layout, results, [...flagged].sort((a, b) => a - b));
  comparisonSensitivity(layout, report, results);
  comparisonPlots(layout, report, results, pairs);
  exclusions(layout, report);
  comparisonRows(layout, report, pairs, flagged);
}
