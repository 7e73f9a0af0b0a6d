import type { GridRow, SpecimenLayout } from '../../studies/specimens/specimen-layout';

/** An excluded specimen row as the review lists it: where it is, what it is, its results and why it is left out. */
export interface ExclusionRow {
  position: number;
  label: string;
  /** "Comparative result 5.1 · Candidate result 5.4" */
  results: string;
  reason: string;
}

/** The excluded rows of a study, in grid order, with their reasons ("No reason given" stands out if one is missing). */
export function exclusionRows(rows: readonly GridRow[], layout: SpecimenLayout): ExclusionRow[] {
  const results = layout.fields.filter((f) => f.kind === 'result');
  const out: ExclusionRow[] = [];
  rows.forEach((row, i) => {
    if (row['excluded'] !== true) return;
    out.push({
      position: i + 1,
      label: String(row['label'] ?? '').trim() || '—',
      results: results.map((f) => `${f.header} ${String(row[f.field] ?? '').trim() || '—'}`).join(' · '),
      reason: String(row['exclusionReason'] ?? '').trim() || 'No reason given',
    });
  });
  return out;
}
