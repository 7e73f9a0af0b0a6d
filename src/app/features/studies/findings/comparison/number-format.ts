/**
 * How the findings pages write numbers: the one rule the PDF and the full-record workbook use too
 * (shared/types/findings-numbers.ts), so the screen and the report print the same decimals and words.
 */
export { formatCi, formatNumber, formatP, levelLabel, estimateWithCi, findingsDecimals } from '@shared/types/findings-numbers';
