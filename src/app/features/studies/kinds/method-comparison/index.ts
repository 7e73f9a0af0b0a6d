import { COMPARISON_LAYOUT } from '../../specimens/specimen-layout';
import type { KindView } from '../kind-view';
import { ComparisonSetupFields } from './comparison-setup-fields';
import { COMPARISON_GUIDANCE } from './guidance';
import { comparisonRows } from './plan-rows';

/** Method comparison: two instruments, pairs of results, regression and bias at the decision levels. */
export const methodComparisonView: KindView = {
  kind: 'method-comparison',
  setupFields: ComparisonSetupFields,
  setupPanel: () => import('./plan/plan-panel').then((m) => m.PlanPanel),
  guidance: COMPARISON_GUIDANCE,
  layout: COMPARISON_LAYOUT,
  findings: () => import('../../findings/comparison/comparison-findings').then((m) => m.ComparisonFindings),
  planRows: comparisonRows,
  reviewPanel: 'comparison-view',
};
