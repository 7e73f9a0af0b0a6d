import type { KindView } from '../kind-view';
import { RANGE_GUIDANCE } from './guidance';
import { RANGE_LAYOUT } from './layout';
import { rangeRows } from './plan-rows';
import { RangeSetupFields } from './range-setup-fields';
import { rangeControls } from './settings-controls';

/** Reportable range: linearity and recovery across the claimed measuring interval (CLSI EP06 practice). */
export const reportableRangeView: KindView = {
  kind: 'reportable-range',
  setupFields: RangeSetupFields,
  guidance: RANGE_GUIDANCE,
  layout: RANGE_LAYOUT,
  findings: () => import('./findings/range-findings').then((m) => m.RangeFindings),
  planRows: rangeRows,
  reviewPanel: 'own-panel',
  settingsControls: rangeControls,
};
