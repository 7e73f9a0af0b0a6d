import { MAX_ROWS } from '@shared/schemas';
import type { ApiIssue } from '@shared/schemas';
import type { DecimalMark } from '@shared/schemas/result-text';
import { kindMeta } from '@shared/kinds/kinds';
import type { RowField } from '@shared/kinds/kind';
import { EXCLUDED_WITHOUT_REASON, fieldProblem, lacksReason, readField } from '@shared/results/row-checks';

export interface CleanRow {
  label: string; comparative: number | null; candidate: number | null; value: number | null;
  comparativeText: string | null; candidateText: string | null; valueText: string | null;
  sex: string | null; ageBand: string | null; excluded: boolean; exclusionReason: string | null; note: string;
  /** The kind's fields without a column (shared/kinds/kind.ts); null for kinds that have none. */
  extra: Record<string, string | number | null> | null;
}

/**
 * Checks every row against its kind's row schema and fields (shared/kinds/<kind>/meta.ts) and names each problem
 * by its row (1-based, as the grid shows it) and field, e.g. `row 3: candidate result "1,234" is unclear: …`.
 * Results are read with the study's decimal mark. Nothing is saved unless every row is clean.
 */
export function validateRows(
  kind: string, raw: Record<string, unknown>[], canBeNegative: boolean, decimalMark: DecimalMark = 'auto',
): { rows: CleanRow[]; issues: ApiIssue[] } {
  const meta = kindMeta(kind);
  const issues: ApiIssue[] = [];
  const rows: CleanRow[] = [];
  if (raw.length > MAX_ROWS) issues.push({ path: 'rows', message: `At most ${MAX_ROWS} rows` });
  raw.slice(0, MAX_ROWS).forEach((input, i) => {
    const where = `row ${i + 1}`;
    const shape = meta.row.safeParse(input);
    if (!shape.success) {
      for (const e of shape.error.issues) issues.push({ path: `rows.${i}.${e.path.join('.')}`, message: `${where}: ${e.path.join('.')}: ${e.message}` });
      return;
    }
    const r = shape.data as Record<string, unknown>;
    const clean: CleanRow = {
      label: '', comparative: null, candidate: null, value: null, comparativeText: null, candidateText: null, valueText: null,
      sex: null, ageBand: null, excluded: Boolean(r.excluded), exclusionReason: ((r.exclusionReason as string | null) ?? '').trim() || null,
      note: String(r.note ?? ''), extra: null,
    };
    const put = (f: RowField, v: string | number | null) => {
      if (f.column) (clean as unknown as Record<string, unknown>)[f.column] = v;
      else clean.extra = { ...(clean.extra ?? {}), [f.field]: v };
    };
    // The shared checks (shared/results/row-checks.ts), which the grid applies to the same cells in the same words.
    for (const f of meta.rowFields) {
      const read = readField(f, r[f.field], { canBeNegative, decimalMark });
      if ('error' in read) {
        issues.push({ path: `rows.${i}.${f.field}`, message: `${where}: ${fieldProblem(f, read.error)}` });
        continue;
      }
      put(f, read.value);
      if (f.type === 'result') (clean as unknown as Record<string, unknown>)[`${f.column}Text`] = read.text;
    }
    if (lacksReason(clean.excluded, clean.exclusionReason)) issues.push({ path: `rows.${i}.exclusionReason`, message: `${where}: ${EXCLUDED_WITHOUT_REASON}` });
    rows.push(clean);
  });
  return { rows, issues };
}
