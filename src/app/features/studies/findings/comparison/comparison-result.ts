import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import type { Study } from '@shared/schemas';
import type { ComparisonResult } from './engine-types';
import { stepWords as wordsOfStep, type StepWords } from '@shared/types/resolution-words';
import { findingsDecimals } from '@shared/types/findings-numbers';
import type { ComparisonUnits } from '@shared/types/findings-rows';

/**
 * The results of a method-comparison analysis as the API returns them: the engine's result
 * (shared/stats types; the figures are the server's stored run, never recomputed here) plus the grid positions
 * of the flagged outliers, which the server adds.
 */
export type ComparisonFindingsResult = ComparisonResult & { outlierPositions?: number[] };

export function asComparison(results: unknown): ComparisonFindingsResult | null {
  const r = results as Partial<ComparisonResult> | null;
  return r && r.kind === methodComparisonMeta.resultKind ? (r as ComparisonFindingsResult) : null;
}

/** How findings write their numbers: the unit of results and of differences, and the decimals of each. */
export interface Units {
  unit: string;
  /** The unit of a difference: the study's unit, or % for percent differences. */
  difference: string;
  decimals: number;
  differenceDecimals: number;
  percent: boolean;
}

export function unitsOf(study: Pick<Study, 'settings' | 'analyteUnit'>, result: Pick<ComparisonResult, 'differenceType'>): Units {
  const unit = study.settings.unit || study.analyteUnit;
  const d = findingsDecimals(study.settings.decimals, result.differenceType);
  const percent = result.differenceType !== 'absolute';
  return { unit, difference: percent ? '%' : unit, decimals: d.stat, differenceDecimals: d.difference, percent };
}

/** The same units in the shape of the shared wording (shared/types/findings-rows.ts), which the PDF uses too. */
export function sharedUnits(u: Units): ComparisonUnits {
  return { unit: u.unit, difference: u.difference, decimals: { ...findingsDecimals(u.decimals - 1), difference: u.differenceDecimals } };
}

/** A value with its unit: "0.12 mmol/L", "1.5 %". */
export function withUnit(text: string, unit: string): string {
  return unit ? `${text} ${unit}` : text;
}

/**
 * What the reporting step allows (DOMAIN.md, "Coarse results"): the words beside each estimate whose CI is
 * narrower than one step, keyed by its path; the rule to state once above the findings (null when no
 * estimate is limited); and the step of an estimate in words. Results stored before the engine reported
 * its step (engine 1.1.0) have no resolution, so all three say nothing.
 */
export function stepWords(result: Pick<ComparisonResult, 'resolution'>, u: Units): StepWords {
  return wordsOfStep(result.resolution, u.unit, u.difference);
}
