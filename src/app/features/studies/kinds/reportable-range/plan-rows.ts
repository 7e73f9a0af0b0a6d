import type { RangeLevel } from '@shared/kinds/reportable-range/meta';
import { levelLabel } from '@shared/types/findings-numbers';
import { plural } from '@shared/types/plural';
import { type PlanRow, type PlanStudy, orNone, unitOf, withUnit } from '../plan-parts';
import { RANGE_RULES } from './guidance';
import { type RangeOwn, pooledValue, rangeOwn } from './own-settings';
import { MIN_LEVELS } from './settings-controls';

/** A value as entered, with the unit: "12.5 mmol/L". */
const entered = (value: number, unit: string): string => withUnit(String(value), unit);

/** "Assigned value 12.5 mmol/L", or "Fraction 0.25 of the high pool (8.5 mmol/L from the pools)". */
function levelText(l: RangeLevel, own: RangeOwn, unit: string): string {
  if (l.assigned !== null) return `Assigned value ${entered(l.assigned, unit)}`;
  if (l.fraction === null) return 'No value given';
  const pooled = pooledValue(l.fraction, own.poolLow, own.poolHigh);
  return `Fraction ${l.fraction} of the high pool${pooled === null ? '' : ` (${entered(Number(pooled.toPrecision(12)), unit)} from the pools)`}`;
}

/** How the levels are given: "5 levels, as assigned values" / "as fractions of the high pool" / "as assigned values and fractions". */
function levelsSummary(levels: readonly RangeLevel[]): string {
  const fractions = levels.filter((l) => l.fraction !== null).length;
  const assigned = levels.filter((l) => l.assigned !== null).length;
  const as = fractions === 0 ? 'as assigned values' : assigned === 0 ? 'as fractions of the high pool' : 'as assigned values and fractions of the high pool';
  const few = levels.length < MIN_LEVELS ? `; at least ${MIN_LEVELS} are needed` : '';
  return `${plural(levels.length, 'level')}, ${as}${few}`;
}

/** "±0.3 mmol/L or ±5 % of the level, whichever is greater", as the engine applies the goal at each level. */
export function nonlinearityText(own: Pick<RangeOwn, 'allowableNonlinearity' | 'allowableNonlinearityPercent'>, unit: string): string | null {
  const absolute = own.allowableNonlinearity === null ? null : `±${entered(own.allowableNonlinearity, unit)}`;
  const percent = own.allowableNonlinearityPercent === null ? null : `±${own.allowableNonlinearityPercent} % of the level`;
  if (absolute && percent) return `${absolute} or ${percent}, whichever is greater`;
  return absolute ?? percent;
}

/**
 * A reportable-range study's plan: the levels (how they are given, then each with its assigned value or fraction), the
 * pools where fractions need them, the design (replicates per level, and the results that makes against those included),
 * the allowable nonlinearity with its source, the claimed measuring interval, α, the bootstrap of the deviations, the
 * outlier and acceptance rules, and the reagent lot.
 */
export function rangeRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const own = rangeOwn(s);
  const unit = unitOf(study);
  const levels: PlanRow[] = own.levels.length === 0
    ? [{ label: 'Levels', value: 'None named', missing: true }]
    : [
      { label: 'Levels', value: levelsSummary(own.levels), missing: own.levels.length < MIN_LEVELS },
      ...own.levels.map((l, i) => ({
        label: l.name.trim().toLowerCase() === `level ${i + 1}` ? l.name.trim() : `Level ${i + 1}: ${l.name}`,
        value: levelText(l, own, unit),
        missing: l.assigned === null && l.fraction === null,
      })),
    ];
  const fractions = own.levels.some((l) => l.fraction !== null);
  const pools: PlanRow[] = own.poolLow !== null && own.poolHigh !== null
    ? [{ label: 'Pools', value: `Low ${entered(own.poolLow, unit)}, high ${entered(own.poolHigh, unit)}` }]
    : fractions
      ? [{ label: 'Pools', value: 'Not given: the findings are drawn against the fraction, without recovery' }]
      : [];
  const planned = own.replicates * own.levels.length;
  const design = `${plural(own.replicates, 'replicate')} per level`;
  const goal = nonlinearityText(own, unit);
  const claimed = own.claimedLow !== null && own.claimedHigh !== null
    ? `${own.claimedLow} to ${entered(own.claimedHigh, unit)}`
    : null;
  return [
    ...levels,
    ...pools,
    {
      label: 'Results',
      value: own.levels.length === 0 ? `${design}; ${study.n} included` : `${design}: ${planned} planned for ${plural(own.levels.length, 'level')}; ${study.n} included`,
      missing: study.n < planned,
    },
    { label: 'Allowable nonlinearity', value: goal ?? 'Not set: no verdict can be given', missing: goal === null },
    { label: 'Source of the allowable nonlinearity', value: orNone(own.nonlinearitySource) },
    { label: 'Claimed measuring interval', value: claimed ?? 'Not given', missing: claimed === null },
    { label: 'Significance level', value: `α = ${own.alpha}, for the t-test of each polynomial's top coefficient` },
    {
      label: 'Bootstrap',
      value: `${s.resamples.toLocaleString('en-GB')} resamples of the replicates within each level, percentile ${levelLabel(s.confidenceLevel)} CIs of the deviations, seed ${s.seed}`,
    },
    { label: 'Outlier rule', value: orNone(s.outlierRule) },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule, RANGE_RULES.acceptanceRule) },
    { label: 'Lots', value: s.reagentLot.trim() ? `reagent lot ${s.reagentLot.trim()}` : 'Not given' },
  ];
}
