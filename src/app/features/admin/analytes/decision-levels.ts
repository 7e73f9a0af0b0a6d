/**
 * Reads medical decision levels typed as a list: "5.5, 7.0; 11.1" (commas, semicolons or spaces
 * between numbers, a point for decimals). Returns null when any entry is not a number.
 */
export function parseDecisionLevels(text: string): number[] | null {
  const entries = text.split(/[\s,;]+/).filter((entry) => entry !== '');
  const levels = entries.map((entry) => (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(entry) ? Number(entry) : NaN));
  return levels.every(Number.isFinite) ? levels : null;
}

/** The list form of decision levels, for editing and for the table. */
export function formatDecisionLevels(levels: readonly number[]): string {
  return levels.join(', ');
}
