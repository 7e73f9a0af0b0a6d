import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { amendments } from './amendments';
import { cautionCallout } from './caution';
import { comparisonPairs, outlierPositions } from './comparison-data';
import { comparisonFlags } from './comparison-flags';
import { comparisonPlots } from './comparison-plots';
import { comparisonSensitivity } from './comparison-sensitivity';
import { comparisonSettings } from './comparison-settings';
import { comparisonStatistics } from './comparison-statistics';
import { comparisonLead, comparisonVerdictDetails } from './comparison-verdict';
import { comparisonPlan } from './plan';
import { signatureBlock } from './signature';
import { comparisonRows, exclusions } from './specimen-rows';
import { studyBlock } from './title';

/**
 * The body of a method-comparison report, in reading order. Page 1 leads with the conclusion: the sentences,
 * the decision-level picture, the pairs analysed, entered and excluded, who signed (or that no one has), then
 * the plan; what was studied, the settings and the details follow.
 */
export function comparisonReport(layout: Layout, report: StudyReport, results: ComparisonFindings | null): void {
  const pairs = comparisonPairs(report, results);
  if (!results) {
    layout.conclusion('Conclusion', 'There is no current analysis of these rows and settings, so no findings are shown.');
    cautionCallout(layout);
    signatureBlock(layout, report);
    comparisonPlan(layout, report);
    amendments(layout, report);
    studyBlock(layout, report);
    comparisonSettings(layout, report, null);
    comparisonRows(layout, report, pairs, new Set());
    return;
  }
  const flagged = outlierPositions(results, pairs);
  comparisonLead(layout, report, results);
  signatureBlock(layout, report);
  comparisonPlan(layout, report);
  amendments(layout, report);
  comparisonVerdictDetails(layout, report, results);
  studyBlock(layout, report);
  comparisonSettings(layout, report, results);
  comparisonStatistics(layout, report, results);
  comparisonFlags(layout, results, [...flagged].sort((a, b) => a - b));
  comparisonSensitivity(layout, report, results);
  comparisonPlots(layout, report, results, pairs);
  exclusions(layout, report);
  comparisonRows(layout, report, pairs, flagged);
}
