import { readResult, type DecimalMark, type ResultReading } from '@shared/schemas/result-text';

export type ParsedResult = ResultReading;

/**
 * A result as a person types, pastes or imports it, read with the study's decimal mark by the parser
 * the client shares (shared/schemas/result-text.ts): the number and its text as reported, or an error
 * in words. Nothing is read loosely: "1,234" in a study that detects the mark, "1e309", "1e-400" and
 * more than 15 significant digits are refused, never stored changed.
 */
export function parseResult(input: unknown, decimalMark: DecimalMark = 'auto'): ParsedResult {
  return readResult(input, decimalMark);
}
