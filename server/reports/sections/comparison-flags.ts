import type { Layout } from '../layout';
import type { ComparisonFindings } from '../report-model';
import { warningsList } from './warnings';
import { num } from '../format';
import { nounFor } from '../../../shared/types/plural';

/** Outliers the engine flagged (never removed by it) and the engine's warnings, in full. */
export function comparisonFlags(layout: Layout, results: ComparisonFindings, flagged: number[]): void {
  const test = results.outlierTest;
  layout.subheading('Outliers flagged');
  const rule = test ? `${test.method.charAt(0).toUpperCase()}${test.method.slice(1)}, α = ${num(test.alpha, 3)}, testing up to ${test.maxOutliers}` : 'Generalized ESD';
  layout.paragraph(flagged.length
    ? `${rule}: ${nounFor(flagged.length, 'row')} ${flagged.join(', ')} flagged as ${nounFor(flagged.length, 'a possible outlier', 'possible outliers')}. A flag is not an exclusion: a row leaves the analysis only with a recorded reason.`
    : `${rule}: no row flagged.`);
  warningsList(layout, results.warnings);
}
