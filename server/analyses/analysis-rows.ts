import { kindMeta } from '@shared/kinds/kinds';
import type { RowField } from '@shared/kinds/kind';
import { emptyRequired, emptyRequiredWords } from '@shared/results/row-checks';
import { magnitudeProblem } from '@shared/stats/magnitude';
import { repeatedLabels, repeatedLabelsSentence } from '@shared/types/repeated-labels';
import type { AnalysisInput } from '../specimens/input-hash';

/** One analysed row as the input hash covers it. */
export type Row = AnalysisInput['rows'][number];
export const has = (v: number | null | undefined): v is number => v !== null && v !== undefined && Number.isFinite(v);

/** A row's value of a kind's field: its column, or its `extra` JSON. */
export function fieldValue(r: Row, f: RowField): unknown {
  if (f.column) return (r as unknown as Record<string, unknown>)[f.column];
  return r.extra?.[f.field] ?? null;
}

/**
 * Rows that cannot enter an analysis: an included row with an empty result or another field the kind requires
 * (the shared rule, shared/results/row-checks.ts, which the grid shows in the same words before it saves).
 */
export function missingResults(input: AnalysisInput): string[] {
  const fields = kindMeta(input.kind).rowFields;
  return input.rows.flatMap((r) => emptyRequired(fields, (f) => fieldValue(r, f), r.excluded).map((f) => `row ${r.position}: ${emptyRequiredWords(f)}`));
}

/** Results (excluded ones too: the sensitivity run uses them) the engine cannot compute with (magnitude.ts), named by grid row and field. */
export function outOfRangeResults(input: AnalysisInput): string[] {
  const fields = kindMeta(input.kind).rowFields.filter((f) => f.type === 'result');
  const out: string[] = [];
  for (const r of input.rows) {
    for (const f of fields) {
      const v = fieldValue(r, f);
      const problem = typeof v === 'number' && has(v) ? magnitudeProblem(v) : null;
      if (problem) out.push(`row ${r.position}: the ${f.words} ${problem}`);
    }
  }
  return out;
}

/**
 * The result with a first warning naming the labels two or more analysed (included) rows carry, when any do
 * (repeated-labels.ts): "Labels S01, S07 appear more than once among the analysed rows (4 rows): …".
 */
export function withRepeatedLabels<T extends { warnings: string[] }>(result: T, used: Row[]): T {
  const repeats = repeatedLabelsSentence(repeatedLabels(used), ' among the analysed rows');
  if (!repeats) return result;
  const warning = `${repeats}: a specimen entered twice counts twice in every estimate; check the labels, or exclude the extra rows with a reason.`;
  return { ...result, warnings: [warning, ...result.warnings] };
}

/** Maps 1-based analysed-row numbers back to the grid's row positions. */
export const toPositions = (numbers: number[], used: Row[]) => numbers.map((k) => used[k - 1]?.position).filter((p): p is number => p !== undefined);
