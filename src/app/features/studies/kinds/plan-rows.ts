import { kindView } from '.';
import type { PlanRow, PlanStudy } from './plan-parts';

export { allowableBiasText, type PlanRow, type PlanStudy } from './plan-parts';

/** The plan and acceptance criteria of a study, as its kind writes them (its view's planRows), then the settings of its engine. */
export function planRows(study: PlanStudy): PlanRow[] {
  return kindView(study.kind).planRows(study);
}
