/** A result written with a decimal point or a decimal comma: "5.2", "5,2", "-0.4", ".5", "1e3". */
const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)(e[+-]?\d+)?$/i;

/** Whitespace a spreadsheet may leave around a value, non-breaking spaces included. */
function clean(text: string): string {
  return text.replace(/[\s\u00a0\u202f]+/g, ' ').trim();
}

/**
 * Reads a typed or pasted result. Returns null for an empty cell and NaN for text that is not a
 * number (e.g. "5,x", "<0.5", "1.234,5"), so the caller can tell "missing" from "wrong".
 */
export function parseResult(text: string): number | null {
  const value = clean(text);
  if (value === '') return null;
  return NUMBER.test(value) ? Number(value.replace(',', '.')) : Number.NaN;
}

/** True when the text reads as a number (decimal point or comma). */
export function isNumberText(text: string): boolean {
  return NUMBER.test(clean(text));
}

/**
 * A number typed with a decimal comma, rewritten with a point and its decimals kept ("5,20" → "5.20").
 * Anything else comes back trimmed and otherwise as it was, so a typing error stays visible.
 */
export function normaliseDecimal(text: string): string {
  const value = clean(text);
  return NUMBER.test(value) ? value.replace(',', '.') : value;
}
