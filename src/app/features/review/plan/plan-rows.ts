import type { Study, StudySettings } from '../../../../../shared/schemas';
import { formatNumber, levelLabel } from '../../studies/findings/comparison/number-format';
import { METHOD_WORDS } from '../../studies/intervals/findings/interval-wording';
import { percentileWords } from '../../studies/intervals/setup/percentile-choices';
import { DIFFERENCE_LABELS, INTERVAL_LABELS, REGRESSION_LABELS, usesDemingRatio } from '../../studies/study-text';

/** One line of the plan: what was fixed before the data, in words; `missing` marks what sign-off needs but is not set. */
export interface PlanRow {
  label: string;
  value: string;
  missing?: boolean;
}

type PlanStudy = Pick<Study, 'kind' | 'n' | 'settings' | 'analyteUnit'>;

const unitOf = (study: PlanStudy): string => study.settings.unit || study.analyteUnit;
const withUnit = (text: string, unit: string): string => (unit ? `${text} ${unit}` : text);
const orNone = (text: string, none = 'Not given'): string => (text.trim() === '' ? none : text);

/** "±0.3 mmol/L or ±5 % of the decision level, whichever is greater", as the engine applies the goal. */
export function allowableBiasText(s: StudySettings, unit: string): string {
  const absolute = s.allowableBiasAbsolute === null ? null : withUnit(`±${formatNumber(s.allowableBiasAbsolute, s.decimals + 1)}`, unit);
  const percent = s.allowableBiasPercent === null ? null : `±${s.allowableBiasPercent} % of the decision level`;
  if (absolute && percent) return `${absolute} or ${percent}, whichever is greater`;
  return absolute ?? percent ?? 'Not set: no verdict can be given';
}

function specimensRow(study: PlanStudy): PlanRow {
  const planned = study.settings.plannedSpecimens;
  const value = planned === null ? `Not planned; ${study.n} included` : `${planned} planned; ${study.n} included`;
  return { label: 'Specimens', value, missing: planned !== null && study.n < planned };
}

function comparisonRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const unit = unitOf(study);
  const levels = s.decisionLevels.map((l) => formatNumber(l, s.decimals)).join('; ');
  const noGoal = s.allowableBiasAbsolute === null && s.allowableBiasPercent === null;
  return [
    { label: 'Medical decision levels', value: levels ? withUnit(levels, unit) : 'None set', missing: !levels },
    { label: 'Allowable bias', value: allowableBiasText(s, unit), missing: noGoal },
    { label: 'Source of the allowable bias', value: orNone(s.allowableBiasSource), missing: s.allowableBiasSource.trim() === '' },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule) },
    { label: 'Outlier rule', value: orNone(s.outlierRule) },
    specimensRow(study),
    { label: 'Difference', value: DIFFERENCE_LABELS[s.differenceType] },
    { label: 'Regression', value: REGRESSION_LABELS[s.regression] + (usesDemingRatio(s.regression) ? `, error ratio λ = ${s.demingRatio}` : '') },
  ];
}

function verifyRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const stated = s.statedLower === null || s.statedUpper === null ? 'Not set' : withUnit(`${s.statedLower} to ${s.statedUpper}`, unitOf(study));
  return [
    { label: 'Stated reference interval', value: stated, missing: stated === 'Not set' },
    { label: 'Source of the stated interval', value: orNone(s.statedSource), missing: s.statedSource.trim() === '' },
    { label: 'Reference population', value: orNone(s.populationDescription) },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule) },
    specimensRow(study),
  ];
}

function establishRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const partitions = s.partitionFields.map((f) => (f === 'sex' ? 'sex' : 'age band')).join(', ');
  return [
    { label: 'Reference population', value: orNone(s.populationDescription), missing: s.populationDescription.trim() === '' },
    { label: 'Percentiles', value: percentileWords(s.percentiles) },
    { label: 'Method', value: METHOD_WORDS[s.intervalMethod] ?? s.intervalMethod },
    { label: 'Partitions tested', value: partitions || 'None' },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule) },
    specimensRow(study),
  ];
}

/** The plan and acceptance criteria of a study, kind by kind, then the settings of the engine. */
export function planRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const rows = study.kind === 'method-comparison' ? comparisonRows(study) : study.kind === 'interval-verify' ? verifyRows(study) : establishRows(study);
  const engine = `${s.resamples.toLocaleString('en-GB')} resamples, ${INTERVAL_LABELS[s.interval].toLowerCase()}, ${levelLabel(s.confidenceLevel)} CIs, seed ${s.seed}`;
  return [...rows, { label: 'Bootstrap', value: engine }];
}
