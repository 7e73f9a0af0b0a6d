import { precisionFormat as formatOf, type PrecisionFormat } from '@shared/kinds/precision/words';
import type { Study } from '@shared/schemas';
import type { PrecisionResult } from '@shared/stats/precision-types';

/** A precision verification's results as the API returns them, or null for results of another kind. */
export function asPrecision(results: unknown): PrecisionResult | null {
  const r = results as Partial<PrecisionResult> | null | undefined;
  return r && typeof r === 'object' && r.kind === 'precision' && Array.isArray(r.materials) ? (r as PrecisionResult) : null;
}

/**
 * How this study's precision findings write their numbers (shared/kinds/precision/words.ts, the PDF's rule too):
 * the study's unit, or the analyte's when the study sets none, and the study's decimals.
 */
export function precisionFormat(study: Pick<Study, 'settings' | 'analyteUnit'>): PrecisionFormat {
  return formatOf(study.settings.unit || study.analyteUnit || '', study.settings.decimals);
}
