import { MAX_ROWS } from '@shared/schemas';
import type { ApiIssue } from '@shared/schemas';
import type { DecimalMark } from '@shared/schemas/result-text';
import { kindMeta } from '@shared/kinds/kinds';
import type { RowField } from '@shared/kinds/kind';
import { parseResult } from './parse-result';

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
    const problem = (f: RowField, message: string) => issues.push({ path: `rows.${i}.${f.field}`, message: `${where}: ${f.words} ${message}` });
    const put = (f: RowField, v: string | number | null) => {
      if (f.column) (clean as unknown as Record<string, unknown>)[f.column] = v;
      else clean.extra = { ...(clean.extra ?? {}), [f.field]: v };
    };
    for (const f of meta.rowFields) {
      const v = r[f.field];
      if (f.type === 'result') {
        const parsed = parseResult(v, decimalMark);
        if ('error' in parsed) problem(f, parsed.error);
        else if (parsed.value !== null && parsed.value < 0 && !canBeNegative) problem(f, 'is negative, which this analyte cannot be');
        else {
          put(f, parsed.value);
          (clean as unknown as Record<string, unknown>)[`${f.column}Text`] = parsed.text;
        }
      } else if (f.type === 'integer') {
        const text = v === null || v === undefined ? '' : String(v).trim();
        if (text === '') put(f, null);
        else if (!/^\d{1,6}$/.test(text) || Number(text) < 1) problem(f, `"${text}" must be a whole number from 1`);
        else put(f, Number(text));
      } else if (f.type === 'sex') {
        const sex = normaliseSex(v as string | null);
        if (sex === 'invalid') issues.push({ path: `rows.${i}.${f.field}`, message: `${where}: sex must be F or M (or empty)` });
        else put(f, sex);
      } else {
        const text = v === null || v === undefined ? '' : String(v).trim();
        put(f, text === '' ? (f.emptyIsNull || !f.column ? null : '') : text);
      }
    }
    if (clean.excluded && !clean.exclusionReason) issues.push({ path: `rows.${i}.exclusionReason`, message: `${where}: excluded without a reason; give the reason` });
    rows.push(clean);
  });
  return { rows, issues };
}

function normaliseSex(s: string | null): string | null {
  const t = (s ?? '').trim().toUpperCase();
  if (!t) return null;
  if (['F', 'FEMALE', 'W'].includes(t)) return 'F';
  if (['M', 'MALE'].includes(t)) return 'M';
  return 'invalid';
}
