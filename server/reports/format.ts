/**
 * Number formats of the report: a fixed number of decimals, a true minus sign (U+2212), an em dash
 * for a value that is not available, p-values to three decimals with a floor of "< 0.001".
 */
export const NOT_AVAILABLE = '—';
const MINUS = '\u2212';

export function num(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_AVAILABLE;
  const text = value.toFixed(decimals);
  // -0.00 prints as 0.00: a rounded zero has no sign.
  if (/^-0(\.0+)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}

/** "a to b", or the dash when the interval is missing. */
export function range(interval: readonly [number, number] | null | undefined, decimals: number): string {
  if (!interval) return NOT_AVAILABLE;
  return `${num(interval[0], decimals)} to ${num(interval[1], decimals)}`;
}

export function pValue(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return NOT_AVAILABLE;
  return p < 0.001 ? '< 0.001' : p.toFixed(3);
}

/** A fraction as a percentage without trailing zeros: 0.95 → "95%", 0.975 → "97.5%". */
export function percent(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return NOT_AVAILABLE;
  return `${Number((fraction * 100).toFixed(2))}%`;
}

/** A value and its unit, or the value alone when the unit is empty. */
export function withUnit(text: string, unit: string): string {
  return unit && text !== NOT_AVAILABLE ? `${text} ${unit}` : text;
}

export function integer(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_AVAILABLE;
  return Math.round(value).toLocaleString('en-US');
}

export const orDash = (text: string | null | undefined): string => (text && text.trim() ? text : NOT_AVAILABLE);

/** "0.35 (0.21 to 0.40)": an estimate with its CI. */
export function withCi(e: { estimate: number | null; ci: readonly [number, number] | null } | null | undefined, decimals: number): string {
  return `${num(e?.estimate, decimals)} (${range(e?.ci, decimals)})`;
}
