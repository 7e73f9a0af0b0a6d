import type { Study } from '@shared/schemas';
import { formatNumber } from '../../findings/comparison/number-format';
import { withUnit } from '../../findings/comparison/comparison-result';

/** How interval findings write a value: the study's decimals plus `extra` (one for estimated limits), with its unit. */
export function valueFormat(study: Pick<Study, 'settings' | 'analyteUnit'>, extra = 1): { decimals: number; unit: string; label: (v: number) => string } {
  const decimals = study.settings.decimals + extra;
  const unit = study.settings.unit || study.analyteUnit;
  return { decimals, unit, label: (v) => withUnit(formatNumber(v, decimals), unit) };
}
