/**
 * Number formats of the report: the one rule of shared/format/number-format.ts, so the PDF
 * prints what the findings page shows: a fixed number of decimals, a true minus sign (U+2212), an em dash
 * for a value that is not available, "not available" for a CI that could not be formed, p-values to three
 * decimals with a floor of "< 0.001".
 */
import { estimateWithCi, formatChance, formatCi, formatCount, formatNumber, formatP, formatPercent, NOT_AVAILABLE, withUnit as unitAfter } from '@shared/format/number-format';

export { NOT_AVAILABLE };

export const num = (value: number | null | undefined, decimals: number): string => formatNumber(value, decimals);

/** A CI, "a to b"; "not available" when it could not be formed. */
export const range = (interval: readonly [number, number] | null | undefined, decimals: number): string => formatCi(interval, decimals);

export const pValue = (p: number | null | undefined): string => formatP(p);

/** A share set by a person as a percentage without trailing zeros: 0.95 → "95%", 0.975 → "97.5%" (formatPercent). */
export const percent = (fraction: number | null | undefined): string => formatPercent(fraction);

/** A computed chance to one decimal, never a rounded certainty: 0.677 → "67.7%", 0.9996 → "> 99.9%" (formatChance). */
export const chance = (p: number | null | undefined): string => formatChance(p);

/** A value and its unit, or the value alone when the unit is empty. */
export const withUnit = (text: string, unit: string): string => unitAfter(text, unit);

/** A count with a comma between thousands: 2000 → "2,000" (formatCount). */
export const integer = (value: number | null | undefined): string => formatCount(value);

export const orDash = (text: string | null | undefined): string => (text && text.trim() ? text : NOT_AVAILABLE);

/** "0.35 (0.21 to 0.40)": an estimate with its CI, and its unit when given, as the findings page writes it. */
export function withCi(e: { estimate: number | null; ci: readonly [number, number] | null } | null | undefined, decimals: number, unit = ''): string {
  return estimateWithCi(e, decimals, unit);
}
