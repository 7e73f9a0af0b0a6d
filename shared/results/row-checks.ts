import type { RowField } from '../kinds/kind';
import { readResult, type DecimalMark } from '../schemas/result-text';

/**
 * The checks of one entered, pasted or imported row, for both sides: the server applies them when it saves
 * rows (server/specimens/row-validation.ts) and when it refuses to analyse (server/analyses/analysis-rows.ts);
 * the grid marks the same cells with the same words before it sends them (src/app/features/studies/specimens/
 * row-validation.ts). Results are read by the one parser, shared/schemas/result-text.ts.
 *
 * The rules:
 * - a result is read exactly or refused ("<0.5" is censored, "1,234" is unclear where the study detects the mark,
 *   "1.2.3" and "NaN" are not numbers); "-0" reads as 0; empty (or only spaces) is no result, never an error;
 * - a result below zero is refused where the analyte cannot be negative;
 * - an integer field takes a whole number from 1; a sex field F or M (female, male, w; any case) or nothing;
 * - saving takes a row with an empty result (the grid saves as it is typed), but an INCLUDED row with a field its
 *   kind requires left empty cannot be analysed: "the candidate result is empty; fill it or exclude the row with a
 *   reason" (an excluded row needs nothing but its reason);
 * - an excluded row needs a reason.
 */

/** What a study allows in its rows. */
export interface RowRules {
  /** False when the analyte cannot be below zero (Study.canBeNegative). */
  canBeNegative: boolean;
  /** How results are read (the study's settings.decimalMark). */
  decimalMark: DecimalMark;
}

/** A field read: the value to store (a result with its text as reported), or why it is refused, in words that follow the field's name. */
export type FieldReading = { value: string | number | null; text: string | null } | { error: string };

/** The words of a refused field or row, for a sentence that names the field first: "is negative, which this analyte cannot be". */
export const NEGATIVE_WORDS = 'is negative, which this analyte cannot be';
export const SEX_WORDS = 'must be F or M (or empty)';
export const EXCLUDED_WITHOUT_REASON = 'excluded without a reason; give the reason';

/** Reads one field of a row by its type (RowField.type), as saving stores it. */
export function readField(f: Pick<RowField, 'type' | 'column' | 'emptyIsNull'>, input: unknown, rules: RowRules): FieldReading {
  switch (f.type) {
    case 'result': {
      const read = readResult(input, rules.decimalMark);
      if ('error' in read) return read;
      if (read.value !== null && read.value < 0 && !rules.canBeNegative) return { error: NEGATIVE_WORDS };
      return read;
    }
    case 'integer': {
      const text = asText(input);
      if (text === '') return { value: null, text: null };
      if (!/^\d{1,6}$/.test(text) || Number(text) < 1) return { error: `"${text}" must be a whole number from 1` };
      return { value: Number(text), text: null };
    }
    case 'sex': {
      const sex = sexOf(input);
      return sex === 'invalid' ? { error: SEX_WORDS } : { value: sex, text: null };
    }
    default: {
      const text = asText(input);
      return { value: text === '' ? (f.emptyIsNull || !f.column ? null : '') : text, text: null };
    }
  }
}

/** A refused field in a sentence: "candidate result "<0.5" is censored …". */
export const fieldProblem = (f: Pick<RowField, 'words'>, error: string): string => `${f.words} ${error}`;

/** Nothing entered: null, undefined, only spaces, or a number that is not finite. */
export function isEmptyEntry(v: unknown): boolean {
  return v === null || v === undefined || (typeof v === 'string' && v.trim() === '') || (typeof v === 'number' && !Number.isFinite(v));
}

/** Why an included row cannot be analysed without this field. */
export const emptyRequiredWords = (f: Pick<RowField, 'words'>): string => `the ${f.words} is empty; fill it or exclude the row with a reason`;

/** The fields an analysis needs that the row leaves empty; none when the row is excluded. */
export function emptyRequired<F extends Pick<RowField, 'required'>>(fields: readonly F[], valueOf: (f: F) => unknown, excluded: boolean): F[] {
  return excluded ? [] : fields.filter((f) => f.required && isEmptyEntry(valueOf(f)));
}

/** True when a row is excluded without a reason (spaces are no reason). */
export function lacksReason(excluded: unknown, reason: unknown): boolean {
  return excluded === true && asText(reason) === '';
}

function asText(v: unknown): string {
  return v === null || v === undefined ? '' : String(v).trim();
}

/** F for F, FEMALE or W; M for M or MALE (any case); null for nothing; 'invalid' otherwise. */
function sexOf(v: unknown): string | null {
  const t = asText(v).toUpperCase();
  if (!t) return null;
  if (['F', 'FEMALE', 'W'].includes(t)) return 'F';
  if (['M', 'MALE'].includes(t)) return 'M';
  return 'invalid';
}
