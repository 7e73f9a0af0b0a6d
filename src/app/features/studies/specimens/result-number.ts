import { DecimalMark, looksLikeNumber, readResult } from '@shared/schemas/result-text';

/**
 * Results in the grid, read by the parser the server uses (shared/schemas/result-text.ts) with the
 * study's decimal mark, so the grid marks exactly the cells the server would refuse. A result that
 * reads is kept as its reported text written with the study's mark ("5,20" in a study that writes a
 * comma, "5.20" otherwise) and no thousands separators, so it reads back to the same number.
 */

/** Whitespace a spreadsheet may leave around a value, non-breaking spaces included. */
function clean(text: string): string {
  return text.replace(/[\s\u00a0\u202f]+/g, ' ').trim();
}

/**
 * Reads a typed or pasted result as the server will. Returns null for an empty cell and NaN for text
 * the server refuses (e.g. "5,x", "<0.5", "1e309", and "1,234" unless the study says which mark is the
 * decimal), so the caller can tell "missing" from "wrong".
 */
export function parseResult(text: string, mark: DecimalMark = 'auto'): number | null {
  const read = readResult(clean(text), mark);
  return 'error' in read ? Number.NaN : read.value;
}

/** Why the server would refuse a result, in words that follow the field's name (`"1,234" is unclear: …`); null when it reads. */
export function resultProblem(text: string, mark: DecimalMark = 'auto'): string | null {
  const read = readResult(clean(text), mark);
  return 'error' in read ? read.error : null;
}

/** True when the text has the shape of a number, readable or not ("1,234" too): a header line has none. */
export function isNumberText(text: string): boolean {
  return looksLikeNumber(clean(text));
}

/** A reported text (decimal point) as the grid writes it in a study whose decimal mark is `mark`. */
export function shownWith(text: string, mark: DecimalMark): string {
  return mark === 'comma' ? text.replace('.', ',') : text;
}

/**
 * A typed or pasted result as the grid keeps it: when it reads, its reported text with the study's
 * decimal mark ("1.234,50" → "1234,50" where the mark is a comma; "5,20" → "5.20" where it is detected).
 * Anything else comes back trimmed and otherwise as it was, so a typing error stays visible.
 */
export function normaliseDecimal(text: string, mark: DecimalMark = 'auto'): string {
  return rewriteForMark(text, mark, mark);
}

/**
 * A cell written for one decimal mark, rewritten for another (the stored text is written for 'point';
 * the study's mark may change while rows are on screen): the same number, in the new writing. Text that
 * does not read stays as it was, and is then judged by the new mark.
 */
export function rewriteForMark(text: string, from: DecimalMark, to: DecimalMark): string {
  const value = clean(text);
  const read = readResult(value, from);
  return 'error' in read || read.text === null ? value : shownWith(read.text, to);
}

/**
 * The number of a grid cell for drawing a plot. A cell that reads is written with one decimal mark and no
 * thousands separators, so a comma in it is the decimal mark; anything else is NaN (empty is null).
 */
export function gridNumber(text: string): number | null {
  return parseResult(text, text.includes(',') ? 'comma' : 'point');
}
