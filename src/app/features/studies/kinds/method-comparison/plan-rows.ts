import { type PlanRow, type PlanStudy, allowableBiasText, bootstrapRow, orNone, specimensRow, unitOf, withUnit } from '../plan-parts';
import { formatNumber } from '../../findings/comparison/number-format';
import { DIFFERENCE_LABELS, REGRESSION_LABELS, usesDemingRatio } from '../../study-text';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';

const SHAPE_WORDS: Record<SamplePlan['shape'], string> = { uniform: 'even across the range', 'log-uniform': 'even on a log scale', 'earlier-study': 'as in an earlier comparison' };

/** The plan by simulation in one line: the stated truth and the grid (its figures are on Setup and in the PDF). */
export function samplePlanText(plan: SamplePlan | null | undefined, unit: string): string {
  if (!plan) return 'Not set';
  const imprecision = plan.errorModel === 'proportional'
    ? `CV ${plan.cvComparative}% (comparative) and ${plan.cvCandidate}% (candidate)`
    : `SD ${withUnit(String(plan.cvComparative), unit)} (comparative) and ${withUnit(String(plan.cvCandidate), unit)} (candidate)`;
  const values = plan.shape === 'earlier-study' ? `values ${SHAPE_WORDS[plan.shape]} (study ${plan.earlierStudyId})` : `values ${plan.low} to ${withUnit(String(plan.high), unit)}, ${SHAPE_WORDS[plan.shape]}`;
  return `${imprecision}; ${values}; n = ${plan.n.join(', ')}; ${plan.simulations.toLocaleString('en-US')} simulated studies each; ` +
    `targets ${Math.round(plan.targetPower * 100)}% power, at most ${Math.round(plan.maxFalsePass * 1000) / 10}% false passes`;
}

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
    { label: 'Plan by simulation', value: samplePlanText((s as { samplePlan?: SamplePlan | null }).samplePlan, unit) },
  ];
}
