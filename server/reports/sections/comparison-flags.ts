import type { Layout } from '../layout';
import type { ComparisonFindings } from '../report-model';
import { warningsList } from './warnings';
import { nounFor } from '@shared/types/plural';
import { FLAG_IS_NOT_A_REASON, outlierRuleWords } from '@shared/types/findings-rows';

/** Outliers the engine flagged (never removed by it), the rule in the findings page's words, and the engine's warnings in full. */
export function comparisonFlags(layout: Layout, results: ComparisonFindings, flagged: number[]): void {
  layout.subheading('Possible outliers');
  const rule = outlierRuleWords(results.outlierTest);
  layout.paragraph(flagged.length
    ? `${rule}: ${nounFor(flagged.length, 'row')} ${flagged.join(', ')} flagged as ${nounFor(flagged.length, 'a possible outlier', 'possible outliers')}. ${FLAG_IS_NOT_A_REASON}`
    : `${rule}: no row flagged.`);
  warningsList(layout, results.warnings);
}
