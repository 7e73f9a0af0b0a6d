import type { Study } from '@shared/schemas';
import { allowableBiasText, unitOf } from '../../plan-parts';
import { formatNumber, levelLabel } from '../../../findings/comparison/number-format';
import { REGRESSION_LABELS, usesDemingRatio } from '../../../study-text';

/** One setting the plan takes from the saved Setup, in words. */
export interface SetupFact {
  label: string;
  value: string;
  /** True when the plan cannot run without it. */
  missing: boolean;
}

/** What the simulation takes from the saved Setup: the analysis as planned and the goal it is judged against. */
export function fromSetup(study: Pick<Study, 'settings' | 'analyteUnit' | 'kind' | 'n'>): SetupFact[] {
  const s = study.settings;
  const unit = unitOf(study);
  const levels = s.decisionLevels.map((l) => formatNumber(l, s.decimals)).join('; ');
  const noGoal = s.allowableBiasAbsolute === null && s.allowableBiasPercent === null;
  return [
    { label: 'Regression', value: REGRESSION_LABELS[s.regression] + (usesDemingRatio(s.regression) ? `, error ratio λ = ${s.demingRatio}` : ''), missing: false },
    { label: 'Medical decision levels', value: levels ? `${levels}${unit ? ` ${unit}` : ''}` : 'None set', missing: !levels },
    { label: 'Allowable bias', value: allowableBiasText(s, unit), missing: noGoal },
    { label: 'CIs of the bias', value: `${levelLabel(s.confidenceLevel)}, results rounded to ${s.decimals} ${s.decimals === 1 ? 'decimal' : 'decimals'}, seed ${s.seed}`, missing: false },
  ];
}
