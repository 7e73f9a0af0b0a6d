/**
 * How findings write their numbers, on the findings pages, in the PDF and in the full-record workbook alike:
 * one rule for the decimals of each kind of estimate and one way to write a number, a CI and a p-value.
 * The client's number-format.ts and the report's format.ts are thin wrappers of these.
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

/** A confidence level as a percentage label: 0.95 → "95%", 0.975 → "97.5%". */
export function levelLabel(level: number): string {
  return `${Number((level * 100).toFixed(1))}%`;
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

/** The decimals of each kind of number in the findings. */
export interface FindingsDecimals {
  /** Results as reported, decision levels and stated limits: the study's decimals. */
  value: number;
  /** Estimates in result units (intercept, predicted bias, reference limits, allowable bias): one decimal more. */
  stat: number;
  /** Differences (bias, SD, limits of agreement): like `stat` in result units; two decimals for percent differences. */
  difference: number;
  /** The slope: three decimals, so a tenth of a percent per unit shows. */
  slope: number;
  /** A percentage derived from an estimate (the slope's "x% higher", bias %): one decimal, a tenth of a percent as the slope. */
  percent: number;
  /** Pearson r. */
  correlation: number;
}

export const SLOPE_DECIMALS = 3;
export const PERCENT_DECIMALS = 1;
export const CORRELATION_DECIMALS = 4;
export const PERCENT_DIFFERENCE_DECIMALS = 2;

/**
 * The one rule: `decimals` is the study's (the analyte's, unless the study changed it; 1 when unset) and
 * `differenceType` the comparison's ('absolute' for the interval kinds).
 */
export function findingsDecimals(decimals: number | null | undefined, differenceType: string = 'absolute'): FindingsDecimals {
  const value = typeof decimals === 'number' && Number.isInteger(decimals) && decimals >= 0 ? decimals : 1;
  const stat = value + 1;
  return {
    value, stat,
    difference: differenceType === 'absolute' ? stat : PERCENT_DIFFERENCE_DECIMALS,
    slope: SLOPE_DECIMALS, percent: PERCENT_DECIMALS, correlation: CORRELATION_DECIMALS,
  };
}

/** A spreadsheet number format showing `decimals` decimals: 0 → "0", 2 → "0.00". */
export function numberFormat(decimals: number): string {
  return decimals > 0 ? `0.${'0'.repeat(decimals)}` : '0';
}

/** The spreadsheet format of a p-value, written as formatP writes it: three decimals, "< 0.001" below that. */
export const P_VALUE_FORMAT = '[<0.001]"< 0.001";0.000';
