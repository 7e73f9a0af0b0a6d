/**
 * A result as a person types or pastes it: "5.2", "5,2", " 12 ", a number, or empty.
 * Returns the number and the text as reported (with a point), or an error in words.
 * Thousands separators are not accepted: "1,234" would be read as 1.234, so it is refused as unclear.
 */
export type ParsedResult = { value: number | null; text: string | null } | { error: string };

const PLAIN = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

export function parseResult(input: unknown): ParsedResult {
  if (input === null || input === undefined) return { value: null, text: null };
  if (typeof input === 'number') {
    return Number.isFinite(input) ? { value: input, text: String(input) } : { error: 'is not a finite number' };
  }
  if (typeof input !== 'string') return { error: 'is not a number' };
  const t = input.trim();
  if (t === '') return { value: null, text: null };
  if (/^[<>]/.test(t)) return { error: `"${t}" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason` };
  if ((t.match(/[.,]/g) ?? []).length > 1) return { error: `"${t}" has more than one decimal separator` };
  if (!PLAIN.test(t)) return { error: `"${t}" is not a number` };
  const text = t.replace(',', '.').replace(/^\+/, '');
  return { value: Number(text), text };
}
