import type { KindView } from '../kind-view';
import { PRECISION_GUIDANCE } from './guidance';
import { PRECISION_LAYOUT } from './layout';
import { precisionRows } from './plan-rows';
import { PrecisionSetupFields } from './precision-setup-fields';
import { precisionControls } from './settings-controls';

/** Precision verification: days × replicates per material against the manufacturer's claims (CLSI EP15 practice). */
export const precisionView: KindView = {
  kind: 'precision',
  setupFields: PrecisionSetupFields,
  guidance: PRECISION_GUIDANCE,
  layout: PRECISION_LAYOUT,
  findings: () => import('./findings/precision-findings').then((m) => m.PrecisionFindings),
  planRows: precisionRows,
  reviewPanel: 'own-panel',
  settingsControls: precisionControls,
};
