/**
 * Reading a measured result exactly, or not at all. Client and server both use this one parser, so the
 * grid marks the same cells the server refuses (the row checks built on it: shared/results/row-checks.ts).
 * A value is refused (never changed silently) when it cannot be read exactly and unambiguously: "1,234"
 * where the study detects the decimal mark ('auto': a decimal comma or a thousands separator?; a study
 * that says its mark reads it as 1234 or 1.234), "1e309" (beyond the largest number), "1e-400" (would
 * become 0), "1.00000000000000000001" (more digits than a number keeps), "<0.5" (censored: a result
 * below or above a limit is not a number the statistics can use), "1.2.3" and "NaN" (not numbers).
 * Empty, or only spaces, is no result (null), never an error; "-0" reads as 0.
 */

/** How a study reads a comma and a point in typed, pasted and imported results. */
export const DECIMAL_MARKS = ['auto', 'point', 'comma'] as const;
export type DecimalMark = (typeof DECIMAL_MARKS)[number];

/** A result read: its number and its text as reported (decimal point, no thousands separators), or an error in words. */
export type ResultReading = { value: number | null; text: string | null } | { error: string };

/** Any decimal of up to 15 significant digits comes back unchanged from a double; 16 or more may not. */
export const MAX_SIGNIFICANT_DIGITS = 15;
/** The smallest normal double: closer to zero, digits are lost (subnormal) or the value becomes 0. */
const MIN_NORMAL = 2.2250738585072014e-308;

const EMPTY: ResultReading = { value: null, text: null };
/** Sign, digits with points and commas, exponent: the shape of anything that could be a number. */
const SHAPE = /^([+-]?)([\d.,]+)(?:[eE]([+-]?\d+))?$/;

interface Mantissa { int: string; frac: string }

/**
 * Reads a typed, pasted or imported result with the study's decimal mark: 'auto' reads a point as the
 * decimal mark and a comma only where it cannot separate thousands ("5,2", "0,234", "1,2345"); 'point'
 * reads a comma as a thousands separator ("1,234.5"), 'comma' a point ("1.234,5"). Empty is null.
 * The error words follow the field's name, e.g. `"1,234" is unclear: …`.
 */
export function readResult(input: unknown, mark: DecimalMark = 'auto'): ResultReading {
  if (input === null || input === undefined) return EMPTY;
  if (typeof input === 'number') return readNumber(input);
  if (typeof input !== 'string') return { error: 'is not a number' };
  // Spaces a spreadsheet leaves (tabs, non-breaking and narrow spaces) count as one, so both sides quote the same text.
  const t = input.replace(/\s+/g, ' ').trim();
  if (t === '') return EMPTY;
  if (/^[<>≤≥]/.test(t)) {
    return { error: `"${t}" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason` };
  }
  const shape = SHAPE.exec(t);
  if (!shape || !/\d/.test(shape[2])) return { error: `"${t}" is not a number` };
  const [, sign, body, exponent] = shape;
  const mantissa = mark === 'auto' ? autoMantissa(t, sign, body, exponent) : groupedMantissa(body, mark);
  if (!mantissa) return { error: `"${t}" is not a number as this study reads results: ${MARK_WORDS[mark as 'point' | 'comma']}` };
  if ('error' in mantissa) return mantissa;
  return exactly(t, textOf(sign, mantissa, exponent));
}

/**
 * True when the text has the shape of a number (digits, points, commas, an exponent), readable or not, censored
 * ("<0.5", "> 100") included: a result the row checks will name, never a header's word.
 */
export function looksLikeNumber(text: string): boolean {
  const shape = SHAPE.exec(text.trim().replace(/^[<>≤≥]=?\s*/, ''));
  return !!shape && /\d/.test(shape[2]);
}

const MARK_WORDS = {
  point: 'the decimal mark is a point, and a comma only separates thousands (as in 1,234.5)',
  comma: 'the decimal mark is a comma, and a point only separates thousands (as in 1.234,5)',
};
const CHOOSE = "or choose the decimal mark in the study's Setup";

/** A number given as a number (JSON, a spreadsheet cell): kept when finite, normal and short enough to write back exactly. */
function readNumber(n: number): ResultReading {
  if (!Number.isFinite(n)) return { error: 'is not a finite number' };
  const text = String(n).replace('e+', 'e');
  return exactly(text, text);
}

