/**
 * Number formats of the report: the findings' one rule (shared/types/findings-numbers.ts), so the PDF
 * prints what the findings page shows: a fixed number of decimals, a true minus sign (U+2212), an em dash
 * for a value that is not available, "not available" for a CI that could not be formed, p-values to three
 * decimals with a floor of "< 0.001".
 */
import { estimateWithCi, formatCi, formatNumber, formatP, NOT_AVAILABLE, withUnit as unitAfter } from '@shared/types/findings-numbers';

export { NOT_AVAILABLE };

export const num = (value: number | null | undefined, decimals: number): string => formatNumber(value, decimals);

/** A CI, "a to b"; "not available" when it could not be formed. */
export const range = (interval: readonly [number, number] | null | undefined, decimals: number): string => formatCi(interval, decimals);

export const pValue = (p: number | null | undefined): string => formatP(p);

/** A fraction as a percentage without trailing zeros: 0.95 → "95%", 0.975 → "97.5%". */
export function percent(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return NOT_AVAILABLE;
  return `${Number((fraction * 100).toFixed(2))}%`;
}

/** A value and its unit, or the value alone when the unit is empty. */
export const withUnit = (text: string, unit: string): string => unitAfter(text, unit);

export function integer(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_AVAILABLE;
  return Math.round(value).toLocaleString('en-US');
}

export const orDash = (text: string | null | undefined): string => (text && text.trim() ? text : NOT_AVAILABLE);

/** "0.35 (0.21 to 0.40)": an estimate with its CI, and its unit when given, as the findings page writes it. */
export function withCi(e: { estimate: number | null; ci: readonly [number, number] | null } | null | undefined, decimals: number, unit = ''): string {
  return estimateWithCi(e, decimals, unit);
}
