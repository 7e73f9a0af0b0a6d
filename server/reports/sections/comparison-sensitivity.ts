import { integer } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { sensitivityLines } from '@shared/types/findings-rows';
import { nounFor } from '@shared/types/plural';
import { comparisonUnits, stepWords } from './comparison-data';

/**
 * The main estimates with the excluded rows left out (as analysed) and put back in, side by side, in the
 * names, decimals and words of the findings page (shared/types/findings-rows.ts, sensitivityLines).
 */
export function comparisonSensitivity(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  layout.subheading('Sensitivity: with and without the excluded rows');
  const other = results.sensitivity;
  if (!other) {
    layout.paragraph('No row was excluded, so there is no second analysis to compare.');
    return;
  }
  // The notes name the estimates in resolution.limitedEstimates, which describes the analysed rows only.
  const { notes } = stepWords(report, results);
  const lines = sensitivityLines(results, other, comparisonUnits(report, results), notes);
  drawTable(layout, [
    { header: 'Estimate (CI)', weight: 1.6 },
    { header: 'Without the excluded rows (as analysed)', weight: 2 },
    { header: `With every row, ${integer(other.excludedCount)} ${nounFor(other.excludedCount ?? 0, 'excluded row')} included`, weight: 2 },
  ], lines.map((l) => [l.name, l.main, l.all]));
}
