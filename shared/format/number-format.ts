/**
 * How numbers are written, on screen, in the PDF and in the spreadsheets alike: the one home of the rules (the
 * client's src/app/features/studies/findings/comparison/number-format.ts and the report's server/reports/format.ts
 * only re-export or wrap these; shared/types/findings-numbers.ts adds the findings' decimals and re-exports them).
 *
 * - a value: fixed decimals, a true minus sign (U+2212), no sign on a rounded zero, "—" when there is none;
 * - a CI: "a to b", "not available" when it could not be formed; a p-value: three decimals, "< 0.001" below;
 * - a share set by a person (a confidence level, a target, a limit, a true share outside): up to two decimals of a
 *   percent, trailing zeros dropped ("95%", "97.5%", "1.25%");
 * - a chance computed (a probability, the share of simulated studies, a coverage): one decimal of a percent, kept
 *   ("67.7%", "37.0%"), and never a rounded certainty: "> 99.9%" just short of 1, "< 0.1%" just above 0;
 * - a count: a whole number with a comma between thousands ("2,000").
 */

export const MINUS = '\u2212';
/** A number that is not there: "—". */
export const NOT_AVAILABLE = '—';
/** A CI that could not be formed, in a table cell. */
export const CI_NOT_AVAILABLE = 'not available';

type Range = readonly [number, number];

/** A number with a fixed number of decimals and a true minus sign; a rounded zero has no sign; "—" when there is none. */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_AVAILABLE;
  const text = value.toFixed(decimals);
  if (/^-0(\.0+)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}

/** A confidence interval: "−0.12 to 0.31"; "not available" when it could not be formed. */
export function formatCi(ci: Range | null | undefined, decimals: number): string {
  if (!ci) return CI_NOT_AVAILABLE;
  return `${formatNumber(ci[0], decimals)} to ${formatNumber(ci[1], decimals)}`;
}

/** A p-value: three decimals, or "< 0.001"; "—" when the test was not run. */
export function formatP(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return NOT_AVAILABLE;
  return p < 0.001 ? '< 0.001' : p.toFixed(3);
}

/** A p-value inside a sentence: "p = 0.420", "p < 0.001". */
export function pInWords(p: number | null | undefined): string {
  const text = formatP(p);
  return text.startsWith('<') ? `p ${text}` : `p = ${text}`;
}

/** A confidence level as a percentage label: 0.95 → "95%", 0.975 → "97.5%" (a share set by a person: formatPercent). */
export function levelLabel(level: number): string {
  return formatPercent(level);
}

/** A value and its unit: "0.12 mmol/L"; the value alone when the unit is empty or the value is missing. */
export function withUnit(text: string, unit: string): string {
  return unit && text !== NOT_AVAILABLE ? `${text} ${unit}` : text;
}

/** An estimate with its unit and its CI, for a crowded cell: "0.20 mmol/L (0.10 to 0.30)", "0.20 mmol/L (CI not available)". */
export function estimateWithCi(e: { estimate: number | null; ci: Range | null } | null | undefined, decimals: number, unit: string): string {
  const ci = e?.ci ? formatCi(e.ci, decimals) : `CI ${CI_NOT_AVAILABLE}`;
  return `${withUnit(formatNumber(e?.estimate, decimals), unit)} (${ci})`;
}

/** A share set by a person, as a percentage with up to two decimals, trailing zeros dropped: 0.95 → "95%", 0.0125 → "1.25%"; "—" when missing. */
export function formatPercent(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return NOT_AVAILABLE;
  const text = String(Number((fraction * 100).toFixed(2)));
  return `${text.startsWith('-') ? MINUS + text.slice(1) : text}%`;
}

/**
 * A computed chance as a percentage to one decimal: 0.677 → "67.7%", 0.37 → "37.0%". A chance short of 1 (above 0)
 * that would round to 100.0% (0.0%) is written "> 99.9%" ("< 0.1%"), so no rounding reads as certainty; "—" when missing.
 */
export function formatChance(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return NOT_AVAILABLE;
  if (p < 1 && p >= 0.9995) return '> 99.9%';
  if (p > 0 && p < 0.0005) return '< 0.1%';
  return `${formatNumber(100 * p, 1)}%`;
}

/** A count: a whole number, rounded, with a comma between thousands: 2000 → "2,000"; "—" when missing. */
export function formatCount(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return NOT_AVAILABLE;
  const text = Math.round(n).toLocaleString('en-US');
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}
