import { INTERVAL_LAYOUT } from '../../intervals/interval-layout';
import { EstablishSetupFields } from '../../intervals/setup/establish-setup-fields';
import { ESTABLISH_GUIDANCE } from '../../intervals/setup/interval-plans';
import type { KindView } from '../kind-view';
import { establishRows } from './plan-rows';

/** Establishing a reference interval from reference individuals (its screens are shared with verification in ../../intervals/). */
export const intervalEstablishView: KindView = {
  kind: 'interval-establish',
  setupFields: EstablishSetupFields,
  setupPanel: () => import('../../intervals/setup/plan/establish-plan').then((m) => m.EstablishPlan),
  guidance: ESTABLISH_GUIDANCE,
  layout: INTERVAL_LAYOUT,
  findings: () => import('../../intervals/findings/establish-findings').then((m) => m.EstablishFindings),
  planRows: establishRows,
  reviewPanel: 'own-panel',
};
