/**
 * Specimen labels that more than one row carries. Labels are compared trimmed and without regard to case
 * ("S01" and " s01 " are one label); an empty label is no label and never repeats.
 *
 * A repeat is UNRESOLVED while two or more INCLUDED rows carry the label: excluding a row (which needs a
 * reason) resolves it. So excluded rows are left out here; the specimens answer warns, submission refuses
 * and the analysis warns about exactly these repeats.
 */
export const labelKey = (label: string | null | undefined): string => (label ?? '').trim().toLowerCase();

/** One repeated label: as the first row that carries it writes it (trimmed), and the 0-based indexes of its rows. */
export interface RepeatedLabel {
  label: string;
  indexes: number[];
}

/** Labels that two or more included rows share, in the order of their first row. */
export function repeatedLabels(rows: readonly { label: string | null; excluded?: boolean }[]): RepeatedLabel[] {
  const byKey = new Map<string, RepeatedLabel>();
  rows.forEach((row, i) => {
    const key = labelKey(row.label);
    if (!key || row.excluded) return;
    const seen = byKey.get(key);
    if (seen) seen.indexes.push(i);
    else byKey.set(key, { label: (row.label ?? '').trim(), indexes: [i] });
  });
  return [...byKey.values()].filter((r) => r.indexes.length > 1);
}

/** How many labels a message names before it says "and N more". */
export const NAMED_LABELS = 5;

/** "S01", "S01, S07", "S01, S02, S03, S04, S05 and 40 more". */
export function namedLabels(labels: readonly string[], max = NAMED_LABELS): string {
  const named = labels.slice(0, max).join(', ');
  return labels.length > max ? `${named} and ${labels.length - max} more` : named;
}

/**
 * The repeats in one sentence, or null when there are none:
 * "Label S01 appears more than once (2 rows)", "Labels S01, S07 appear more than once among the included rows (4 rows)".
 * @param where words after "more than once", e.g. " in the file" (with its leading space)
 */
export function repeatedLabelsSentence(repeats: readonly RepeatedLabel[], where = ''): string | null {
  return repeatsSentence(repeats.map((r) => r.label), repeats.reduce((sum, r) => sum + r.indexes.length, 0), where);
}

/** The same sentence from the repeated labels and the number of rows that carry them. */
export function repeatsSentence(labels: readonly string[], rows: number, where = ''): string | null {
  if (!labels.length) return null;
  const names = namedLabels(labels);
  return labels.length === 1
    ? `Label ${names} appears more than once${where} (${rows} rows)`
    : `Labels ${names} appear more than once${where} (${rows} rows)`;
}
