/**
 * How the findings pages write numbers: the one rule the PDF and the full-record workbook use too
 * (shared/format/number-format.ts; the findings' decimals from shared/types/findings-numbers.ts), so the screen
 * and the report print the same decimals and words.
 */
export { estimateWithCi, formatChance, formatCi, formatCount, formatNumber, formatP, formatPercent, levelLabel } from '@shared/format/number-format';
export { findingsDecimals } from '@shared/types/findings-numbers';
