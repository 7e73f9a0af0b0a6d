/**
 * How findings write their numbers, on the findings pages, in the PDF and in the full-record workbook alike:
 * one rule for the decimals of each kind of estimate and one way to write a number, a CI and a p-value.
 * The client's number-format.ts and the report's format.ts are thin wrappers of these. The writing of a number
 * itself is shared/format/number-format.ts's; this file adds the decimals of each kind of finding.
 */

// How a number, a CI, a p-value, a percentage and a unit are written lives in shared/format/number-format.ts;
// re-exported here so the findings' users keep one import.
export {
  CI_NOT_AVAILABLE, MINUS, NOT_AVAILABLE, estimateWithCi, formatChance, formatCi, formatCount, formatNumber, formatP, formatPercent,
  levelLabel, pInWords, withUnit,
} from '../format/number-format';

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
