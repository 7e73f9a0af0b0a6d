import { type PlanRow, type PlanStudy, allowableBiasText, bootstrapRow, orNone, specimensRow, unitOf, withUnit } from '../../../review/plan/plan-parts';
import { formatNumber } from '../../findings/comparison/number-format';
import { DIFFERENCE_LABELS, REGRESSION_LABELS, usesDemingRatio } from '../../study-text';

/** A comparison's plan: decision levels, the allowable bias and its source, the rules, the count, the difference and regression, the bootstrap. */
export function comparisonRows(study: PlanStudy): PlanRow[] {
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
    bootstrapRow(study),
  ];
}
