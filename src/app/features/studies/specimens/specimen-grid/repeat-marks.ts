import { repeatedLabels } from '@shared/types/repeated-labels';
import type { GridRow } from '../specimen-layout';

/** "rows 3 and 17", "rows 3, 9 and 17" (row numbers as the grid shows them). */
export function rowList(indexes: readonly number[]): string {
  const numbers = indexes.map((i) => String(i + 1));
  return numbers.length === 1 ? `row ${numbers[0]}` : `rows ${numbers.slice(0, -1).join(', ')} and ${numbers.at(-1)}`;
}

/**
 * The rows whose label another included row carries too (compared trimmed and regardless of case; excluded
 * rows and empty labels do not count), each with the words of its mark: "Label repeated on rows 3 and 17".
 * The same rule the server warns with and submission applies.
 */
export function repeatMarks(rows: readonly GridRow[]): Map<number, string> {
  const marks = new Map<number, string>();
  const plain = rows.map((row) => ({ label: String(row['label'] ?? ''), excluded: row['excluded'] === true }));
  for (const repeat of repeatedLabels(plain)) {
    const text = `Label repeated on ${rowList(repeat.indexes)}`;
    for (const i of repeat.indexes) marks.set(i, text);
  }
  return marks;
}