/** 'auto': a point is the decimal mark; a comma too, unless it may separate thousands; two separators are refused. */
function autoMantissa(t: string, sign: string, body: string, exponent: string | undefined): Mantissa | { error: string } {
  const separators = body.replace(/\d/g, '');
  if (separators.length === 0) return { int: body, frac: '' };
  if (separators.length === 1) {
    const [int, frac] = body.split(separators);
    if (separators === ',' && /^[1-9]\d{0,2}$/.test(int) && /^\d{3}$/.test(frac)) {
      const [decimal, thousands] = [textOf(sign, { int, frac }, exponent), textOf(sign, { int: int + frac, frac: '' }, exponent)];
      return { error: `"${t}" is unclear: it may be ${decimal} (a decimal comma) or ${thousands} (a comma separating thousands); write ${decimal} or ${thousands}, ${CHOOSE}` };
    }
    return { int, frac };
  }
  const readings = (['point', 'comma'] as const).map((m) => groupedMantissa(body, m)).filter((m): m is Mantissa => m !== null);
  if (readings.length !== 1) return { error: `"${t}" is not a number` };
  const plain = textOf(sign, readings[0], exponent);
  return { error: `"${t}" has a thousands separator, which is only read when the study says which mark is the decimal; write ${plain}, ${CHOOSE}` };
}

/**
 * 'point' or 'comma': at most one decimal mark, and the other mark only between proper groups of three
 * digits ("1,234,567.5"; never "12,34" or "0,234"). Null when the body does not read so.
 */
function groupedMantissa(body: string, mark: 'point' | 'comma'): Mantissa | null {
  const [decimal, group] = mark === 'point' ? ['.', ','] : [',', '.'];
  const parts = body.split(decimal);
  if (parts.length > 2) return null;
  const [int, frac = ''] = parts;
  if (!/^\d*$/.test(frac)) return null;
  if (/^\d*$/.test(int)) return { int, frac };
  const grouped = new RegExp(`^[1-9]\\d{0,2}(\\${group}\\d{3})+$`);
  return grouped.test(int) ? { int: int.split(group).join(''), frac } : null;
}

/** The text as reported, with a point: sign kept only when negative, no thousands separators, "e" exponent. */
function textOf(sign: string, m: Mantissa, exponent: string | undefined): string {
  const exp = exponent === undefined ? '' : `e${exponent.replace(/^\+/, '')}`;
  return `${sign === '-' ? '-' : ''}${m.int}${m.frac ? `.${m.frac}` : ''}${exp}`;
}

/**
 * The value of a reported text, refused when a double cannot hold it exactly: too many digits, too large,
 * too close to zero. Up to 15 significant digits always come back unchanged; more only when the number
 * prints back as the same decimal (0.30000000000000004, a spreadsheet's own double), never when digits
 * would be lost (1.00000000000000000001 would become 1).
 */
function exactly(quoted: string, text: string): ResultReading {
  const digits = text.replace(/e.*$/, '').replace(/\D/g, '').replace(/^0+/, '');
  const value = Number(text);
  if (digits.length > MAX_SIGNIFICANT_DIGITS && Number.isFinite(value) && decimalOf(String(value)) !== decimalOf(text)) {
    return { error: `"${quoted}" has ${digits.length} significant digits, more than a number keeps exactly (at most ${MAX_SIGNIFICANT_DIGITS} always are), so round it` };
  }
  if (!Number.isFinite(value)) return { error: `"${quoted}" is too large to be kept (the largest number is about 1.8e308)` };
  if (/[1-9]/.test(digits) && Math.abs(value) < MIN_NORMAL) {
    return { error: `"${quoted}" is too close to zero to be kept exactly (the smallest is about 2.2e-308)` };
  }
  return { value: value + 0, text };
}

/** A decimal's significant digits and power of ten, trailing zeros dropped: "1.50e2" and "150" both give "15e1". */
function decimalOf(text: string): string {
  const m = /^-?(\d*)\.?(\d*)(?:e([+-]?\d+))?$/i.exec(text);
  if (!m) return text;
  let digits = (m[1] + m[2]).replace(/^0+/, '');
  let exponent = Number(m[3] ?? 0) - m[2].length;
  while (digits.endsWith('0')) { digits = digits.slice(0, -1); exponent++; }
  return digits ? `${text.startsWith('-') ? '-' : ''}${digits}e${exponent}` : '0';
}
