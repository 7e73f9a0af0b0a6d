import { INTERVAL_LAYOUT } from '../../intervals/interval-layout';
import { VERIFY_GUIDANCE } from '../../intervals/setup/interval-plans';
import { VerifySetupFields } from '../../intervals/setup/verify-setup-fields';
import type { KindView } from '../kind-view';
import { verifyRows } from './plan-rows';

/** Verifying a stated reference interval with 20 local individuals (its screens are shared with establishment in ../../intervals/). */
export const intervalVerifyView: KindView = {
  kind: 'interval-verify',
  setupFields: VerifySetupFields,
  setupPanel: () => import('../../intervals/setup/plan/transference-plan').then((m) => m.TransferencePlan),
  guidance: VERIFY_GUIDANCE,
  layout: INTERVAL_LAYOUT,
  findings: () => import('../../intervals/findings/verify-findings').then((m) => m.VerifyFindings),
  planRows: verifyRows,
  reviewPanel: 'own-panel',
};
