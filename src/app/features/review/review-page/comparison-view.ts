import type { Analysis, Study } from '@shared/schemas';
import { PlotPoint, plotPoints } from '../../studies/findings/charts/plot-points';
import { ComparisonFindingsResult, Units, asComparison, unitsOf } from '../../studies/findings/comparison/comparison-result';
import type { GridRow } from '../../studies/specimens/specimen-layout';

/** What the review's comparison panels read: the engine's result, how to write its numbers, and the pairs to plot. */
export interface ComparisonView {
  result: ComparisonFindingsResult;
  units: Units;
  /** Null while the rows are not those analysed (the plots then say so instead of drawing other data). */
  points: PlotPoint[] | null;
}

/**
 * The comparison findings of a finished analysis, for a kind whose view shows them with the review's comparison panels
 * (KindView.reviewPanel); null for runs not done, or results of another shape.
 */
export function comparisonView(study: Study, analysis: Analysis | null, rows: readonly GridRow[], rowsReady: boolean): ComparisonView | null {
  if (analysis?.state !== 'done') return null;
  const result = asComparison(analysis.results);
  if (!result) return null;
  const points = analysis.current && rowsReady ? plotPoints(rows, result.differenceType) : null;
  return { result, units: unitsOf(study, result), points };
}
