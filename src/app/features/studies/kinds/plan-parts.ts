import type { Study, StudySettings } from '@shared/schemas';
import { formatNumber, levelLabel } from '../findings/comparison/number-format';
import { INTERVAL_LABELS } from '../study-text';

/** One line of the plan: what was fixed before the data, in words; `missing` marks what sign-off needs but is not set. */
export interface PlanRow {
  label: string;
  value: string;
  missing?: boolean;
}

/** What a kind's plan rows read of a study. */
export type PlanStudy = Pick<Study, 'kind' | 'n' | 'settings' | 'analyteUnit'>;

/** The parts of the plan several kinds write the same way; each kind's plan rows are in its folder (studies/kinds/<kind>/). */
export const unitOf = (study: PlanStudy): string => study.settings.unit || study.analyteUnit;
export const withUnit = (text: string, unit: string): string => (unit ? `${text} ${unit}` : text);
export const orNone = (text: string, none = 'Not given'): string => (text.trim() === '' ? none : text);

/** "±0.3 mmol/L or ±5 % of the decision level, whichever is greater", as the engine applies the goal. */
export function allowableBiasText(s: StudySettings, unit: string): string {
  const absolute = s.allowableBiasAbsolute === null ? null : withUnit(`±${formatNumber(s.allowableBiasAbsolute, s.decimals + 1)}`, unit);
  const percent = s.allowableBiasPercent === null ? null : `±${s.allowableBiasPercent} % of the decision level`;
  if (absolute && percent) return `${absolute} or ${percent}, whichever is greater`;
  return absolute ?? percent ?? 'Not set: no verdict can be given';
}

/** The planned and included count; missing while fewer are included than planned. */
export function specimensRow(study: PlanStudy): PlanRow {
  const planned = study.settings.plannedSpecimens;
  const value = planned === null ? `Not planned; ${study.n} included` : `${planned} planned; ${study.n} included`;
  return { label: 'Specimens', value, missing: planned !== null && study.n < planned };
}

/** The bootstrap's settings: resamples, interval, level and seed. */
export function bootstrapRow(study: PlanStudy): PlanRow {
  const s = study.settings;
  return { label: 'Bootstrap', value: `${s.resamples.toLocaleString('en-GB')} resamples, ${INTERVAL_LABELS[s.interval].toLowerCase()}, ${levelLabel(s.confidenceLevel)} CIs, seed ${s.seed}` };
}
