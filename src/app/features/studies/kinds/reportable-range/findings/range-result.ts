import { rangeFormat as formatOf, type RangeFormat } from '@shared/kinds/reportable-range/words';
import type { Study } from '@shared/schemas';
import type { RangeResult } from '@shared/stats/reportable-range-types';

/** A reportable-range study's results as the API returns them, or null for results of another kind. */
export function asRange(results: unknown): RangeResult | null {
  const r = results as Partial<RangeResult> | null | undefined;
  return r && typeof r === 'object' && r.kind === 'reportable-range' && Array.isArray(r.levels) && Array.isArray(r.fits) ? (r as RangeResult) : null;
}

/**
 * How this study's findings write their numbers (shared/kinds/reportable-range/words.ts, the PDF's rule too): the study's
 * unit, or the analyte's when the study sets none, and the study's decimals.
 */
export function rangeFormat(study: Pick<Study, 'settings' | 'analyteUnit'>): RangeFormat {
  return formatOf(study.settings.unit || study.analyteUnit || '', study.settings.decimals);
}
