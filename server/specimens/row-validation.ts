import { ComparisonRowInput, IntervalRowInput, MAX_ROWS } from '../../shared/schemas';
import type { ApiIssue } from '../../shared/schemas';
import type { DecimalMark } from '../../shared/schemas/result-text';
import { parseResult } from './parse-result';

export interface CleanRow {
  label: string; comparative: number | null; candidate: number | null; value: number | null;
  comparativeText: string | null; candidateText: string | null; valueText: string | null;
  sex: string | null; ageBand: string | null; excluded: boolean; exclusionReason: string | null; note: string;
}

const RESULT_NAMES: Record<string, string> = { comparative: 'comparative result', candidate: 'candidate result', value: 'value' };

/**
 * Checks every row and names each problem by its row (1-based, as the grid shows it) and field, e.g.
 * `row 3: candidate result "1,234" is unclear: …`. Results are read with the study's decimal mark.
 * Nothing is saved unless every row is clean.
 */
export function validateRows(
  kind: string, raw: Record<string, unknown>[], canBeNegative: boolean, decimalMark: DecimalMark = 'auto',
): { rows: CleanRow[]; issues: ApiIssue[] } {
  const issues: ApiIssue[] = [];
  const rows: CleanRow[] = [];
  const comparison = kind === 'method-comparison';
  if (raw.length > MAX_ROWS) issues.push({ path: 'rows', message: `At most ${MAX_ROWS} rows` });
  raw.slice(0, MAX_ROWS).forEach((input, i) => {
    const where = `row ${i + 1}`;
    const shape = (comparison ? ComparisonRowInput : IntervalRowInput).safeParse(input);
    if (!shape.success) {
      for (const e of shape.error.issues) issues.push({ path: `rows.${i}.${e.path.join('.')}`, message: `${where}: ${e.path.join('.')}: ${e.message}` });
      return;
    }
    const r = shape.data as Record<string, unknown>;
    const clean: CleanRow = {
      label: String(r.label ?? '').trim(), comparative: null, candidate: null, value: null,
      comparativeText: null, candidateText: null, valueText: null,
      sex: comparison ? null : normaliseSex(r.sex as string | null), ageBand: comparison ? null : ((r.ageBand as string | null)?.trim() || null),
      excluded: Boolean(r.excluded), exclusionReason: ((r.exclusionReason as string | null) ?? '').trim() || null, note: String(r.note ?? ''),
    };
    for (const field of comparison ? (['comparative', 'candidate'] as const) : (['value'] as const)) {
      const parsed = parseResult(r[field], decimalMark);
      if ('error' in parsed) issues.push({ path: `rows.${i}.${field}`, message: `${where}: ${RESULT_NAMES[field]} ${parsed.error}` });
      else if (parsed.value !== null && parsed.value < 0 && !canBeNegative) {
        issues.push({ path: `rows.${i}.${field}`, message: `${where}: ${RESULT_NAMES[field]} is negative, which this analyte cannot be` });
      } else {
        clean[field] = parsed.value;
        clean[`${field}Text`] = parsed.text;
      }
    }
    if (clean.excluded && !clean.exclusionReason) issues.push({ path: `rows.${i}.exclusionReason`, message: `${where}: excluded without a reason; give the reason` });
    if (!comparison && clean.sex === 'invalid') issues.push({ path: `rows.${i}.sex`, message: `${where}: sex must be F or M (or empty)` });
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
